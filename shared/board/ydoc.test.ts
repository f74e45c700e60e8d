import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { parseBoardFile } from './validate';
import type { BoardFile } from './schema';
import { boardToDoc, canonicalBoard, docToBoard, partsMap, wiresMap } from './ydoc';

/** The half adder of CONTRACTS §1, in the key order an export uses. */
const HALF_ADDER: BoardFile = {
  format: 'gatefold-board', version: 1, title: 'Half adder', family: 'ideal',
  parts: [
    { id: 'a', kind: 'switch', label: 'A', x: 40, y: 40, on: false },
    { id: 'b', kind: 'switch', label: 'B', x: 40, y: 120, on: true },
    { id: 'g1', kind: 'xor', inputs: 2, x: 200, y: 60 },
    { id: 'g2', kind: 'and', inputs: 2, x: 200, y: 140, rotation: 90 },
    { id: 's', kind: 'lamp', label: 'S', x: 360, y: 60 },
    { id: 'c', kind: 'lamp', label: 'C', x: 360, y: 140 },
    { id: 'n', kind: 'note', x: 40, y: 200, text: 'sum and carry' },
    { id: 'ff', kind: 'dff', x: 40, y: 300, init: 1 },
  ],
  wires: [
    { id: 'w1', from: 'a.out', to: 'g1.in0' }, { id: 'w2', from: 'b.out', to: 'g1.in1' },
    { id: 'w3', from: 'a.out', to: 'g2.in0' }, { id: 'w4', from: 'b.out', to: 'g2.in1' },
    { id: 'w5', from: 'g1.out', to: 's.in' }, { id: 'w6', from: 'g2.out', to: 'c.in' },
  ],
};

describe('boardToDoc / docToBoard', () => {
  it('round-trips a board file byte for byte', () => {
    const doc = new Y.Doc();
    boardToDoc(HALF_ADDER, doc);
    expect(JSON.stringify(docToBoard(doc))).toBe(JSON.stringify(HALF_ADDER));
  });

  it('keeps the file order of parts and wires, not the id order', () => {
    const board: BoardFile = { ...HALF_ADDER, parts: [...HALF_ADDER.parts].reverse(), wires: [...HALF_ADDER.wires].reverse() };
    const doc = new Y.Doc();
    boardToDoc(board, doc);
    const out = docToBoard(doc);
    expect(out.parts.map((p) => p.id)).toEqual(board.parts.map((p) => p.id));
    expect(out.wires.map((w) => w.id)).toEqual(board.wires.map((w) => w.id));
  });

  it('survives encoding to an update and loading into a fresh document', () => {
    const doc = new Y.Doc();
    boardToDoc(HALF_ADDER, doc);
    const copy = new Y.Doc();
    Y.applyUpdate(copy, Y.encodeStateAsUpdate(doc));
    expect(docToBoard(copy)).toEqual(HALF_ADDER);
  });

  it('never exports the order field and stores plain values', () => {
    const doc = new Y.Doc();
    boardToDoc(HALF_ADDER, doc);
    expect(partsMap(doc).get('a')!.get('order')).toBe(1);
    expect(JSON.stringify(docToBoard(doc))).not.toContain('order');
    expect(wiresMap(doc).get('w5')!.toJSON()).toEqual({ id: 'w5', from: 'g1.out', to: 's.in', order: 5 });
  });

  it('runs as one transaction with the given origin', () => {
    const doc = new Y.Doc();
    const origin = { who: 'test' };
    const seen: unknown[] = [];
    doc.on('afterTransaction', (tr: Y.Transaction) => seen.push(tr.origin));
    boardToDoc(HALF_ADDER, doc, origin);
    expect(seen).toEqual([origin]);
  });

  it('gives an empty document the default title and family', () => {
    expect(docToBoard(new Y.Doc())).toEqual({ format: 'gatefold-board', version: 1, title: 'Untitled board', family: 'ideal', parts: [], wires: [] });
  });

  it('leaves out wires whose part is gone (a concurrent delete), so the export stays valid', () => {
    const doc = new Y.Doc();
    boardToDoc(HALF_ADDER, doc);
    partsMap(doc).delete('g1');
    const out = docToBoard(doc);
    expect(out.wires.map((w) => w.id)).toEqual(['w3', 'w4', 'w6']);
    expect(parseBoardFile(JSON.parse(JSON.stringify(out))).ok).toBe(true);
  });

  it('canonicalBoard of a parsed file with a different key order gives the export order', () => {
    const raw = { format: 'gatefold-board', version: 1, title: 'T', family: 'ideal', parts: [{ x: 1, y: 2, kind: 'switch', id: 'a', label: 'A' }], wires: [] };
    const parsed = parseBoardFile(raw);
    if (!parsed.ok) throw new Error('invalid');
    expect(JSON.stringify(canonicalBoard(parsed.board).parts[0])).toBe('{"id":"a","kind":"switch","label":"A","x":1,"y":2,"on":false}');
  });
});
