import * as Y from 'yjs';
import { libraryOriginId, type ApiLibraryContent, type ApiLibraryModule, type PublishLibraryModuleBody } from '../../shared/api';
import { ModuleOriginSchema, modulesMap, parseBoardFile, type BoardFile, type Module, type ModuleOrigin } from '../../shared/board';
import type { Db } from '../db/knex';
import { nowIso } from '../db/knex';
import * as libraryDb from '../db/library';
import { badRequest, conflict, forbidden, HttpError, notFound } from '../lib/errors';
import type { AuthzService } from './authz';

/** What the library reads of a board: its content as a board file (the board registry gives it). */
export interface BoardFileReader {
  readBoardFile(boardId: number): Promise<BoardFile>;
}

/**
 * How the library writes into a board: a server edit of its document (the board registry's
 * `editBoardDoc`: live in an open room, checked and repaired in the same transaction; resolves once stored).
 */
export interface BoardDocEditor {
  editBoardDoc(boardId: number, userId: number | null, reason: string, edit: (doc: Y.Doc) => void): Promise<void>;
}

/** Largest content of one entry (the module and the modules it uses, as JSON text). */
export const LIBRARY_CONTENT_LIMIT = 1_000_000;

export interface LibraryService {
  /** Entries of every library the user may read: their own and those of the owners of their boards. */
  list(userId: number): Promise<ApiLibraryModule[]>;
  /**
   * Publishes a module of a board the user can edit (403 otherwise) into the board owner's library: a new
   * entry at version 1, or the same entry at the next version when that module was published before
   * (its `origin` names an entry of this library, or the entry was published from this board and module).
   * The board's module then records the entry as its origin (`{library, version}` of the new version), a
   * server edit every open screen of the board receives, so the board does not count as an older copy.
   * 400 `invalid_input` for a module the board lacks, 400 `invalid_module` naming the ids (a nesting cycle,
   * a missing module, a port clash…), 413 `too_large` beyond LIBRARY_CONTENT_LIMIT. Publishes at the same
   * instant each get their own version (one transaction each, db/library.ts); 409 `publish_conflict` only
   * when one kept losing the race for a new entry to others publishing the same module.
   */
  publish(userId: number, body: PublishLibraryModuleBody): Promise<{ entry: ApiLibraryContent; created: boolean }>;
  /** An entry with its content; 404 `library_module_not_found` when missing or not readable by the user. */
  get(userId: number, id: number): Promise<ApiLibraryContent>;
  /** Deletes an entry: the library's owner only (403 `not_library_owner` for other readers, 404 for the rest). */
  remove(userId: number, id: number): Promise<void>;
}

function toApi(row: Omit<libraryDb.LibraryModuleRow, 'content'> & { owner_name?: string }, ownerName: string, userId: number): ApiLibraryModule {
  return {
    id: row.id,
    ownerId: row.owner_id,
    ownerName: row.owner_name ?? ownerName,
    title: row.title,
    version: row.version,
    sourceBoardId: row.source_board_id,
    sourceModuleId: row.source_module_id,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
    mine: row.owner_id === userId,
  };
}

/** The module `moduleId` first, then every module its instances use (directly or nested), each once. */
function moduleClosure(modules: readonly Module[], moduleId: string): Module[] {
  const byId = new Map(modules.map((m) => [m.id, m]));
  const out: Module[] = [];
  const seen = new Set<string>();
  const queue = [moduleId];
  while (queue.length) {
    const id = queue.shift()!;
    if (seen.has(id)) continue;
    seen.add(id);
    const m = byId.get(id);
    if (!m) continue; // a missing module is reported by the board check below, naming the instance
    out.push(m);
    for (const p of m.parts) if (p.kind === 'module' && !seen.has(p.module)) queue.push(p.module);
  }
  return out;
}

/**
 * Checks the content with the board file's own checks (a board with no parts of its own holding the
 * modules); 400 `invalid_module` naming the ids. The board it comes from already passed them (every
 * server write and client edit is checked and repaired), so this is the library's own guard of what it stores.
 */
export function checkLibraryContent(modules: Module[], family: BoardFile['family']): Module[] {
  const parsed = parseBoardFile({ format: 'gatefold-board', version: 1, title: 'library', family, parts: [], wires: [], modules });
  if (parsed.ok) return parsed.board.modules ?? [];
  const fields: Record<string, string> = {};
  for (const p of parsed.problems) {
    const key = p.id ?? p.path;
    if (!(key in fields)) fields[key] = p.message;
  }
  throw badRequest('invalid_module', `This module cannot go into the library: ${parsed.problems.map((p) => p.message).join('; ')}`, fields);
}

function readContent(row: libraryDb.LibraryModuleRow): Module[] {
  return JSON.parse(row.content) as Module[];
}

/**
 * The edit that records `origin` on the board's module `moduleId` after it was published: nothing when the
 * module is gone meanwhile, or already records this entry at this version or a later one (two publishes
 * finishing out of order never lower it).
 */
function recordOrigin(moduleId: string, origin: ModuleOrigin): (doc: Y.Doc) => void {
  return (doc) => {
    const module = modulesMap(doc).get(moduleId);
    if (!(module instanceof Y.Map)) return;
    const now = ModuleOriginSchema.safeParse(module.get('origin'));
    if (now.success && now.data.library === origin.library && now.data.version >= origin.version) return;
    module.set('origin', { library: origin.library, version: origin.version });
  };
}

export function createLibraryService(db: Db, authz: AuthzService, boards: BoardFileReader & BoardDocEditor): LibraryService {
  const readable = async (userId: number, id: number): Promise<libraryDb.LibraryModuleRow> => {
    const row = await libraryDb.findLibraryModule(db, id);
    if (!row || !(await libraryDb.canReadLibrary(db, row.owner_id, userId))) throw notFound('library_module_not_found', 'No such module in your team library');
    return row;
  };
  const withContent = async (row: libraryDb.LibraryModuleRow, userId: number): Promise<ApiLibraryContent> => {
    const modules = readContent(row);
    const ownerName = (await libraryDb.ownerName(db, row.owner_id)) ?? '';
    return { ...toApi(row, ownerName, userId), moduleId: modules[0]?.id ?? '', modules, origin: { library: libraryOriginId(row.id), version: row.version } };
  };

  return {
    async list(userId) {
      const rows = await libraryDb.listLibraryModules(db, await libraryDb.libraryOwnersFor(db, userId));
      return rows.map((r) => toApi(r, r.owner_name, userId));
    },

    async publish(userId, { boardId, moduleId }) {
      await authz.requireRole(boardId, userId, 'editor');
      const ownerId = await libraryDb.boardOwner(db, boardId);
      if (ownerId === undefined) throw notFound('board_not_found', 'No such board');
      const board = await boards.readBoardFile(boardId);
      const module = board.modules?.find((m) => m.id === moduleId);
      if (!module) throw badRequest('invalid_input', `This board has no module "${moduleId}"`, { moduleId: `No module "${moduleId}" on board ${boardId}` });

      // the entry's own module carries no origin (a copy records where it came from); modules it uses keep theirs
      const { origin, ...own } = module;
      const modules = checkLibraryContent([own, ...moduleClosure(board.modules ?? [], moduleId).slice(1)], board.family);
      const content = JSON.stringify(modules);
      if (Buffer.byteLength(content) > LIBRARY_CONTENT_LIMIT) {
        throw new HttpError(413, 'too_large', `This module and the modules it uses take ${Buffer.byteLength(content)} bytes; the library takes at most ${LIBRARY_CONTENT_LIMIT}`);
      }

      const title = module.title.trim() || module.id;
      const originId = origin ? Number(origin.library) : NaN;
      let published: { row: libraryDb.LibraryModuleRow; created: boolean };
      try {
        published = await libraryDb.publishLibraryModule(db, {
          ownerId, boardId, moduleId, title, content, now: nowIso(),
          ...(Number.isInteger(originId) && originId > 0 ? { originId } : {}),
        });
      } catch (err) {
        if (err instanceof libraryDb.PublishConflictError) throw conflict('publish_conflict', 'This module is being published by someone else at this moment: publish it again');
        throw err;
      }
      const { row, created } = published;
      const entry = await withContent(row, userId);
      // the board's module is now this entry at this version: record it, so the board is not shown an update
      // of its own module. The entry is published either way: a failure here is logged, not the caller's.
      try {
        await boards.editBoardDoc(boardId, userId, 'library-publish', recordOrigin(moduleId, entry.origin));
      } catch (err) {
        console.error(`library: entry ${row.id} v${row.version} published, but recording its origin on board ${boardId} module "${moduleId}" failed:`, err);
      }
      return { entry, created };
    },

    async get(userId, id) {
      return withContent(await readable(userId, id), userId);
    },

    async remove(userId, id) {
      const row = await readable(userId, id);
      if (row.owner_id !== userId) throw forbidden('not_library_owner', 'Only the owner of this library can delete its modules');
      await libraryDb.deleteLibraryModule(db, id);
    },
  };
}
