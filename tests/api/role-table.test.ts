import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { contractHalfAdder } from '../helpers/boards';
import { createTestApp, type Agent, type TestApp } from '../helpers/test-app';

// Who may do what on a board (PRODUCT.md "Roles", CONTRACTS §3), every board route against every kind of
// caller, each case on a fresh board. 401 not signed in, 403 role too low or not a member, 404 missing
// (RFC 9110 §15.5.2, §15.5.4, §15.5.5 — from memory). Share-link guests are a caller of the share-link
// issue; their column is in that tests, next to the share-link routes themselves.

type Caller = 'owner' | 'editor' | 'viewer' | 'nonMember' | 'anonymous';
const CALLERS: Caller[] = ['owner', 'editor', 'viewer', 'nonMember', 'anonymous'];

/** What a case may point at: the board, another member of it, a pending invitation, the caller's own id. */
interface Fixture { boardId: number; otherMemberId: number; invitationId: number; selfId: number }
interface Route {
  name: string;
  send(agent: Agent, f: Fixture): Promise<{ status: number; body: Record<string, unknown> }>;
  expect: Record<Caller, number>;
}

const boardFile = () => Buffer.from(JSON.stringify(contractHalfAdder()));
const all = (n: number, anonymous = 401) => ({ owner: n, editor: n, viewer: n, nonMember: n, anonymous });

const ROUTES: Route[] = [
  { name: 'GET /api/boards', send: (a) => a.get('/api/boards'), expect: all(200) },
  { name: 'POST /api/boards', send: (a) => a.post('/api/boards').send({ title: 'Counter' }), expect: all(201) },
  { name: 'GET /api/boards/:id', send: (a, f) => a.get(`/api/boards/${f.boardId}`), expect: { owner: 200, editor: 200, viewer: 200, nonMember: 403, anonymous: 401 } },
  {
    name: 'PATCH /api/boards/:id', send: (a, f) => a.patch(`/api/boards/${f.boardId}`).send({ title: 'Half adder, rev B' }),
    expect: { owner: 200, editor: 200, viewer: 403, nonMember: 403, anonymous: 401 },
  },
  { name: 'DELETE /api/boards/:id', send: (a, f) => a.delete(`/api/boards/${f.boardId}`), expect: { owner: 204, editor: 403, viewer: 403, nonMember: 403, anonymous: 401 } },
  { name: 'GET /api/boards/:id/members', send: (a, f) => a.get(`/api/boards/${f.boardId}/members`), expect: { owner: 200, editor: 200, viewer: 200, nonMember: 403, anonymous: 401 } },
  {
    name: 'POST /api/boards/:id/members', send: (a, f) => a.post(`/api/boards/${f.boardId}/members`).send({ email: `new${f.boardId}@room14.example`, role: 'viewer' }),
    expect: { owner: 201, editor: 403, viewer: 403, nonMember: 403, anonymous: 401 },
  },
  {
    name: 'PATCH /api/boards/:id/members/:userId', send: (a, f) => a.patch(`/api/boards/${f.boardId}/members/${f.otherMemberId}`).send({ role: 'editor' }),
    expect: { owner: 200, editor: 403, viewer: 403, nonMember: 403, anonymous: 401 },
  },
  {
    name: 'DELETE /api/boards/:id/members/:userId (another member)', send: (a, f) => a.delete(`/api/boards/${f.boardId}/members/${f.otherMemberId}`),
    expect: { owner: 204, editor: 403, viewer: 403, nonMember: 403, anonymous: 401 },
  },
  {
    // leaving: the owner cannot (400 owner_required), members can, strangers are not members
    name: 'DELETE /api/boards/:id/members/:userId (oneself)', send: (a, f) => a.delete(`/api/boards/${f.boardId}/members/${f.selfId}`),
    expect: { owner: 400, editor: 204, viewer: 204, nonMember: 403, anonymous: 401 },
  },
  {
    name: 'DELETE /api/boards/:id/invitations/:invitationId', send: (a, f) => a.delete(`/api/boards/${f.boardId}/invitations/${f.invitationId}`),
    expect: { owner: 204, editor: 403, viewer: 403, nonMember: 403, anonymous: 401 },
  },
  { name: 'GET /api/boards/:id/export', send: (a, f) => a.get(`/api/boards/${f.boardId}/export`), expect: { owner: 200, editor: 200, viewer: 200, nonMember: 403, anonymous: 401 } },
  { name: 'POST /api/boards/import', send: (a) => a.post('/api/boards/import').attach('file', boardFile(), 'half-adder.gatefold.json'), expect: all(201) },
  { name: 'POST /api/analyze', send: (a) => a.post('/api/analyze').send(contractHalfAdder()), expect: all(200) },
  { name: 'GET /api/boards/:id/snapshots', send: (a, f) => a.get(`/api/boards/${f.boardId}/snapshots`), expect: { owner: 200, editor: 200, viewer: 200, nonMember: 403, anonymous: 401 } },
  {
    name: 'POST /api/boards/:id/snapshots', send: (a, f) => a.post(`/api/boards/${f.boardId}/snapshots`).send({ name: 'Before rewiring' }),
    expect: { owner: 201, editor: 201, viewer: 403, nonMember: 403, anonymous: 401 },
  },
  {
    name: 'GET /api/boards/:id on a board that does not exist', send: (a, f) => a.get(`/api/boards/${f.boardId + 100000}`),
    expect: { owner: 404, editor: 404, viewer: 404, nonMember: 404, anonymous: 401 },
  },
];

describe('role × route table', () => {
  let t: TestApp;
  const agents = {} as Record<Caller, Agent>;
  const ids = {} as Record<Exclude<Caller, 'anonymous'> | 'other', number>;

  beforeAll(async () => {
    t = await createTestApp();
    const people = [
      ['owner', 'Theo Vance', 'theo@larkspur.example'],
      ['editor', 'Ines Okafor', 'ines@larkspur.example'],
      ['viewer', 'Ruth Calder', 'calder@room14.example'],
      ['nonMember', 'Sam Ortiz', 'sam@room14.example'],
      ['other', 'Priya Nair', 'priya@room14.example'],
    ] as const;
    for (const [key, name, email] of people) {
      const agent = await t.signUp(name, email);
      ids[key] = (await agent.get('/api/auth/me')).body.user.id;
      if (key !== 'other') agents[key] = agent;
    }
    agents.anonymous = t.request();
  });
  afterAll(() => t.close());

  /** A fresh board: owner, an editor, a viewer, another viewer, and a pending invitation. */
  async function fixture(caller: Caller): Promise<Fixture> {
    const board = await t.ctx.services.boards.create(ids.owner, { title: 'Half adder' });
    await t.ctx.services.members.addDirect(board.id, ids.editor, 'editor');
    await t.ctx.services.members.addDirect(board.id, ids.viewer, 'viewer');
    await t.ctx.services.members.addDirect(board.id, ids.other, 'viewer');
    const inv = await agents.owner.post(`/api/boards/${board.id}/members`).send({ email: `pending${board.id}@room14.example`, role: 'viewer' });
    expect(inv.status).toBe(201);
    return { boardId: board.id, otherMemberId: ids.other, invitationId: inv.body.invitation.id, selfId: caller === 'anonymous' ? ids.owner : ids[caller] };
  }

  const cases = ROUTES.flatMap((route) => CALLERS.map((caller) => ({ route, caller, status: route.expect[caller] })));

  it.each(cases)('$route.name as $caller → $status', async ({ route, caller, status }) => {
    const res = await route.send(agents[caller], await fixture(caller));
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    if (status >= 400) {
      const error = res.body.error as { code: string; message: string };
      expect(typeof error.code).toBe('string');
      expect(typeof error.message).toBe('string');
    }
  });
});

describe('members list: e-mail addresses for the owner only', () => {
  let t: TestApp;
  beforeAll(async () => { t = await createTestApp(); });
  afterAll(() => t.close());

  it('gives the owner every address, the others names and roles (and their own address)', async () => {
    const owner = await t.signUp('Theo Vance', 'theo@larkspur.example');
    const editor = await t.signUp('Ines Okafor', 'ines@larkspur.example');
    const viewer = await t.signUp('Ruth Calder', 'calder@room14.example');
    const [eid, vid] = [(await editor.get('/api/auth/me')).body.user.id, (await viewer.get('/api/auth/me')).body.user.id];
    const board = (await owner.post('/api/boards').send({ title: 'Half adder' })).body.board;
    await t.ctx.services.members.addDirect(board.id, eid, 'editor');
    await t.ctx.services.members.addDirect(board.id, vid, 'viewer');

    const asOwner = (await owner.get(`/api/boards/${board.id}/members`)).body.members as { name: string; email?: string }[];
    expect(asOwner.map((m) => m.email)).toEqual(['theo@larkspur.example', 'ines@larkspur.example', 'calder@room14.example']);
    for (const [agent, own] of [[editor, 'ines@larkspur.example'], [viewer, 'calder@room14.example']] as const) {
      const list = (await agent.get(`/api/boards/${board.id}/members`)).body.members as { name: string; role: string; email?: string }[];
      expect(list.map((m) => m.name)).toEqual(['Theo Vance', 'Ines Okafor', 'Ruth Calder']);
      expect(list.map((m) => m.role)).toEqual(['owner', 'editor', 'viewer']);
      expect(list.filter((m) => m.email !== undefined).map((m) => m.email)).toEqual([own]);
    }
  });
});
