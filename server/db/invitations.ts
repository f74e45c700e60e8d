import type { Db } from './knex';

export interface InvitationRow {
  id: number;
  board_id: number;
  email: string;
  role: string;
  token_hash: string;
  invited_by: number;
  created_at: string;
  expires_at: string;
  accepted_at: string | null;
}

/** Pending (not accepted, not expired) invitations of a board, newest first. */
export async function listPendingInvitations(db: Db, boardId: number, now: string): Promise<InvitationRow[]> {
  return db<InvitationRow>('invitations')
    .where({ board_id: boardId })
    .whereNull('accepted_at')
    .where('expires_at', '>', now)
    .orderBy('id', 'desc');
}

export async function insertInvitation(
  db: Db,
  inv: { boardId: number; email: string; role: string; tokenHash: string; invitedBy: number; now: string; expiresAt: string },
): Promise<number> {
  return db.transaction(async (tx) => {
    // One pending invitation per address and board: a new one replaces the old link.
    await tx('invitations').where({ board_id: inv.boardId, email: inv.email }).whereNull('accepted_at').del();
    const [row] = await tx('invitations')
      .insert({
        board_id: inv.boardId, email: inv.email, role: inv.role, token_hash: inv.tokenHash,
        invited_by: inv.invitedBy, created_at: inv.now, expires_at: inv.expiresAt,
      })
      .returning('id');
    return typeof row === 'object' ? (row as { id: number }).id : (row as number);
  });
}

export async function findInvitationById(db: Db, id: number): Promise<InvitationRow | undefined> {
  return db<InvitationRow>('invitations').where({ id }).first();
}

/** A usable invitation by token hash, with the board title and the inviter's name. */
export async function findPendingByTokenHash(
  db: Db,
  tokenHash: string,
  now: string,
): Promise<(InvitationRow & { board_title: string; invited_by_name: string }) | undefined> {
  return db('invitations as i')
    .join('boards as b', 'b.id', 'i.board_id')
    .join('users as u', 'u.id', 'i.invited_by')
    .where('i.token_hash', tokenHash)
    .whereNull('i.accepted_at')
    .where('i.expires_at', '>', now)
    .first('i.*', 'b.title as board_title', 'u.name as invited_by_name');
}

/** Marks the invitation used; false when someone else used it first (single use). */
export async function markAccepted(db: Db, id: number, userId: number, now: string): Promise<boolean> {
  const n = await db('invitations').where({ id }).whereNull('accepted_at').update({ accepted_at: now, accepted_by: userId });
  return n === 1;
}

export async function deleteInvitation(db: Db, id: number): Promise<void> {
  await db('invitations').where({ id }).del();
}
