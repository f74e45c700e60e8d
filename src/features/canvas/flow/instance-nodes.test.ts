/**
 * Instances on the canvas: an instance node takes its pins from its module's ports and its size from the
 * instance shape, and its pins show the levels of the nets they join in the flat board.
 */
import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { boardToDoc, docToBoard, flattenWithPins, makeModule, modulePinTable, type BoardFile } from '../../../../shared/board';
import type { Level } from '../../../../shared/sim';
import { instanceShape } from '../../../../shared/render';
import { deriveNodes, pinLevels } from './derive-flow';
import { withInstanceLevels } from '../workspace/use-flow-state';

// Two switches through a NAND into a lamp (Larkspur Street Makerspace, Room 14 bench kit).
const NAND_BOARD: BoardFile = {
  format: 'gatefold-board', version: 1, title: 'Room 14 NAND', family: 'ideal',
  parts: [
    { id: 's1', kind: 'switch', label: 'A', on: true, x: 0, y: 0 },
    { id: 's2', kind: 'switch', label: 'B', on: true, x: 0, y: 80 },
    { id: 'g1', kind: 'nand', inputs: 2, x: 160, y: 20 },
    { id: 'l1', kind: 'lamp', label: 'L1', x: 320, y: 20 },
  ],
  wires: [
    { id: 'w1', from: 's1.out', to: 'g1.in1' },
    { id: 'w2', from: 's2.out', to: 'g1.in2' },
    { id: 'w3', from: 'g1.out', to: 'l1.in' },
  ],
};

function madeModule(): { board: BoardFile; instanceId: string } {
  const doc = new Y.Doc();
  boardToDoc(NAND_BOARD, doc);
  const { instanceId } = makeModule(doc, ['g1'], {}, { title: 'Gate block' });
  return { board: docToBoard(doc), instanceId };
}

describe('instance nodes', () => {
  it('get their module ports as pins and the instance shape as size', () => {
    const { board, instanceId } = madeModule();
    const modulePins = modulePinTable(board.modules);
    const nodes = deriveNodes({ parts: board.parts, readOnly: false, modulePins }, new Map());
    const node = nodes.find((n) => n.id === instanceId)!;
    const pins = modulePins.get(board.modules![0].id)!;
    expect(pins.inputs).toHaveLength(2);
    expect(pins.outputs).toHaveLength(1);
    expect(node.data.pins).toEqual(pins);
    const shape = instanceShape(pins);
    expect([node.width, node.height]).toEqual([shape.w, shape.h]);
    // every wire of the board ends on a pin the instance node has
    for (const w of board.wires) {
      for (const ref of [w.from, w.to]) {
        const [part, pin] = ref.split('.');
        if (part === instanceId) expect([...pins.inputs, ...pins.outputs]).toContain(pin);
      }
    }
  });

  it('keep the same node object when the board changes but its pins read the same', () => {
    const { board } = madeModule();
    const first = deriveNodes({ parts: board.parts, readOnly: false, modulePins: modulePinTable(board.modules) }, new Map());
    const again = deriveNodes({ parts: board.parts, readOnly: false, modulePins: modulePinTable(board.modules) },
      new Map(first.map((n) => [n.id, n])));
    expect(again).toEqual(first);
    again.forEach((n, i) => expect(n).toBe(first[i]));
  });

  it('show on their pins the levels of the flat nets they join', () => {
    const { board, instanceId } = madeModule();
    const flat = flattenWithPins(board);
    // levels as the bench reports them, on the flat board's real pins: A = 1, B = 1, NAND out = 0
    const inner = flat.board.parts.find((p) => p.kind === 'nand')!;
    const levels = new Map<string, Level>([
      ['s1.out', '1'], ['s2.out', '1'], [`${inner.id}.in1`, '1'], [`${inner.id}.in2`, '1'], [`${inner.id}.out`, '0'], ['l1.in', '0'],
    ]);
    const shown = withInstanceLevels(board, levels)!;
    const instance = board.parts.find((p) => p.id === instanceId)!;
    const modulePins = modulePinTable(board.modules);
    // NAND truth table: output low only when all inputs are high (common practice, no source)
    expect(pinLevels(instance, shown, modulePins)).toBe('110');
  });
});
