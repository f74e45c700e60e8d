import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { addPart, connect, movePart } from '../../shared/board';
import { countBoardUpdates, loadBoardUpdates } from '../../server/db/board-updates';
import { connectClient, createBoard, exportText, signUp, waitFor, type User } from './helpers';

const ME = { local: 'test' };
const dir = mkdtempSync(join(tmpdir(), 'gatefold-collab-persist-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Builds a small circuit through a live client: n switches, each driving a lamp, moved around. */
async function drawCircuit(server: TestServer, user: User, boardId: number, n: number): Promise<void> {
  const c = connectClient(server, boardId, user.cookie);
  await c.synced;
  for (let i = 0; i < n; i++) {
    addPart(c.doc, { id: `s${i}`, kind: 'switch', label: `S${i}`, x: 0, y: i * 40, on: i % 2 === 0 }, ME);
    addPart(c.doc, { id: `l${i}`, kind: 'lamp', label: `L${i}`, x: 200, y: i * 40 }, ME);
    connect(c.doc, `s${i}.out`, `l${i}.in`, ME);
    for (let step = 1; step <= 3; step++) movePart(c.doc, [{ id: `l${i}`, x: 200 + step * 20, y: i * 40 }], ME);
  }
  await waitFor(async () => (await exportText(server, user, boardId)).includes(`"L${n - 1}"`), 'the server to hold the last part');
  c.destroy();
}

describe('board persistence', () => {
  it('a board survives a server restart byte for byte', async () => {
    const databaseFile = join(dir, 'restart.sqlite');
    let server = await startTestServer({ databaseFile });
    const owner = await signUp(server, 'Owner');
    const boardId = await createBoard(server, owner);
    const c = connectClient(server, boardId, owner.cookie);
    await c.synced;
    for (let i = 0; i < 30; i++) addPart(c.doc, { id: `g${i}`, kind: 'nand', inputs: 2, x: i * 20, y: 0 }, ME);
    await waitFor(async () => (await exportText(server, owner, boardId)).includes('"g29"'), 'the last edit');
    // edit once more and shut down at once, with the client still connected: shutdown must store it
    movePart(c.doc, [{ id: 'g0', x: 400, y: 400 }], ME);
    await waitFor(() => server.ctx.boardRegistry.rooms.get(boardId)!.doc.getMap<import('yjs').Map<unknown>>('parts').get('g0')!.get('x') === 400, 'the move to reach the room');
    const before = await exportText(server, owner, boardId);
    await server.close();
    c.destroy();
    server = await startTestServer({ databaseFile });
    const after = await exportText(server, owner, boardId); // same SESSION_SECRET and session table: the cookie still works
    expect(after).toBe(before);
    expect(JSON.parse(after).parts[0]).toMatchObject({ id: 'g0', x: 400, y: 400 });
    await server.close();
  });

  it('compaction past the threshold keeps the content, and a stored board compacts to one row', async () => {
    const databaseFile = join(dir, 'compact.sqlite');
    let server = await startTestServer({ databaseFile, collab: { compactThreshold: 20 } });
    const owner = await signUp(server, 'Owner');
    const boardId = await createBoard(server, owner);
    await drawCircuit(server, owner, boardId, 12); // 12 × 6 = 72 updates
    const live = await exportText(server, owner, boardId);
    await waitFor(() => !server.ctx.boardRegistry.rooms.has(boardId), 'the room to unload');
    const rows = await countBoardUpdates(server.ctx.db, boardId);
    expect(rows).toBeLessThanOrEqual(21); // compacted at least once on the way (72 rows otherwise)
    expect(await exportText(server, owner, boardId)).toBe(live);
    const bytesBefore = (await loadBoardUpdates(server.ctx.db, boardId)).reduce((n, r) => n + r.data.length, 0);
    expect(await server.ctx.boardRegistry.compactStored(boardId)).toBe(1);
    expect(await countBoardUpdates(server.ctx.db, boardId)).toBe(1);
    expect((await loadBoardUpdates(server.ctx.db, boardId))[0].data.length).toBeLessThanOrEqual(bytesBefore);
    expect(await exportText(server, owner, boardId)).toBe(live);
    await server.close();
    server = await startTestServer({ databaseFile });
    expect(await exportText(server, owner, boardId)).toBe(live);
    await server.close();
  });
});
