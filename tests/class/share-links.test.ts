import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addPart, docToBoard } from '../../shared/board';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { addMember, api, connectClient, createBoard, rawUpgrade, signUp, sleep, waitFor, type Client, type User } from '../collab/helpers';

const ME = { local: 'test' };
let server: TestServer;
let owner: User;
let editor: User;
let viewer: User;
let stranger: User;
const clients: Client[] = [];
const open = (boardId: number, cookie: string, params: Record<string, string> = {}) => {
  const c = connectClient(server, boardId, cookie, params);
  clients.push(c);
  return c;
};

beforeAll(async () => {
  server = await startTestServer({ logErrors: false, collab: { pingIntervalMs: 150 } });
  [owner, editor, viewer, stranger] = await Promise.all(['Owner', 'Editor', 'Viewer', 'Stranger'].map((n) => signUp(server, n)));
});
afterAll(async () => {
  clients.forEach((c) => c.destroy());
  await server.close();
});

interface NewLink { id: number; token: string; url: string; createdAt: string; expiresAt: string | null }

async function createLink(boardId: number, body: object = {}): Promise<NewLink> {
  const res = await api(server, 'POST', `/api/boards/${boardId}/share-links`, owner.cookie, body);
  expect(res.status).toBe(201);
  return ((await res.json()) as { link: NewLink }).link;
}

/** Joins through the link as an anonymous guest; returns the guest session's cookie. */
async function joinAsGuest(token: string, name = 'Robin'): Promise<string> {
  const res = await api(server, 'POST', `/api/share/${token}/join`, undefined, { name });
  expect(res.status).toBe(200);
  expect(await res.json()).toMatchObject({ join: { role: 'viewer', guest: { name } } });
  const cookie = (res.headers.getSetCookie()[0] ?? '').split(';')[0];
  expect(cookie).toMatch(/^gatefold\.sid=/);
  return cookie;
}

const closeCode = (c: Client) => new Promise<number>((resolve) => c.provider.once('connection-close', (ev: { code: number } | null) => resolve(ev?.code ?? -1)));

describe('share links: create, list, revoke (owner only)', () => {
  it('returns the token once (at least 128 random bits, base64url), lists links without it, stores only its hash', async () => {
    const boardId = await createBoard(server, owner, 'Room 14 counter');
    const link = await createLink(boardId, { expiresInMinutes: 90 });
    // base64url of ≥ 16 bytes is ≥ 22 characters (6 bits each)
    expect(link.token).toMatch(/^[A-Za-z0-9_-]{22,}$/);
    expect(link.token.length * 6).toBeGreaterThanOrEqual(128);
    expect(link.url).toBe(`${server.ctx.config.publicUrl ?? server.url}/s/${link.token}`);
    expect(Date.parse(link.expiresAt!) - Date.parse(link.createdAt)).toBeGreaterThan(89 * 60_000);
    const other = await createLink(boardId);
    expect(other.token).not.toBe(link.token);
    expect(other.expiresAt).toBeNull();

    const list = await api(server, 'GET', `/api/boards/${boardId}/share-links`, owner.cookie);
    expect(list.status).toBe(200);
    const body = (await list.json()) as { links: Record<string, unknown>[] };
    expect(body.links).toEqual([
      { id: link.id, createdAt: link.createdAt, expiresAt: link.expiresAt, audience: 0 },
      { id: other.id, createdAt: other.createdAt, expiresAt: null, audience: 0 },
    ]);
    const rows = (await server.ctx.db('share_links').where({ board_id: boardId })) as Record<string, unknown>[];
    expect(rows).toHaveLength(2);
    for (const row of rows) expect(JSON.stringify(row)).not.toContain(link.token);
  });

  it('only the owner manages links; bad input is a 400 with fields', async () => {
    const boardId = await createBoard(server, owner);
    await addMember(server, owner, boardId, editor, 'editor');
    await addMember(server, owner, boardId, viewer, 'viewer');
    for (const [user, status] of [[editor, 403], [viewer, 403], [stranger, 403]] as const) {
      expect((await api(server, 'POST', `/api/boards/${boardId}/share-links`, user.cookie, {})).status).toBe(status);
      expect((await api(server, 'GET', `/api/boards/${boardId}/share-links`, user.cookie)).status).toBe(status);
    }
    expect((await api(server, 'GET', `/api/boards/${boardId}/share-links`)).status).toBe(401);
    const bad = await api(server, 'POST', `/api/boards/${boardId}/share-links`, owner.cookie, { expiresInMinutes: 'soon' });
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { fields: Record<string, string> } }).error.fields).toHaveProperty('expiresInMinutes');
    const link = await createLink(boardId);
    expect((await api(server, 'DELETE', `/api/boards/${boardId}/share-links/${link.id}`, editor.cookie)).status).toBe(403);
    expect((await api(server, 'DELETE', `/api/boards/${boardId}/share-links/999999`, owner.cookie)).status).toBe(404);
    expect((await api(server, 'DELETE', `/api/boards/${boardId}/share-links/${link.id}`, owner.cookie)).status).toBe(204);
  });
});

describe('guests', () => {
  it('a guest with a valid token syncs as viewer, gets live updates, and its updates are never applied', async () => {
    const boardId = await createBoard(server, owner, 'Half adder for Room 14');
    const link = await createLink(boardId);
    const info = await api(server, 'GET', `/api/share/${link.token}`);
    expect(await info.json()).toEqual({ share: { boardId, title: 'Half adder for Room 14', expiresAt: null, guest: null, memberRole: null } });
    const cookie = await joinAsGuest(link.token);
    expect(await (await api(server, 'GET', `/api/share/${link.token}`, cookie)).json()).toMatchObject({ share: { guest: { name: 'Robin' } } });

    const o = open(boardId, owner.cookie);
    const g = open(boardId, cookie); // the guest session
    const t = open(boardId, '', { share: link.token }); // the token alone, no cookie at all
    await Promise.all([o.synced, g.synced, t.synced]);
    addPart(o.doc, { id: 'a', kind: 'switch', label: 'A', x: 0, y: 0, on: false }, ME);
    await waitFor(() => g.doc.getMap('parts').has('a') && t.doc.getMap('parts').has('a'), 'both guests to receive the part');

    addPart(g.doc, { id: 'evil', kind: 'lamp', label: 'Z', x: 0, y: 0 }, ME);
    addPart(t.doc, { id: 'evil2', kind: 'lamp', label: 'Y', x: 0, y: 0 }, ME);
    addPart(o.doc, { id: 'marker', kind: 'note', x: 0, y: 0, text: '' }, ME);
    await waitFor(() => g.doc.getMap('parts').has('marker') && t.doc.getMap('parts').has('marker'), 'the marker to reach the guests');
    await sleep(100);
    expect(docToBoard(o.doc).parts.map((p) => p.id)).toEqual(['a', 'marker']);
    await server.ctx.boardRegistry.flushAll();
    expect((await server.ctx.boardRegistry.readBoardFile(boardId)).parts.map((p) => p.id)).toEqual(['a', 'marker']);

    const list = await api(server, 'GET', `/api/boards/${boardId}/share-links`, owner.cookie);
    expect(((await list.json()) as { links: { audience: number }[] }).links[0].audience).toBe(2);
  });

  it('refuses an invalid, an expired and a revoked token; revoking closes the guests’ sockets at once', async () => {
    const boardId = await createBoard(server, owner);
    expect((await rawUpgrade(server, `/collab/${boardId}?share=AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA`)).status).toBe(401);
    expect((await api(server, 'GET', '/api/share/not-a-token')).status).toBe(404);
    expect((await api(server, 'POST', '/api/share/AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA/join', undefined, { name: 'X' })).status).toBe(404);

    const expiring = await createLink(boardId, { expiresInMinutes: 5 });
    const expCookie = await joinAsGuest(expiring.token, 'Sam');
    await server.ctx.db('share_links').where({ id: expiring.id }).update({ expires_at: new Date(Date.now() - 1000).toISOString() });
    expect((await rawUpgrade(server, `/collab/${boardId}?share=${expiring.token}`)).status).toBe(401);
    expect((await rawUpgrade(server, `/collab/${boardId}`, expCookie)).status).toBe(401);
    expect((await api(server, 'GET', `/api/share/${expiring.token}`)).status).toBe(404);
    expect((await api(server, 'GET', `/api/boards/${boardId}`, expCookie)).status).toBe(401);

    const link = await createLink(boardId);
    const cookie = await joinAsGuest(link.token, 'Kim');
    const g = open(boardId, cookie);
    const t = open(boardId, '', { share: link.token });
    const m = open(boardId, viewer.cookie); // not a member: stays out
    await Promise.all([g.synced, t.synced]);
    const gClosed = closeCode(g);
    const tClosed = closeCode(t);
    const before = Date.now();
    expect((await api(server, 'DELETE', `/api/boards/${boardId}/share-links/${link.id}`, owner.cookie)).status).toBe(204);
    expect(await gClosed).toBe(4403);
    expect(await tClosed).toBe(4403);
    expect(Date.now() - before).toBeLessThan(1000); // the event, not the 150 ms re-check
    g.provider.disconnect();
    t.provider.disconnect();
    m.provider.disconnect();
    expect((await rawUpgrade(server, `/collab/${boardId}?share=${link.token}`)).status).toBe(401);
    expect((await rawUpgrade(server, `/collab/${boardId}`, cookie)).status).toBe(401);
    expect((await api(server, 'GET', `/api/boards/${boardId}`, cookie)).status).toBe(401);
  });

  it('an expiring link closes its guests’ sockets at the next check', async () => {
    const boardId = await createBoard(server, owner);
    const link = await createLink(boardId, { expiresInMinutes: 5 });
    const t = open(boardId, '', { share: link.token });
    await t.synced;
    const closed = closeCode(t);
    await server.ctx.db('share_links').where({ id: link.id }).update({ expires_at: new Date(Date.now() - 1000).toISOString() });
    expect(await closed).toBe(4401);
    t.provider.disconnect();
  });

  it('the token and the guest session open no other board and no route beyond the board page’s two reads', async () => {
    const boardId = await createBoard(server, owner, 'Shared');
    const otherBoard = await createBoard(server, owner, 'Private');
    const link = await createLink(boardId);
    const cookie = await joinAsGuest(link.token);
    // what the board page needs
    const board = await api(server, 'GET', `/api/boards/${boardId}`, cookie);
    expect(board.status).toBe(200);
    expect(await board.json()).toMatchObject({ board: { id: boardId, title: 'Shared', role: 'viewer' } });
    expect((await api(server, 'GET', `/api/boards/${boardId}/export`, cookie)).status).toBe(200);
    // and nothing else
    const refused: [string, string, unknown?][] = [
      ['GET', `/api/boards/${otherBoard}`], ['GET', `/api/boards/${otherBoard}/export`], ['GET', '/api/boards'], ['POST', '/api/boards', { title: 'x' }],
      ['PATCH', `/api/boards/${boardId}`, { title: 'hacked' }], ['DELETE', `/api/boards/${boardId}`], ['GET', `/api/boards/${boardId}/members`],
      ['POST', `/api/boards/${boardId}/members`, { email: 'a@b.example', role: 'editor' }], ['GET', `/api/boards/${boardId}/snapshots`],
      ['POST', `/api/boards/${boardId}/snapshots`, { name: 'n' }], ['GET', `/api/boards/${boardId}/share-links`], ['POST', `/api/boards/${boardId}/share-links`, {}],
      ['POST', `/api/boards/${boardId}/copy`, {}], ['POST', '/api/analyze', {}], ['GET', '/api/auth/me'], ['GET', `/api/boards/${boardId}/photos`],
      ['GET', `/api/boards/${boardId}/bringup`],
    ];
    for (const [method, path, body] of refused) {
      const res = await api(server, method, path, cookie, body);
      expect({ method, path, status: res.status }).toEqual({ method, path, status: 401 });
    }
    expect((await rawUpgrade(server, `/collab/${otherBoard}`, cookie)).status).toBe(401);
    expect((await rawUpgrade(server, `/collab/${otherBoard}?share=${link.token}`)).status).toBe(401);
    expect((await rawUpgrade(server, `/collab/${boardId}`, cookie)).opened).toBe(true);
  });

  it('members who use a link keep their own role', async () => {
    const boardId = await createBoard(server, owner);
    await addMember(server, owner, boardId, editor, 'editor');
    const link = await createLink(boardId);
    const res = await api(server, 'POST', `/api/share/${link.token}/join`, editor.cookie, { name: 'Ed' });
    expect(await res.json()).toEqual({ join: { boardId, role: 'editor', guest: null } });
    const e = open(boardId, editor.cookie, { share: link.token });
    const o = open(boardId, owner.cookie);
    await Promise.all([e.synced, o.synced]);
    addPart(e.doc, { id: 'from-editor', kind: 'lamp', label: 'L', x: 0, y: 0 }, ME);
    await waitFor(() => o.doc.getMap('parts').has('from-editor'), 'the editor’s edit to be applied');
    // a signed-in stranger with the link joins as a guest viewer of this board only
    const s = await api(server, 'POST', `/api/share/${link.token}/join`, stranger.cookie, { name: 'Stranger' });
    expect(await s.json()).toEqual({ join: { boardId, role: 'viewer', guest: { name: 'Stranger' } } });
    expect((await api(server, 'GET', `/api/boards/${boardId}`, stranger.cookie)).status).toBe(200);
    expect((await api(server, 'PATCH', `/api/boards/${boardId}`, stranger.cookie, { title: 'no' })).status).toBe(403);
  });

  it('a display name is required', async () => {
    const boardId = await createBoard(server, owner);
    const link = await createLink(boardId);
    const res = await api(server, 'POST', `/api/share/${link.token}/join`, undefined, { name: '   ' });
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: { fields: Record<string, string> } }).error.fields).toHaveProperty('name');
  });
});
