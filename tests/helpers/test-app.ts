import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import supertest from 'supertest';
import { createApp, type AppContext } from '../../server/app';
import { loadConfig, type AppConfig } from '../../server/config';
import { startServer } from '../../server/index';
import type { ApiMail } from '../../shared/api';
import type { CaughtMail } from '../../server/services/mail-catcher';
import { createTestDatabase, dropTestDatabase } from './test-database';

/** The origin test agents send, and the PUBLIC_URL the test app links to in e-mails. */
export const TEST_ORIGIN = 'http://gatefold.test';

/** Config overrides; feature engineers may add their own keys (e.g. `collab`). */
export type TestAppOverrides = Partial<AppConfig> & Record<string, unknown>;

/** A supertest agent: keeps cookies between requests and sends `Origin: TEST_ORIGIN` on each. */
export type Agent = supertest.Agent;

/**
 * Config for a test: fresh SQLite file in its own temp dir, built-in SMTP catcher on a free port,
 * bcrypt cost 10, no demo seed, generous rate limits, no client build, PUBLIC_URL = TEST_ORIGIN.
 */
export function testConfig(overrides: TestAppOverrides = {}): { config: AppConfig; dir: string } {
  const dir = mkdtempSync(join(tmpdir(), 'gatefold-test-'));
  const base = loadConfig({ SESSION_SECRET: 'test-secret-0123456789abcdef', BCRYPT_COST: '10' });
  const config: AppConfig = {
    ...base,
    port: 0,
    host: '127.0.0.1',
    databaseFile: join(dir, 'gatefold.sqlite'),
    uploadDir: join(dir, 'uploads'),
    distDir: join(dir, 'no-dist'),
    smtpUrl: undefined,
    smtpCatcherPort: 0,
    publicUrl: TEST_ORIGIN,
    seedDemo: false,
    rateLimit: { ...base.rateLimit, windowMs: 60_000, login: 1000, loginPerAddress: 1000, signup: 1000, resetRequest: 1000, invitations: 1000 },
    logMailLinks: false,
    ...overrides,
  } as AppConfig;
  return { config, dir };
}

export interface TestApp {
  ctx: AppContext;
  /** A new agent (no cookie yet) that sends the allowed Origin header. */
  request(): Agent;
  /** Signs up a new account and returns an agent carrying its session cookie. */
  signUp(name: string, email: string, password?: string): Promise<Agent>;
  /** Signs in an existing account and returns an agent carrying its session cookie. */
  signIn(email: string, password: string): Promise<Agent>;
  /** Waits (up to `timeoutMs`) for a caught message to `to` (newest first) whose subject matches, as the Outbox stores it. */
  waitForMail(to: string, subject?: RegExp, timeoutMs?: number): Promise<ApiMail>;
  /** Waits for a message to `to` as the SMTP catcher received it (live links, unlike the Outbox), newest first. */
  waitForDelivery(to: string, subject?: RegExp, timeoutMs?: number): Promise<CaughtMail>;
  /** Every message the SMTP catcher received so far, in order. */
  deliveries: CaughtMail[];
  close(): Promise<void>;
}

/** A link `${TEST_ORIGIN}/<prefix>/<token>` in a message's text; returns the token. */
export function tokenFromMail(mail: Pick<ApiMail, 'text'>, prefix: 'invitations' | 'reset'): string {
  const m = new RegExp(`/${prefix}/([A-Za-z0-9_-]+)`).exec(mail.text);
  if (!m) throw new Error(`no /${prefix}/ link in mail: ${mail.text}`);
  return m[1];
}

/**
 * An app built by `createApp` (not listening: supertest drives it) on a real temporary SQLite file,
 * with the real SMTP catcher. Call `close()` in afterAll/afterEach: it closes the app and removes the dir.
 */
export async function createTestApp(overrides: TestAppOverrides = {}): Promise<TestApp> {
  // on PostgreSQL (project api-postgres) each app gets its own fresh database
  const databaseUrl = 'databaseUrl' in overrides ? overrides.databaseUrl : await createTestDatabase();
  const { config, dir } = testConfig({ databaseUrl, ...overrides });
  const ctx = await createApp(config);
  const deliveries = collectDeliveries(ctx);
  const request = () => supertest.agent(ctx.app).set('Origin', TEST_ORIGIN);

  const withSession = async (agent: Agent, path: string, body: object, expected: number) => {
    const res = await agent.post(path).send(body);
    if (res.status !== expected) throw new Error(`${path} answered ${res.status}: ${JSON.stringify(res.body)}`);
    return agent;
  };

  return {
    ctx,
    request,
    signUp: (name, email, password = 'correct horse battery') =>
      withSession(request(), '/api/auth/signup', { name, email, password }, 201),
    signIn: (email, password) => withSession(request(), '/api/auth/login', { email, password }, 200),
    deliveries,
    waitForDelivery: (to, subject, timeoutMs) => waitForDelivery(deliveries, to, subject, timeoutMs),
    async waitForMail(to, subject, timeoutMs = 5000) {
      const until = Date.now() + timeoutMs;
      for (;;) {
        const list = await ctx.services.outbox.list();
        const hit = list.find((m) => m.to.toLowerCase().includes(to.toLowerCase()) && (!subject || subject.test(m.subject)));
        if (hit) return ctx.services.outbox.get(hit.id);
        if (Date.now() > until) throw new Error(`no mail to ${to} matching ${subject ?? 'anything'} within ${timeoutMs} ms`);
        await new Promise((r) => setTimeout(r, 25));
      }
    },
    async close() {
      await ctx.close();
      if (databaseUrl !== overrides.databaseUrl) await dropTestDatabase(databaseUrl);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Collects what the app's built-in SMTP catcher receives (the live messages, as a mailbox would). */
export function collectDeliveries(ctx: AppContext): CaughtMail[] {
  const list: CaughtMail[] = [];
  // an app sending to SMTP_URL has no catcher: nothing to collect
  ctx.mail.catcher?.onDelivery((m) => list.push(m));
  return list;
}

/** Waits (up to `timeoutMs`) for a delivered message to `to` whose subject matches; newest first. */
export async function waitForDelivery(list: CaughtMail[], to: string, subject?: RegExp, timeoutMs = 5000): Promise<CaughtMail> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const hit = [...list].reverse().find((m) => m.to.toLowerCase().includes(to.toLowerCase()) && (!subject || subject.test(m.subject)));
    if (hit) return hit;
    if (Date.now() > until) throw new Error(`no delivery to ${to} matching ${subject ?? 'anything'} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

export interface TestServer {
  /** e.g. `http://127.0.0.1:41234` — use it for fetch, websockets and browsers. */
  url: string;
  ctx: AppContext;
  /** What the built-in SMTP catcher received, live links included. */
  deliveries: CaughtMail[];
  close(): Promise<void>;
}

/**
 * A LISTENING server (via `startServer`, so features attached there, like collaboration, are on) on a
 * free port of 127.0.0.1, with a temp SQLite file. PUBLIC_URL is unset, so its own origin is allowed and
 * e-mailed links point at `url`. Pass `seedDemo: true` for the demo data.
 */
export async function startTestServer(overrides: TestAppOverrides = {}): Promise<TestServer> {
  const databaseUrl = 'databaseUrl' in overrides ? overrides.databaseUrl : await createTestDatabase();
  const { config, dir } = testConfig({ publicUrl: undefined, databaseUrl, ...overrides });
  const running = await startServer(config);
  return {
    url: running.url,
    ctx: running.ctx,
    deliveries: collectDeliveries(running.ctx),
    async close() {
      await running.close();
      if (databaseUrl !== overrides.databaseUrl) await dropTestDatabase(databaseUrl);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
