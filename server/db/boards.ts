import type { Db } from './knex';

/** A board as one user sees it: the row plus that user's role and the member count. */
export interface BoardViewRow {
  id: number;
  title: string;
  family: string;
  owner_id: number;
  created_at: string;
  updated_at: string;
  role: string;
  member_count: number;
}

function boardView(db: Db, userId: number) {
  return db('boards as b')
    .join('board_members as m', function () {
      this.on('m.board_id', '=', 'b.id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .select(
      'b.id', 'b.title', 'b.family', 'b.owner_id', 'b.created_at', 'b.updated_at', 'm.role',
      db.raw('(select count(*) from board_members c where c.board_id = b.id) as member_count'),
    );
}

/** Boards the user is a member of, most recently changed first. */
export async function listBoardsForUser(db: Db, userId: number): Promise<BoardViewRow[]> {
  return boardView(db, userId).orderBy([{ column: 'b.updated_at', order: 'desc' }, { column: 'b.id', order: 'desc' }]);
}

export async function getBoardForUser(db: Db, boardId: number, userId: number): Promise<BoardViewRow | undefined> {
  return boardView(db, userId).where('b.id', boardId).first();
}

export async function boardExists(db: Db, boardId: number): Promise<boolean> {
  return (await db('boards').where({ id: boardId }).first('id')) !== undefined;
}

export async function getBoardTitle(db: Db, boardId: number): Promise<{ title: string; family: string } | undefined> {
  return db('boards').where({ id: boardId }).first('title', 'family');
}

/** Creates the board and its owner membership in one transaction; returns the id. */
export async function insertBoard(
  db: Db,
  b: { title: string; family: string; ownerId: number; now: string },
): Promise<number> {
  return db.transaction(async (tx) => {
    const [row] = await tx('boards')
      .insert({ title: b.title, family: b.family, owner_id: b.ownerId, created_at: b.now, updated_at: b.now })
      .returning('id');
    const id = typeof row === 'object' ? (row as { id: number }).id : (row as number);
    await tx('board_members').insert({ board_id: id, user_id: b.ownerId, role: 'owner', created_at: b.now });
    return id;
  });
}

/** Deletes the board; members, invitations and other per-board rows go with it (ON DELETE CASCADE). */
export async function deleteBoard(db: Db, boardId: number): Promise<void> {
  await db('boards').where({ id: boardId }).del();
}
