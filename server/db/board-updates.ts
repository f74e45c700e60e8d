import type { Db } from './knex';
import type { NewBoardUpdate } from '../boards-live/store';

/** The `board_updates` table. Only server/db/board-store.ts imports this module (ESLint checks it). */

/** One stored Yjs update of a board. */
export interface BoardUpdateRow {
  seq: number;
  data: Uint8Array;
}

/** A board's updates in the order they were applied. */
export async function loadBoardUpdates(db: Db, boardId: number): Promise<BoardUpdateRow[]> {
  const rows = await db('board_updates').where({ board_id: boardId }).orderBy('seq', 'asc').select('seq', 'data');
  return rows.map((r: { seq: number; data: Buffer }) => ({ seq: r.seq, data: new Uint8Array(r.data) }));
}

/** Appends updates (one statement per chunk, in one transaction). */
export async function appendBoardUpdates(db: Db, boardId: number, updates: NewBoardUpdate[]): Promise<void> {
  if (!updates.length) return;
  const rows = updates.map((u) => ({
    board_id: boardId, seq: u.seq, data: Buffer.from(u.data), user_id: u.userId, created_at: u.createdAt,
  }));
  await db.transaction(async (tx) => {
    // SQLite allows at most 999 bound values per statement in older builds: 5 columns × 150 rows stays under.
    for (let i = 0; i < rows.length; i += 150) await tx('board_updates').insert(rows.slice(i, i + 150));
  });
}

/** Number of stored rows of a board. */
export async function countBoardUpdates(db: Db, boardId: number): Promise<number> {
  const row = (await db('board_updates').where({ board_id: boardId }).count({ n: '*' }).first()) as { n: number | string } | undefined;
  return Number(row?.n ?? 0);
}

/** The highest stored seq of a board (0 when it has none). */
export async function maxBoardUpdateSeq(db: Db, boardId: number): Promise<number> {
  const row = (await db('board_updates').where({ board_id: boardId }).max({ m: 'seq' }).first()) as { m: number | null } | undefined;
  return Number(row?.m ?? 0);
}

/**
 * Compaction: replaces every row up to `uptoSeq` by one row holding `data` (their merge), in one
 * transaction, so a reader sees either the old rows or the new one, never neither.
 */
export async function replaceBoardUpdates(
  db: Db, boardId: number, uptoSeq: number, data: Uint8Array, createdAt: string,
): Promise<void> {
  await db.transaction(async (tx) => {
    await tx('board_updates').where({ board_id: boardId }).where('seq', '<=', uptoSeq).del();
    await tx('board_updates').insert({ board_id: boardId, seq: uptoSeq, data: Buffer.from(data), user_id: null, created_at: createdAt });
  });
}

/** Whether the board row still exists (a deleted board's pending updates are dropped, not written). */
export async function boardRowExists(db: Db, boardId: number): Promise<boolean> {
  return (await db('boards').where({ id: boardId }).first('id')) !== undefined;
}
