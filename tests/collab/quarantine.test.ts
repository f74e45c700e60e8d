import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { checkDoc, metaMap, parseBoardFile, partToYMap, partsMap, wireToYMap, wiresMap } from '../../shared/board';
import { loadBoardDoc } from '../../server/boards-live';
import { connectClient, createBoard, exportText, signUp, waitFor, type User } from './helpers';

let server: TestServer;
let owner: User;

beforeAll(async () => {
  server = await startTestServer({ logErrors: false });
  owner = await signUp(server, 'Owner');
});
afterAll(async () => {
  await server.close();
});

/** Stores, straight through the board store, what the server accepted before updates were checked. */
async function storePoisonedBoard(boardId: number): Promise<void> {
  const doc = new Y.Doc();
  doc.transact(() => {
    metaMap(doc).set('title', 'T'.repeat(100_000));
    partsMap(doc).set('sw1', partToYMap({ id: 'sw1', kind: 'switch', label: 'A', x: 0, y: 0, on: false }, 1));
    partsMap(doc).set('sw2', partToYMap({ id: 'sw2', kind: 'switch', label: 'A', x: 0, y: 40, on: false }, 2));
    partsMap(doc).set('x', 'str' as never);
    const odd = new Y.Map<unknown>();
    for (const [k, v] of Object.entries({ id: 'u1', kind: 'flux', x: 'left', order: 3 })) odd.set(k, v);
    partsMap(doc).set('u1', odd as never);
    wiresMap(doc).set('w1', wireToYMap({ id: 'w1', from: 'sw1.out', to: 'u1.in0' }, 1));
    wiresMap(doc).set('w2', 42 as never);
  });
  const store = server.ctx.boardRegistry.store;
  const seq = await store.lastSeq(boardId);
  await store.append(boardId, [{ seq: seq + 1, data: Y.encodeStateAsUpdate(doc), userId: null, createdAt: new Date().toISOString() }]);
}

describe('a stored board that fails the board check', () => {
  it('exports as a valid board file without the bad entries, even with no room open', async () => {
    const boardId = await createBoard(server, owner, 'Old board');
    await storePoisonedBoard(boardId);
    const text = await exportText(server, owner, boardId);
    const parsed = parseBoardFile(JSON.parse(text));
    expect(parsed.ok ? [] : parsed.problems).toEqual([]);
    const board = JSON.parse(text) as { title: string; parts: { id: string; label?: string }[]; wires: unknown[] };
    expect(board.parts.map((p) => [p.id, p.label])).toEqual([['sw1', 'A'], ['sw2', 'A_2']]);
    expect(board.wires).toEqual([]);
    expect(board.title).toBe('Untitled board');
  });

  it('opens in a live room with the bad entries removed by a stored server edit, and reported', async () => {
    const boardId = await createBoard(server, owner, 'Old board');
    await storePoisonedBoard(boardId);
    const c = connectClient(server, boardId, owner.cookie);
    await c.synced;
    const room = server.ctx.boardRegistry.rooms.get(boardId)!;
    expect(room.quarantine?.removed.map((r) => `${r.where}:${r.key}`).sort()).toEqual(['meta:title', 'parts:u1', 'parts:x', 'wires:w2']);
    expect(room.quarantine?.repaired).toEqual({ wires: ['w1'], relabelled: ['sw2'], parts: [] });
    await waitFor(() => !partsMap(c.doc).has('x') && partsMap(c.doc).size === 2, 'the client to get the repaired board');
    await server.ctx.boardRegistry.flushAll();
    // what is stored now loads clean: the removal was stored like any other edit
    const { doc } = await loadBoardDoc(server.ctx.boardRegistry.store, boardId);
    expect(checkDoc(doc).filter((p) => p.where !== 'root')).toEqual([]);
    doc.destroy();
    c.destroy();
  });
});
