import { isPostgres, type Db, type Tx } from './knex';
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

/**
 * Takes the board's write lock for the rest of the transaction. Several servers may append to one
 * board on PostgreSQL; SQLite has one writer at a time anyway (and Knex ignores FOR UPDATE there).
 */
async function lockBoard(tx: Tx, boardId: number): Promise<void> {
  if (isPostgres(tx)) await tx('boards').where({ id: boardId }).forUpdate().first('id');
}

/**
 * Appends updates after the stored ones, in one transaction that also marks the board changed. The
 * seqs are given here, after the highest stored one and under the board's lock, in the order of
 * `updates`: with several servers writing one board a caller's own count could collide with another
 * server's rows. (On one server they are the numbers the caller counted anyway.) Returns the last seq.
 */
export async function appendBoardUpdates(db: Db, boardId: number, updates: NewBoardUpdate[], changedAt: string): Promise<number> {
  if (!updates.length) return maxBoardUpdateSeq(db, boardId);
  return db.transaction(async (tx) => {
    await lockBoard(tx, boardId);
    let seq = await maxBoardUpdateSeq(tx, boardId);
    const rows = updates.map((u) => ({
      board_id: boardId, seq: ++seq, data: Buffer.from(u.data), user_id: u.userId, created_at: u.createdAt,
    }));
    // SQLite allows at most 999 bound values per statement in older builds: 5 columns × 150 rows stays under.
    for (let i = 0; i < rows.length; i += 150) await tx('board_updates').insert(rows.slice(i, i + 150));
    await tx('boards').where({ id: boardId }).update({ updated_at: changedAt });
    return seq;
  });
}

/** Number of stored rows of a board. */
export async function countBoardUpdates(db: Db, boardId: number): Promise<number> {
  const row = (await db('board_updates').where({ board_id: boardId }).count({ n: '*' }).first()) as { n: number | string } | undefined;
  return Number(row?.n ?? 0);
}

/** The highest stored seq of a board (0 when it has none). */
export async function maxBoardUpdateSeq(db: Db | Tx, boardId: number): Promise<number> {
  const row = (await db('board_updates').where({ board_id: boardId }).max({ m: 'seq' }).first()) as { m: number | null } | undefined;
  return Number(row?.m ?? 0);
}

/**
 * Compaction: replaces every row up to `uptoSeq` by one row holding `merge(rows)` (the caller's state
 * merged with those rows), in one transaction under the board's lock, so a reader sees either the old
 * rows or the new one, never neither. The rows go into the merge because with several servers a row
 * up to `uptoSeq` may hold an update the compacting server has not received yet.
 */
export async function replaceBoardUpdates(
  db: Db, boardId: number, uptoSeq: number, merge: (rows: Uint8Array[]) => Uint8Array, createdAt: string,
): Promise<void> {
  await db.transaction(async (tx) => {
    await lockBoard(tx, boardId);
    const rows = (await tx('board_updates').where({ board_id: boardId }).where('seq', '<=', uptoSeq).orderBy('seq', 'asc').select('data')) as { data: Buffer }[];
    const data = merge(rows.map((r) => new Uint8Array(r.data)));
    await tx('board_updates').where({ board_id: boardId }).where('seq', '<=', uptoSeq).del();
    await tx('board_updates').insert({ board_id: boardId, seq: uptoSeq, data: Buffer.from(data), user_id: null, created_at: createdAt });
  });
}

/** Whether the board row still exists (a deleted board's pending updates are dropped, not written). */
export async function boardRowExists(db: Db, boardId: number): Promise<boolean> {
  return (await db('boards').where({ id: boardId }).first('id')) !== undefined;
}
