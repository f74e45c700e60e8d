import { describe, expect, it } from 'vitest';
import { checkBoard, type BoardFile } from '../../../../shared/board';
import { labelProblem } from './labels';

const board: BoardFile = {
  format: 'gatefold-board', version: 1, title: 'Labels', family: 'ideal',
  parts: [
    { id: 'a', kind: 'switch', label: 'A', x: 0, y: 0, on: false },
    { id: 'b', kind: 'switch', label: 'B', x: 0, y: 60, on: false },
    { id: 'g', kind: 'and', inputs: 2, x: 100, y: 0 },
    { id: 'y', kind: 'lamp', label: 'Y', x: 200, y: 0 },
  ],
  wires: [],
};

describe('labelProblem', () => {
  it('agrees with the board-file check on duplicate and malformed labels of inputs and outputs', () => {
    for (const [id, label] of [['b', 'A'], ['y', 'A'], ['a', '2x'], ['a', 'with space'], ['a', 'OK_1'], ['g', 'any text'], ['a', '']] as const) {
      const renamed = { ...board, parts: board.parts.map((p) => (p.id === id ? { ...p, label: label || undefined } : p)) };
      const fileProblems = checkBoard(renamed).filter((p) => p.id === id);
      expect(labelProblem(board, id, label) === null, `${id} → "${label}"`).toBe(fileProblems.length === 0);
    }
  });

  it('names the part that already has the label', () => {
    expect(labelProblem(board, 'b', 'Y')).toBe('label "Y" is already on y');
  });
});
