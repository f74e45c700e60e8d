import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, TEST_ORIGIN, tokenFromMail, type TestApp } from '../helpers/test-app';

describe('password reset by e-mailed link', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
    await t.signUp('Theo Vance', 'theo@larkspur.example', 'old-password-1');
  });
  afterAll(() => t.close());

  it('answers 202 for an unknown address and sends nothing', async () => {
    const res = await t.request().post('/api/auth/reset-request').send({ email: 'nobody@larkspur.example' });
    expect(res.status).toBe(202);
    expect(res.body).toEqual({ ok: true });
    expect(await t.ctx.services.outbox.list()).toEqual([]);
  });

  it('request → mail → token → new password works, old does not, token single use, other sessions end', async () => {
    const elsewhere = await t.signIn('theo@larkspur.example', 'old-password-1');
    const res = await t.request().post('/api/auth/reset-request').send({ email: 'THEO@larkspur.example' });
    expect(res.status).toBe(202);
    // the link as the SMTP delivery carries it (the Outbox keeps it masked)
    const mail = await t.waitForDelivery('theo@larkspur.example', /Reset your Gatefold password/);
    const token = tokenFromMail(mail, 'reset');
    expect(mail.text).toContain(`${TEST_ORIGIN}/reset/${token}`);
    expect(mail.html).toContain(`${TEST_ORIGIN}/reset/${token}`);

    const short = await t.request().post('/api/auth/reset').send({ token, password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toMatch(/at least 8/);

    const ok = await t.request().post('/api/auth/reset').send({ token, password: 'new-password-2' });
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ ok: true });

    expect((await t.request().post('/api/auth/login').send({ email: 'theo@larkspur.example', password: 'old-password-1' })).status).toBe(401);
    expect((await t.request().post('/api/auth/login').send({ email: 'theo@larkspur.example', password: 'new-password-2' })).status).toBe(200);
    expect((await elsewhere.get('/api/auth/me')).status).toBe(401);

    const again = await t.request().post('/api/auth/reset').send({ token, password: 'third-password-3' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');
  });

  it('refuses an unknown token and an expired one', async () => {
    const unknown = await t.request().post('/api/auth/reset').send({ token: 'x'.repeat(43), password: 'new-password-9' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.code).toBe('invalid_token');

    const before = t.deliveries.length;
    await t.request().post('/api/auth/reset-request').send({ email: 'theo@larkspur.example' });
    await expect.poll(() => t.deliveries.length).toBe(before + 1);
    const token = tokenFromMail(t.deliveries[before], 'reset');
    // The link lives one hour; move its expiry into the past instead of waiting.
    await t.ctx.db('password_resets').whereNull('used_at').update({ expires_at: new Date(Date.now() - 1000).toISOString() });
    const expired = await t.request().post('/api/auth/reset').send({ token, password: 'new-password-9' });
    expect(expired.status).toBe(400);
    expect(expired.body.error.code).toBe('invalid_token');
  });

  it('sets the expiry one hour after the request', async () => {
    const before = Date.now();
    await t.request().post('/api/auth/reset-request').send({ email: 'theo@larkspur.example' });
    const row = await t.ctx.db('password_resets').orderBy('id', 'desc').first();
    const ttl = Date.parse(row.expires_at) - Date.parse(row.created_at);
    expect(ttl).toBe(60 * 60 * 1000);
    expect(Date.parse(row.created_at)).toBeGreaterThanOrEqual(before - 5);
  });
});
