import type { BoardRole } from '../../shared/api';
import type { Db } from '../db/knex';
import { boardExists } from '../db/boards';
import { findRole } from '../db/members';
import { forbidden, notFound } from '../lib/errors';

/**
 * The one authorization layer for boards. Every route (through `requireBoardRole` in
 * server/http/middleware/board-role.ts) and every socket that touches a board asks here.
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

export interface AuthzService {
  /** The user's role on the board, or null (not a member, or no such board). */
  roleOf(boardId: number, userId: number): Promise<BoardRole | null>;
  /**
   * The user's role when it is `min` or stronger; else 404 `board_not_found` (no such board),
   * 403 `not_a_member` or 403 `role_too_low`.
   */
  requireRole(boardId: number, userId: number, min: BoardRole): Promise<BoardRole>;
}

export function createAuthzService(db: Db): AuthzService {
  return {
    roleOf: (boardId, userId) => getBoardRole(db, boardId, userId),
    async requireRole(boardId, userId, min) {
      const role = await getBoardRole(db, boardId, userId);
      if (!role) {
        if (!(await boardExists(db, boardId))) throw notFound('board_not_found', 'No such board');
        throw forbidden('not_a_member', 'You are not a member of this board');
      }
      if (!roleAtLeast(role, min)) throw forbidden('role_too_low', `This needs the ${min} role or stronger; you are ${role}`);
      return role;
    },
  };
}
