import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { createTestApp, type Agent, type TestApp } from '../helpers/test-app';

// Who may do what on a board (PRODUCT.md "Roles", CONTRACTS §3): one row per route, one column per caller.
// 401 not signed in, 403 role too low or not a member (RFC 9110 §15.5.2/§15.5.4 — from memory).

type Caller = 'owner' | 'editor' | 'viewer' | 'nonMember' | 'anonymous';
const CALLERS: Caller[] = ['owner', 'editor', 'viewer', 'nonMember', 'anonymous'];

interface Route {
  name: string;
  send(agent: Agent, boardId: number, extraId: number): Promise<{ status: number; body: Record<string, unknown> }>;
  expect: Record<Caller, number>;
}

let inviteSeq = 0;
const ROUTES: Route[] = [
  {
    name: 'GET /api/boards/:id',
    send: (a, id) => a.get(`/api/boards/${id}`),
    expect: { owner: 200, editor: 200, viewer: 200, nonMember: 403, anonymous: 401 },
  },
  {
    name: 'PATCH /api/boards/:id',
    send: (a, id) => a.patch(`/api/boards/${id}`).send({ title: 'Half adder, rev B' }),
    expect: { owner: 200, editor: 200, viewer: 403, nonMember: 403, anonymous: 401 },
  },
  {
    name: 'DELETE /api/boards/:id',
    send: (a, id) => a.delete(`/api/boards/${id}`),
    expect: { owner: 204, editor: 403, viewer: 403, nonMember: 403, anonymous: 401 },
  },
  {
    name: 'GET /api/boards/:id/members',
    send: (a, id) => a.get(`/api/boards/${id}/members`),
    expect: { owner: 200, editor: 200, viewer: 200, nonMember: 403, anonymous: 401 },
  },
  {
    name: 'POST /api/boards/:id/members',
    send: (a, id) => a.post(`/api/boards/${id}/members`).send({ email: `guest${++inviteSeq}@larkspur.example`, role: 'viewer' }),
    expect: { owner: 201, editor: 403, viewer: 403, nonMember: 403, anonymous: 401 },
  },
  {
    name: 'PATCH /api/boards/:id/members/:userId',
    send: (a, id, extra) => a.patch(`/api/boards/${id}/members/${extra}`).send({ role: 'editor' }),
    expect: { owner: 200, editor: 403, viewer: 403, nonMember: 403, anonymous: 401 },
  },
  {
    name: 'DELETE /api/boards/:id/members/:userId (someone else)',
    send: (a, id, extra) => a.delete(`/api/boards/${id}/members/${extra}`),
    expect: { owner: 204, editor: 403, viewer: 403, nonMember: 403, anonymous: 401 },
  },
];

describe('board routes by role', () => {
  let t: TestApp;
  const agents = {} as Record<Caller, Agent>;
  const ids = {} as Record<'owner' | 'editor' | 'viewer' | 'nonMember' | 'extra', number>;
  let boardId = 0;

  beforeAll(async () => {
    t = await createTestApp();
    const people = [
      ['owner', 'Theo Vance', 'theo@larkspur.example'],
      ['editor', 'Ines Okafor', 'ines@larkspur.example'],
      ['viewer', 'Ruth Calder', 'calder@room14.example'],
      ['nonMember', 'Sam Ortiz', 'sam@room14.example'],
      ['extra', 'Priya Nair', 'priya@room14.example'],
    ] as const;
    for (const [key, name, email] of people) {
      const agent = await t.signUp(name, email);
      ids[key] = (await agent.get('/api/auth/me')).body.user.id;
      if (key !== 'extra') agents[key] = agent;
    }
    agents.anonymous = t.request();
  });
  afterAll(() => t.close());

  beforeEach(async () => {
    const board = await t.ctx.services.boards.create(ids.owner, { title: 'Half adder', family: 'tube-drl-nor' });
    boardId = board.id;
    await t.ctx.services.members.addDirect(boardId, ids.editor, 'editor');
    await t.ctx.services.members.addDirect(boardId, ids.viewer, 'viewer');
    await t.ctx.services.members.addDirect(boardId, ids.extra, 'viewer');
  });

  for (const route of ROUTES) {
    for (const caller of CALLERS) {
      const expected = route.expect[caller];
      it(`${route.name} as ${caller} → ${expected}`, async () => {
        const res = await route.send(agents[caller], boardId, ids.extra);
        expect(res.status).toBe(expected);
        if (expected >= 400) {
          const code = (res.body.error as { code: string }).code;
          expect(code).toBe(expected === 401 ? 'not_signed_in' : caller === 'nonMember' ? 'not_a_member' : 'role_too_low');
        }
      });
    }
  }

  it('GET /api/boards lists only my boards, with my role and the member count', async () => {
    const mine = await agents.viewer.get('/api/boards');
    expect(mine.status).toBe(200);
    const board = mine.body.boards.find((b: { id: number }) => b.id === boardId);
    expect(board).toMatchObject({ id: boardId, title: 'Half adder', family: 'tube-drl-nor', ownerId: ids.owner, role: 'viewer', memberCount: 4 });
    const theirs = await agents.nonMember.get('/api/boards');
    expect(theirs.body.boards.map((b: { id: number }) => b.id)).not.toContain(boardId);
    expect((await agents.anonymous.get('/api/boards')).status).toBe(401);
  });

  it('POST /api/boards creates a board owned by the caller; anonymous gets 401', async () => {
    const res = await agents.nonMember.post('/api/boards').send({ title: '4-bit ripple counter', family: 'ttl-74ls' });
    expect(res.status).toBe(201);
    expect(res.body.board).toMatchObject({ title: '4-bit ripple counter', family: 'ttl-74ls', ownerId: ids.nonMember, role: 'owner', memberCount: 1 });
    const defaulted = await agents.nonMember.post('/api/boards').send({ title: 'Scratch' });
    expect(defaulted.body.board.family).toBe('ideal');
    expect((await agents.anonymous.post('/api/boards').send({ title: 'x' })).status).toBe(401);
    const bad = await agents.nonMember.post('/api/boards').send({ title: '  ', family: 'valve' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['family', 'title']);
  });

  it('a missing board is 404 board_not_found for anyone signed in', async () => {
    const res = await agents.owner.get('/api/boards/999999');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('board_not_found');
  });

  it('a member may leave a board; the owner cannot be removed or downgraded', async () => {
    expect((await agents.viewer.delete(`/api/boards/${boardId}/members/${ids.viewer}`)).status).toBe(204);
    expect((await agents.viewer.get(`/api/boards/${boardId}`)).status).toBe(403);
    const remove = await agents.owner.delete(`/api/boards/${boardId}/members/${ids.owner}`);
    expect(remove.status).toBe(400);
    expect(remove.body.error.code).toBe('owner_required');
    const downgrade = await agents.owner.patch(`/api/boards/${boardId}/members/${ids.owner}`).send({ role: 'viewer' });
    expect(downgrade.status).toBe(400);
    expect(downgrade.body.error.code).toBe('owner_required');
    const badRole = await agents.owner.patch(`/api/boards/${boardId}/members/${ids.extra}`).send({ role: 'owner' });
    expect(badRole.status).toBe(400);
    expect(badRole.body.error.fields.role).toMatch(/editor.*viewer/);
  });

  it('members list shows invitations to the owner only', async () => {
    await agents.owner.post(`/api/boards/${boardId}/members`).send({ email: 'newcomer@room14.example', role: 'editor' });
    const own = await agents.owner.get(`/api/boards/${boardId}/members`);
    expect(own.body.members.map((m: { role: string }) => m.role)).toEqual(['owner', 'editor', 'viewer', 'viewer']);
    expect(own.body.invitations).toHaveLength(1);
    expect(own.body.invitations[0]).toMatchObject({ email: 'newcomer@room14.example', role: 'editor' });
    const ed = await agents.editor.get(`/api/boards/${boardId}/members`);
    expect(ed.body.invitations).toEqual([]);
  });

  it('tells listeners about membership changes and deletion', async () => {
    const seen: unknown[] = [];
    const onMember = (e: unknown) => seen.push(['membership-changed', e]);
    const onDelete = (e: unknown) => seen.push(['board-deleted', e]);
    t.ctx.events.on('membership-changed', onMember);
    t.ctx.events.on('board-deleted', onDelete);
    await agents.owner.patch(`/api/boards/${boardId}/members/${ids.extra}`).send({ role: 'editor' });
    await agents.owner.delete(`/api/boards/${boardId}/members/${ids.extra}`);
    await agents.owner.delete(`/api/boards/${boardId}`);
    t.ctx.events.off('membership-changed', onMember);
    t.ctx.events.off('board-deleted', onDelete);
    expect(seen).toEqual([
      ['membership-changed', { boardId, userId: ids.extra, role: 'editor' }],
      ['membership-changed', { boardId, userId: ids.extra, role: null }],
      ['board-deleted', { boardId }],
    ]);
    expect(await t.ctx.db('board_members').where({ board_id: boardId })).toEqual([]);
  });
});
