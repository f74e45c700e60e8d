import * as Y from 'yjs';
import type { BoardFile } from '../../shared/board';
import { boardToDoc, docToBoard, metaMap, partsMap, wiresMap } from '../../shared/board';
import { quarantineDoc, replaceWithBoard, setMeta } from '../../shared/board';
import type { BoardLocks } from './locks';
import { ServerOrigin, type BoardMeta, type BoardStore } from './store';

/**
 * A board's content outside the socket protocol: load it into a document, read or write a whole board
 * file, rename it, edit it (`editBoardDoc`). Through the live room when one is open (so every connected
 * screen updates and the room stores the change in order), else straight through the store under the
 * board's lock. Either way what the server writes goes through the whole check and repair
 * (`quarantineDoc`) before anyone sees it: in a room in the write's own transaction
 * (`Room.serverWrite`), without one by `editStored` after the edit, stored with it.
 */

/** A board open in a live room. */
export interface LiveDoc {
  doc: Y.Doc;
  /** Runs `edit` and then the whole check and repair in one transaction with `origin` (room.ts). */
  serverWrite(origin: ServerOrigin, edit: (doc: Y.Doc) => void): unknown;
  /** Resolves when every applied update (and the meta projection after it) is stored. */
  flush(): Promise<void>;
}

export interface BoardDocsDeps {
  store: BoardStore;
  locks: BoardLocks;
  live(boardId: number): LiveDoc | undefined;
}

/** A loaded board: a fresh document holding the merge of its rows, the last seq and the row count. */
export interface LoadedBoard {
  doc: Y.Doc;
  seq: number;
  rows: number;
}

/** Loads a board's stored updates into a fresh Y.Doc (an unknown board gives an empty document). */
export async function loadBoardDoc(store: BoardStore, boardId: number): Promise<LoadedBoard> {
  const { updates, seq } = await store.load(boardId);
  const doc = new Y.Doc();
  doc.transact(() => {
    for (const u of updates) Y.applyUpdate(doc, u);
  });
  return { doc, seq, rows: updates.length };
}

/**
 * A board made through the API has its first title and family in its row only: the document takes
 * them (with `origin`) the first time it is loaded. From then on the document owns them.
 */
export async function ensureBoardMeta(store: BoardStore, boardId: number, doc: Y.Doc, origin: unknown): Promise<void> {
  if (typeof metaMap(doc).get('title') === 'string') return;
  const meta = await store.readMeta(boardId);
  if (meta) setMeta(doc, meta, origin);
}

/** The document's meta as the board row would hold it. */
export function metaOf(doc: Y.Doc): { title: unknown; family: unknown } {
  const meta = metaMap(doc);
  return { title: meta.get('title'), family: meta.get('family') };
}

/**
 * Runs `edit` on the board's document without a room: load, edit, append what the edit produced
 * (numbered after the stored rows), project the meta. The caller holds the lock.
 */
async function editStored(deps: BoardDocsDeps, boardId: number, userId: number | null, edit: (doc: Y.Doc) => void | Promise<void>): Promise<void> {
  const { doc } = await loadBoardDoc(deps.store, boardId);
  const updates: Uint8Array[] = [];
  const metaBefore = JSON.stringify(metaOf(doc));
  doc.on('update', (u: Uint8Array) => updates.push(u));
  // content stored before updates were checked is removed first, and that removal stored with the edit
  quarantineDoc(doc, new ServerOrigin(null, 'quarantine'));
  await edit(doc);
  // and what the edit wrote is checked and repaired as a live room does after a server write (room.ts)
  quarantineDoc(doc, new ServerOrigin(null, 'repair'));
  const meta = metaOf(doc);
  doc.destroy();
  if (!updates.length) return;
  let seq = await deps.store.lastSeq(boardId);
  const createdAt = new Date().toISOString();
  await deps.store.append(boardId, updates.map((data) => ({ seq: ++seq, data, userId, createdAt })));
  if (JSON.stringify(meta) !== metaBefore) await deps.store.writeMeta(boardId, meta);
}

/** The board file of a board: from its live room if open, else from the store. */
export async function readBoardFile(deps: BoardDocsDeps, boardId: number): Promise<BoardFile> {
  const live = deps.live(boardId);
  if (live) return docToBoard(live.doc);
  return deps.locks.run(boardId, async () => {
    const open = deps.live(boardId);
    if (open) return docToBoard(open.doc);
    const { doc } = await loadBoardDoc(deps.store, boardId);
    await ensureBoardMeta(deps.store, boardId, doc, null);
    // a board stored before updates were checked: read it without what no board file allows
    quarantineDoc(doc, null);
    const board = docToBoard(doc);
    doc.destroy();
    return board;
  });
}

/**
 * Makes the board's content `file`: an empty board gets it directly; a board with content (live or
 * stored) is turned into it by `replaceWithBoard`, an ordinary change every connected screen receives.
 */
export async function writeBoardFile(deps: BoardDocsDeps, boardId: number, file: BoardFile, userId: number | null): Promise<void> {
  await deps.locks.run(boardId, async () => {
    const origin = new ServerOrigin(userId, 'write-board-file');
    const live = deps.live(boardId);
    if (live) {
      live.serverWrite(origin, (doc) => replaceWithBoard(doc, file, origin));
      return live.flush();
    }
    await editStored(deps, boardId, userId, (doc) => {
      const empty = partsMap(doc).size === 0 && wiresMap(doc).size === 0;
      if (empty) boardToDoc(file, doc, origin);
      else replaceWithBoard(doc, file, origin);
    });
  });
}

/**
 * Renames the board or changes its family: a change of the document (live: every screen shows it at
 * once), whose meta the store then projects into the board row. Resolves once both are stored.
 */
export async function writeBoardMeta(deps: BoardDocsDeps, boardId: number, meta: Partial<BoardMeta>, userId: number | null): Promise<void> {
  await deps.locks.run(boardId, async () => {
    const origin = new ServerOrigin(userId, 'rename');
    const live = deps.live(boardId);
    if (live) {
      live.serverWrite(origin, (doc) => setMeta(doc, meta, origin));
      return live.flush();
    }
    await editStored(deps, boardId, userId, async (doc) => {
      // the document takes the row's first title and family before it changes one of them
      await ensureBoardMeta(deps.store, boardId, doc, new ServerOrigin(null, 'board-row'));
      setMeta(doc, meta, origin);
    });
  });
}

/**
 * A server edit of a board's document (the library recording a module's origin, …): `edit` runs with a
 * `ServerOrigin(userId, reason)` — in the open room as one transaction with the check and repair, so
 * every connected screen gets it at once, else on the stored board under its lock. Resolves once it is
 * stored. `edit` should change nothing when what it is about is gone (a module deleted meanwhile).
 */
export async function editBoardDoc(deps: BoardDocsDeps, boardId: number, userId: number | null, reason: string, edit: (doc: Y.Doc) => void): Promise<void> {
  await deps.locks.run(boardId, async () => {
    const origin = new ServerOrigin(userId, reason);
    const live = deps.live(boardId);
    if (live) {
      live.serverWrite(origin, edit);
      return live.flush();
    }
    await editStored(deps, boardId, userId, (doc) => doc.transact(() => edit(doc), origin));
  });
}

/** Compacts a board that is not open in a room (a room compacts its own); returns the remaining row count. */
export async function compactStoredBoard(deps: BoardDocsDeps, boardId: number): Promise<number> {
  return deps.locks.run(boardId, async () => {
    if (deps.live(boardId)) return deps.store.count(boardId);
    const { doc, seq, rows } = await loadBoardDoc(deps.store, boardId);
    // Re-encoding from a Y.Doc (not Y.mergeUpdates) drops garbage-collected deleted content.
    if (rows > 1) await deps.store.compact(boardId, seq, Y.encodeStateAsUpdate(doc));
    doc.destroy();
    return deps.store.count(boardId);
  });
}
