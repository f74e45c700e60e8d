/**
 * Playwright fixtures shared by Gatefold's browser tests.
 *
 * Each TEST gets its own running Gatefold: the built client (`dist/`, made by `vite build`, which
 * `npm test` runs before Playwright; or the folder DIST_DIR names) served by
 * `node_modules/.bin/tsx server/index.ts` on a free port, with its own SQLite file and upload folder in
 * a fresh temp directory, so specs never see each other's accounts (the first account to sign up is
 * the site admin) and can run side by side.
 *
 * Usage in a spec:
 *   import { test, expect, signUp, signIn } from './fixtures';
 *   test.use({ seedDemo: true });              // optional: start with the demo accounts and boards
 *   test('…', async ({ page, gatefold, browser }) => {
 *     await signUp(page, { name: 'Mara Quinn', email: 'mara@larkspur.example', password: 'long-enough' });
 *     const other = await browser.newContext({ baseURL: gatefold.baseURL });   // a second person
 *   });
 *
 * Fixtures: `gatefold` ({ baseURL, dataDir, logs() }); `baseURL` is set from it, so `page.goto('/boards')`
 * works. Options: `seedDemo` (GATEFOLD_SEED_DEMO=1), `serverEnv` (extra environment variables).
 * The server runs in its own process group, which is killed when the test ends; its output is
 * attached to the test report when the test fails.
 */
import { test as base, expect, type Page } from '@playwright/test';
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const START_TIMEOUT_MS = 45_000;

export interface GatefoldServer {
  /** e.g. http://127.0.0.1:41234 */
  baseURL: string;
  /** The temp directory holding gf.sqlite and uploads/ (removed after the test). */
  dataDir: string;
  /** Everything the server printed so far. */
  logs: () => string;
}

interface Options {
  seedDemo: boolean;
  serverEnv: Record<string, string>;
}

/** A port nobody is listening on right now (the OS picks it). */
export function freePort(): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const addr = srv.address();
      const port = typeof addr === 'object' && addr ? addr.port : 0;
      srv.close(() => resolvePort(port));
    });
  });
}

async function waitForHealth(baseURL: string, child: ChildProcess, logs: () => string): Promise<void> {
  const deadline = Date.now() + START_TIMEOUT_MS;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`Gatefold server exited with code ${child.exitCode} before it was healthy:\n${logs()}`);
    try {
      const res = await fetch(`${baseURL}/api/health`);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`Gatefold server did not answer GET /api/health within ${START_TIMEOUT_MS / 1000} s:\n${logs()}`);
}

async function stop(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.pid === undefined) return;
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  const signal = (sig: NodeJS.Signals) => {
    try {
      process.kill(-child.pid!, sig); // the whole group: tsx and the node process it starts
    } catch {
      // already gone
    }
  };
  signal('SIGTERM');
  const timer = setTimeout(() => signal('SIGKILL'), 5_000);
  await exited;
  clearTimeout(timer);
}

export const test = base.extend<Options & { gatefold: GatefoldServer }>({
  seedDemo: [false, { option: true }],
  serverEnv: [{}, { option: true }],

  // The fixture callback is named `provide`, not `use`: the React hooks lint rule reserves `use`.
  gatefold: async ({ seedDemo, serverEnv }, provide, testInfo) => {
    // the server serves DIST_DIR (relative to the checkout) when it is set, else dist/
    const index = join(resolve(ROOT, process.env.DIST_DIR ?? 'dist'), 'index.html');
    if (!existsSync(index)) {
      throw new Error(`${index} is missing: build the client first (node_modules/.bin/vite build; npm test does it)`);
    }
    const dataDir = mkdtempSync(join(tmpdir(), 'gatefold-e2e-'));
    const port = await freePort();
    const baseURL = `http://127.0.0.1:${port}`;
    let output = '';
    const child = spawn(join(ROOT, 'node_modules', '.bin', 'tsx'), ['server/index.ts'], {
      cwd: ROOT,
      detached: true, // its own process group, so stop() reaches every child
      stdio: ['ignore', 'pipe', 'pipe'],
      env: {
        ...process.env,
        NODE_ENV: 'production',
        PORT: String(port),
        HOST: '127.0.0.1',
        DATABASE_FILE: join(dataDir, 'gf.sqlite'),
        UPLOAD_DIR: join(dataDir, 'uploads'),
        // the server asks for at least 16 characters
        SESSION_SECRET: 'test-session-secret-e2e',
        // the lowest cost the server accepts: sign-ups stay quick on shared CPUs
        BCRYPT_COST: '10',
        GATEFOLD_SEED_DEMO: seedDemo ? '1' : '0',
        ...serverEnv,
      },
    });
    child.stdout?.on('data', (d: Buffer) => (output += d.toString()));
    child.stderr?.on('data', (d: Buffer) => (output += d.toString()));
    const logs = () => output;
    try {
      await waitForHealth(baseURL, child, logs);
      await provide({ baseURL, dataDir, logs });
    } finally {
      await stop(child);
      if (testInfo.status !== testInfo.expectedStatus) await testInfo.attach('gatefold-server.log', { body: output, contentType: 'text/plain' });
      rmSync(dataDir, { recursive: true, force: true });
    }
  },

  baseURL: async ({ gatefold }, provide) => {
    await provide(gatefold.baseURL);
  },
});

export { expect };

export interface NewAccount {
  name: string;
  email: string;
  password: string;
}

/**
 * Creates an account through the sign-up page and waits until the app has moved on (to `/boards`,
 * or to the page named by `?next=`). Pass `{ goto: false }` when the page is already on a sign-up
 * form (e.g. reached from an invitation); the e-mail field is then filled over whatever it holds.
 */
export async function signUp(page: Page, account: NewAccount, opts: { goto?: boolean } = {}): Promise<void> {
  if (opts.goto !== false) await page.goto('/signup');
  const form = page.getByRole('form', { name: 'Sign up' });
  await form.getByLabel('Name', { exact: true }).fill(account.name);
  await form.getByLabel('E-mail', { exact: true }).fill(account.email);
  await form.getByLabel('Password', { exact: true }).fill(account.password);
  await form.getByRole('button', { name: 'Create account' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/signup'));
}

/** Signs in through the sign-in page and waits until the app has moved on. */
export async function signIn(page: Page, email: string, password: string, opts: { goto?: boolean } = {}): Promise<void> {
  if (opts.goto !== false) await page.goto('/signin');
  const form = page.getByRole('form', { name: 'Sign in' });
  await form.getByLabel('E-mail', { exact: true }).fill(email);
  await form.getByLabel('Password', { exact: true }).fill(password);
  await form.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/signin'));
}
