import { isPostgres, type Db } from './knex';

export interface MemberRow {
  user_id: number;
  email: string;
  name: string;
  role: string;
}

/** The role of one user on one board, or undefined when not a member. */
export async function findRole(db: Db, boardId: number, userId: number): Promise<string | undefined> {
  const row = await db('board_members').where({ board_id: boardId, user_id: userId }).first('role');
  return row?.role as string | undefined;
}

/** Members, owner first, then editors, then viewers, each by name. */
export async function listMembers(db: Db, boardId: number): Promise<MemberRow[]> {
  return db('board_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.board_id', boardId)
    .select('m.user_id', 'u.email', 'u.name', 'm.role')
    .orderByRaw(`case m.role when 'owner' then 0 when 'editor' then 1 else 2 end, ${isPostgres(db) ? 'lower(u.name)' : 'u.name collate nocase'}, u.id`);
}

export async function findMember(db: Db, boardId: number, userId: number): Promise<MemberRow | undefined> {
  return db('board_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.board_id': boardId, 'm.user_id': userId })
    .first('m.user_id', 'u.email', 'u.name', 'm.role');
}

export async function insertMember(db: Db, boardId: number, userId: number, role: string, now: string): Promise<void> {
  await db('board_members').insert({ board_id: boardId, user_id: userId, role, created_at: now });
}

export async function updateMemberRole(db: Db, boardId: number, userId: number, role: string): Promise<void> {
  await db('board_members').where({ board_id: boardId, user_id: userId }).update({ role });
}

export async function deleteMember(db: Db, boardId: number, userId: number): Promise<void> {
  await db('board_members').where({ board_id: boardId, user_id: userId }).del();
}
