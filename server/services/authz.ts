import type { RequestHandler } from 'express';
import type { BoardRole } from '../../shared/api/types';
import { IdParamSchema } from '../../shared/api/schemas';
import type { Db } from '../db/knex';
import { boardExists } from '../db/boards';
import { findRole } from '../db/members';
import { HttpError, forbidden, notFound, notSignedIn } from '../http/errors';

/**
 * The one authorization layer for boards. Every route and socket that touches a board asks here.
 */

const RANK: Record<BoardRole, number> = { viewer: 1, editor: 2, owner: 3 };

/** The user's role on the board, or null when not a member (or the board does not exist). */
export async function getBoardRole(db: Db, boardId: number, userId: number): Promise<BoardRole | null> {
  const role = await findRole(db, boardId, userId);
  return role === 'owner' || role === 'editor' || role === 'viewer' ? role : null;
}

/** True when `role` is `min` or stronger (owner > editor > viewer); null is never enough. */
export function roleAtLeast(role: BoardRole | null | undefined, min: BoardRole): boolean {
  return role != null && RANK[role] >= RANK[min];
}

/** Where `requireBoardRole` finds the database: set by createApp on `app.locals`. */
export const APP_DB_KEY = 'gatefoldDb';

/**
 * Express middleware: the signed-in user must hold at least `min` on the board in `req.params[param]`.
 * 401 `not_signed_in` for anonymous, 400 for a malformed id, 404 `board_not_found` for a missing board,
 * 403 `not_a_member` / `role_too_low` otherwise. On success `res.locals.boardRole`, `res.locals.boardId`
 * and `res.locals.userId` are set.
 */
export function requireBoardRole(min: BoardRole, param = 'id'): RequestHandler {
  return async (req, res, next) => {
    const userId = req.session?.userId;
    if (!userId) throw notSignedIn();
    const parsed = IdParamSchema.safeParse(req.params[param]);
    if (!parsed.success) {
      throw new HttpError(400, 'invalid_input', 'The board id must be a positive whole number', { [param]: parsed.error.issues[0]?.message ?? 'Invalid id' });
    }
    const boardId = parsed.data;
    const db = req.app.locals[APP_DB_KEY] as Db;
    const role = await getBoardRole(db, boardId, userId);
    if (!role) {
      if (!(await boardExists(db, boardId))) throw notFound('board_not_found', 'No such board');
      throw forbidden('not_a_member', 'You are not a member of this board');
    }
    if (!roleAtLeast(role, min)) throw forbidden('role_too_low', `This needs the ${min} role or stronger; you are ${role}`);
    res.locals.boardRole = role;
    res.locals.boardId = boardId;
    res.locals.userId = userId;
    next();
  };
}
