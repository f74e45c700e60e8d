import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { boardToDoc, docToBoard, parseBoardFile, type BoardFile, type Module } from '../../../shared/board';
import { libraryCopies, placeFromLibrary, updateFromLibrary, type LibraryContent } from './library-edits';

const HALF = {
  id: 'half', title: 'Half adder',
  parts: [
    { id: 'a', kind: 'port', dir: 'in', label: 'A', x: 0, y: 0 },
    { id: 'b', kind: 'port', dir: 'in', label: 'B', x: 0, y: 80 },
    { id: 'g1', kind: 'xor', inputs: 2, x: 200, y: 0 },
    { id: 'g2', kind: 'and', inputs: 2, x: 200, y: 80 },
    { id: 's', kind: 'port', dir: 'out', label: 'S', x: 360, y: 0 },
    { id: 'c', kind: 'port', dir: 'out', label: 'C', x: 360, y: 80 },
  ],
  wires: [
    { id: 'w1', from: 'a.out', to: 'g1.in0' }, { id: 'w2', from: 'b.out', to: 'g1.in1' },
    { id: 'w3', from: 'a.out', to: 'g2.in0' }, { id: 'w4', from: 'b.out', to: 'g2.in1' },
    { id: 'w5', from: 'g1.out', to: 's.in' }, { id: 'w6', from: 'g2.out', to: 'c.in' },
  ],
} as Module;
const PAIR = (x: number) => ({
  id: 'pair', title: 'Two half adders',
  parts: [
    { id: 'a', kind: 'port', dir: 'in', label: 'A', x: 0, y: 0 },
    { id: 'u1', kind: 'module', module: 'half', x: 160, y: 0 },
    { id: 'u2', kind: 'module', module: 'half', x, y: 0 },
    { id: 's', kind: 'port', dir: 'out', label: 'S', x: 560, y: 0 },
  ],
  wires: [
    { id: 'w1', from: 'a.out', to: 'u1.A' }, { id: 'w2', from: 'a.out', to: 'u1.B' },
    { id: 'w3', from: 'u1.S', to: 'u2.A' }, { id: 'w4', from: 'u1.C', to: 'u2.B' },
    { id: 'w5', from: 'u2.S', to: 's.in' },
  ],
}) as Module;

function docOf(modules: unknown[]): Y.Doc {
  const parsed = parseBoardFile({ format: 'gatefold-board', version: 1, title: 'Room 14', parts: [], wires: [], modules });
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
  const doc = new Y.Doc();
  boardToDoc(parsed.board, doc);
  return doc;
}
const valid = (file: BoardFile) => parseBoardFile(file).ok;

describe('library edits on a board document', () => {
  it('places a copy with its origin, then updates it to a newer version, reusing an unchanged nested module', () => {
    const own = { id: 'half', title: 'Our own', parts: [{ id: 'x', kind: 'port', dir: 'in', label: 'X', x: 0, y: 0 }], wires: [] };
    const doc = docOf([own]);
    const v1: LibraryContent = { moduleId: 'pair', modules: [PAIR(360), HALF], origin: { library: '7', version: 1 } };
    const placed = placeFromLibrary(doc, v1, 100, 100, 'me');
    expect(placed.moduleId).toBe('pair');
    expect(libraryCopies(doc).get('7')).toEqual({ moduleId: 'pair', version: 1 });
    let file = docToBoard(doc);
    expect(valid(file)).toBe(true);
    expect(file.parts).toEqual([{ id: placed.instanceId, kind: 'module', module: 'pair', x: 100, y: 100 }]);
    expect(file.modules!.map((m) => m.id).sort()).toEqual(['half', 'half_2', 'pair']);

    updateFromLibrary(doc, 'pair', { moduleId: 'pair', modules: [PAIR(420), HALF], origin: { library: '7', version: 2 } }, 'me');
    file = docToBoard(doc);
    expect(valid(file)).toBe(true);
    // the unchanged half adder copy is reused, not added again; the board's own "half" is untouched
    expect(file.modules!.map((m) => m.id).sort()).toEqual(['half', 'half_2', 'pair']);
    const pair = file.modules!.find((m) => m.id === 'pair')!;
    expect(pair.origin).toEqual({ library: '7', version: 2 });
    expect(pair.parts.find((p) => p.id === 'u2')).toMatchObject({ x: 420, module: 'half_2' });
    expect(file.modules!.find((m) => m.id === 'half')!.title).toBe('Our own');
    expect(libraryCopies(doc).get('7')).toEqual({ moduleId: 'pair', version: 2 });
  });

  it('adds a nested module whose inside changed in the new version', () => {
    const doc = docOf([]);
    placeFromLibrary(doc, { moduleId: 'pair', modules: [PAIR(360), HALF], origin: { library: '3', version: 1 } }, 0, 0, 'me');
    const changedHalf = { ...HALF, parts: HALF.parts.map((p) => (p.id === 'g2' ? { ...p, x: 240 } : p)) } as Module;
    updateFromLibrary(doc, 'pair', { moduleId: 'pair', modules: [PAIR(360), changedHalf], origin: { library: '3', version: 2 } }, 'me');
    const file = docToBoard(doc);
    expect(valid(file)).toBe(true);
    const pair = file.modules!.find((m) => m.id === 'pair')!;
    const used = pair.parts.find((p) => p.id === 'u1') as { module: string };
    expect(used.module).toBe('half_2');
    expect(file.modules!.find((m) => m.id === 'half_2')!.parts.find((p) => p.id === 'g2')!.x).toBe(240);
  });

  it('places a second instance of an entry on the board\'s copy, and refuses it inside a module the copy uses', () => {
    const doc = docOf([]);
    const v1: LibraryContent = { moduleId: 'pair', modules: [PAIR(360), HALF], origin: { library: '9', version: 1 } };
    const first = placeFromLibrary(doc, v1, 0, 0, 'me');
    const second = placeFromLibrary(doc, { ...v1, origin: { library: '9', version: 2 } }, 200, 0, 'me');
    expect(second.moduleId).toBe(first.moduleId);
    expect(second.instanceId).not.toBe(first.instanceId);
    let file = docToBoard(doc);
    expect(file.modules!.map((m) => m.id).sort()).toEqual(['half', 'pair']);
    expect(file.parts.map((p) => (p as { module?: string }).module)).toEqual(['pair', 'pair']);
    // inside "half" (which "pair" uses) an instance of "pair" would make a cycle: refused, nothing changes
    expect(() => placeFromLibrary(doc, v1, 0, 0, 'me', 'half')).toThrow(/cannot contain itself/);
    // inside a module of the board's own that "pair" does not use, it is placed
    const own = placeFromLibrary(doc, { moduleId: 'solo', modules: [{ ...HALF, id: 'solo' }], origin: { library: '10', version: 1 } }, 0, 0, 'me');
    placeFromLibrary(doc, v1, 40, 40, 'me', own.moduleId);
    file = docToBoard(doc);
    expect(valid(file)).toBe(true);
    expect(file.modules!.find((m) => m.id === 'solo')!.parts.filter((p) => p.kind === 'module').map((p) => (p as { module: string }).module)).toEqual(['pair']);
  });
});
