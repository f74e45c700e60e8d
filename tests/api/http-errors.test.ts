import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, TEST_ORIGIN, type TestApp } from '../helpers/test-app';

// Status codes: RFC 9110 §15.5 (400, 403, 404, 413) — from memory. Error shape: CONTRACTS §3.

describe('HTTP error handling', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ jsonLimit: '2kb', logErrors: false });
  });
  afterAll(() => t.close());

  it('answers health with ok and the package version', async () => {
    const res = await t.request().get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, version: t.ctx.config.version });
    expect(t.ctx.config.version).toMatch(/^\d+\.\d+\.\d+/);
  });

  it('answers unknown /api routes with a JSON 404 not_found', async () => {
    for (const [method, path] of [['get', '/api/no-such-thing'], ['post', '/api/boards/1/no-such-thing'], ['delete', '/api']] as const) {
      const res = await t.request()[method](path);
      expect(res.status, `${method} ${path}`).toBe(404);
      expect(res.headers['content-type']).toMatch(/application\/json/);
      expect(res.body.error.code).toBe('not_found');
    }
  });

  it('refuses a state-changing request from another origin with 403 bad_origin', async () => {
    const res = await t.request().post('/api/auth/signup').set('Origin', 'http://evil.example').send({ email: 'a@b.example', password: '12345678', name: 'A' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('bad_origin');
    expect(await t.ctx.db('users').count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it('refuses a state-changing request with no Origin or Referer', async () => {
    const supertest = (await import('supertest')).default;
    const res = await supertest(t.ctx.app).post('/api/auth/logout');
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('bad_origin');
  });

  it('accepts a Referer from our own origin when Origin is absent, and lets GETs through', async () => {
    const supertest = (await import('supertest')).default;
    const res = await supertest(t.ctx.app).post('/api/auth/logout').set('Referer', `${TEST_ORIGIN}/boards`);
    expect(res.status).toBe(204);
    const get = await supertest(t.ctx.app).get('/api/health').set('Origin', 'http://evil.example');
    expect(get.status).toBe(200);
  });

  it('answers malformed JSON with 400 malformed_json', async () => {
    const res = await t.request().post('/api/auth/login').set('Content-Type', 'application/json').send('{"email": "x@y.example", ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.(ts|js):\d+/);
  });

  it('answers a body over the limit with 413 too_large', async () => {
    const res = await t.request().post('/api/auth/login').send({ email: 'x@y.example', password: 'p'.repeat(5000) });
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
  });

  it('validates path ids: a non-number board id is 400 with the field named', async () => {
    const agent = await t.signUp('Ruth Calder', 'calder@room14.example');
    const res = await agent.get('/api/boards/abc');
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('id');
  });

  it('sends security headers with a CSP of our own origin', async () => {
    const res = await t.request().get('/api/health');
    const csp = String(res.headers['content-security-policy']);
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).toMatch(/connect-src 'self' ws:\/\//);
    expect(csp).toContain("worker-src 'self' blob:");
    expect(csp).toContain("img-src 'self' blob: data:");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('lets scripts compile WebAssembly and nothing wider: script-src is exactly self and wasm-unsafe-eval', async () => {
    // the analysis worker compiles its truth-table kernel as WebAssembly (decision 007); 'wasm-unsafe-eval'
    // allows that only, where 'unsafe-eval' would also allow eval() and new Function() (CSP Level 3, W3C)
    const res = await t.request().get('/api/health');
    const directives = new Map(String(res.headers['content-security-policy']).split(';').map((d) => d.trim().split(/\s+/)).map(([name, ...sources]) => [name, sources]));
    expect(directives.get('script-src')).toEqual(["'self'", "'wasm-unsafe-eval'"]);
    expect(directives.get('worker-src')).toEqual(["'self'", 'blob:']);
    for (const [name, sources] of directives) {
      expect(sources, name).not.toContain("'unsafe-eval'");
      if (name !== 'style-src') expect(sources, name).not.toContain("'unsafe-inline'");
    }
  });
});
