import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { chownSync, existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';

/**
 * Debian's PostgreSQL 15 and Redis 7, started for tests on free loopback ports with their data in a
 * temp folder, and stopped by pid. PostgreSQL refuses to run as root: as root it runs as the
 * `postgres` user on a folder that user owns (`runuser`).
 */

export const PG_BIN = '/usr/lib/postgresql/15/bin';
export const REDIS_BIN = '/usr/bin/redis-server';

/** Why the services cannot run here, or undefined when they can. */
export function backingServicesMissing(): string | undefined {
  if (!existsSync(join(PG_BIN, 'initdb'))) return `PostgreSQL 15 is not installed (${PG_BIN}); as root, npm test installs the Debian package postgresql`;
  if (!existsSync(REDIS_BIN)) return `redis-server is not installed (${REDIS_BIN}); as root, npm test installs the Debian package redis-server`;
  if (process.getuid?.() === 0 && spawnSync('id', ['postgres']).status !== 0) return 'there is no postgres user to run PostgreSQL as';
  return undefined;
}

/** A free TCP port on 127.0.0.1 (closed again at once). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => resolve(port));
    });
  });
}

export interface RunningPostgres {
  /** `postgres://gatefold@127.0.0.1:PORT` (no database: add `/name`) */
  serverUrl: string;
  /** Makes a fresh empty database and returns its URL. */
  createDatabase(name?: string): Promise<string>;
  dropDatabase(url: string): Promise<void>;
  stop(): Promise<void>;
}

const asRoot = () => process.getuid?.() === 0;

function run(cmd: string, args: string[]): void {
  const full = asRoot() ? ['runuser', ['-u', 'postgres', '--', cmd, ...args]] as const : [cmd, args] as const;
  const r = spawnSync(full[0], full[1], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`${cmd} failed (${r.status}): ${r.stderr || r.stdout}`);
}

/** Stops a process by pid and waits (up to 10 s) until it is gone. */
async function stopPid(pid: number, signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
  try {
    process.kill(pid, signal);
  } catch {
    return;
  }
  for (let i = 0; i < 200; i++) {
    try {
      process.kill(pid, 0);
    } catch {
      return;
    }
    await new Promise((r) => setTimeout(r, 50));
  }
  try {
    process.kill(pid, 'SIGKILL');
  } catch {
    /* gone */
  }
}

/** initdb + postgres on a free port, its socket and data in a temp folder; `stop()` removes it all. */
export async function startPostgres(): Promise<RunningPostgres> {
  const dir = mkdtempSync(join(tmpdir(), 'gatefold-pg-'));
  if (asRoot()) {
    const uid = Number(spawnSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).stdout.trim());
    const gid = Number(spawnSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).stdout.trim());
    chownSync(dir, uid, gid);
  }
  const data = join(dir, 'data');
  run(join(PG_BIN, 'initdb'), ['-D', data, '-U', 'gatefold', '--auth=trust', '--no-sync', '--encoding=UTF8', '--locale=C.UTF-8']);
  const port = await freePort();
  // fsync off: test data need not survive a power cut; listen on loopback only
  run(join(PG_BIN, 'pg_ctl'), ['-D', data, '-w', '-l', join(dir, 'log'), '-o', `-p ${port} -k ${dir} -c listen_addresses=127.0.0.1 -c fsync=off -c max_connections=300`, 'start']);
  const pid = Number(readFileSync(join(data, 'postmaster.pid'), 'utf8').split('\n')[0]);
  const serverUrl = `postgres://gatefold@127.0.0.1:${port}`;
  const admin = new pg.Client({ connectionString: `${serverUrl}/postgres` });
  await admin.connect();
  let n = 0;
  return {
    serverUrl,
    async createDatabase(name = `gatefold_t${process.pid}_${++n}_${Date.now() % 100000}`) {
      await admin.query(`create database "${name}"`);
      return `${serverUrl}/${name}`;
    },
    async dropDatabase(url) {
      const name = new URL(url).pathname.slice(1);
      await admin.query(`drop database if exists "${name}" with (force)`);
    },
    async stop() {
      await admin.end().catch(() => undefined);
      await stopPid(pid);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

export interface RunningRedis {
  url: string;
  stop(): Promise<void>;
}

/** redis-server on a free loopback port, no persistence, its folder in a temp dir. */
export async function startRedis(): Promise<RunningRedis> {
  const dir = mkdtempSync(join(tmpdir(), 'gatefold-redis-'));
  const port = await freePort();
  const child: ChildProcess = spawn(REDIS_BIN, ['--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no', '--dir', dir], { stdio: ['ignore', 'pipe', 'pipe'] });
  await new Promise<void>((resolve, reject) => {
    let out = '';
    const onData = (b: Buffer) => {
      out += b.toString();
      if (out.includes('Ready to accept connections')) resolve();
    };
    child.stdout?.on('data', onData);
    child.once('exit', (code) => reject(new Error(`redis-server exited (${code}): ${out}`)));
    setTimeout(() => reject(new Error(`redis-server did not start: ${out}`)), 15000).unref();
  });
  child.stdout?.resume();
  return {
    url: `redis://127.0.0.1:${port}`,
    async stop() {
      if (child.pid) await stopPid(child.pid);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
