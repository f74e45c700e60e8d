import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { getBoardRole, roleAtLeast } from '../../server/services/authz';
import { createTestApp, type TestApp } from '../helpers/test-app';

describe('authz', () => {
  it('orders roles owner > editor > viewer and never lets null through', () => {
    // Role ladder: PRODUCT.md "Roles" (ours). Expected matrix written out by hand.
    const roles = ['owner', 'editor', 'viewer'] as const;
    const table = roles.map((have) => roles.map((min) => roleAtLeast(have, min)));
    expect(table).toEqual([
      [true, true, true],
      [false, true, true],
      [false, false, true],
    ]);
    for (const min of roles) {
      expect(roleAtLeast(null, min)).toBe(false);
      expect(roleAtLeast(undefined, min)).toBe(false);
    }
  });

  describe('getBoardRole', () => {
    let t: TestApp;
    beforeAll(async () => {
      t = await createTestApp();
    });
    afterAll(() => t.close());

    it('reads the role from the members table, null for strangers and missing boards', async () => {
      const owner = await t.ctx.services.auth.signUp({ email: 'theo@larkspur.example', name: 'Theo Vance', password: 'gatefold-demo' });
      const other = await t.ctx.services.auth.signUp({ email: 'ines@larkspur.example', name: 'Ines Okafor', password: 'gatefold-demo' });
      const board = await t.ctx.services.boards.create(owner.id, { title: 'Debounced clock' });
      expect(await getBoardRole(t.ctx.db, board.id, owner.id)).toBe('owner');
      expect(await getBoardRole(t.ctx.db, board.id, other.id)).toBeNull();
      await t.ctx.services.members.addDirect(board.id, other.id, 'editor');
      expect(await getBoardRole(t.ctx.db, board.id, other.id)).toBe('editor');
      expect(await getBoardRole(t.ctx.db, 424242, owner.id)).toBeNull();
    });
  });
});

describe('config', () => {
  it('has the documented defaults', () => {
    const c = loadConfig({ SESSION_SECRET: 'a-long-enough-secret' });
    expect(c).toMatchObject({ port: 3000, databaseFile: 'data/gatefold.sqlite', uploadDir: 'data/uploads', seedDemo: false, smtpUrl: undefined });
    expect(c.bcryptCost).toBeGreaterThanOrEqual(10);
  });

  it('names every bad setting in one line', () => {
    expect(() => loadConfig({ PORT: 'eighty', PUBLIC_URL: 'ftp://x', BCRYPT_COST: '4' })).toThrow(/PORT: .*PUBLIC_URL: .*BCRYPT_COST: BCRYPT_COST must be at least 10/);
  });

  it('reads PUBLIC_URL as an origin and GATEFOLD_SEED_DEMO as a flag', () => {
    const c = loadConfig({ SESSION_SECRET: 'a-long-enough-secret', PUBLIC_URL: 'https://gatefold.larkspur.example/', GATEFOLD_SEED_DEMO: '1' });
    expect(c.publicUrl).toBe('https://gatefold.larkspur.example');
    expect(c.seedDemo).toBe(true);
  });
});

describe('https deployment', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ publicUrl: 'https://gatefold.larkspur.example' });
  });
  afterAll(() => t.close());

  it('marks the session cookie Secure behind an https proxy and allows that origin', async () => {
    const res = await t
      .request()
      .post('/api/auth/signup')
      .set('Origin', 'https://gatefold.larkspur.example')
      .set('X-Forwarded-Proto', 'https')
      .send({ email: 'mara@larkspur.example', password: 'gatefold-demo', name: 'Mara Quinn' });
    expect(res.status).toBe(201);
    expect(String(res.headers['set-cookie'])).toMatch(/; Secure/);
    expect(String(res.headers['content-security-policy'])).toContain('wss://');
    expect(res.headers['strict-transport-security']).toBeDefined();
  });
});
