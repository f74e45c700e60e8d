import type { Db } from './knex';

export interface PasswordResetRow {
  id: number;
  user_id: number;
  token_hash: string;
  expires_at: string;
  used_at: string | null;
}

export async function insertPasswordReset(
  db: Db,
  r: { userId: number; tokenHash: string; now: string; expiresAt: string },
): Promise<void> {
  await db('password_resets').insert({ user_id: r.userId, token_hash: r.tokenHash, created_at: r.now, expires_at: r.expiresAt });
}

/** An unused, unexpired reset by token hash. */
export async function findUsableReset(db: Db, tokenHash: string, now: string): Promise<PasswordResetRow | undefined> {
  return db<PasswordResetRow>('password_resets')
    .where({ token_hash: tokenHash })
    .whereNull('used_at')
    .where('expires_at', '>', now)
    .first();
}

/**
 * Uses the reset: marks it and every other open reset of that user as used, so one link works once
 * and older links die with it. Returns false when it was already used (a race between two clicks).
 */
export async function consumeReset(db: Db, reset: PasswordResetRow, now: string): Promise<boolean> {
  return db.transaction(async (tx) => {
    const n = await tx('password_resets').where({ id: reset.id }).whereNull('used_at').update({ used_at: now });
    if (n !== 1) return false;
    await tx('password_resets').where({ user_id: reset.user_id }).whereNull('used_at').update({ used_at: now });
    return true;
  });
}
