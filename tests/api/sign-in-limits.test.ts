import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig, type RateLimitConfig } from '../../server/config';
import { createTestApp, type TestApp } from '../helpers/test-app';

// 429 Too Many Requests: RFC 6585 §4.
const limits = (l: Partial<RateLimitConfig>): RateLimitConfig => ({
  windowMs: 60_000, login: 1000, loginPerAddress: 1000, signup: 1000, resetRequest: 1000, invitations: 1000, invitationsWindowMs: 3_600_000, ...l,
});

describe('sign-in limits per account and per address', () => {
  let t: TestApp;
  beforeAll(async () => {
    // the defaults of RATE_LIMIT_LOGIN (10 per account) and RATE_LIMIT_LOGIN_ADDRESS (100 per address)
    const d = loadConfig({ SESSION_SECRET: 'a-long-enough-secret' }).rateLimit;
    expect([d.login, d.loginPerAddress]).toEqual([10, 100]);
    t = await createTestApp({ rateLimit: limits({ login: d.login, loginPerAddress: d.loginPerAddress }) });
    await t.signUp('Sam Ortiz', 'sam@room14.example', 'sam-password-1');
    await t.signUp('Priya Nair', 'priya@room14.example', 'priya-password-1');
  });
  afterAll(() => t.close());

  it('limits account A after 10 failures while account B signs in from the same address', async () => {
    const failures: number[] = [];
    for (let i = 0; i < 10; i++) {
      failures.push((await t.request().post('/api/auth/login').send({ email: 'sam@room14.example', password: `guess-${i}-wrong` })).status);
    }
    expect(failures).toEqual(Array(10).fill(401));
    // all from 127.0.0.1, as a classroom behind one NAT
    const b = await t.request().post('/api/auth/login').send({ email: 'priya@room14.example', password: 'priya-password-1' });
    expect(b.status).toBe(200);
    const a = await t.request().post('/api/auth/login').send({ email: 'SAM@room14.example', password: 'sam-password-1' });
    expect(a.status).toBe(429);
    expect(a.body.error.code).toBe('too_many_attempts');
  });

  it('never counts correct sign-ins (more of them than the per-account limit)', async () => {
    const codes: number[] = [];
    for (let i = 0; i < 11; i++) codes.push((await t.request().post('/api/auth/login').send({ email: 'priya@room14.example', password: 'priya-password-1' })).status);
    expect(codes).toEqual(Array(11).fill(200));
  });
});

describe('the per-address count and X-Forwarded-For', () => {
  const spray = async (t: TestApp) => {
    const codes: number[] = [];
    for (let i = 0; i < 4; i++) {
      const res = await t.request().post('/api/auth/login')
        .set('X-Forwarded-For', `203.0.113.${i + 1}`)
        .send({ email: `nobody${i}@room14.example`, password: 'wrong-password' });
      codes.push(res.status);
    }
    return codes;
  };

  it('ignores a spoofed X-Forwarded-For with TRUST_PROXY unset: the socket address is counted', async () => {
    const t = await createTestApp({ rateLimit: limits({ loginPerAddress: 3 }) });
    try {
      expect(t.ctx.config.trustProxy).toBeUndefined();
      expect(await spray(t)).toEqual([401, 401, 401, 429]);
    } finally {
      await t.close();
    }
  });

  it('counts the forwarded address only when TRUST_PROXY names the proxy', async () => {
    const t = await createTestApp({ rateLimit: limits({ loginPerAddress: 3 }), trustProxy: ['127.0.0.1'] });
    try {
      expect(await spray(t)).toEqual([401, 401, 401, 401]);
    } finally {
      await t.close();
    }
  });
});

describe('TRUST_PROXY', () => {
  const cfg = (v: string) => loadConfig({ SESSION_SECRET: 'a-long-enough-secret', TRUST_PROXY: v }).trustProxy;

  it('is a hop count or a list of proxy addresses and subnets', () => {
    expect(loadConfig({ SESSION_SECRET: 'a-long-enough-secret' }).trustProxy).toBeUndefined();
    expect(cfg('1')).toBe(1);
    expect(cfg('0')).toBeUndefined();
    expect(cfg('127.0.0.1, 10.1.2.0/24,::1')).toEqual(['127.0.0.1', '10.1.2.0/24', '::1']);
    expect(cfg('loopback')).toEqual(['loopback']);
  });

  it.each([
    ['true', /TRUST_PROXY=true would believe any X-Forwarded-For/],
    ['uniquelocal', /TRUST_PROXY: "uniquelocal" is not an IP address or subnet/],
    ['10.0.0.0/33', /TRUST_PROXY: "10.0.0.0\/33" has a bad prefix length/],
    ['proxy.example', /TRUST_PROXY: "proxy.example" is not an IP address/],
    ['99', /TRUST_PROXY 99 hops is not believable/],
  ])('refuses %s at start with a clear error', (value, message) => {
    expect(() => cfg(value)).toThrow(message);
  });
});
