import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addPart, replaceWithBoard } from '../../shared/board';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { contractHalfAdder } from '../helpers/boards';
import { connectClient, createBoard, signUp, waitFor, type User } from '../collab/helpers';
import { createSnapshotsService, snapshotsToThin } from '../../server/snapshots';
import { insertSnapshot, listSnapshots as listRows } from '../../server/db/snapshots';
import { listSnapshots, takeSnapshot } from './helpers';

const NOW = Date.parse('2026-12-02T12:00:00Z');
const at = (msAgo: number) => new Date(NOW - msAgo).toISOString();

describe('snapshotsToThin (retention of automatic snapshots)', () => {
  it('keeps all from the last hour, the newest per clock hour for a day, the newest per day for 30 days, none older', () => {
    const items = [
      { id: 1, createdAt: at(5 * 60_000) }, { id: 2, createdAt: at(20 * 60_000) }, { id: 3, createdAt: at(50 * 60_000) }, // last hour
      { id: 4, createdAt: '2026-12-02T09:50:00.000Z' }, { id: 5, createdAt: '2026-12-02T09:10:00.000Z' }, // same hour, 2-3 h ago
      { id: 6, createdAt: '2026-12-02T07:30:00.000Z' }, // another hour
      { id: 7, createdAt: '2026-11-28T18:00:00.000Z' }, { id: 8, createdAt: '2026-11-28T06:00:00.000Z' }, // same day, days ago
      { id: 9, createdAt: '2026-10-01T10:00:00.000Z' }, // older than 30 days
    ];
    expect(snapshotsToThin(items, NOW).sort((a, b) => a - b)).toEqual([5, 8, 9]);
    expect(snapshotsToThin([], NOW)).toEqual([]);
  });
});

let server: TestServer;
let owner: User;
beforeAll(async () => {
  server = await startTestServer({ snapshots: { settleMs: 150, minUpdates: 3 } });
  owner = await signUp(server, 'Owner');
});
afterAll(() => server.close());

describe('retention on a real database', () => {
  it('never removes a named snapshot, however old', async () => {
    const boardId = await createBoard(server, owner, 'Old history');
    const { db } = server.ctx;
    const base = { boardId, authorId: null, partCount: 0, wireCount: 0, state: new Uint8Array([0, 0]), thumbnailSvg: '<svg/>' };
    const named = await insertSnapshot(db, { ...base, name: 'Named long ago', kind: 'named', createdAt: '2020-01-01T00:00:00.000Z' });
    const restoreBackup = await insertSnapshot(db, { ...base, name: 'Before restoring', kind: 'before-restore', createdAt: '2020-01-02T00:00:00.000Z' });
    const oldAuto = await insertSnapshot(db, { ...base, name: 'Automatic long ago', kind: 'automatic', createdAt: '2020-01-03T00:00:00.000Z' });
    const freshAuto = await insertSnapshot(db, { ...base, name: 'Automatic now', kind: 'automatic', createdAt: new Date().toISOString() });
    const service = createSnapshotsService({ db, registry: server.ctx.boardRegistry, boards: server.ctx.services.boards });
    expect(await service.thin(boardId)).toBe(1);
    const ids = (await listRows(db, boardId)).map((r) => r.id);
    expect(ids).toContain(named);
    expect(ids).toContain(restoreBackup);
    expect(ids).toContain(freshAuto);
    expect(ids).not.toContain(oldAuto);
  });
});

describe('automatic snapshots', () => {
  it('are taken once a burst of edits settles, and when the last person leaves a changed board', async () => {
    const boardId = await createBoard(server, owner, 'Busy board');
    const c = connectClient(server, boardId, owner.cookie);
    await c.synced;
    replaceWithBoard(c.doc, contractHalfAdder(), { me: 1 });
    for (let i = 0; i < 4; i++) addPart(c.doc, { id: `n${i}`, kind: 'note', x: 0, y: 300 + i * 80, text: `step ${i}` }, { me: 1 });
    await waitFor(async () => (await listSnapshots(server, owner, boardId)).some((s) => s.kind === 'automatic'), 'a settle snapshot');
    const [settled] = await listSnapshots(server, owner, boardId);
    expect(settled).toMatchObject({ kind: 'automatic', authorId: null, partCount: contractHalfAdder().parts.length + 4 });

    // a named snapshot counts as a snapshot: one edit after it, then everyone leaves
    await takeSnapshot(server, owner, boardId, 'Named');
    addPart(c.doc, { id: 'n9', kind: 'note', x: 0, y: 700, text: 'last words' }, { me: 1 });
    await server.ctx.boardRegistry.flushAll();
    c.destroy();
    await waitFor(async () => (await listSnapshots(server, owner, boardId)).length === 3, 'a snapshot on leaving');
    const [left] = await listSnapshots(server, owner, boardId);
    expect(left).toMatchObject({ kind: 'automatic', partCount: contractHalfAdder().parts.length + 5 });
  });
});
