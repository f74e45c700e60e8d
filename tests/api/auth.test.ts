import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/test-app';

// Status codes follow RFC 9110 (400, 401, 403, 404, 409, 413) and RFC 6585 §4 (429 Too Many Requests)
// — from memory; the codes and shapes themselves are our contract (CONTRACTS §3).

describe('auth API', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('rejects an invalid sign-up with 400 and a message per field', async () => {
    const res = await t.request().post('/api/auth/signup').send({ email: 'not-an-address', password: 'short', name: '' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.fields).toEqual({
      email: 'Enter a valid e-mail address',
      password: 'Password must be at least 8 characters',
      name: 'Name is required',
    });
  });

  it('reports missing fields by name', async () => {
    const res = await t.request().post('/api/auth/signup').send({});
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'name', 'password']);
  });

  it('signs up (first account is site admin), signs in at once, and answers me', async () => {
    const agent = t.request();
    const res = await agent.post('/api/auth/signup').send({ email: 'Mara@Larkspur.example', password: 'gatefold-demo', name: 'Mara Quinn' });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email: 'mara@larkspur.example', name: 'Mara Quinn', isAdmin: true });
    expect(Object.keys(res.body.user).sort()).toEqual(['createdAt', 'email', 'id', 'isAdmin', 'name']);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/^gatefold\.sid=/);
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    expect(cookie).not.toMatch(/Secure/); // PUBLIC_URL is http in tests
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe('mara@larkspur.example');
  });

  it('makes later accounts plain members', async () => {
    const res = await t.request().post('/api/auth/signup').send({ email: 'theo@larkspur.example', password: 'gatefold-demo', name: 'Theo Vance' });
    expect(res.status).toBe(201);
    expect(res.body.user.isAdmin).toBe(false);
  });

  it('answers 409 email_taken for a duplicate address, whatever its case', async () => {
    const res = await t.request().post('/api/auth/signup').send({ email: 'THEO@larkspur.example', password: 'another-password', name: 'Theo Again' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('email_taken');
  });

  it('answers 401 bad_credentials for a wrong password and for an unknown address alike', async () => {
    const wrong = await t.request().post('/api/auth/login').send({ email: 'theo@larkspur.example', password: 'not-the-password' });
    const unknown = await t.request().post('/api/auth/login').send({ email: 'nobody@larkspur.example', password: 'whatever1' });
    for (const res of [wrong, unknown]) {
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe('bad_credentials');
      expect(res.headers['set-cookie']).toBeUndefined();
    }
  });

  it('gives a new session id at sign-in and forgets the session at sign-out', async () => {
    const agent = t.request();
    // An anonymous session exists only once something is stored; sign in twice and compare the ids.
    const first = await agent.post('/api/auth/login').send({ email: 'theo@larkspur.example', password: 'gatefold-demo' });
    expect(first.status).toBe(200);
    expect(first.body.user.email).toBe('theo@larkspur.example');
    const sid1 = String(first.headers['set-cookie']).split(';')[0];
    const second = await agent.post('/api/auth/login').send({ email: 'theo@larkspur.example', password: 'gatefold-demo' });
    const sid2 = String(second.headers['set-cookie']).split(';')[0];
    expect(sid2).not.toBe(sid1);
    // the old id no longer signs anyone in
    const stale = await t.request().get('/api/auth/me').set('Cookie', sid1);
    expect(stale.status).toBe(401);

    const out = await agent.post('/api/auth/logout');
    expect(out.status).toBe(204);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(401);
    expect(me.body.error.code).toBe('not_signed_in');
    const replay = await t.request().get('/api/auth/me').set('Cookie', sid2);
    expect(replay.status).toBe(401);
  });

  it('stores only a bcrypt hash of cost 10 or more', async () => {
    const row = await t.ctx.db('users').where({ email: 'theo@larkspur.example' }).first();
    // bcrypt modular-crypt format $2b$<cost>$… (common practice, no source)
    expect(row.password_hash).toMatch(/^\$2[aby]\$(1\d)\$/);
    expect(row.password_hash).not.toContain('gatefold-demo');
  });
});

describe('sign-in rate limit', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ rateLimit: { windowMs: 60_000, login: 3, loginPerAddress: 1000, signup: 2, resetRequest: 3, invitations: 1000, invitationsWindowMs: 3_600_000 } });
    await t.signUp('Ines Okafor', 'ines@larkspur.example', 'gatefold-demo');
  });
  afterAll(() => t.close());

  it('answers 429 too_many_attempts after too many failed sign-ins', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) {
      const res = await t.request().post('/api/auth/login').send({ email: 'ines@larkspur.example', password: `wrong-${i}-pass` });
      statuses.push(res.status);
      if (res.status === 429) {
        expect(res.body.error.code).toBe('too_many_attempts');
        expect(typeof res.body.error.message).toBe('string');
      }
    }
    expect(statuses).toEqual([401, 401, 401, 429]);
    // even the right password is refused while limited
    const right = await t.request().post('/api/auth/login').send({ email: 'ines@larkspur.example', password: 'gatefold-demo' });
    expect(right.status).toBe(429);
  });

  it('answers 429 after too many sign-ups', async () => {
    // one sign-up already counted in beforeAll; the limit is 2
    const ok = await t.request().post('/api/auth/signup').send({ email: 'sam@room14.example', password: 'gatefold-demo', name: 'Sam Ortiz' });
    expect(ok.status).toBe(201);
    const limited = await t.request().post('/api/auth/signup').send({ email: 'priya@room14.example', password: 'gatefold-demo', name: 'Priya Nair' });
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('too_many_attempts');
  });
});
