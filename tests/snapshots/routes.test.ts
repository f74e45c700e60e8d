import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { docToBoard, movePart, addPart, disconnect, relabelPart, replaceWithBoard } from '../../shared/board';
import type { ApiSnapshot, ApiBoard } from '../../shared/api';
import type { BoardDiff } from '../../shared/render';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { contractHalfAdder } from '../helpers/boards';
import { addMember, api, connectClient, createBoard, exportText, signUp, waitFor, type Client, type User } from '../collab/helpers';
import { listSnapshots, same, snapshotBoard, takeSnapshot } from './helpers';

const ME = { local: 'routes-test' };
let server: TestServer;
let owner: User, editor: User, viewer: User, stranger: User;
let boardId: number;
let otherBoardId: number;
let client: Client;
let s: ApiSnapshot;

beforeAll(async () => {
  server = await startTestServer();
  [owner, editor, viewer, stranger] = await Promise.all(['Owner', 'Editor', 'Viewer', 'Stranger'].map((n) => signUp(server, n)));
  boardId = await createBoard(server, owner, 'Permissions board');
  otherBoardId = await createBoard(server, owner, 'Another board');
  await addMember(server, owner, boardId, editor, 'editor');
  await addMember(server, owner, boardId, viewer, 'viewer');
  client = connectClient(server, boardId, owner.cookie);
  await client.synced;
  replaceWithBoard(client.doc, { ...contractHalfAdder(), title: 'Permissions board' }, ME);
  await waitFor(async () => JSON.parse(await exportText(server, owner, boardId)).parts.length === contractHalfAdder().parts.length, 'content stored');
  s = await takeSnapshot(server, editor, boardId, 'Editor took this');
});
afterAll(async () => {
  client.destroy();
  await server.close();
});

const call = (user: User, method: string, path: string, body?: unknown) => api(server, method, path, user.cookie, body);

describe('snapshot routes: who may do what', () => {
  it('lets viewers list, preview and compare', async () => {
    const list = await call(viewer, 'GET', `/api/boards/${boardId}/snapshots`);
    expect(list.status).toBe(200);
    const { snapshots } = (await list.json()) as { snapshots: ApiSnapshot[] };
    expect(snapshots.map((x) => x.name)).toContain('Editor took this');
    expect(snapshots[0]).toMatchObject({ kind: 'named', authorName: 'Editor', partCount: 6, wireCount: 6 });
    expect((await call(viewer, 'GET', `/api/boards/${boardId}/snapshots/${s.id}`)).status).toBe(200);
    expect((await call(viewer, 'GET', `/api/boards/${boardId}/snapshots/${s.id}/compare`)).status).toBe(200);
    const thumb = await call(viewer, 'GET', s.thumbnailUrl);
    expect(thumb.status).toBe(200);
    expect(thumb.headers.get('content-type')).toMatch(/image\/svg\+xml/);
    expect(await thumb.text()).toMatch(/^<svg /);
  });

  it('refuses a viewer taking or renaming (403) and lets an editor rename', async () => {
    expect((await call(viewer, 'POST', `/api/boards/${boardId}/snapshots`, { name: 'mine' })).status).toBe(403);
    expect((await call(viewer, 'PATCH', `/api/boards/${boardId}/snapshots/${s.id}`, { name: 'x' })).status).toBe(403);
    const renamed = await call(editor, 'PATCH', `/api/boards/${boardId}/snapshots/${s.id}`, { name: '  Renamed  ' });
    expect(renamed.status).toBe(200);
    expect(((await renamed.json()) as { snapshot: ApiSnapshot }).snapshot.name).toBe('Renamed');
  });

  it('lets only the owner restore and delete (editor 403)', async () => {
    const restore = await call(editor, 'POST', `/api/boards/${boardId}/snapshots/${s.id}/restore`);
    expect(restore.status).toBe(403);
    expect(((await restore.json()) as { error: { code: string } }).error.code).toBe('role_too_low');
    expect((await call(editor, 'DELETE', `/api/boards/${boardId}/snapshots/${s.id}`)).status).toBe(403);
    const extra = await takeSnapshot(server, owner, boardId, 'To delete');
    expect((await call(owner, 'DELETE', `/api/boards/${boardId}/snapshots/${extra.id}`)).status).toBe(204);
    expect((await listSnapshots(server, owner, boardId)).map((x) => x.id)).not.toContain(extra.id);
  });

  it("answers 404 for another board's snapshot id, 403 for a stranger, 400 for bad input", async () => {
    for (const [method, suffix] of [['GET', ''], ['GET', '/compare'], ['POST', '/restore'], ['DELETE', ''], ['PATCH', '']] as const) {
      const res = await call(owner, method, `/api/boards/${otherBoardId}/snapshots/${s.id}${suffix}`, method === 'PATCH' ? { name: 'n' } : undefined);
      expect(res.status, `${method} ${suffix}`).toBe(404);
      expect(((await res.json()) as { error: { code: string } }).error.code).toBe('snapshot_not_found');
    }
    expect((await call(stranger, 'GET', `/api/boards/${boardId}/snapshots`)).status).toBe(403);
    const badId = await call(owner, 'GET', `/api/boards/${boardId}/snapshots/abc`);
    expect(badId.status).toBe(400);
    expect(((await badId.json()) as { error: { fields: Record<string, string> } }).error.fields).toHaveProperty('sid');
    const badName = await call(editor, 'POST', `/api/boards/${boardId}/snapshots`, { name: '' });
    expect(badName.status).toBe(400);
    expect(((await badName.json()) as { error: { fields: Record<string, string> } }).error.fields).toHaveProperty('name');
    const badCopy = await call(viewer, 'POST', `/api/boards/${boardId}/copy`, { snapshotId: 'x' });
    expect(badCopy.status).toBe(400);
  });
});

describe('compare', () => {
  it('lists exactly a known change: one move, one relabel, one added part, one removed wire', async () => {
    const before = await takeSnapshot(server, owner, boardId, 'Before the change');
    movePart(client.doc, [{ id: 'g2', x: 220, y: 160 }], ME);
    relabelPart(client.doc, 's', 'SUM', ME);
    addPart(client.doc, { id: 'p9', kind: 'probe', label: 'P9', x: 400, y: 220 }, ME);
    disconnect(client.doc, ['w6'], ME);
    await waitFor(async () => {
      const res = await call(viewer, 'GET', `/api/boards/${boardId}/snapshots/${before.id}/compare`);
      return ((await res.json()) as BoardDiff).added.parts.length === 1;
    }, 'the change on the server');
    const res = await call(viewer, 'GET', `/api/boards/${boardId}/snapshots/${before.id}/compare`);
    expect(await res.json()).toEqual({
      added: { parts: [{ id: 'p9', kind: 'probe', label: 'P9', x: 400, y: 220 }], wires: [] },
      removed: { parts: [], wires: [{ id: 'w6', from: 'g2.out', to: 'c.in' }] },
      changed: {
        parts: [
          { id: 'g2', kind: 'and', moved: true, fields: [{ field: 'x', from: 200, to: 220 }, { field: 'y', from: 140, to: 160 }] },
          { id: 's', kind: 'lamp', label: 'SUM', moved: false, fields: [{ field: 'label', from: 'S', to: 'SUM' }] },
        ],
        wires: [],
        meta: [],
      },
    });
  });
});

describe('make my own copy', () => {
  it('gives a viewer a board they own, titled "<title> (copy)", whose history starts with a copied-from snapshot', async () => {
    const res = await call(viewer, 'POST', `/api/boards/${boardId}/copy`, {});
    expect(res.status).toBe(201);
    const { board } = (await res.json()) as { board: ApiBoard };
    expect(board).toMatchObject({ title: 'Permissions board (copy)', role: 'owner', ownerId: viewer.id });
    const copied = JSON.parse(await exportText(server, viewer, board.id));
    expect(same({ ...copied, title: 'x' }, { ...docToBoard(client.doc), title: 'x' })).toBe(true);
    const history = await listSnapshots(server, viewer, board.id);
    expect(history).toHaveLength(1);
    expect(history[0]).toMatchObject({ kind: 'copied-from', authorId: viewer.id, source: { boardId, boardTitle: 'Permissions board', snapshotId: null } });
    expect(history[0].name).toContain('Permissions board');
    // the original is untouched and the viewer is still only a viewer there
    expect((await call(viewer, 'POST', `/api/boards/${boardId}/snapshots`, {})).status).toBe(403);
  });

  it('copies one snapshot of the board when asked', async () => {
    const res = await call(viewer, 'POST', `/api/boards/${boardId}/copy`, { snapshotId: s.id });
    expect(res.status).toBe(201);
    const { board } = (await res.json()) as { board: ApiBoard };
    const copied = JSON.parse(await exportText(server, viewer, board.id));
    const snap = await snapshotBoard(server, viewer, boardId, s.id);
    expect(copied).toEqual({ ...snap, title: 'Permissions board (copy)' });
    const [first] = await listSnapshots(server, viewer, board.id);
    expect(first.source).toMatchObject({ boardId, snapshotId: s.id, snapshotName: 'Renamed' });
    expect((await call(viewer, 'POST', `/api/boards/${otherBoardId}/copy`, {})).status).toBe(403);
    expect((await call(viewer, 'POST', `/api/boards/${boardId}/copy`, { snapshotId: 999999 })).status).toBe(404);
  });
});
