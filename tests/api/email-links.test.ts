import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { loadConfig } from '../../server/config';
import { up as maskStoredResetLinks } from '../../migrations/20261211000100_mask_stored_reset_links';
import { createTestApp, startTestServer, tokenFromMail, type TestApp, type TestServer } from '../helpers/test-app';
import { cookieOf, rawRequest, type RawResponse } from './raw-http';

const json = (base: string, path: string, body: object, headers: Record<string, string>) =>
  rawRequest(base, { method: 'POST', path, headers: { 'Content-Type': 'application/json', ...headers }, body: JSON.stringify(body) });
const errorCode = (res: RawResponse) => (res.json as { error?: { code: string } }).error?.code;

describe('e-mailed links with PUBLIC_URL unset', () => {
  let s: TestServer;
  let ownerCookie: string;
  beforeAll(async () => {
    s = await startTestServer();
    const res = await json(s.url, '/api/auth/signup', { name: 'Theo Vance', email: 'theo@larkspur.example', password: 'old-password-1' }, { Origin: s.url });
    expect(res.status).toBe(201);
    ownerCookie = cookieOf(res);
  });
  afterAll(() => s.close());

  it('refuses a reset request with a forged Host and matching Origin; no mail carries that host', async () => {
    const forged = await json(s.url, '/api/auth/reset-request', { email: 'theo@larkspur.example' }, { Host: 'attacker.example', Origin: 'http://attacker.example' });
    expect(forged.status).toBe(400);
    expect(errorCode(forged)).toBe('host_not_allowed');
    // the same answer for an address without an account: nothing is revealed either way
    const unknown = await json(s.url, '/api/auth/reset-request', { email: 'nobody@larkspur.example' }, { Host: 'attacker.example', Origin: 'http://attacker.example' });
    expect([unknown.status, unknown.json]).toEqual([forged.status, forged.json]);

    // a request to the listening host right after: its mail arrives, and it is the only one
    const honest = await json(s.url, '/api/auth/reset-request', { email: 'theo@larkspur.example' }, { Origin: s.url });
    expect(honest.status).toBe(202);
    await expect.poll(() => s.deliveries.length, { timeout: 5000 }).toBe(1);
    const mail = s.deliveries[0];
    expect(mail.text).toContain(`${s.url}/reset/${tokenFromMail(mail, 'reset')}`);
    expect(s.deliveries.some((m) => m.text.includes('attacker.example') || m.html.includes('attacker.example'))).toBe(false);
  });

  it('refuses adding a member with a forged Host before any invitation is made or mailed', async () => {
    const board = await json(s.url, '/api/boards', { title: 'Half adder' }, { Origin: s.url, Cookie: ownerCookie });
    expect(board.status).toBe(201);
    const id = (board.json as { board: { id: number } }).board.id;
    const before = s.deliveries.length;
    const forged = await json(s.url, `/api/boards/${id}/members`, { email: 'ines@larkspur.example', role: 'editor' }, {
      Host: 'attacker.example', Origin: 'http://attacker.example', Cookie: ownerCookie,
    });
    expect(forged.status).toBe(400);
    expect(errorCode(forged)).toBe('host_not_allowed');
    expect(await s.ctx.db('invitations').where({ board_id: id })).toEqual([]);
    // localhost on the listening port is the listening host too
    const local = await json(s.url, `/api/boards/${id}/members`, { email: 'ines@larkspur.example', role: 'editor' }, {
      Host: `localhost:${new URL(s.url).port}`, Origin: `http://localhost:${new URL(s.url).port}`, Cookie: ownerCookie,
    });
    expect(local.status).toBe(201);
    await expect.poll(() => s.deliveries.length, { timeout: 5000 }).toBe(before + 1);
    expect(s.deliveries[before].text).toContain(`http://localhost:${new URL(s.url).port}/invitations/`);
    expect(s.deliveries.some((m) => m.text.includes('attacker.example'))).toBe(false);
  });
});

describe('e-mailed links with ALLOWED_HOSTS', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer({ allowedHosts: ['gatefold.room14.example'] });
    await json(s.url, '/api/auth/signup', { name: 'Ruth Calder', email: 'calder@room14.example', password: 'old-password-1' }, { Origin: s.url });
  });
  afterAll(() => s.close());

  it('links to an allowed host and refuses every other one, the listening host included', async () => {
    const ok = await json(s.url, '/api/auth/reset-request', { email: 'calder@room14.example' }, { Host: 'gatefold.room14.example', Origin: 'http://gatefold.room14.example' });
    expect(ok.status).toBe(202);
    await expect.poll(() => s.deliveries.length, { timeout: 5000 }).toBe(1);
    expect(s.deliveries[0].text).toMatch(/http:\/\/gatefold\.room14\.example\/reset\/[A-Za-z0-9_-]+/);
    const listening = await json(s.url, '/api/auth/reset-request', { email: 'calder@room14.example' }, { Origin: s.url });
    expect(listening.status).toBe(400);
    expect(errorCode(listening)).toBe('host_not_allowed');
  });

  it('reads ALLOWED_HOSTS from the environment and names a bad entry', () => {
    expect(loadConfig({ SESSION_SECRET: 'a-long-enough-secret', ALLOWED_HOSTS: 'Gatefold.Room14.example:8443, localhost' }).allowedHosts)
      .toEqual(['gatefold.room14.example:8443', 'localhost']);
    expect(() => loadConfig({ SESSION_SECRET: 'a-long-enough-secret', ALLOWED_HOSTS: 'http://gatefold.example/' })).toThrow(/ALLOWED_HOSTS: "http:\/\/gatefold.example\/" is not a host name/);
  });
});

describe('reset tokens are never stored or shown readable', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
    await t.signUp('Mara Quinn', 'mara@larkspur.example', 'old-password-1'); // the first account: site admin
  });
  afterAll(() => t.close());

  it('keeps only a SHA-256 hash in password_resets and a masked link in the Outbox', async () => {
    const admin = await t.signIn('mara@larkspur.example', 'old-password-1');
    await t.request().post('/api/auth/reset-request').send({ email: 'mara@larkspur.example' });
    const token = tokenFromMail(await t.waitForDelivery('mara@larkspur.example', /Reset/), 'reset');
    const stored = await t.waitForMail('mara@larkspur.example', /Reset/);

    const rows = await t.ctx.db('password_resets').select('token_hash');
    expect(rows).toHaveLength(1);
    // sha256 of the token, hex (FIPS 180-4; computed here with node:crypto)
    const { createHash } = await import('node:crypto');
    expect(rows[0].token_hash).toBe(createHash('sha256').update(token).digest('hex'));

    const outbox = await admin.get(`/api/admin/outbox/${stored.id}`);
    expect(outbox.status).toBe(200);
    const everything = JSON.stringify(outbox.body) + JSON.stringify(await t.ctx.db('mail_messages'));
    expect(everything).not.toContain(token);
    expect(outbox.body.message.text).toContain('/reset/hidden-see-server-console');
    expect(outbox.body.message.text).toMatch(/link in this message is hidden/);
    // the live link still works
    expect((await t.request().post('/api/auth/reset').send({ token, password: 'new-password-2' })).status).toBe(200);
  });

  it('masks reset links stored before the change (migration)', async () => {
    const live = 'http://gatefold.test/reset/abcdefghijklmnopqrstuvwxyz0123456789ABCDEFG';
    const [inserted] = await t.ctx.db('mail_messages').insert({
      from_addr: 'a', to_addr: 'b', subject: 'Reset your Gatefold password', date: new Date().toISOString(),
      text: `Choose a new password: ${live}`, html: `<a href="${live}">x</a>`, received_at: new Date().toISOString(),
    }).returning('id');
    const id = typeof inserted === 'object' ? (inserted as { id: number }).id : inserted; // PostgreSQL: a row, SQLite: the id
    await maskStoredResetLinks(t.ctx.db);
    const row = await t.ctx.db('mail_messages').where({ id }).first();
    expect(row.text).toBe('Choose a new password: http://gatefold.test/reset/hidden-see-server-console');
    expect(row.html).not.toContain('abcdefghijklmnop');
  });

  it('prints the live reset link to the server console when the built-in catcher is used (logMailLinks)', async () => {
    const app = await createTestApp({ logMailLinks: true });
    const log = vi.spyOn(console, 'log').mockImplementation(() => undefined);
    try {
      await app.signUp('Ines Okafor', 'ines@larkspur.example', 'old-password-1');
      await app.request().post('/api/auth/reset-request').send({ email: 'ines@larkspur.example' });
      const token = tokenFromMail(await app.waitForDelivery('ines@larkspur.example', /Reset/), 'reset');
      expect(log.mock.calls.map((c) => String(c[0])).some((line) => line.includes(`/reset/${token}`) && line.includes('ines@larkspur.example'))).toBe(true);
    } finally {
      log.mockRestore();
      await app.close();
    }
  });
});
