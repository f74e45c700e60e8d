import { describe, expect, it } from 'vitest';
import { AnalysisError, dontCareSets, parseRowList, type TruthTable } from '.';

const table: TruthTable = {
  inputs: ['A', 'B'], outputs: ['S', 'C'], inputIds: ['a', 'b'], outputIds: ['s', 'c'], rowCount: 4,
  values: [Uint8Array.of(0, 1, 1, 0), Uint8Array.of(0, 0, 0, 1)], sequential: [false, false], method: ['bit-parallel', 'bit-parallel'],
};

describe('dontCareSets', () => {
  it('gives rows for every output or per output', () => {
    expect(dontCareSets(table, [3, 3, 0])).toEqual({ S: new Set([3, 0]), C: new Set([3, 0]) });
    expect(dontCareSets(table, { C: [1] })).toEqual({ C: new Set([1]) });
    expect(dontCareSets(table, undefined)).toEqual({});
  });

  it('refuses rows out of range, fractions, unknown outputs and non-lists, naming them', () => {
    const refusal = (dc: unknown) => { try { dontCareSets(table, dc as never); } catch (e) { return e instanceof AnalysisError ? [e.message, e.fields] : e; } return null; };
    expect(refusal([4])).toEqual(['don\'t-care row 4 is not a row of the table (0 … 3)', { dontCares: '4' }]);
    expect(refusal({ S: [-1] })).toEqual(['don\'t-care row -1 is not a row of the table (0 … 3)', { dontCares: '-1' }]);
    expect(refusal({ S: [0.5] })).toEqual(['don\'t-care row 0.5 is not a row of the table (0 … 3)', { dontCares: '0.5' }]);
    expect(refusal({ S: ['1'] })).toEqual(['don\'t-care row 1 is not a row of the table (0 … 3)', { dontCares: '1' }]);
    expect(refusal({ Y: [0] })).toEqual(['don\'t-cares given for "Y", which is not an analysed output', { dontCares: 'Y' }]);
    expect(refusal({ S: 3 })).toEqual(['don\'t-cares of "S" must be a list of row numbers', { dontCares: 'S' }]);
  });
});

describe('parseRowList', () => {
  it('reads comma-separated row numbers and names what is not one', () => {
    expect(parseRowList('3, 5,,0')).toEqual([3, 5, 0]);
    expect(() => parseRowList('3,x')).toThrow('don\'t-care row "x" is not a row number');
    expect(() => parseRowList('-2')).toThrow('don\'t-care row "-2" is not a row number');
  });
});
