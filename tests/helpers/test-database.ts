import { inject } from 'vitest';
import pg from 'pg';

/**
 * The API suite runs twice: on a SQLite file per test app, and (Vitest project `api-postgres`, see
 * postgres-setup.ts) on a fresh PostgreSQL database per test app. This gives that database.
 */

declare module 'vitest' {
  export interface ProvidedContext {
    /** `postgres://user@host:port` of the test PostgreSQL server, when the project runs on it */
    pgServerUrl?: string;
  }
}

function serverUrl(): string | undefined {
  try {
    return inject('pgServerUrl') ?? process.env.GATEFOLD_TEST_PG;
  } catch {
    return process.env.GATEFOLD_TEST_PG;
  }
}

async function admin<T>(url: string, work: (c: pg.Client) => Promise<T>): Promise<T> {
  const c = new pg.Client({ connectionString: `${url}/postgres` });
  await c.connect();
  try {
    return await work(c);
  } finally {
    await c.end();
  }
}

let n = 0;

/** A new empty database's URL when the tests run on PostgreSQL, else undefined (SQLite). */
export async function createTestDatabase(): Promise<string | undefined> {
  const url = serverUrl();
  if (!url) return undefined;
  const name = `gatefold_${process.pid}_${Date.now().toString(36)}_${++n}`;
  await admin(url, (c) => c.query(`create database "${name}"`));
  return `${url}/${name}`;
}

/** Drops a database made by createTestDatabase (its connections are ended first). */
export async function dropTestDatabase(databaseUrl: string | undefined): Promise<void> {
  const url = serverUrl();
  if (!url || !databaseUrl) return;
  const name = new URL(databaseUrl).pathname.slice(1);
  await admin(url, (c) => c.query(`drop database if exists "${name}" with (force)`));
}
