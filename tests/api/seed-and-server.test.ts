import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo, DEMO_PASSWORD, type BoardContentSeeder } from '../../server/seed/demo';
import { createTestApp, startTestServer, type TestApp, type TestServer } from '../helpers/test-app';

describe('demo seed', () => {
  let t: TestApp;
  const seeded: Array<[number, string, number]> = [];
  beforeAll(async () => {
    t = await createTestApp();
    const content: BoardContentSeeder = { seed: async (boardId, slug, ownerId) => void seeded.push([boardId, slug, ownerId]) };
    await seedDemo({ services: t.ctx.services, boardContent: content });
  });
  afterAll(() => t.close());

  it('creates the six demo accounts with the published password; Mara is the site admin', async () => {
    const users = await t.ctx.db('users').orderBy('id').select('email', 'name', 'is_admin');
    expect(users.map((u) => [u.email, u.name, Boolean(u.is_admin)])).toEqual([
      ['mara@larkspur.example', 'Mara Quinn', true],
      ['theo@larkspur.example', 'Theo Vance', false],
      ['ines@larkspur.example', 'Ines Okafor', false],
      ['calder@room14.example', 'Ruth Calder', false],
      ['sam@room14.example', 'Sam Ortiz', false],
      ['priya@room14.example', 'Priya Nair', false],
    ]);
    const theo = await t.signIn('theo@larkspur.example', DEMO_PASSWORD);
    const boards = (await theo.get('/api/boards')).body.boards.map((b: { title: string; role: string }) => [b.title, b.role]).sort();
    expect(boards).toEqual([['1-bit processor', 'editor'], ['Debounced clock', 'owner'], ['Half adder', 'owner'], ['Mux logic unit', 'editor'], ['Tube logic unit', 'editor']]);
  });

  it('gives each board its members and calls the content hook with its slug', async () => {
    const sam = await t.signIn('sam@room14.example', DEMO_PASSWORD);
    const [counter] = (await sam.get('/api/boards')).body.boards;
    expect(counter).toMatchObject({ title: '4-bit ripple counter', role: 'viewer', memberCount: 3 });
    const calder = await t.signIn('calder@room14.example', DEMO_PASSWORD);
    const mux = (await calder.get('/api/boards')).body.boards.find((b: { title: string }) => b.title === 'Mux logic unit');
    expect(mux.role).toBe('viewer');
    expect(seeded.map(([, slug]) => slug)).toEqual(['half-adder', 'mux-logic-unit', 'debounced-clock', 'tube-logic-unit', 'one-bit-processor', 'ripple-counter-4bit']);
    const counterRow = seeded.find(([, slug]) => slug === 'ripple-counter-4bit')!;
    expect(counterRow[0]).toBe(counter.id);
    expect(counterRow[2]).toBe(counter.ownerId);
  });
});

describe('listening server', () => {
  let s: TestServer;
  beforeAll(async () => {
    const dist = join(tmpdir(), `gatefold-dist-${process.pid}-${Date.now()}`);
    mkdirSync(join(dist, 'assets'), { recursive: true });
    writeFileSync(join(dist, 'index.html'), '<!doctype html><title>Gatefold</title><div id="root"></div>');
    writeFileSync(join(dist, 'assets', 'app-1234.js'), 'console.log(1)');
    s = await startTestServer({ distDir: dist, seedDemo: true });
  });
  afterAll(() => s.close());

  it('serves the API, seeds the demo when asked, and signs in with its own origin', async () => {
    const health = await fetch(`${s.url}/api/health`);
    expect(await health.json()).toMatchObject({ ok: true });
    const login = await fetch(`${s.url}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', origin: s.url },
      body: JSON.stringify({ email: 'theo@larkspur.example', password: DEMO_PASSWORD }),
    });
    expect(login.status).toBe(200);
    expect(login.headers.get('set-cookie')).toMatch(/^gatefold\.sid=.*HttpOnly.*SameSite=Lax/i);
  });

  it('serves the built client with the client-side routing fallback, but not for /api', async () => {
    const page = await fetch(`${s.url}/boards/3/members`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('<div id="root">');
    const asset = await fetch(`${s.url}/assets/app-1234.js`);
    expect(asset.headers.get('cache-control')).toMatch(/immutable/);
    const api = await fetch(`${s.url}/api/nothing-here`);
    expect(api.status).toBe(404);
    expect((await api.json()).error.code).toBe('not_found');
  });
});
