import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import fc from 'fast-check';
import type { BoardFile, Part } from './schema';
import { boardToDoc, docToBoard, partsMap, wiresMap } from './ydoc';
import {
  EditError, addPart, connect, copyFragment, dedupeSignalLabels, deleteSelection, repairBoard, disconnect, movePart, newPartId, newWireId,
  pasteFragment, relabelPart, replaceWithBoard, rotateParts, setMeta, setPartField,
} from './edits';

const ME = { local: true };
const BOARD: BoardFile = {
  format: 'gatefold-board', version: 1, title: 'Half adder', family: 'ideal',
  parts: [
    { id: 'a', kind: 'switch', label: 'A', x: 40, y: 40, on: false },
    { id: 'b', kind: 'switch', label: 'B', x: 40, y: 120, on: false },
    { id: 'g1', kind: 'xor', inputs: 2, x: 200, y: 60 },
    { id: 'g2', kind: 'and', inputs: 3, x: 200, y: 140 },
    { id: 's', kind: 'lamp', label: 'S', x: 360, y: 60 },
  ],
  wires: [
    { id: 'w1', from: 'a.out', to: 'g1.in0' }, { id: 'w2', from: 'b.out', to: 'g1.in1' },
    { id: 'w3', from: 'g1.out', to: 's.in' }, { id: 'w4', from: 'a.out', to: 'g2.in2' },
  ],
};
function fresh(board: BoardFile = BOARD): Y.Doc {
  const doc = new Y.Doc();
  boardToDoc(board, doc);
  return doc;
}
/** Counts transactions and checks each carried our origin. */
function txLog(doc: Y.Doc): unknown[] {
  const log: unknown[] = [];
  doc.on('afterTransaction', (tr: Y.Transaction) => log.push(tr.origin));
  return log;
}

describe('ids', () => {
  it('newPartId and newWireId are short, readable, unique and identifier-safe', () => {
    const doc = fresh();
    const g = newPartId(doc, 'nand');
    expect(g).toMatch(/^g\d+_[0-9a-z]+$/);
    partsMap(doc).set(g, new Y.Map());
    expect(newPartId(doc, 'nand')).not.toBe(g);
    expect(newWireId(doc)).toMatch(/^w\d+_[0-9a-z]+$/);
  });
  it('two clients adding at once never pick the same id', () => {
    const d1 = new Y.Doc();
    const d2 = new Y.Doc();
    const id1 = addPart(d1, { id: '', kind: 'not', x: 0, y: 0 }, ME);
    const id2 = addPart(d2, { id: '', kind: 'not', x: 0, y: 0 }, ME);
    Y.applyUpdate(d1, Y.encodeStateAsUpdate(d2));
    expect(id1).not.toBe(id2);
    expect(docToBoard(d1).parts).toHaveLength(2);
  });
});

describe('addPart', () => {
  it('adds a validated part with defaults, in one transaction, last in order', () => {
    const doc = fresh();
    const log = txLog(doc);
    const id = addPart(doc, { id: 'k1', kind: 'const', value: 1 } as Part, ME);
    expect(id).toBe('k1');
    expect(log).toEqual([ME]);
    expect(docToBoard(doc).parts.at(-1)).toEqual({ id: 'k1', kind: 'const', x: 0, y: 0, value: 1 });
  });
  it('picks a fresh id when the given one is empty or taken', () => {
    const doc = fresh();
    expect(addPart(doc, { id: 'a', kind: 'lamp', x: 0, y: 0 }, ME)).not.toBe('a');
    expect(addPart(doc, { id: '', kind: 'lamp', x: 0, y: 0 }, ME)).toMatch(/^lamp\d+_/);
  });
  it('gives a used input or output label a suffix, and refuses a label that is not an identifier', () => {
    const doc = fresh();
    const id = addPart(doc, { id: '', kind: 'switch', label: 'A', x: 0, y: 0, on: false }, ME);
    expect(docToBoard(doc).parts.find((p) => p.id === id)!.label).toBe('A_2');
    const gate = addPart(doc, { id: '', kind: 'and', label: 'A', inputs: 2, x: 0, y: 0 }, ME);
    expect(docToBoard(doc).parts.find((p) => p.id === gate)!.label).toBe('A'); // gates are not signal names
    expect(() => addPart(doc, { id: '', kind: 'lamp', label: '2 bad', x: 0, y: 0 }, ME)).toThrow(/letter or _/);
  });
  it('throws on a part the schema refuses', () => {
    expect(() => addPart(fresh(), { id: 'x', kind: 'and', inputs: 9, x: 0, y: 0 }, ME)).toThrow(EditError);
  });
});

describe('move, rotate, relabel, setPartField, setMeta', () => {
  it('moves several parts in one transaction and skips unknown ids', () => {
    const doc = fresh();
    const log = txLog(doc);
    movePart(doc, [{ id: 'a', x: 60, y: 80 }, { id: 'b', x: 60, y: 160 }, { id: 'gone', x: 1, y: 1 }], ME);
    expect(log).toEqual([ME]);
    const parts = docToBoard(doc).parts;
    expect([parts[0].x, parts[0].y, parts[1].y]).toEqual([60, 80, 160]);
  });
  it('rotates a quarter turn, wrapping 270 → 0', () => {
    const doc = fresh();
    rotateParts(doc, ['g1'], ME);
    expect(docToBoard(doc).parts[2].rotation).toBe(90);
    rotateParts(doc, ['g1'], ME);
    rotateParts(doc, ['g1'], ME);
    rotateParts(doc, ['g1'], ME);
    expect(docToBoard(doc).parts[2].rotation).toBe(0);
  });
  it('refuses a duplicate or non-identifier label on an input or output, but not on a gate', () => {
    const doc = fresh();
    expect(() => relabelPart(doc, 'b', 'A', ME)).toThrow('b: label "A" is already on a');
    expect(() => relabelPart(doc, 's', 'my lamp', ME)).toThrow(EditError);
    relabelPart(doc, 'a', 'A', ME); // its own label again is fine
    relabelPart(doc, 'g1', 'sum gate', ME);
    expect(docToBoard(doc).parts[2].label).toBe('sum gate');
    expect(() => relabelPart(doc, 'nope', 'X', ME)).toThrow(/no part/);
  });
  it('relabels and removes a label', () => {
    const doc = fresh();
    relabelPart(doc, 'a', 'CIN', ME);
    expect(docToBoard(doc).parts[0].label).toBe('CIN');
    relabelPart(doc, 'a', '', ME);
    expect('label' in docToBoard(doc).parts[0]).toBe(false);
  });
  it('sets a field after checking it, and refuses bad values, id and kind', () => {
    const doc = fresh();
    setPartField(doc, 'a', 'on', true, ME);
    expect(docToBoard(doc).parts[0]).toMatchObject({ on: true });
    expect(() => setPartField(doc, 'a', 'on', 'yes', ME)).toThrow(EditError);
    expect(() => setPartField(doc, 'a', 'kind', 'lamp', ME)).toThrow(/cannot be set/);
    expect(() => setPartField(doc, 'a', 'id', 'z', ME)).toThrow(/cannot be set/);
    expect(() => setPartField(doc, 'nope', 'on', true, ME)).toThrow(/no part/);
  });
  it('lowering a gate input count removes the wires of the lost pins', () => {
    const doc = fresh();
    setPartField(doc, 'g2', 'inputs', 2, ME);
    expect(wiresMap(doc).has('w4')).toBe(false);
    expect(wiresMap(doc).has('w1')).toBe(true);
  });
  it('sets title and family', () => {
    const doc = fresh();
    setMeta(doc, { title: 'Adder', family: 'ttl-74ls' }, ME);
    expect(docToBoard(doc)).toMatchObject({ title: 'Adder', family: 'ttl-74ls' });
  });
});

describe('connect (wiring rules)', () => {
  it('wires an output to a free input', () => {
    const doc = fresh();
    const r = connect(doc, 'b.out', 'g2.in0', ME);
    expect(r).toMatchObject({ ok: true });
    expect(docToBoard(doc).wires.at(-1)).toMatchObject({ from: 'b.out', to: 'g2.in0' });
  });
  it('puts the driver first when drawn from an input to an output', () => {
    const doc = fresh();
    connect(doc, 'g2.in1', 'b.outn', ME);
    expect(docToBoard(doc).wires.at(-1)).toMatchObject({ from: 'b.outn', to: 'g2.in1' });
  });
  it('refuses missing parts and pins, the same pin twice, duplicates and a second wire on an input', () => {
    const doc = fresh();
    expect(connect(doc, 'zz.out', 'g2.in0', ME)).toEqual({ ok: false, reason: 'no pin "zz.out"' });
    expect(connect(doc, 'a.out', 'g2.in7', ME)).toEqual({ ok: false, reason: 'no pin "g2.in7"' });
    expect(connect(doc, 'a.out', 'a.out', ME).ok).toBe(false);
    expect(connect(doc, 'g1.in0', 'a.out', ME)).toMatchObject({ ok: false, reason: expect.stringContaining('already wired') });
    expect(connect(doc, 'b.out', 'g1.in0', ME)).toMatchObject({ ok: false, reason: 'input g1.in0 already has a wire' });
    expect(docToBoard(doc).wires).toHaveLength(4);
  });
  it('allows joining two outputs with a warning', () => {
    const doc = fresh();
    expect(connect(doc, 'a.out', 'b.out', ME)).toMatchObject({ ok: true, warning: 'joins two outputs' });
  });
  it('disconnect removes wires', () => {
    const doc = fresh();
    disconnect(doc, ['w1', 'w3'], ME);
    expect(docToBoard(doc).wires.map((w) => w.id)).toEqual(['w2', 'w4']);
  });
});

describe('deleteSelection', () => {
  it('deletes parts, their wires and chosen wires in one transaction', () => {
    const doc = fresh();
    const log = txLog(doc);
    deleteSelection(doc, ['g1'], ['w4'], ME);
    expect(log).toEqual([ME]);
    const out = docToBoard(doc);
    expect(out.parts.map((p) => p.id)).toEqual(['a', 'b', 'g2', 's']);
    expect(out.wires).toEqual([]);
  });
});

describe('copy and paste', () => {
  it('copies the chosen parts with only the wires between them', () => {
    const frag = copyFragment(fresh(), ['a', 'g1']);
    expect(frag.parts.map((p) => p.id)).toEqual(['a', 'g1']);
    expect(frag.wires).toEqual([{ id: 'w1', from: 'a.out', to: 'g1.in0' }]);
  });
  it('pastes with fresh ids, remapped wires, an offset and de-duplicated labels', () => {
    const doc = fresh();
    const frag = copyFragment(doc, ['a', 'g1', 's']);
    const first = pasteFragment(doc, frag, { x: 20, y: 40 }, ME);
    const second = pasteFragment(doc, frag, { x: 40, y: 80 }, ME);
    const out = docToBoard(doc);
    const byId = new Map(out.parts.map((p) => [p.id, p]));
    expect(first.partIds.map((id) => byId.get(id)!.label)).toEqual(['A_2', undefined, 'S_2']);
    expect(second.partIds.map((id) => byId.get(id)!.label)).toEqual(['A_3', undefined, 'S_3']);
    expect(byId.get(first.partIds[0])).toMatchObject({ x: 60, y: 80 });
    const [pa, pg, ps] = first.partIds;
    const pasted = out.wires.filter((w) => first.wireIds.includes(w.id)).map((w) => [w.from, w.to]);
    expect(pasted).toEqual([[`${pa}.out`, `${pg}.in0`], [`${pg}.out`, `${ps}.in`]]);
    expect(new Set(out.parts.map((p) => p.id)).size).toBe(out.parts.length);
  });
});

describe('replaceWithBoard', () => {
  it('turns any document into the target board, as one transaction', () => {
    const doc = fresh();
    addPart(doc, { id: 'extra', kind: 'probe', x: 1, y: 1 }, ME);
    connect(doc, 'b.out', 'g2.in0', ME);
    movePart(doc, [{ id: 'a', x: 999, y: 999 }], ME);
    setPartField(doc, 'a', 'on', true, ME);
    const target: BoardFile = { ...BOARD, title: 'Restored', parts: [BOARD.parts[4], ...BOARD.parts.slice(0, 4)] };
    const log = txLog(doc);
    replaceWithBoard(doc, target, ME);
    expect(log).toEqual([ME]);
    expect(JSON.stringify(docToBoard(doc))).toBe(JSON.stringify(target));
  });
  it('can be undone by the caller’s UndoManager', () => {
    const doc = fresh();
    const before = JSON.stringify(docToBoard(doc));
    const undo = new Y.UndoManager([partsMap(doc), wiresMap(doc), doc.getMap('meta')], { trackedOrigins: new Set([ME]) });
    replaceWithBoard(doc, { ...BOARD, parts: [], wires: [], title: 'Empty' }, ME);
    expect(docToBoard(doc).parts).toEqual([]);
    undo.undo();
    expect(JSON.stringify(docToBoard(doc))).toBe(before);
  });
  it('property: from any random document, replace gives exactly the target', () => {
    const partArb = fc.record({
      id: fc.constantFrom('a', 'b', 'g1', 'g2', 's', 'z1', 'z2'),
      x: fc.integer({ min: 0, max: 50 }).map((n) => n * 20),
      y: fc.integer({ min: 0, max: 50 }).map((n) => n * 20),
      kind: fc.constantFrom('lamp', 'not', 'dff'),
    });
    fc.assert(fc.property(fc.array(partArb, { maxLength: 8 }), (parts) => {
      const doc = new Y.Doc();
      for (const p of parts) addPart(doc, p as Part, ME);
      connect(doc, 'z1.out', 'z2.in0', ME);
      replaceWithBoard(doc, BOARD, ME);
      return JSON.stringify(docToBoard(doc)) === JSON.stringify(BOARD);
    }), { numRuns: 100 });
  });
});

describe('dedupeSignalLabels', () => {
  it('repairs labels two replicas made equal concurrently, the same way on both', () => {
    const d1 = fresh();
    const d2 = new Y.Doc();
    Y.applyUpdate(d2, Y.encodeStateAsUpdate(d1));
    relabelPart(d1, 'a', 'X', ME); // each replica alone is valid
    relabelPart(d2, 'b', 'X', ME);
    Y.applyUpdate(d1, Y.encodeStateAsUpdate(d2));
    Y.applyUpdate(d2, Y.encodeStateAsUpdate(d1));
    expect(docToBoard(d1).parts.filter((p) => p.label === 'X')).toHaveLength(2);
    expect(dedupeSignalLabels(d1, ME)).toEqual(['b']);
    Y.applyUpdate(d2, Y.encodeStateAsUpdate(d1));
    expect(docToBoard(d2).parts.slice(0, 2).map((p) => p.label)).toEqual(['X', 'X_2']);
    expect(dedupeSignalLabels(d2, ME)).toEqual([]);
  });
});

describe('repairBoard', () => {
  it('removes wires to a part deleted concurrently and to pins a gate lost', () => {
    const d1 = fresh();
    const d2 = new Y.Doc();
    Y.applyUpdate(d2, Y.encodeStateAsUpdate(d1));
    deleteSelection(d1, ['g2'], [], ME);
    const r = connect(d2, 'b.out', 'g2.in0', ME);
    Y.applyUpdate(d1, Y.encodeStateAsUpdate(d2));
    expect(wiresMap(d1).has((r as { id: string }).id)).toBe(true); // the merge kept the dangling wire
    const log = txLog(d1);
    expect(repairBoard(d1, ME)).toEqual({ wires: [(r as { id: string }).id], relabelled: [], parts: [] });
    expect(log).toEqual([ME]);
    expect(repairBoard(d1, ME)).toEqual({ wires: [], relabelled: [], parts: [] });
  });
});

describe('convergence', () => {
  it('property: two replicas applying random edits in any interleaving converge', () => {
    type Op = { who: 0 | 1; kind: 'move' | 'add' | 'del' | 'wire' | 'rot'; n: number };
    const opArb = fc.record({ who: fc.constantFrom(0 as const, 1 as const), kind: fc.constantFrom('move', 'add', 'del', 'wire', 'rot') as fc.Arbitrary<Op['kind']>, n: fc.integer({ min: 0, max: 30 }) });
    fc.assert(fc.property(fc.array(opArb, { maxLength: 30 }), fc.array(fc.boolean(), { maxLength: 30 }), (ops, syncs) => {
      const docs = [fresh(), new Y.Doc()];
      Y.applyUpdate(docs[1], Y.encodeStateAsUpdate(docs[0]));
      ops.forEach((op, i) => {
        const doc = docs[op.who];
        const ids = [...partsMap(doc).keys()].sort();
        const id = ids[op.n % Math.max(ids.length, 1)];
        switch (op.kind) {
          case 'move': if (id) movePart(doc, [{ id, x: op.n * 20, y: 40 }], ME); break;
          case 'add': addPart(doc, { id: '', kind: 'not', x: op.n, y: 0 }, ME); break;
          case 'del': if (id) deleteSelection(doc, [id], [], ME); break;
          case 'wire': if (ids.length > 1) connect(doc, `${id}.out`, `${ids[(op.n + 1) % ids.length]}.in0`, ME); break;
          case 'rot': if (id) rotateParts(doc, [id], ME); break;
        }
        if (syncs[i]) {
          Y.applyUpdate(docs[1], Y.encodeStateAsUpdate(docs[0], Y.encodeStateVector(docs[1])));
          Y.applyUpdate(docs[0], Y.encodeStateAsUpdate(docs[1], Y.encodeStateVector(docs[0])));
        }
      });
      Y.applyUpdate(docs[1], Y.encodeStateAsUpdate(docs[0]));
      Y.applyUpdate(docs[0], Y.encodeStateAsUpdate(docs[1]));
      return JSON.stringify(docToBoard(docs[0])) === JSON.stringify(docToBoard(docs[1]));
    }), { numRuns: 150 });
  });
});
