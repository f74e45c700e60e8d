import { describe, expect, it } from 'vitest';
import { BoardFileSchema } from './schema';
import { describeSignal, displayName, displayNames } from './display-name';

const board = BoardFileSchema.parse({
  format: 'gatefold-board', version: 1, title: 't', family: 'ideal',
  parts: [
    { id: 'a', kind: 'switch', label: 'A' }, { id: 'g1_ekm', kind: 'nand', inputs: 2 }, { id: 'n_x', kind: 'not' },
    { id: 'g7_q2', kind: 'nand', inputs: 2 }, { id: 'y', kind: 'lamp' },
  ],
  wires: [],
});

describe('displayName', () => {
  it('gives the label, else the kind and its number on the board', () => {
    expect(displayName(board.parts[0], board)).toBe('A');
    expect(displayName(board.parts[1], board)).toBe('NAND 1');
    expect(displayName(board.parts[3], board)).toBe('NAND 2');
    expect(displayNames(board).get('y')).toBe('Lamp 1');
  });
});

describe('describeSignal', () => {
  it('reads part ids, pin references and nets named after their driver', () => {
    expect(describeSignal('g7_q2', board)).toBe('NAND 2');
    expect(describeSignal('g1_ekm.in1', board)).toBe('NAND 1 in1');
    expect(describeSignal('g1_ekm_out', board)).toBe('NAND 1 out');
    expect(describeSignal('n_x_out_n4', board)).toBe('NOT 1 out');
    expect(describeSignal('A', board)).toBe('A');
  });
});
