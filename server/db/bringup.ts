import type { Db } from './knex';

/** A bring-up observation as listed (with the name of who entered it). */
export interface ObservationRow {
  id: number;
  board_id: number;
  vector: string;
  observed: string;
  expected: string | null;
  step: number | null;
  user_id: number | null;
  user_name: string | null;
  created_at: string;
}

export interface NewObservation {
  boardId: number;
  vector: string;
  observed: string;
  expected: string | null;
  step: number | null;
  userId: number;
  createdAt: string;
}

const view = (db: Db) => db('bringup_observations as o').leftJoin('users as u', 'u.id', 'o.user_id')
  .select('o.id', 'o.board_id', 'o.vector', 'o.observed', 'o.expected', 'o.step', 'o.user_id', 'u.name as user_name', 'o.created_at');

export async function insertObservation(db: Db, o: NewObservation): Promise<number> {
  const [row] = await db('bringup_observations')
    .insert({ board_id: o.boardId, vector: o.vector, observed: o.observed, expected: o.expected, step: o.step, user_id: o.userId, created_at: o.createdAt })
    .returning('id');
  return typeof row === 'object' ? (row as { id: number }).id : (row as number);
}

/** The board's observations in the order they were entered. */
export async function listObservations(db: Db, boardId: number): Promise<ObservationRow[]> {
  return view(db).where('o.board_id', boardId).orderBy([{ column: 'o.created_at', order: 'asc' }, { column: 'o.id', order: 'asc' }]);
}

export async function getObservation(db: Db, boardId: number, id: number): Promise<ObservationRow | undefined> {
  return view(db).where({ 'o.board_id': boardId, 'o.id': id }).first();
}

export async function deleteObservation(db: Db, boardId: number, id: number): Promise<boolean> {
  return (await db('bringup_observations').where({ board_id: boardId, id }).del()) > 0;
}

export async function clearObservations(db: Db, boardId: number): Promise<number> {
  return db('bringup_observations').where({ board_id: boardId }).del();
}
