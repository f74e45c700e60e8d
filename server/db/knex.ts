import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import knex, { type Knex } from 'knex';

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

/** Current time as stored in the database (ISO 8601, UTC). */
export function nowIso(): string {
  return new Date().toISOString();
}
