import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { addPart, movePart } from '../../shared/board';
import { docToBoard } from '../../shared/board';
import {
  addMember, api, connectClient, createBoard, exportText, rawUpgrade, signUp, sleep, waitFor, type Client, type User,
} from './helpers';

const ME = { local: 'test' };
let server: TestServer;
let owner: User;
let editor: User;
let viewer: User;
let stranger: User;
const clients: Client[] = [];
const open = (boardId: number, user: User) => {
  const c = connectClient(server, boardId, user.cookie);
  clients.push(c);
  return c;
};

beforeAll(async () => {
  server = await startTestServer();
  [owner, editor, viewer, stranger] = await Promise.all(['Owner', 'Editor', 'Viewer', 'Stranger'].map((n) => signUp(server, n)));
});
afterAll(async () => {
  clients.forEach((c) => c.destroy());
  await server.close();
});

describe('who may join a board room', () => {
  it('refuses anonymous (401) and non-member (403) upgrades before any document byte', async () => {
    const boardId = await createBoard(server, owner);
    const anon = await rawUpgrade(server, `/collab/${boardId}`);
    expect(anon).toEqual({ status: 401, bytes: 0, opened: false });
    const other = await rawUpgrade(server, `/collab/${boardId}`, stranger.cookie);
    expect(other).toEqual({ status: 403, bytes: 0, opened: false });
    const missing = await rawUpgrade(server, `/collab/999999`, owner.cookie);
    expect(missing.status).toBe(403);
    const badPath = await rawUpgrade(server, `/collab/not-a-number`, owner.cookie);
    expect(badPath.status).toBe(404);
    const member = await rawUpgrade(server, `/collab/${boardId}`, owner.cookie);
    expect(member.opened).toBe(true);
    expect(member.bytes).toBeGreaterThan(0); // the member got the server's sync step 1
  });

  it('a bad share token is not a way in', async () => {
    const boardId = await createBoard(server, owner);
    expect((await rawUpgrade(server, `/collab/${boardId}?share=nonsense`)).status).toBe(401);
  });
});

describe('viewers are read-only on the server', () => {
  it("a viewer's update is not applied, not stored, and never reaches others", async () => {
    const boardId = await createBoard(server, owner);
    await addMember(server, owner, boardId, editor, 'editor');
    await addMember(server, owner, boardId, viewer, 'viewer');
    const e = open(boardId, editor);
    const v = open(boardId, viewer);
    await Promise.all([e.synced, v.synced]);
    addPart(e.doc, { id: 'sw1', kind: 'switch', label: 'A', x: 0, y: 0, on: false }, ME);
    await waitFor(() => v.doc.getMap('parts').has('sw1'), 'the viewer to receive the editor’s part');
    addPart(v.doc, { id: 'evil', kind: 'lamp', label: 'Z', x: 0, y: 0 }, ME);
    movePart(v.doc, [{ id: 'sw1', x: 400, y: 400 }], ME);
    // an edit after it, from the editor, proves the viewer's messages had time to arrive and be ignored
    addPart(e.doc, { id: 'marker', kind: 'note', x: 0, y: 0, text: '' }, ME);
    await waitFor(() => v.doc.getMap('parts').has('marker'), 'the marker to round-trip');
    await sleep(100);
    expect(e.doc.getMap('parts').has('evil')).toBe(false);
    expect(docToBoard(e.doc).parts.find((p) => p.id === 'sw1')).toMatchObject({ x: 0, y: 0 });
    await server.ctx.boardRegistry.flushAll();
    const stored = await server.ctx.boardRegistry.readBoardFile(boardId);
    expect(stored.parts.map((p) => p.id)).toEqual(['sw1', 'marker']);
    expect(await exportText(server, owner, boardId)).not.toContain('evil');
    // a fresh client (editor) sees the server's truth
    const late = open(boardId, owner);
    await late.synced;
    expect(late.doc.getMap('parts').has('evil')).toBe(false);
  });
});

describe('membership changes reach open sockets', () => {
  it('downgrading an editor to viewer stops their later edits; removing closes their socket', async () => {
    const boardId = await createBoard(server, owner);
    await addMember(server, owner, boardId, editor, 'editor');
    const o = open(boardId, owner);
    const e = open(boardId, editor);
    await Promise.all([o.synced, e.synced]);
    addPart(e.doc, { id: 'before', kind: 'lamp', label: 'B', x: 0, y: 0 }, ME);
    await waitFor(() => o.doc.getMap('parts').has('before'), 'the editor’s edit while an editor');

    const patch = await api(server, 'PATCH', `/api/boards/${boardId}/members/${editor.id}`, owner.cookie, { role: 'viewer' });
    expect(patch.status).toBe(200);
    addPart(e.doc, { id: 'after', kind: 'lamp', label: 'C', x: 0, y: 0 }, ME);
    addPart(o.doc, { id: 'marker', kind: 'note', x: 0, y: 0, text: '' }, ME);
    await waitFor(() => e.doc.getMap('parts').has('marker'), 'the owner’s marker');
    await sleep(100);
    expect(o.doc.getMap('parts').has('after')).toBe(false);
    expect((await server.ctx.boardRegistry.readBoardFile(boardId)).parts.map((p) => p.id)).toEqual(['before', 'marker']);

    const closed = new Promise<number>((resolve) => {
      e.provider.on('connection-close', (event: { code: number } | null) => resolve(event?.code ?? -1));
    });
    const del = await api(server, 'DELETE', `/api/boards/${boardId}/members/${editor.id}`, owner.cookie);
    expect(del.status).toBe(204);
    expect(await closed).toBe(4403);
    // and the removed user cannot come back in
    expect((await rawUpgrade(server, `/collab/${boardId}`, editor.cookie)).status).toBe(403);
    e.provider.disconnect();
  });

  it('making a viewer an editor reconnects them, and then their edits count', async () => {
    const boardId = await createBoard(server, owner);
    await addMember(server, owner, boardId, viewer, 'viewer');
    const o = open(boardId, owner);
    const v = open(boardId, viewer);
    await Promise.all([o.synced, v.synced]);
    const closed = new Promise<number>((resolve) => v.provider.once('connection-close', (ev: { code: number } | null) => resolve(ev?.code ?? -1)));
    expect((await api(server, 'PATCH', `/api/boards/${boardId}/members/${viewer.id}`, owner.cookie, { role: 'editor' })).status).toBe(200);
    expect(await closed).toBe(4001);
    await waitFor(() => v.provider.wsconnected && v.provider.synced, 'the reconnect');
    addPart(v.doc, { id: 'now-editor', kind: 'lamp', label: 'E', x: 0, y: 0 }, ME);
    await waitFor(() => o.doc.getMap('parts').has('now-editor'), 'the new editor’s edit');
  });

  it('deleting the board closes its sockets', async () => {
    const boardId = await createBoard(server, owner);
    const o = open(boardId, owner);
    await o.synced;
    const closed = new Promise<number>((resolve) => o.provider.on('connection-close', (ev: { code: number } | null) => resolve(ev?.code ?? -1)));
    expect((await api(server, 'DELETE', `/api/boards/${boardId}`, owner.cookie)).status).toBe(204);
    expect(await closed).toBe(4404);
    o.provider.disconnect();
  });
});
