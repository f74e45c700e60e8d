import type { Db } from './knex';

/** A build photo's row (with the uploader's name). */
export interface PhotoRow {
  id: number;
  board_id: number;
  part_id: string | null;
  uploader_id: number | null;
  uploader_name: string | null;
  file_name: string;
  thumb_name: string;
  original_name: string;
  mime: string;
  bytes: number;
  width: number;
  height: number;
  caption: string;
  created_at: string;
}

export type NewPhoto = Omit<PhotoRow, 'id' | 'uploader_name'>;

const view = (db: Db) => db('board_photos as p').leftJoin('users as u', 'u.id', 'p.uploader_id').select('p.*', 'u.name as uploader_name');

export async function insertPhoto(db: Db, p: NewPhoto): Promise<number> {
  const [row] = await db('board_photos').insert(p).returning('id');
  return typeof row === 'object' ? (row as { id: number }).id : (row as number);
}

/** The board's photos, newest first. */
export async function listPhotos(db: Db, boardId: number): Promise<PhotoRow[]> {
  return view(db).where('p.board_id', boardId).orderBy([{ column: 'p.created_at', order: 'desc' }, { column: 'p.id', order: 'desc' }]);
}

export async function getPhoto(db: Db, boardId: number, id: number): Promise<PhotoRow | undefined> {
  return view(db).where({ 'p.board_id': boardId, 'p.id': id }).first();
}

export async function deletePhoto(db: Db, boardId: number, id: number): Promise<boolean> {
  return (await db('board_photos').where({ board_id: boardId, id }).del()) > 0;
}
