import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { movePart, setPartField, connect } from '../../../../shared/board';
import { boardToDoc, docToBoard } from '../../../../shared/board';
import type { BoardFile } from '../../../../shared/board';
import type { Level } from '../../../../shared/sim';
import { byId, deriveEdges, deriveNodes, mergeLocal, PIN_BOX, pinLevels, stabilizeBoard } from './derive-flow';
import { placedShape } from '../lib/geometry';
import { contractHalfAdder } from '../../../../tests/helpers/boards';

// The half adder of CONTRACTS §1 (our own example board).
const HALF_ADDER: BoardFile = contractHalfAdder();

function liveDoc(): Y.Doc {
  const doc = new Y.Doc();
  boardToDoc(HALF_ADDER, doc);
  return doc;
}

describe('stabilizeBoard', () => {
  it('returns the previous board object when the document did not change', () => {
    const doc = liveDoc();
    const first = stabilizeBoard(null, docToBoard(doc));
    expect(stabilizeBoard(first, docToBoard(doc))).toBe(first);
  });

  it('keeps every unchanged part and wire object and replaces only the moved part', () => {
    const doc = liveDoc();
    const origin = {};
    const first = stabilizeBoard(null, docToBoard(doc));
    movePart(doc, [{ id: 'g1', x: 220, y: 60 }], origin);
    const next = stabilizeBoard(first, docToBoard(doc));
    expect(next).not.toBe(first);
    next.parts.forEach((p, i) => (p.id === 'g1' ? expect(p).not.toBe(first.parts[i]) : expect(p).toBe(first.parts[i])));
    expect(next.parts.find((p) => p.id === 'g1')!.x).toBe(220);
    next.wires.forEach((w, i) => expect(w).toBe(first.wires[i]));
  });
});

describe('deriveNodes', () => {
  const base = (board: BoardFile, extra: Partial<Parameters<typeof deriveNodes>[0]> = {}) => ({ parts: board.parts, readOnly: false, ...extra });

  it('makes one node per part with the part in its data, positioned at the part', () => {
    const nodes = deriveNodes(base(HALF_ADDER), new Map());
    expect(nodes.map((n) => n.id)).toEqual(['a', 'b', 'g1', 'g2', 's', 'c']);
    expect(nodes[2].position).toEqual({ x: 200, y: 60 });
    expect(nodes[2].data.part).toBe(HALF_ADDER.parts[2]);
    // a 2-input gate is 100 × 60 (inputs on the 20 px grid, see lib/geometry)
    expect([nodes[2].width, nodes[2].height]).toEqual([100, 60]);
  });

  it('keeps node identity for parts whose object and overlays did not change', () => {
    const doc = liveDoc();
    const b1 = stabilizeBoard(null, docToBoard(doc));
    const n1 = deriveNodes(base(b1), new Map());
    setPartField(doc, 'a', 'on', true, {});
    const b2 = stabilizeBoard(b1, docToBoard(doc));
    const n2 = deriveNodes(base(b2), byId(n1));
    expect(n2[0]).not.toBe(n1[0]);
    expect(n2[0].data.shown).toBe(true);
    for (let i = 1; i < n1.length; i++) expect(n2[i]).toBe(n1[i]);
  });

  it('gives a part a new node only when its pin levels change', () => {
    const l1 = new Map<string, Level>([['a.out', '0'], ['a.outn', '1'], ['s.in', '0']]);
    const n1 = deriveNodes(base(HALF_ADDER, { levels: l1 }), new Map());
    const l2 = new Map<string, Level>([['a.out', '0'], ['a.outn', '1'], ['s.in', '1']]);
    const n2 = deriveNodes(base(HALF_ADDER, { levels: l2 }), byId(n1));
    expect(n2[0]).toBe(n1[0]);
    expect(n2[4]).not.toBe(n1[4]);
    expect(n2[4].data.levels).toBe('1');
    expect(n1[0].data.levels).toBe('01');
  });

  it('shows a viewer\u2019s try-out value instead of the document\u2019s, and a collaborator\u2019s live drag position', () => {
    const nodes = deriveNodes(base(HALF_ADDER, {
      tryOut: new Map([['b', true]]),
      remoteDrag: new Map([['g2', { x: 500, y: 20 }]]),
      remoteSelection: new Map([['c', '#4cc9f0']]),
      readOnly: true,
    }), new Map());
    expect(nodes[1].data.shown).toBe(true);
    expect(nodes[0].data.shown).toBe(false);
    expect(nodes[3].position).toEqual({ x: 500, y: 20 });
    expect(nodes[5].data.remoteColor).toBe('#4cc9f0');
    expect(nodes.every((n) => n.draggable === false && n.connectable === false)).toBe(true);
  });
});

describe('pinLevels', () => {
  it('lists the levels in pin order (inputs, then outputs) with - for unknown pins', () => {
    const levels = new Map<string, Level>([['g1.in0', '1'], ['g1.out', 'X']]);
    expect(pinLevels(HALF_ADDER.parts[2], levels)).toBe('1-X');
    expect(pinLevels(HALF_ADDER.parts[2], undefined)).toBe('');
  });
});

describe('deriveEdges', () => {
  it('maps each wire to an edge between the pins and colours it by the level of its from pin', () => {
    const levels = new Map<string, Level>([['a.out', '1']]);
    const edges = deriveEdges(HALF_ADDER.wires, levels, false, new Map());
    expect(edges[0]).toMatchObject({ id: 'w1', source: 'a', sourceHandle: 'out', target: 'g1', targetHandle: 'in0', data: { level: '1' } });
    expect(edges[1].data?.level).toBeUndefined();
    const again = deriveEdges(HALF_ADDER.wires, levels, false, byId(edges));
    again.forEach((e, i) => expect(e).toBe(edges[i]));
    const changed = deriveEdges(HALF_ADDER.wires, new Map<string, Level>([['a.out', '0']]), false, byId(edges));
    expect(changed[0]).not.toBe(edges[0]);
    expect(changed[0].data?.level).toBe('0');
    expect(changed[4]).toBe(edges[4]);
  });

  it('follows a wire added through the connect edit', () => {
    const doc = liveDoc();
    const result = connect(doc, 'g1.out', 'c.in', {});
    expect(result.ok).toBe(false); // c.in already has a wire (w6): an input takes one wire
    const edges = deriveEdges(docToBoard(doc).wires, undefined, false, new Map());
    expect(edges).toHaveLength(6);
  });
});

describe('mergeLocal', () => {
  it('keeps React Flow\u2019s local selection and an ongoing drag position across a document change', () => {
    const bases = new Map();
    const d1 = deriveNodes({ parts: HALF_ADDER.parts, readOnly: false }, new Map());
    const local1 = mergeLocal(d1, [], bases);
    expect(local1).toEqual(d1);
    const local = local1.map((n) => (n.id === 'a' ? { ...n, selected: true } : n.id === 'g1' ? { ...n, dragging: true, position: { x: 999, y: 9 } } : n));
    // unchanged derivation → the local list as it is
    expect(mergeLocal(d1, local, bases)).toBe(local);
    const moved = HALF_ADDER.parts.map((p) => (p.id === 'a' || p.id === 'g1' ? { ...p, x: p.x + 20 } : p));
    const d2 = deriveNodes({ parts: moved, readOnly: false }, byId(d1));
    const merged = mergeLocal(d2, local, bases);
    const a = merged.find((n) => n.id === 'a')!;
    const g1 = merged.find((n) => n.id === 'g1')!;
    expect(a.selected).toBe(true);
    expect(a.position).toEqual({ x: 60, y: 40 });
    expect(g1.position).toEqual({ x: 999, y: 9 }); // the user's drag wins until it stops
    expect(merged.find((n) => n.id === 'b')).toBe(local.find((n) => n.id === 'b'));
  });
});

describe('deriveNodes with bench badges', () => {
  it('keeps the node when a new badge object says the same thing', () => {
    const parts = HALF_ADDER.parts;
    const n1 = deriveNodes({ parts, readOnly: false, badges: new Map([['s', { tone: 'undriven' as const, text: 'no driver' }]]) }, new Map());
    const n2 = deriveNodes({ parts, readOnly: false, badges: new Map([['s', { tone: 'undriven' as const, text: 'no driver' }]]) }, byId(n1));
    expect(n2[4]).toBe(n1[4]);
    const n3 = deriveNodes({ parts, readOnly: false, badges: new Map([['s', { tone: 'conflict' as const, text: 'two drivers' }]]) }, byId(n2));
    expect(n3[4]).not.toBe(n2[4]);
    expect(n3[4].data.badge?.tone).toBe('conflict');
  });
});

describe('deriveNodes pin boxes', () => {
  it('gives each node its size and a handle box per pin, centred on the pin, so React Flow measures nothing', () => {
    const nodes = deriveNodes({ parts: HALF_ADDER.parts, readOnly: false }, new Map());
    const g1 = nodes[2];
    expect(g1.measured).toEqual({ width: 100, height: 60 });
    const spots = placedShape(HALF_ADDER.parts[2]).pins;
    expect(g1.handles).toHaveLength(spots.length);
    g1.handles!.forEach((h, i) => {
      expect(h.id).toBe(spots[i].pin);
      expect(h.type).toBe(spots[i].output ? 'source' : 'target');
      expect(h.position).toBe(spots[i].side);
      expect([h.x + PIN_BOX / 2, h.y + PIN_BOX / 2]).toEqual([spots[i].x, spots[i].y]);
    });
  });
});
