import { isPostgres, isUniqueViolation, type Db } from './knex';

/** A row of `users`, with the password hash (never sent to a client). */
export interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string;
  is_admin: number | boolean;
  created_at: string;
}

export async function findUserByEmail(db: Db, email: string): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ email }).first();
}

export async function findUserById(db: Db, id: number): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ id }).first();
}

export async function countUsers(db: Db): Promise<number> {
  const row = await db('users').count({ n: '*' }).first();
  return Number(row?.n ?? 0);
}

export async function insertUser(
  db: Db,
  u: { email: string; name: string; passwordHash: string; isAdmin: boolean; createdAt: string },
): Promise<number> {
  let row: unknown;
  try {
    [row] = await db('users')
      .insert({ email: u.email, name: u.name, password_hash: u.passwordHash, is_admin: u.isAdmin, created_at: u.createdAt })
      .returning('id');
  } catch (err) {
    // callers recognise a taken e-mail by SQLite's wording; PostgreSQL's (code 23505) is made the same here
    if (isPostgres(db) && isUniqueViolation(err)) throw new Error('UNIQUE constraint failed: users.email', { cause: err });
    throw err;
  }
  return typeof row === 'object' ? (row as { id: number }).id : (row as number);
}

export async function updatePasswordHash(db: Db, id: number, passwordHash: string): Promise<void> {
  await db('users').where({ id }).update({ password_hash: passwordHash });
}
