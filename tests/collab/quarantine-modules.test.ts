/**
 * Repair INSIDE modules (docs/decisions/004-modules.md): a stored board whose modules hold what no board
 * file allows — a part or wire entry of the wrong shape, a module that is not one, a wire to a part that is
 * gone, two ports with one label, a switch inside a module, an instance of a missing module, a nesting
 * cycle — loads with those entries quarantined (and logged) and exports a valid board file; and over the
 * real room server, concurrent edits inside a module that merge into an invalid one are repaired for
 * everyone.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import * as Y from 'yjs';
import {
  addPart, boardToDoc, checkDoc, connect, deleteSelection, docToBoard, moduleDoc, modulesMap, parseBoardFile, partToYMap, quarantineDoc,
  wireToYMap, type BoardFile, type YRecord,
} from '../../shared/board';
import { compileBoard, Simulator } from '../../shared/sim';
import { loadBoardDoc } from '../../server/boards-live';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { DOOR_LAMP } from './door-lamp';
import { addMember, connectClient, createBoard, exportText, signUp, waitFor, type User } from './helpers';

const ME = { local: 'me' };

// Room 14's door lamp (./door-lamp.ts) with two modules of one port each, for the nesting tests.
const DOOR: BoardFile = {
  ...DOOR_LAMP,
  modules: [
    ...DOOR_LAMP.modules!,
    { id: 'loop1', title: 'Loop one', parts: [{ id: 'pi', kind: 'port', dir: 'in', label: 'I', x: 0, y: 0 }], wires: [] },
    { id: 'loop2', title: 'Loop two', parts: [{ id: 'pi', kind: 'port', dir: 'in', label: 'I', x: 0, y: 0 }], wires: [] },
  ],
};

const insideOf = (doc: Y.Doc, id: string) => modulesMap(doc).get(id) as Y.Map<unknown>;
const mapOf = (doc: Y.Doc, id: string, which: 'parts' | 'wires') => insideOf(doc, id).get(which) as Y.Map<unknown>;

/** Writes into a board document, straight to the maps, what servers accepted before updates were checked. */
function poison(doc: Y.Doc): void {
  doc.transact(() => {
    const parts = mapOf(doc, 'inv', 'parts');
    const wires = mapOf(doc, 'inv', 'wires');
    // shape problems inside a module: a gate with 1000 inputs, a wire that is a number
    parts.set('g2', partToYMap({ id: 'g2', kind: 'and', inputs: 2, x: 120, y: 80 }, 4));
    (parts.get('g2') as YRecord).set('inputs', 1000);
    wires.set('wx', 42);
    // merge problems inside a module: a wire to a part that is gone, a second port "A", a switch, two lamps "MON"
    wires.set('wd', wireToYMap({ id: 'wd', from: 'g1.out', to: 'ghost.in0' }, 3));
    parts.set('pb', partToYMap({ id: 'pb', kind: 'port', dir: 'in', label: 'A', x: 0, y: 80 }, 5));
    parts.set('sw', partToYMap({ id: 'sw', kind: 'switch', label: 'S', on: false, x: 0, y: 160 }, 6));
    parts.set('m1', partToYMap({ id: 'm1', kind: 'lamp', label: 'MON', x: 240, y: 80 }, 7));
    parts.set('m2', partToYMap({ id: 'm2', kind: 'lamp', label: 'MON', x: 240, y: 160 }, 8));
    // a nesting cycle (loop1 uses loop2 uses loop1), and a title that is not text
    mapOf(doc, 'loop1', 'parts').set('u2', partToYMap({ id: 'u2', kind: 'module', module: 'loop2', x: 80, y: 0 }, 2));
    mapOf(doc, 'loop2', 'parts').set('u2', partToYMap({ id: 'u2', kind: 'module', module: 'loop1', x: 80, y: 0 }, 2));
    insideOf(doc, 'loop1').set('title', 7);
    // a module entry that is not a module, and on the top level an instance of a module that is not there
    modulesMap(doc).set('junk', 'not a module' as never);
    const top = doc.getMap<YRecord>('parts');
    top.set('u9', partToYMap({ id: 'u9', kind: 'module', module: 'gone', x: 160, y: 120 }, 4));
    doc.getMap<YRecord>('wires').set('w9', wireToYMap({ id: 'w9', from: 'a.out', to: 'u9.X' }, 3));
  });
}

function poisonedDoc(): Y.Doc {
  const doc = new Y.Doc();
  boardToDoc(DOOR, doc);
  poison(doc);
  return doc;
}

/** OPEN with KEY set to `key`, simulated on the exported board. */
function openWith(board: BoardFile, key: boolean): string {
  const withKey = { ...board, parts: board.parts.map((p) => (p.id === 'a' ? { ...p, on: key } : p)) } as BoardFile;
  const sim = new Simulator(compileBoard(withKey));
  sim.settle();
  return sim.outputValues().OPEN;
}

describe('quarantineDoc inside modules', () => {
  it('removes or repairs every bad entry inside the modules; the board file passes its check and still works', () => {
    const doc = poisonedDoc();
    const before = checkDoc(doc).map((p) => p.message).join('\n');
    expect(before).toMatch(/module "inv": part "g2": inputs/);
    expect(before).toMatch(/module "junk": is not a module/);

    const q = quarantineDoc(doc, ME);
    expect(q.removed.filter((r) => r.where === 'modules').map((r) => r.key).sort()).toEqual(['inv/g2', 'inv/wx', 'junk', 'loop1/title']);
    expect(q.repaired.parts.sort()).toEqual(['inv/sw', 'loop2/u2', 'u9']);
    expect(q.repaired.relabelled.sort()).toEqual(['inv/m2', 'inv/pb']);
    expect(q.repaired.wires.sort()).toEqual(['inv/wd', 'w9']);

    const board = docToBoard(doc);
    const parsed = parseBoardFile(board);
    expect(parsed.ok ? [] : parsed.problems).toEqual([]);
    expect(checkDoc(doc)).toEqual([]);
    const inv = board.modules!.find((m) => m.id === 'inv')!;
    expect(inv.parts.map((p) => [p.id, p.label])).toEqual([['pa', 'A'], ['g1', undefined], ['py', 'Y'], ['pb', 'A_2'], ['m1', 'MON'], ['m2', 'MON_2']]);
    expect(inv.wires.map((w) => w.id)).toEqual(['w1', 'w2']);
    expect(board.modules!.find((m) => m.id === 'loop1')!.title).toBe('loop1');
    expect(board.modules!.find((m) => m.id === 'loop1')!.parts.map((p) => p.id)).toEqual(['pi', 'u2']);
    // the good part of the board is untouched: the lamp is the inverse of the key through the module
    expect(board.parts.map((p) => p.id)).toEqual(['a', 'u1', 'l1']);
    expect([openWith(board, false), openWith(board, true)]).toEqual(['1', '0']);
    // a second pass finds nothing left to do
    const again = quarantineDoc(doc, ME);
    expect([again.removed, again.repaired]).toEqual([[], { wires: [], relabelled: [], parts: [] }]);
  });
});

describe('a stored board whose modules fail the board check, on the server', () => {
  let server: TestServer;
  let owner: User;
  let editor: User;

  beforeAll(async () => {
    server = await startTestServer({ logErrors: false });
    [owner, editor] = await Promise.all([signUp(server, 'Owner'), signUp(server, 'Editor')]);
  });
  afterAll(async () => {
    await server.close();
  });

  async function storePoisoned(boardId: number): Promise<void> {
    const store = server.ctx.boardRegistry.store;
    const seq = await store.lastSeq(boardId);
    await store.append(boardId, [{ seq: seq + 1, data: Y.encodeStateAsUpdate(poisonedDoc()), userId: null, createdAt: new Date().toISOString() }]);
  }

  it('exports a valid board file without the bad entries inside modules, with no room open', async () => {
    const boardId = await createBoard(server, owner, 'Old board with modules');
    await storePoisoned(boardId);
    const file = JSON.parse(await exportText(server, owner, boardId)) as BoardFile;
    const parsed = parseBoardFile(file);
    expect(parsed.ok ? [] : parsed.problems).toEqual([]);
    expect(file.modules!.map((m) => m.id)).toEqual(['inv', 'loop1', 'loop2']);
    expect(file.modules![0].parts.map((p) => p.id)).toEqual(['pa', 'g1', 'py', 'pb', 'm1', 'm2']);
  });

  it('opens in a live room with the bad entries inside modules removed by a stored server edit, and logged', async () => {
    const boardId = await createBoard(server, owner, 'Old board with modules');
    await storePoisoned(boardId);
    const warn = vi.spyOn(console, 'warn').mockImplementation(() => undefined);
    const c = connectClient(server, boardId, owner.cookie);
    try {
      await c.synced;
      const room = server.ctx.boardRegistry.rooms.get(boardId)!;
      expect(room.quarantine?.removed.filter((r) => r.where === 'modules').map((r) => r.key).sort()).toEqual(['inv/g2', 'inv/wx', 'junk', 'loop1/title']);
      expect(room.quarantine?.repaired.parts.sort()).toEqual(['inv/sw', 'loop2/u2', 'u9']);
      const logged = warn.mock.calls.map((args) => args.join(' ')).find((line) => line.includes(`board ${boardId}:`));
      expect(logged).toMatch(/did not pass the board check/);
      expect(logged).toContain('modules "inv/g2"');
      expect(logged).toContain('inv/sw');
      await waitFor(() => !mapOf(c.doc, 'inv', 'parts').has('g2') && !modulesMap(c.doc).has('junk'), 'the client to get the repaired modules');
      expect(parseBoardFile(docToBoard(c.doc)).ok).toBe(true);
      await server.ctx.boardRegistry.flushAll();
      // what is stored now loads clean: the removal was stored like any other edit
      const { doc } = await loadBoardDoc(server.ctx.boardRegistry.store, boardId);
      expect(checkDoc(doc)).toEqual([]);
      expect(parseBoardFile(docToBoard(doc)).ok).toBe(true);
      doc.destroy();
    } finally {
      warn.mockRestore();
      c.destroy();
    }
  });

  it('repairs concurrent edits inside a module that merge into an invalid one, for everyone', async () => {
    const boardId = await createBoard(server, owner, 'Shared module');
    await addMember(server, owner, boardId, editor, 'editor');
    const a = connectClient(server, boardId, owner.cookie);
    const b = connectClient(server, boardId, editor.cookie);
    try {
      await Promise.all([a.synced, b.synced]);
      boardToDoc({ ...DOOR, modules: [DOOR.modules![0]] }, a.doc, ME);
      await waitFor(() => modulesMap(b.doc).has('inv'), 'the module to reach the editor');
      const insideA = moduleDoc(a.doc, 'inv');
      const insideB = moduleDoc(b.doc, 'inv');
      // in the same moment: both add a port "B"; one deletes the NOT while the other wires its output to a new port
      addPart(insideA, { id: 'pb1', kind: 'port', dir: 'in', label: 'B', x: 0, y: 80 }, ME);
      addPart(insideB, { id: 'pb2', kind: 'port', dir: 'in', label: 'B', x: 0, y: 160 }, ME);
      addPart(insideB, { id: 'pz', kind: 'port', dir: 'out', label: 'Z', x: 240, y: 80 }, ME);
      expect(connect(insideB, 'g1.out', 'pz.in', ME).ok).toBe(true);
      deleteSelection(insideA, ['g1'], [], ME);
      const settled = (doc: Y.Doc) => {
        const parts = mapOf(doc, 'inv', 'parts') as Y.Map<YRecord>;
        const labels = ['pb1', 'pb2'].map((id) => parts.get(id)?.get('label')).sort();
        return JSON.stringify(labels) === JSON.stringify(['B', 'B_2']) && !parts.has('g1') && [...(mapOf(doc, 'inv', 'wires') as Y.Map<YRecord>).values()].every((w) => w.get('from') !== 'g1.out');
      };
      await waitFor(() => settled(a.doc) && settled(b.doc), 'both editors to get the repaired module');
      for (const doc of [a.doc, b.doc, server.ctx.boardRegistry.rooms.get(boardId)!.doc]) {
        expect(checkDoc(doc)).toEqual([]);
        const parsed = parseBoardFile(docToBoard(doc));
        expect(parsed.ok ? [] : parsed.problems).toEqual([]);
      }
      const file = JSON.parse(await exportText(server, owner, boardId)) as BoardFile;
      expect(parseBoardFile(file).ok).toBe(true);
    } finally {
      a.destroy();
      b.destroy();
    }
  });
});
