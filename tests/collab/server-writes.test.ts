/**
 * The server's own writes into a board (a snapshot restore, a whole board file written through the
 * registry, a direct server edit of an open room's document) go through the same check and repair as
 * a stored board opened in a room (docs/decisions/004-modules.md): over the real room server, with a
 * client on a real socket, an open room never holds a board the board check refuses.
 *
 * "The board check" is the board file's (`parseBoardFile` on `docToBoard`): `checkDoc` checks the
 * document's entries (shapes, top-level labels and wires) and does not see the module rules (a switch
 * inside a module, a missing module, two ports with one label), so every check here asks both.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import * as Y from 'yjs';
import { boardToDoc, checkDoc, docToBoard, moduleMaps, parseBoardFile, partsMap, partToYMap, wireToYMap, type BoardFile, type Part } from '../../shared/board';
import { compileBoard, Simulator } from '../../shared/sim';
import { loadBoardDoc, ServerOrigin } from '../../server/boards-live';
import * as snapshotsDb from '../../server/db/snapshots';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { DOOR_LAMP } from './door-lamp';
import { restore } from '../snapshots/helpers';
import { connectClient, createBoard, exportText, signUp, waitFor, type Client, type User } from './helpers';

const DOOR = DOOR_LAMP;

/**
 * The door board as a file no board check lets through (each would come from an older server or a
 * hand-edited file): a switch and a clock inside the module, a second port "A", a port on the top level,
 * an instance of a module that is not there.
 */
function badDoor(): BoardFile {
  const inv = DOOR.modules![0];
  const inside: Part[] = [
    ...inv.parts,
    { id: 'sw', kind: 'switch', label: 'S', on: true, x: 0, y: 160 },
    { id: 'ck', kind: 'clock', label: 'CK', x: 0, y: 240 } as Part,
    { id: 'pb', kind: 'port', dir: 'in', label: 'A', x: 0, y: 80 },
  ];
  return {
    ...DOOR,
    parts: [...DOOR.parts, { id: 'px', kind: 'port', dir: 'in', label: 'X', x: 0, y: 200 }, { id: 'u9', kind: 'module', module: 'gone', x: 160, y: 200 }],
    modules: [{ ...inv, parts: inside, wires: [...inv.wires, { id: 'w3', from: 'sw.out', to: 'g1.in0' }] }],
  };
}

/** What the repair must leave of `badDoor()`: the door board, with the second port told apart. */
function expectRepaired(board: BoardFile): void {
  const parsed = parseBoardFile(board);
  expect(parsed.ok ? [] : parsed.problems).toEqual([]);
  expect(board.parts.map((p) => p.id)).toEqual(['a', 'u1', 'l1']);
  const inv = board.modules!.find((m) => m.id === 'inv')!;
  expect(inv.parts.map((p) => [p.id, p.label])).toEqual([['pa', 'A'], ['g1', undefined], ['py', 'Y'], ['pb', 'A_2']]);
  expect(inv.wires.map((w) => w.id)).toEqual(['w1', 'w2']);
  // and it still works: the lamp is the inverse of the key through the module
  for (const key of [false, true]) {
    const sim = new Simulator(compileBoard({ ...board, parts: board.parts.map((p) => (p.id === 'a' ? { ...p, on: key } : p)) } as BoardFile));
    sim.settle();
    expect(sim.outputValues().OPEN).toBe(key ? '0' : '1');
  }
}

let server: TestServer;
let owner: User;

beforeAll(async () => {
  server = await startTestServer({ logErrors: false });
  owner = await signUp(server, 'Owner');
});
afterAll(async () => {
  await server.close();
});

async function openBoard(title: string): Promise<{ boardId: number; client: Client }> {
  const boardId = await createBoard(server, owner, title);
  await server.ctx.boardRegistry.writeBoardFile(boardId, DOOR, owner.id);
  const client = connectClient(server, boardId, owner.cookie);
  await client.synced;
  return { boardId, client };
}

/** Every problem of a document: its entries' (`checkDoc`), then the board file's check of the board it holds. */
function boardProblems(doc: Y.Doc): string[] {
  const entries = checkDoc(doc).map((p) => p.message);
  const parsed = parseBoardFile(docToBoard(doc));
  return [...entries, ...(parsed.ok ? [] : parsed.problems.map((p) => p.message))];
}

/** The board as stored now (every row the room wrote), checked without any repair on the way. */
async function storedProblems(boardId: number): Promise<string[]> {
  await server.ctx.boardRegistry.flushAll();
  const { doc } = await loadBoardDoc(server.ctx.boardRegistry.store, boardId);
  try {
    return boardProblems(doc);
  } finally {
    doc.destroy();
  }
}

/**
 * Watches a client's document from now on: after every update it applies, the problems of its board.
 * The server's write and its repair are one update, so a client never holds the bad board in between.
 */
function watchClient(client: Client): { updates: number; problems: string[][] } {
  const seen = { updates: 0, problems: [] as string[][] };
  client.doc.on('update', () => {
    seen.updates++;
    const found = boardProblems(client.doc);
    if (found.length) seen.problems.push(found);
  });
  return seen;
}

describe('server writes into an open room', () => {
  it('writes a whole board file that breaks the module rules: repaired before the write resolves, for the client too', async () => {
    expect(parseBoardFile(badDoor()).ok).toBe(false); // what the test writes is a board the check refuses
    const { boardId, client } = await openBoard('Door lamp, written whole');
    const watch = watchClient(client);
    const warn = vi.spyOn(console, 'warn').mockImplementation(() => undefined);
    try {
      await server.ctx.boardRegistry.writeBoardFile(boardId, badDoor(), owner.id);
      // the repair ran before the write resolved: the room's document and the stored rows pass the check
      const room = server.ctx.boardRegistry.rooms.get(boardId)!;
      expect(boardProblems(room.doc)).toEqual([]);
      expectRepaired(docToBoard(room.doc));
      expect(await storedProblems(boardId)).toEqual([]);
      // the client has the new board once the second port is there (the door board it held before has none)
      await waitFor(() => moduleMaps(client.doc, 'inv')?.parts.has('pb') === true, 'the client to get the repaired board');
      expectRepaired(docToBoard(client.doc));
      expect(watch.updates).toBe(1); // the write and its repair, one update
      expect(watch.problems).toEqual([]);
      expectRepaired(JSON.parse(await exportText(server, owner, boardId)) as BoardFile);
      const logged = warn.mock.calls.map((args) => args.join(' ')).find((line) => line.includes(`board ${boardId}:`));
      expect(logged).toMatch(/a server write left the board invalid/);
      expect(logged).toContain('inv/sw');
    } finally {
      warn.mockRestore();
      client.destroy();
    }
  });

  it('restores a snapshot stored before the module rules were checked: the client gets a valid board', async () => {
    const { boardId, client } = await openBoard('Door lamp, restored');
    const watch = watchClient(client);
    // a snapshot state holding the bad board, as an older server stored it (straight into SQLite)
    const old = new Y.Doc();
    boardToDoc(DOOR, old);
    old.transact(() => {
      const inside = moduleMaps(old, 'inv')!;
      inside.parts.set('sw', partToYMap({ id: 'sw', kind: 'switch', label: 'S', on: true, x: 0, y: 160 }, 4));
      inside.parts.set('pb', partToYMap({ id: 'pb', kind: 'port', dir: 'in', label: 'A', x: 0, y: 80 }, 5));
      inside.wires.set('w3', wireToYMap({ id: 'w3', from: 'sw.out', to: 'g1.in0' }, 3));
      partsMap(old).set('u9', partToYMap({ id: 'u9', kind: 'module', module: 'gone', x: 160, y: 200 }, 4));
    });
    // every entry has a good shape, so the document check alone lets it through; the board check refuses it
    expect(checkDoc(old)).toEqual([]);
    const oldParsed = parseBoardFile(docToBoard(old));
    expect(oldParsed.ok ? [] : oldParsed.problems.map((p) => p.id)).toEqual(['u9', 'sw', 'pb']);
    const id = await snapshotsDb.insertSnapshot(server.ctx.db, {
      boardId, name: 'From the old server', authorId: owner.id, createdAt: new Date().toISOString(), kind: 'named',
      partCount: 4, wireCount: 2, state: Y.encodeStateAsUpdate(old), thumbnailSvg: '<svg xmlns="http://www.w3.org/2000/svg"/>',
    });
    old.destroy();
    const warn = vi.spyOn(console, 'warn').mockImplementation(() => undefined);
    try {
      const room = server.ctx.boardRegistry.rooms.get(boardId)!;
      await restore(server, owner, boardId, id);
      expect(boardProblems(room.doc)).toEqual([]);
      expectRepaired(docToBoard(room.doc));
      await waitFor(() => moduleMaps(client.doc, 'inv')?.parts.has('pb') === true, 'the client to get the repaired restore');
      expectRepaired(docToBoard(client.doc));
      expect(watch.problems).toEqual([]);
      expect(await storedProblems(boardId)).toEqual([]);
      const logged = warn.mock.calls.map((args) => args.join(' ')).find((line) => line.includes(`board ${boardId}:`));
      expect(logged).toMatch(/a server write left the board invalid/);
      expect(logged).toContain('inv/sw');
    } finally {
      warn.mockRestore();
      client.destroy();
    }
  });

  it('a rename is checked too: a good one changes the title alone, a title no board file allows does not stay', async () => {
    const { boardId, client } = await openBoard('Door lamp, renamed');
    const room = server.ctx.boardRegistry.rooms.get(boardId)!;
    const warn = vi.spyOn(console, 'warn').mockImplementation(() => undefined);
    try {
      await server.ctx.boardRegistry.writeMeta(boardId, { title: 'Room 14 door lamp, east wing' }, owner.id);
      expect(docToBoard(room.doc)).toEqual({ ...DOOR, title: 'Room 14 door lamp, east wing' });
      expect(warn).not.toHaveBeenCalled();
      // straight through the registry (the HTTP route refuses it first): 300 characters are no title
      await server.ctx.boardRegistry.writeMeta(boardId, { title: 'x'.repeat(300) }, owner.id);
      expect(boardProblems(room.doc)).toEqual([]);
      expect(docToBoard(room.doc).title).not.toBe('x'.repeat(300));
      expect(await storedProblems(boardId)).toEqual([]);
      await waitFor(() => client.doc.getMap('meta').get('title') !== 'Room 14 door lamp, east wing', 'the client to get the second rename');
      expect(boardProblems(client.doc)).toEqual([]);
    } finally {
      warn.mockRestore();
      client.destroy();
    }
  });

  it('repairs a server edit made straight on the room document, before any socket message is handled', async () => {
    const { boardId, client } = await openBoard('Door lamp, server edit');
    const room = server.ctx.boardRegistry.rooms.get(boardId)!;
    const warn = vi.spyOn(console, 'warn').mockImplementation(() => undefined);
    try {
      room.doc.transact(() => {
        moduleMaps(room.doc, 'inv')!.parts.set('ck', partToYMap({ id: 'ck', kind: 'clock', label: 'CK', x: 0, y: 240 } as Part, 4));
      }, new ServerOrigin(owner.id, 'library'));
      expect(moduleMaps(room.doc, 'inv')!.parts.has('ck')).toBe(true);
      await Promise.resolve(); // the repair runs in the microtask after the write
      expect(moduleMaps(room.doc, 'inv')!.parts.has('ck')).toBe(false);
      expect(boardProblems(room.doc)).toEqual([]);
      await waitFor(() => client.doc.getMap('modules').size === 1 && !moduleMaps(client.doc, 'inv')!.parts.has('ck'), 'the client to see the clock go');
      expect(await storedProblems(boardId)).toEqual([]);
    } finally {
      warn.mockRestore();
      client.destroy();
    }
  });
});

describe('server writes into a stored board (no room open)', () => {
  it('stores the repaired board, so it loads clean without the quarantine', async () => {
    const boardId = await createBoard(server, owner, 'Door lamp, stored');
    await server.ctx.boardRegistry.writeBoardFile(boardId, DOOR, owner.id);
    await server.ctx.boardRegistry.writeBoardFile(boardId, badDoor(), owner.id);
    expect(server.ctx.boardRegistry.rooms.has(boardId)).toBe(false);
    expect(await storedProblems(boardId)).toEqual([]);
    const { doc } = await loadBoardDoc(server.ctx.boardRegistry.store, boardId);
    expectRepaired(docToBoard(doc));
    doc.destroy();
  });
});
