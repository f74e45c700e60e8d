import { ConnectSessionKnexStore } from 'connect-session-knex';
import { isPostgres, type Db } from './knex';

/** Sessions live in the same database (SQLite file or PostgreSQL), table `sessions` (the store creates it); every server shares them. */
export function createSessionStore(db: Db): ConnectSessionKnexStore {
  const store = new ConnectSessionKnexStore({ knex: db, tableName: 'sessions', createTable: true, cleanupInterval: 10 * 60 * 1000 });
  // Several servers starting at once on one PostgreSQL may all try to create the table: the ones that
  // lose the race find it there (and leave the periodic clean-up to the others).
  store.ready = store.ready.catch(async (err: unknown) => {
    if (!(await db.schema.hasTable('sessions'))) throw err;
  });
  return store;
}

/** Stops the store's periodic clean-up so the process can exit and Knex can close. */
export function stopSessionStore(store: ConnectSessionKnexStore): void {
  if (store.nextDbCleanup) clearTimeout(store.nextDbCleanup);
  store.nextDbCleanup = undefined;
}

/** Signs a user out everywhere (after a password reset), except the session `keepSid`. */
export async function deleteSessionsOfUser(db: Db, userId: number, keepSid?: string): Promise<number> {
  // connect-session-knex stores `sess` as json on PostgreSQL and as text on SQLite
  const q = isPostgres(db)
    ? db('sessions').whereRaw("(sess->>'userId') = ?", [String(userId)])
    : db('sessions').whereRaw("json_extract(sess, '$.userId') = ?", [userId]);
  if (keepSid) q.whereNot('sid', keepSid);
  return q.del();
}
