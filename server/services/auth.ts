import bcrypt from 'bcryptjs';
import type { ApiUser } from '../../shared/api';
import type { LoginBody, ResetBody, SignupBody } from '../../shared/api';
import type { AppConfig } from '../config';
import type { Db } from '../db/knex';
import { nowIso } from '../db/knex';
import { countUsers, findUserByEmail, insertUser, findUserById, updatePasswordHash } from '../db/users';
import { consumeReset, findUsableReset, insertPasswordReset } from '../db/password-resets';
import { deleteSessionsOfUser } from '../db/session-store';
import { HttpError, badRequest, conflict } from '../lib/errors';
import type { AppEvents } from './events';
import type { Mailer } from './mail';
import { passwordResetMail } from './mail-templates';
import { hashToken, newToken } from './tokens';
import { toApiUser } from './users';

const RESET_TTL_MS = 60 * 60 * 1000;

export interface AuthService {
  /** Creates an account; the first account ever is a site admin. 409 `email_taken` on a duplicate. */
  signUp(body: SignupBody, opts?: { isAdmin?: boolean }): Promise<ApiUser>;
  /** Checks the password; 401 `bad_credentials` for an unknown address or a wrong password alike. */
  logIn(body: LoginBody): Promise<ApiUser>;
  /** Mails a reset link if the account exists; silent otherwise (no account probing). */
  requestReset(email: string, origin: string): Promise<void>;
  /**
   * Sets the new password from a reset token; 400 `invalid_token` if unknown, used or expired. Every
   * other session of the user ends (store rows deleted) and every live socket of the user is closed.
   */
  resetPassword(body: ResetBody, keepSid?: string): Promise<void>;
  /** The session `sessionId` of `userId` ended (sign-out): its live sockets close. */
  signedOut(userId: number, sessionId: string): void;
}

export function createAuthService(db: Db, config: AppConfig, mailer: Mailer, events: AppEvents): AuthService {
  // Compared against when the address is unknown, so both failures take as long.
  let dummyHash: Promise<string> | undefined;
  const dummy = () => (dummyHash ??= bcrypt.hash('gatefold-timing-equaliser', config.bcryptCost));

  return {
    async signUp(body, opts) {
      if (await findUserByEmail(db, body.email)) throw conflict('email_taken', 'An account with this e-mail already exists');
      const passwordHash = await bcrypt.hash(body.password, config.bcryptCost);
      const id = await db.transaction(async (tx) => {
        const isAdmin = opts?.isAdmin ?? (await countUsers(tx)) === 0;
        return insertUser(tx, { email: body.email, name: body.name, passwordHash, isAdmin, createdAt: nowIso() });
      }).catch((err: unknown) => {
        // Two sign-ups with one address at once: the unique index decides.
        if (String((err as Error).message).includes('UNIQUE')) throw conflict('email_taken', 'An account with this e-mail already exists');
        throw err;
      });
      return toApiUser((await findUserById(db, id))!);
    },

    async logIn(body) {
      const row = await findUserByEmail(db, body.email);
      const ok = await bcrypt.compare(body.password, row?.password_hash ?? (await dummy()));
      if (!row || !ok) throw new HttpError(401, 'bad_credentials', 'Wrong e-mail or password');
      return toApiUser(row);
    },

    async requestReset(email, origin) {
      const row = await findUserByEmail(db, email);
      if (!row) return;
      const { token, hash } = newToken();
      const now = Date.now();
      await insertPasswordReset(db, {
        userId: row.id, tokenHash: hash, now: new Date(now).toISOString(), expiresAt: new Date(now + RESET_TTL_MS).toISOString(),
      });
      // Not awaited: answering as fast for a known address as for an unknown one reveals nothing.
      void mailer.send(passwordResetMail({ to: row.email, name: row.name, url: `${origin}/reset/${token}` }));
    },

    async resetPassword(body, keepSid) {
      const now = nowIso();
      const reset = await findUsableReset(db, hashToken(body.token), now);
      const invalid = () => badRequest('invalid_token', 'This reset link is unknown, used or expired; ask for a new one', { token: 'Unknown, used or expired' });
      if (!reset) throw invalid();
      const passwordHash = await bcrypt.hash(body.password, config.bcryptCost);
      if (!(await consumeReset(db, reset, now))) throw invalid();
      await updatePasswordHash(db, reset.user_id, passwordHash);
      // Whoever knew the old password is signed out everywhere, live sockets included.
      await deleteSessionsOfUser(db, reset.user_id, keepSid);
      events.emit('sessions-ended', { userId: reset.user_id });
    },

    signedOut(userId, sessionId) {
      events.emit('sessions-ended', { userId, sessionIds: [sessionId] });
    },
  };
}
