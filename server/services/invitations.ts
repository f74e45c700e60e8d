import type { ApiBoard, ApiInvitation, ApiInvitationInfo } from '../../shared/api';
import type { Db } from '../db/knex';
import { nowIso } from '../db/knex';
import * as invDb from '../db/invitations';
import { findRole, insertMember } from '../db/members';
import type { UserRow } from '../db/users';
import { notFound } from '../lib/errors';
import type { AppEvents } from './events';
import type { Mailer } from './mail';
import { invitationMail } from './mail-templates';
import { hashToken, newToken } from './tokens';
import type { BoardsService } from './boards';

const INVITATION_TTL_MS = 14 * 24 * 60 * 60 * 1000;
type InvitedRole = ApiInvitation['role'];

function toApiInvitation(row: invDb.InvitationRow): ApiInvitation {
  return { id: row.id, email: row.email, role: row.role as InvitedRole, createdAt: row.created_at };
}

export interface InvitationsService {
  listPending(boardId: number): Promise<ApiInvitation[]>;
  /** Creates (or renews) the invitation and mails the link `${origin}/invitations/<token>`. */
  create(p: { boardId: number; boardTitle: string; family: string; email: string; role: InvitedRole; inviter: UserRow; origin: string }): Promise<ApiInvitation>;
  /** What the link shows before accepting; 404 when unknown, used or expired. */
  info(token: string): Promise<ApiInvitationInfo>;
  /** Makes the signed-in user a member (single use). An existing member keeps their role. */
  accept(token: string, userId: number): Promise<ApiBoard>;
  /** Withdraws a pending invitation of this board. */
  revoke(boardId: number, invitationId: number): Promise<void>;
}

export function createInvitationsService(db: Db, events: AppEvents, mailer: Mailer, boards: BoardsService): InvitationsService {
  const gone = () => notFound('invitation_not_found', 'This invitation is unknown, already used or expired');
  return {
    async listPending(boardId) {
      return (await invDb.listPendingInvitations(db, boardId, nowIso())).map(toApiInvitation);
    },

    async create(p) {
      const { token, hash } = newToken();
      const now = Date.now();
      const id = await invDb.insertInvitation(db, {
        boardId: p.boardId, email: p.email, role: p.role, tokenHash: hash, invitedBy: p.inviter.id,
        now: new Date(now).toISOString(), expiresAt: new Date(now + INVITATION_TTL_MS).toISOString(),
      });
      await mailer.send(invitationMail({
        to: p.email, inviter: p.inviter.name, boardTitle: p.boardTitle, family: p.family, role: p.role, url: `${p.origin}/invitations/${token}`,
      }));
      return toApiInvitation((await invDb.findInvitationById(db, id))!);
    },

    async info(token) {
      const row = await invDb.findPendingByTokenHash(db, hashToken(token), nowIso());
      if (!row) throw gone();
      return { boardTitle: row.board_title, email: row.email, role: row.role as InvitedRole, invitedBy: row.invited_by_name };
    },

    async accept(token, userId) {
      const now = nowIso();
      const row = await invDb.findPendingByTokenHash(db, hashToken(token), now);
      if (!row) throw gone();
      const joined = await db.transaction(async (tx) => {
        if (!(await invDb.markAccepted(tx, row.id, userId, now))) throw gone();
        if (await findRole(tx, row.board_id, userId)) return false;
        await insertMember(tx, row.board_id, userId, row.role, now);
        return true;
      });
      if (joined) events.emit('membership-changed', { boardId: row.board_id, userId, role: row.role as InvitedRole });
      return boards.get(row.board_id, userId);
    },

    async revoke(boardId, invitationId) {
      const row = await invDb.findInvitationById(db, invitationId);
      if (!row || row.board_id !== boardId || row.accepted_at) throw notFound('invitation_not_found', 'No such pending invitation on this board');
      await invDb.deleteInvitation(db, invitationId);
    },
  };
}
