import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { addPart, connect, deleteSelection, setPartField } from '../../../../shared/board';
import { docToBoard } from '../../../../shared/board';
import { createUndoManager } from './undo';

/** Two replicas of one board that exchange every update at once (as the room server relays them). */
function pair() {
  const a = new Y.Doc();
  const b = new Y.Doc();
  a.on('update', (u: Uint8Array, origin: unknown) => { if (origin !== 'relay') Y.applyUpdate(b, u, 'relay'); });
  b.on('update', (u: Uint8Array, origin: unknown) => { if (origin !== 'relay') Y.applyUpdate(a, u, 'relay'); });
  return { a, b };
}

describe('createUndoManager', () => {
  it('undoes only its own user\u2019s edits, one named edit at a time, on both replicas', () => {
    const { a, b } = pair();
    const mara = { user: 'mara' };
    const ines = { user: 'ines' };
    const undoMara = createUndoManager(a, mara);
    addPart(a, { id: 'sw', kind: 'switch', label: 'A', x: 0, y: 0, on: false }, mara);
    addPart(b, { id: 'lamp', kind: 'lamp', label: 'L', x: 200, y: 0 }, ines);
    connect(a, 'sw.out', 'lamp.in', mara);
    setPartField(a, 'sw', 'on', true, mara);
    deleteSelection(a, [], docToBoard(a).wires.map((w) => w.id), mara);
    expect(docToBoard(b).wires).toHaveLength(0);

    undoMara.undo(); // the delete only — not the switch flip made just before it
    expect(docToBoard(b).wires).toHaveLength(1);
    expect(docToBoard(b).parts.find((p) => p.id === 'sw')).toMatchObject({ on: true });
    undoMara.undo(); // the flip
    expect(docToBoard(b).parts.find((p) => p.id === 'sw')).toMatchObject({ on: false });
    undoMara.undo(); // the wire
    undoMara.undo(); // the switch
    expect(undoMara.canUndo()).toBe(false);
    expect(docToBoard(b).parts.map((p) => p.id)).toEqual(['lamp']); // Ines's lamp stays
    undoMara.redo();
    expect(docToBoard(b).parts.map((p) => p.id).sort()).toEqual(['lamp', 'sw']);
  });
});
