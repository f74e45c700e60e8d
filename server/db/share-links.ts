import type { Db } from './knex';

export interface ShareLinkRow {
  id: number;
  board_id: number;
  token_hash: string;
  created_by: number | null;
  created_at: string;
  expires_at: string | null;
}

export async function insertShareLink(db: Db, row: Omit<ShareLinkRow, 'id'>): Promise<number> {
  const [inserted] = await db('share_links').insert(row).returning('id');
  return typeof inserted === 'object' ? Number((inserted as { id: number }).id) : Number(inserted);
}

/** A board's links, oldest first. */
export function listShareLinks(db: Db, boardId: number): Promise<ShareLinkRow[]> {
  return db('share_links').where({ board_id: boardId }).orderBy('id');
}

export function findShareLinkByHash(db: Db, tokenHash: string): Promise<ShareLinkRow | undefined> {
  return db('share_links').where({ token_hash: tokenHash }).first();
}

export function findShareLink(db: Db, linkId: number): Promise<ShareLinkRow | undefined> {
  return db('share_links').where({ id: linkId }).first();
}

/** Deletes one link of the board; returns whether it existed. */
export async function deleteShareLink(db: Db, boardId: number, linkId: number): Promise<boolean> {
  return (await db('share_links').where({ id: linkId, board_id: boardId }).del()) > 0;
}

/** The board row as a guest sees it (no membership involved). */
export function boardRowForGuest(db: Db, boardId: number): Promise<{ id: number; title: string; family: string; owner_id: number; created_at: string; updated_at: string } | undefined> {
  return db('boards').where({ id: boardId }).first('id', 'title', 'family', 'owner_id', 'created_at', 'updated_at');
}
