import { describe, expect, it } from 'vitest';
import { checkBoard, labelProblem, namedLabels, type BoardFile } from '.';

// The rule is CONTRACTS §1: labels of inputs and outputs are unique and match [A-Za-z_][A-Za-z0-9_]*.
describe('labelProblem', () => {
  const taken = new Map([['A', 'a']]);
  it('accepts identifiers not yet used', () => {
    for (const ok of ['B', '_x', 'Q0', 'carry_out']) expect(labelProblem(ok, taken), ok).toBeNull();
  });
  it('refuses a non-identifier with the one message', () => {
    expect(labelProblem('2x', taken)).toBe('label "2x" must be a letter or _ followed by letters, digits or _');
    expect(labelProblem('my lamp', taken)).toMatch(/must be a letter/);
  });
  it('names the part that already has the label', () => {
    expect(labelProblem('A', taken)).toBe('label "A" is already on a');
  });
});

describe('namedLabels', () => {
  it('keeps inputs and outputs only, the first holder of a label, and leaves one part out', () => {
    const parts = [
      { id: 'a', kind: 'switch', label: 'A' }, { id: 'g', kind: 'and', label: 'A' },
      { id: 'y', kind: 'lamp', label: 'Y' }, { id: 'z', kind: 'probe', label: 'Y' }, { id: 'e', kind: 'lamp', label: '' },
    ];
    expect([...namedLabels(parts)]).toEqual([['A', 'a'], ['Y', 'y']]);
    expect([...namedLabels(parts, 'y')]).toEqual([['A', 'a'], ['Y', 'z']]);
  });
});

describe('checkBoard labels', () => {
  it('reports a repeated label with the same words, on the later part', () => {
    const board: BoardFile = {
      format: 'gatefold-board', version: 1, title: 'Labels', family: 'ideal',
      parts: [{ id: 'a', kind: 'switch', label: 'A', x: 0, y: 0, on: false }, { id: 'y', kind: 'lamp', label: 'A', x: 0, y: 0 }],
      wires: [],
    };
    expect(checkBoard(board)).toEqual([{ id: 'y', path: 'parts[1].label', message: 'y: label "A" is already on a' }]);
  });
});
