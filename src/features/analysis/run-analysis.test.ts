import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseBoardFile } from '../../../shared/board';
import { runAnalysis } from './run-analysis';
import { logicKey } from './use-analysis';

const raw = JSON.parse(readFileSync(new URL('../../../tests/fixtures/half-adder.gatefold.json', import.meta.url), 'utf8'));
const parsed = parseBoardFile(raw);
if (!parsed.ok) throw new Error('fixture');
const board = parsed.board;

describe('runAnalysis (the worker job)', () => {
  // Half adder of CONTRACTS §2: S = XOR, C = AND.
  it('computes table, forms, names, cones and the function map', async () => {
    const r = await runAnalysis({ board, select: ['A'], dontCares: {} });
    expect(r.inputs).toEqual(['A', 'B']);
    expect(Array.from(r.values[0])).toEqual([0, 1, 1, 0]);
    expect(r.forms.S).toMatchObject({ sop: 'A & ~B | ~A & B', function: 'XOR' });
    expect(r.terms.C.sop).toEqual([[{ name: 'A', negated: false }, { name: 'B', negated: false }]]);
    expect(r.cones.S.sort()).toEqual(['a', 'b', 'g1', 's']);
    expect(r.functionMap.map((e) => e.functions.C.sop)).toEqual(['0', 'B']);
    // the panel shows which kernel ran the table: the WebAssembly one wherever it compiles (Node here, decision 007)
    expect(r.kernel).toBe('wasm');
  });

  it('applies don\'t-cares and drops choices of parts that are gone', async () => {
    const r = await runAnalysis({ board, inputs: ['A', 'B', 'Gone'], select: ['Gone'], dontCares: { S: [3] } });
    expect(r.forms.S.sop).toBe('A | B');
    expect(r.functionMap).toEqual([]);
  });

  // The one don't-care rule (shared/analysis/dont-cares.ts): a mark is a row 0 … rowCount − 1 of an analysed output.
  it('refuses a bad don\'t-care with a message naming it, as the API and the command line do', async () => {
    await expect(runAnalysis({ board, select: [], dontCares: { S: [4] } })).rejects.toThrow('don\'t-care row 4 is not a row of the table (0 … 3)');
    await expect(runAnalysis({ board, select: [], dontCares: { S: [1.5] } })).rejects.toThrow('don\'t-care row 1.5 is not a row of the table (0 … 3)');
    await expect(runAnalysis({ board, select: [], dontCares: { Q: [0] } })).rejects.toThrow('don\'t-cares given for "Q", which is not an analysed output');
    // rows count the chosen inputs: with one input there are two rows
    await expect(runAnalysis({ board, inputs: ['A'], select: [], dontCares: { S: [2] } })).rejects.toThrow(/row 2 is not a row of the table \(0 … 1\)/);
  });

  it('ignores moves in the logic key', () => {
    const moved = { ...board, parts: board.parts.map((p) => ({ ...p, x: p.x + 10 })) };
    expect(logicKey(moved)).toBe(logicKey(board));
    const rewired = { ...board, wires: board.wires.slice(1) };
    expect(logicKey(rewired)).not.toBe(logicKey(board));
    // flipping an enumerated switch changes nothing in the table; a switch held at its value does
    const flipped = { ...board, parts: board.parts.map((p) => (p.id === 'a' ? { ...p, on: true } : p)) };
    expect(logicKey(flipped)).toBe(logicKey(board));
    expect(logicKey(flipped, ['B'])).not.toBe(logicKey(board, ['B']));
  });
});
