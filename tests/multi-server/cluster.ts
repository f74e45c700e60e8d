/**
 * Several real Gatefold processes on one PostgreSQL and one Redis (Debian's, started in a temp folder
 * on loopback ports, stopped by pid), as docs/deploy.md runs them; and a small TCP relay standing in
 * for the reverse proxy (any backend, no sticky sessions), so a client whose server died reconnects to
 * another through the same address.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import net from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import knex, { type Knex } from 'knex';
import { freePort, startPostgres, startRedis, type RunningPostgres, type RunningRedis } from '../helpers/backing-services';
import type { TestServer } from '../helpers/test-app';

const ROOT = resolve(import.meta.dirname, '../..');

export interface GatefoldProcess {
  url: string;
  port: number;
  child: ChildProcess;
  /** stdout and stderr so far */
  output: () => string;
  /** SIGTERM and wait for the exit (the graceful drain) */
  stop(): Promise<number | null>;
  /** SIGKILL (a crash) */
  kill(): Promise<void>;
}

/** Starts `server/index.ts` (through tsx's loader) with `env` and resolves once it listens. */
export async function startGatefold(env: Record<string, string>): Promise<GatefoldProcess> {
  const port = await freePort();
  // node itself with tsx's loader (not the tsx wrapper): the pid is the server's, so SIGKILL is a crash
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: ROOT,
    env: { ...process.env, ...env, PORT: String(port), HOST: '127.0.0.1', NODE_ENV: 'test' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout?.on('data', (b: Buffer) => (out += b.toString()));
  child.stderr?.on('data', (b: Buffer) => (out += b.toString()));
  const exited = new Promise<number | null>((r) => child.once('exit', (code) => r(code)));
  await new Promise<void>((ok, fail) => {
    const timer = setInterval(() => {
      if (out.includes('Gatefold listening on')) {
        clearInterval(timer);
        ok();
      }
    }, 50);
    void exited.then((code) => {
      clearInterval(timer);
      fail(new Error(`gatefold exited (${code}) before listening:\n${out}`));
    });
  });
  return {
    url: `http://127.0.0.1:${port}`,
    port,
    child,
    output: () => out,
    async stop() {
      child.kill('SIGTERM');
      return exited;
    },
    async kill() {
      child.kill('SIGKILL');
      await exited;
    },
  };
}

export interface Cluster {
  pg: RunningPostgres;
  redis: RunningRedis;
  databaseUrl: string;
  servers: GatefoldProcess[];
  /** The database the servers share (for checks). */
  db: Knex;
  close(): Promise<void>;
}

/** PostgreSQL, Redis and `n` Gatefold servers sharing them (the first migrates, the rest start together). */
export async function startCluster(n: number, extraEnv: Record<string, string> = {}): Promise<Cluster> {
  const pg = await startPostgres();
  const redis = await startRedis();
  const databaseUrl = await pg.createDatabase('gatefold');
  const uploads = mkdtempSync(join(tmpdir(), 'gatefold-uploads-'));
  const env = {
    DATABASE_URL: databaseUrl, REDIS_URL: redis.url, SESSION_SECRET: 'several-servers-secret-0123456789',
    BCRYPT_COST: '10', UPLOAD_DIR: uploads, DIST_DIR: join(uploads, 'no-dist'),
    RATE_LIMIT_SIGNUP: '1000', RATE_LIMIT_LOGIN: '1000', RATE_LIMIT_LOGIN_ADDRESS: '1000',
    ...extraEnv,
  };
  const servers: GatefoldProcess[] = [];
  try {
    servers.push(await startGatefold(env));
    servers.push(...(await Promise.all(Array.from({ length: n - 1 }, () => startGatefold(env)))));
  } catch (err) {
    await Promise.all(servers.map((s) => s.kill()));
    await redis.stop();
    await pg.stop();
    throw err;
  }
  const db = knex({ client: 'pg', connection: databaseUrl, pool: { min: 0, max: 2 } });
  return {
    pg, redis, databaseUrl, servers, db,
    async close() {
      await db.destroy();
      await Promise.all(servers.map((s) => (s.child.exitCode === null && s.child.signalCode === null ? s.kill() : undefined)));
      await redis.stop();
      await pg.stop();
      rmSync(uploads, { recursive: true, force: true });
    },
  };
}

/** What the collab helpers need of a server: its address. */
export function at(server: { url: string }): TestServer {
  return { url: server.url } as TestServer;
}

export interface Relay {
  url: string;
  close(): Promise<void>;
}

/**
 * A TCP relay on a loopback port: each connection goes to the first backend that accepts it, in the
 * order `backends()` gives (as a proxy skips a dead upstream). HTTP and websocket upgrades pass as bytes.
 */
export async function startRelay(backends: () => number[]): Promise<Relay> {
  const sockets = new Set<net.Socket>();
  const server = net.createServer((client) => {
    sockets.add(client);
    client.on('close', () => sockets.delete(client));
    client.pause();
    const tryNext = (list: number[]) => {
      const port = list[0];
      if (port === undefined) return client.destroy();
      const upstream = net.connect(port, '127.0.0.1');
      upstream.once('error', () => {
        upstream.destroy();
        tryNext(list.slice(1));
      });
      upstream.once('connect', () => {
        sockets.add(upstream);
        upstream.on('close', () => {
          sockets.delete(upstream);
          client.destroy();
        });
        upstream.on('error', () => client.destroy());
        client.on('error', () => upstream.destroy());
        client.on('close', () => upstream.destroy());
        client.pipe(upstream);
        upstream.pipe(client);
        client.resume();
      });
    };
    tryNext(backends());
  });
  const port = await new Promise<number>((ok) => server.listen(0, '127.0.0.1', () => ok((server.address() as net.AddressInfo).port)));
  return {
    url: `http://127.0.0.1:${port}`,
    async close() {
      for (const s of sockets) s.destroy();
      await new Promise<void>((ok) => server.close(() => ok()));
    },
  };
}
