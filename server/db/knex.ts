import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import knex, { type Knex } from 'knex';
import pg from 'pg';

/** The database handle. Only server/db/** imports Knex itself; everyone else uses this type. */
export type Db = Knex;
/** A handle inside a transaction (same query API). */
export type Tx = Knex.Transaction;

interface SqliteConnection {
  pragma(source: string): unknown;
}

/** Opens (creating if needed) the SQLite file with WAL journaling and foreign keys enforced. */
export function openDb(file: string): Db {
  if (file !== ':memory:') mkdirSync(dirname(file), { recursive: true });
  return knex({
    client: 'better-sqlite3',
    connection: { filename: file },
    useNullAsDefault: true,
    pool: {
      min: 1,
      max: 1,
      // Pragmas are per connection, so set them as each one opens. WAL lets readers run while the
      // single writer commits; busy_timeout covers a second process (CLI) touching the same file.
      afterCreate: (conn: SqliteConnection, done: (err: Error | null, conn: unknown) => void) => {
        try {
          conn.pragma('journal_mode = WAL');
          conn.pragma('foreign_keys = ON');
          conn.pragma('busy_timeout = 5000');
          conn.pragma('synchronous = NORMAL');
          done(null, conn);
        } catch (err) {
          done(err as Error, conn);
        }
      },
    },
  });
}

/**
 * Opens the configured database: PostgreSQL when `databaseUrl` is set (several servers share it),
 * else the SQLite file. Both run the same migrations and the same Knex code; what differs between the
 * two is handled in this folder (see `isPostgres`).
 */
export function openDatabase(c: { databaseFile: string; databaseUrl?: string }): Db {
  if (!c.databaseUrl) return openDb(c.databaseFile);
  // count(*) is a bigint, which pg returns as a string; SQLite gives a number. Counts and ids here stay
  // far below 2^53, so both databases answer numbers.
  pg.types.setTypeParser(pg.types.builtins.INT8, (v: string) => Number(v));
  return knex({
    client: 'pg',
    connection: { connectionString: c.databaseUrl, application_name: 'gatefold' },
    // a handful per server: rooms write in batches, and several servers share one database
    pool: { min: 0, max: 10 },
    acquireConnectionTimeout: 10_000,
  });
}

/** Whether `db` is PostgreSQL (otherwise SQLite). */
export function isPostgres(db: Db): boolean {
  const client = (db.client as { config?: { client?: unknown } }).config?.client;
  return client === 'pg' || client === 'postgres' || client === 'postgresql';
}

/** Whether `err` is a unique-constraint violation, in either database. */
export function isUniqueViolation(err: unknown): boolean {
  const e = err as { code?: unknown; message?: unknown } | null;
  return e?.code === '23505' || e?.code === 'SQLITE_CONSTRAINT_UNIQUE' || String(e?.message ?? '').includes('UNIQUE constraint failed');
}

/** Current time as stored in the database (ISO 8601, UTC). */
export function nowIso(): string {
  return new Date().toISOString();
}
