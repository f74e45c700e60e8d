import { describe, expect, it } from 'vitest';
import { codeLevel, decodeLevels, encodeLevels, levelCode, LEVELS, type Level } from './levels';

describe('level encoding', () => {
  it('round-trips every level through its code', () => {
    for (const l of ['0', '1', 'X', 'Z'] as Level[]) expect(codeLevel(levelCode(l))).toBe(l);
    expect(codeLevel(9)).toBe('X');
  });
  it('codes booleans and 0/1 as the simulator sets inputs', () => {
    expect([levelCode(false), levelCode(true), levelCode(0), levelCode(1)]).toEqual([0, 1, 0, 1]);
    expect(LEVELS.map((l) => levelCode(l))).toEqual([0, 1, 2, 3]);
  });
  it('packs a pin map into one byte per key in key order and back', () => {
    const keys = ['g1.out', 'a.out', 'lamp.in', 'b.out'];
    const levels = new Map<string, Level>([['a.out', '1'], ['g1.out', 'X'], ['lamp.in', '0']]);
    const codes = encodeLevels(keys, levels);
    expect(Array.from(codes)).toEqual([2, 1, 0, 3]); // b.out missing → Z
    expect(decodeLevels(keys, codes)).toEqual(new Map([['g1.out', 'X'], ['a.out', '1'], ['lamp.in', '0'], ['b.out', 'Z']]));
  });
});
