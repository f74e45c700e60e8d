import type { Db } from './knex';

/** A row of `library_modules`; `content` is JSON text (the module, then the modules it uses). */
export interface LibraryModuleRow {
  id: number;
  owner_id: number;
  title: string;
  version: number;
  content: string;
  source_board_id: number | null;
  source_module_id: string | null;
  created_at: string;
  updated_at: string;
}

/** A library entry with its owner's name, without the content (for lists). */
export type LibraryListRow = Omit<LibraryModuleRow, 'content'> & { owner_name: string };

const LIST_COLUMNS = ['l.id', 'l.owner_id', 'u.name as owner_name', 'l.title', 'l.version', 'l.source_board_id', 'l.source_module_id', 'l.created_at', 'l.updated_at'];

export async function insertLibraryModule(db: Db, row: Omit<LibraryModuleRow, 'id'>): Promise<number> {
  const [inserted] = await db('library_modules').insert(row).returning('id');
  return typeof inserted === 'object' ? Number((inserted as { id: number }).id) : Number(inserted);
}

export function findLibraryModule(db: Db, id: number): Promise<LibraryModuleRow | undefined> {
  return db('library_modules').where({ id }).first();
}

/** The owner's entry published from that module of that board, if any. */
export function findBySource(db: Db, ownerId: number, boardId: number, moduleId: string): Promise<LibraryModuleRow | undefined> {
  return db('library_modules').where({ owner_id: ownerId, source_board_id: boardId, source_module_id: moduleId }).orderBy('id').first();
}

/** Replaces an entry's title and content and sets its version (a republish). */
export async function updateLibraryModule(db: Db, id: number, patch: Pick<LibraryModuleRow, 'title' | 'content' | 'version' | 'updated_at' | 'source_board_id' | 'source_module_id'>): Promise<void> {
  await db('library_modules').where({ id }).update(patch);
}

export async function deleteLibraryModule(db: Db, id: number): Promise<boolean> {
  return (await db('library_modules').where({ id }).del()) > 0;
}

/**
 * Owners whose library `userId` may read: the user, and the owners of every board the user is a member of
 * (a team is a board owner with the members of their boards).
 */
export async function libraryOwnersFor(db: Db, userId: number): Promise<number[]> {
  const rows: { owner_id: number }[] = await db('boards as b')
    .join('board_members as m', 'm.board_id', 'b.id')
    .where('m.user_id', userId)
    .distinct('b.owner_id');
  return [...new Set([userId, ...rows.map((r) => Number(r.owner_id))])];
}

/** Whether `userId` may read the library of `ownerId` (the owner, or a member of one of the owner's boards). */
export async function canReadLibrary(db: Db, ownerId: number, userId: number): Promise<boolean> {
  if (ownerId === userId) return true;
  const row = await db('boards as b')
    .join('board_members as m', 'm.board_id', 'b.id')
    .where({ 'b.owner_id': ownerId, 'm.user_id': userId })
    .first('b.id');
  return row !== undefined;
}

/** The entries of these owners' libraries, by title then id. */
export function listLibraryModules(db: Db, ownerIds: number[]): Promise<LibraryListRow[]> {
  return db('library_modules as l')
    .join('users as u', 'u.id', 'l.owner_id')
    .whereIn('l.owner_id', ownerIds)
    .select(LIST_COLUMNS)
    .orderBy([{ column: 'l.title' }, { column: 'l.id' }]);
}

/** The owner of a board, or undefined when there is no such board. */
export async function boardOwner(db: Db, boardId: number): Promise<number | undefined> {
  const row = await db('boards').where({ id: boardId }).first('owner_id');
  return row ? Number(row.owner_id) : undefined;
}

export async function ownerName(db: Db, userId: number): Promise<string | undefined> {
  const row = await db('users').where({ id: userId }).first('name');
  return row?.name as string | undefined;
}
