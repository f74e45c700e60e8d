import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AppEventMap } from '../../server/services/events';
import { createTestApp, tokenFromMail, type Agent, type TestApp } from '../helpers/test-app';

type Ended = AppEventMap['sessions-ended'][0];

/** The session id inside the signed cookie `gatefold.sid=s:<id>.<signature>` the agent holds. */
async function sessionIdOf(agent: Agent, t: TestApp): Promise<string> {
  const res = await agent.get('/api/auth/me');
  expect(res.status).toBe(200);
  const rows = (await t.ctx.db('sessions').select('sid', 'sess')) as { sid: string; sess: string }[];
  const cookie = (agent as unknown as { jar: { getCookie(name: string, opts: object): { value: string } | undefined } }).jar
    .getCookie('gatefold.sid', { domain: '127.0.0.1', path: '/', secure: false, script: false });
  const sid = decodeURIComponent(cookie?.value ?? '').replace(/^s:/, '').replace(/\.[^.]+$/, '');
  expect(rows.map((r) => r.sid)).toContain(sid);
  return sid;
}

describe("'sessions-ended' for the live sockets", () => {
  let t: TestApp;
  const ended: Ended[] = [];
  beforeAll(async () => {
    t = await createTestApp();
    t.ctx.events.on('sessions-ended', (e) => ended.push(e));
  });
  afterAll(() => t.close());

  it('names the one session that signed out', async () => {
    const agent = await t.signUp('Sam Ortiz', 'sam@room14.example', 'sam-password-1');
    const other = await t.signIn('sam@room14.example', 'sam-password-1');
    const sid = await sessionIdOf(agent, t);
    const me = (await agent.get('/api/auth/me')).body.user;
    ended.length = 0;
    expect((await agent.post('/api/auth/logout')).status).toBe(204);
    expect(ended).toEqual([{ userId: me.id, sessionIds: [sid] }]);
    // the other session is untouched
    expect((await other.get('/api/auth/me')).status).toBe(200);
    // signing out without a session says nothing
    ended.length = 0;
    expect((await t.request().post('/api/auth/logout')).status).toBe(204);
    expect(ended).toEqual([]);
  });

  it('names the user (every session) after a password reset, whose other sessions are gone from the store', async () => {
    const agent = await t.signUp('Priya Nair', 'priya@room14.example', 'priya-password-1');
    const me = (await agent.get('/api/auth/me')).body.user;
    await t.request().post('/api/auth/reset-request').send({ email: 'priya@room14.example' });
    const token = tokenFromMail(await t.waitForDelivery('priya@room14.example', /Reset/), 'reset');
    ended.length = 0;
    expect((await t.request().post('/api/auth/reset').send({ token, password: 'priya-password-2' })).status).toBe(200);
    expect(ended).toEqual([{ userId: me.id }]);
    const left = (await t.ctx.db('sessions').select('sess')) as { sess: string | { userId?: number } }[];
    // a json column on PostgreSQL (parsed by the driver), text on SQLite
    expect(left.filter((r) => (typeof r.sess === 'string' ? JSON.parse(r.sess) : r.sess).userId === me.id)).toEqual([]);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });
});
