import type { ApiInvitation, ApiMember, BoardRole } from '../../shared/api';
import type { AddMemberBody } from '../../shared/api';
import type { Db } from '../db/knex';
import { nowIso } from '../db/knex';
import * as membersDb from '../db/members';
import { getBoardTitle } from '../db/boards';
import { findUserByEmail, findUserById } from '../db/users';
import { badRequest, conflict, forbidden, notFound } from '../lib/errors';
import type { AppEvents } from './events';
import type { InvitationsService } from './invitations';
import type { Mailer } from './mail';
import { memberAddedMail } from './mail-templates';

export function toApiMember(row: membersDb.MemberRow): ApiMember {
  return { userId: row.user_id, email: row.email, name: row.name, role: row.role as BoardRole };
}

export interface MembersService {
  /**
   * Members, and (for owners) pending invitations. E-mail addresses go to the owner only (and each
   * member sees their own); the others see names and roles.
   */
  list(boardId: number, viewerRole: BoardRole, viewerId: number): Promise<{ members: ApiMember[]; invitations: ApiInvitation[] }>;
  /** Adds an existing account at once (and mails them), or invites an unknown address. */
  add(boardId: number, byUserId: number, body: AddMemberBody, origin: string): Promise<{ member: ApiMember } | { invitation: ApiInvitation }>;
  /** Adds a member without mail (demo seed, accepted invitations). */
  addDirect(boardId: number, userId: number, role: Exclude<BoardRole, 'owner'>): Promise<void>;
  changeRole(boardId: number, userId: number, role: Exclude<BoardRole, 'owner'>): Promise<ApiMember>;
  /** Removes a member; `byUserId` must be the owner (`byRole`) or that member. */
  remove(boardId: number, userId: number, byUserId: number, byRole: BoardRole): Promise<void>;
}

export function createMembersService(db: Db, events: AppEvents, mailer: Mailer, invitations: InvitationsService): MembersService {
  const requireMember = async (boardId: number, userId: number) => {
    const m = await membersDb.findMember(db, boardId, userId);
    if (!m) throw notFound('member_not_found', 'That user is not a member of this board');
    return m;
  };
  const ownerRequired = () => badRequest('owner_required', 'The owner cannot be removed or given another role');

  const addDirect: MembersService['addDirect'] = async (boardId, userId, role) => {
    await membersDb.insertMember(db, boardId, userId, role, nowIso());
    events.emit('membership-changed', { boardId, userId, role });
  };

  return {
    async list(boardId, viewerRole, viewerId) {
      const members = (await membersDb.listMembers(db, boardId)).map((row) => {
        const m = toApiMember(row);
        if (viewerRole === 'owner' || row.user_id === viewerId) return m;
        const { email: _hidden, ...rest } = m;
        return rest;
      });
      const invites = viewerRole === 'owner' ? await invitations.listPending(boardId) : [];
      return { members, invitations: invites };
    },

    async add(boardId, byUserId, body, origin) {
      const board = (await getBoardTitle(db, boardId))!;
      const inviter = (await findUserById(db, byUserId))!;
      const user = await findUserByEmail(db, body.email);
      if (!user) {
        const invitation = await invitations.create({ boardId, boardTitle: board.title, family: board.family, email: body.email, role: body.role, inviter, origin });
        return { invitation };
      }
      if (await membersDb.findRole(db, boardId, user.id)) throw conflict('already_member', `${user.email} is already a member of this board`);
      await addDirect(boardId, user.id, body.role);
      await mailer.send(memberAddedMail({
        to: user.email, inviter: inviter.name, boardTitle: board.title, family: board.family, role: body.role, url: `${origin}/boards/${boardId}`,
      }));
      return { member: toApiMember((await membersDb.findMember(db, boardId, user.id))!) };
    },

    addDirect,

    async changeRole(boardId, userId, role) {
      const m = await requireMember(boardId, userId);
      if (m.role === 'owner') throw ownerRequired();
      if (m.role !== role) {
        await membersDb.updateMemberRole(db, boardId, userId, role);
        events.emit('membership-changed', { boardId, userId, role });
      }
      return toApiMember({ ...m, role });
    },

    async remove(boardId, userId, byUserId, byRole) {
      if (byRole !== 'owner' && byUserId !== userId) throw forbidden('role_too_low', 'Only the owner can remove other members');
      const m = await requireMember(boardId, userId);
      if (m.role === 'owner') throw ownerRequired();
      await membersDb.deleteMember(db, boardId, userId);
      events.emit('membership-changed', { boardId, userId, role: null });
    },
  };
}
