import { isUniqueViolation, type Db, type Tx } from './knex';

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

export function findLibraryModule(db: Db, id: number): Promise<LibraryModuleRow | undefined> {
  return db('library_modules').where({ id }).first();
}

/** What a publish writes: the entry's title and content, where it comes from, and the entry its copy names. */
export interface PublishRow {
  ownerId: number;
  boardId: number;
  moduleId: string;
  title: string;
  content: string;
  now: string;
  /** the entry the board's module records as its origin, if any (used when it is in this owner's library) */
  originId?: number;
}

/** Attempts of a publish that lost a race (for the same new entry) before it answers 409. */
const PUBLISH_ATTEMPTS = 4;

/**
 * Publishes into the owner's library in one transaction: the same entry at the next version when the
 * module's origin names an entry of this library or an entry was published from this board module, else a
 * new entry at version 1. The version is raised by the database (`version + 1` on the row, locked FOR
 * UPDATE on PostgreSQL; SQLite has one writer), so two publishes at the same instant get two versions.
 * Two first publishes of one module race to insert: the unique index on the source refuses the second,
 * which then runs again and raises the first one's version. Throws PublishConflictError after
 * PUBLISH_ATTEMPTS lost races.
 */
export async function publishLibraryModule(db: Db, p: PublishRow): Promise<{ row: LibraryModuleRow; created: boolean }> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await db.transaction((tx) => publishOnce(tx, p));
    } catch (err) {
      // a lost race for a new entry, or (PostgreSQL) a deadlock with a publish that cleared this module's old entry
      if (!isUniqueViolation(err) && (err as { code?: unknown } | null)?.code !== '40P01') throw err;
      if (attempt >= PUBLISH_ATTEMPTS) throw new PublishConflictError(p.boardId, p.moduleId, { cause: err });
    }
  }
}

async function publishOnce(tx: Tx, p: PublishRow): Promise<{ row: LibraryModuleRow; created: boolean }> {
  const source = { owner_id: p.ownerId, source_board_id: p.boardId, source_module_id: p.moduleId };
  let previous: LibraryModuleRow | undefined;
  if (p.originId !== undefined) previous = await tx('library_modules').where({ id: p.originId, owner_id: p.ownerId }).forUpdate().first();
  previous ??= await tx('library_modules').where(source).forUpdate().first();
  if (!previous) {
    const fresh = { ...source, title: p.title, version: 1, content: p.content, created_at: p.now, updated_at: p.now };
    const [inserted] = await tx('library_modules').insert(fresh).returning('id');
    const id = typeof inserted === 'object' ? Number((inserted as { id: number }).id) : Number(inserted);
    return { row: { id, ...fresh }, created: true };
  }
  // this board module now publishes into `previous`: an entry it was published into before is no longer its source
  await tx('library_modules').where(source).whereNot({ id: previous.id }).update({ source_board_id: null, source_module_id: null });
  await tx('library_modules').where({ id: previous.id })
    .update({ title: p.title, content: p.content, version: tx.raw('version + 1'), updated_at: p.now, source_board_id: p.boardId, source_module_id: p.moduleId });
  const row: LibraryModuleRow = await tx('library_modules').where({ id: previous.id }).first();
  return { row, created: false };
}

/** A publish that kept losing the race for a new entry to publishes of the same module (HTTP 409). */
export class PublishConflictError extends Error {
  constructor(boardId: number, moduleId: string, options?: ErrorOptions) {
    super(`module "${moduleId}" of board ${boardId} is being published by someone else at this moment`, options);
    this.name = 'PublishConflictError';
  }
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
