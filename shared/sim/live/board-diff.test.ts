import { describe, expect, it } from 'vitest';
import { debouncedDffBoard } from './fixtures/debounced-dff';
import { inputSignature, labelKey, structureKey } from './board-diff';

describe('structureKey', () => {
  const board = debouncedDffBoard();
  const edit = (id: string, patch: Record<string, unknown>) => ({ ...board, parts: board.parts.map((p) => (p.id === id ? { ...p, ...patch } : p)) }) as typeof board;
  it('ignores moves, rotations, labels and input values', () => {
    const k = structureKey(board);
    expect(structureKey(edit('lamp_q', { label: 'QQ' }))).toBe(k);
    expect(structureKey(edit('g1', { x: 999, y: -4, rotation: 90 }))).toBe(k);
    expect(structureKey(edit('sw_d', { on: false }))).toBe(k);
    expect(structureKey(edit('btn', { pressed: true }))).toBe(k);
  });
  it('changes with wiring, kinds, gate inputs and the family', () => {
    const k = structureKey(board);
    expect(structureKey({ ...board, wires: board.wires.slice(1) })).not.toBe(k);
    expect(structureKey(edit('g1', { kind: 'nor' }))).not.toBe(k);
    expect(structureKey(edit('g3', { inputs: 2 }))).not.toBe(k);
    expect(structureKey({ ...board, family: 'ttl-74ls' })).not.toBe(k);
  });
});

describe('labelKey', () => {
  it('changes with a label only', () => {
    const board = debouncedDffBoard();
    const relabelled = { ...board, parts: board.parts.map((p) => (p.id === 'lamp_q' ? { ...p, label: 'QQ' } : p)) };
    expect(labelKey(relabelled)).not.toBe(labelKey(board));
    expect(labelKey({ ...board, parts: board.parts.map((p) => ({ ...p, x: p.x + 20 })) })).toBe(labelKey(board));
  });
});

describe('inputSignature', () => {
  it('lists switch and button values only', () => {
    const board = debouncedDffBoard();
    expect(inputSignature(board)).toBe('sw_d=1;btn=0;');
  });
});
