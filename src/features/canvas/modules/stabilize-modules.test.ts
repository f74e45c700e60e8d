import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { addPart, boardToDoc, connect, docToBoard, moduleDoc, parseBoardFile } from '../../../../shared/board';
import { stabilizeBoard } from '../flow/derive-flow';
import { stabilizeModules } from './stabilize-modules';

// A board with one module (a NOT between an in port and an out port) and one instance of it.
function liveDoc(): Y.Doc {
  const parsed = parseBoardFile({
    format: 'gatefold-board', version: 1, title: 'Room 14 inverter', family: 'ideal',
    parts: [{ id: 'u1', kind: 'module', module: 'inv', x: 100, y: 0 }],
    wires: [],
    modules: [{
      id: 'inv', title: 'Inverter',
      parts: [
        { id: 'pa', kind: 'port', dir: 'in', label: 'A', x: 0, y: 0 },
        { id: 'g1', kind: 'not', x: 120, y: 0 },
        { id: 'py', kind: 'port', dir: 'out', label: 'Y', x: 240, y: 0 },
      ],
      wires: [{ id: 'w1', from: 'pa.out', to: 'g1.in0' }, { id: 'w2', from: 'g1.out', to: 'py.in' }],
    }],
  });
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
  const doc = new Y.Doc();
  boardToDoc(parsed.board, doc);
  return doc;
}

describe('stabilizeModules', () => {
  it('gives the previous list back when no module changed', () => {
    const doc = liveDoc();
    const first = docToBoard(doc).modules;
    expect(stabilizeModules(first, docToBoard(doc).modules)).toBe(first);
  });

  it('replaces only the module whose inside changed', () => {
    const doc = liveDoc();
    const first = docToBoard(doc).modules!;
    addPart(moduleDoc(doc, 'inv'), { id: '', kind: 'and', inputs: 2, x: 120, y: 80 }, 'me');
    const next = stabilizeModules(first, docToBoard(doc).modules)!;
    expect(next).not.toBe(first);
    expect(next[0]).not.toBe(first[0]);
    expect(next[0].parts.map((p) => p.kind)).toEqual(['port', 'not', 'port', 'and']);
  });
});

describe('stabilizeBoard with modules', () => {
  it('gives a new board when only a module inside changed, keeping the top-level parts', () => {
    const doc = liveDoc();
    const first = stabilizeBoard(null, docToBoard(doc));
    expect(stabilizeBoard(first, docToBoard(doc))).toBe(first);
    const inside = moduleDoc(doc, 'inv');
    const id = addPart(inside, { id: '', kind: 'and', inputs: 2, x: 120, y: 80 }, 'me');
    expect(connect(inside, 'g1.out', `${id}.in0`, 'me').ok).toBe(true);
    const next = stabilizeBoard(first, docToBoard(doc));
    expect(next).not.toBe(first);
    expect(next.parts[0]).toBe(first.parts[0]);
    const inv = next.modules!.find((m) => m.id === 'inv')!;
    expect(inv.parts.some((p) => p.id === id)).toBe(true);
    expect(inv.wires).toHaveLength(3);
  });
});
