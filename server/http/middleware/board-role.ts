import type { RequestHandler } from 'express';
import type { BoardRole } from '../../../shared/api';
import { IdParamSchema } from '../../../shared/api';
import type { AuthzService } from '../../services/authz';
import { HttpError, notSignedIn } from '../errors';

/** A `requireBoardRole(min, param = 'id')` middleware factory bound to the authorization service. */
export type RequireBoardRole = (min: BoardRole, param?: string) => RequestHandler;

/**
 * Express middleware: the signed-in user must hold at least `min` on the board in `req.params[param]`.
 * 401 `not_signed_in` for anonymous, 400 for a malformed id, 404 `board_not_found` for a missing board,
 * 403 `not_a_member` / `role_too_low` otherwise. On success `res.locals.boardRole`, `res.locals.boardId`
 * and `res.locals.userId` are set.
 */
export function boardRoleGuard(authz: AuthzService): RequireBoardRole {
  return (min, param = 'id') =>
    async (req, res, next) => {
      const userId = req.session?.userId;
      if (!userId) throw notSignedIn();
      const parsed = IdParamSchema.safeParse(req.params[param]);
      if (!parsed.success) {
        throw new HttpError(400, 'invalid_input', 'The board id must be a positive whole number', { [param]: parsed.error.issues[0]?.message ?? 'Invalid id' });
      }
      res.locals.boardRole = await authz.requireRole(parsed.data, userId, min);
      res.locals.boardId = parsed.data;
      res.locals.userId = userId;
      next();
    };
}
