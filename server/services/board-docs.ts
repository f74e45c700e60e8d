import { readFileSync } from 'node:fs';
import * as Y from 'yjs';
import { parseBoardFile } from '../../shared/board/validate';
import { FamilySchema, type BoardFile, type FamilyId } from '../../shared/board/schema';
import { boardToDoc, docToBoard, metaMap, partsMap, wiresMap } from '../../shared/board/ydoc';
import { replaceWithBoard, setMeta } from '../../shared/board/edits';
import { getBoardTitle, touchBoard, updateBoard } from '../db/boards';
import type { Db } from '../db/knex';
import { nowIso } from '../db/knex';
import {
  appendBoardUpdates, boardRowExists, countBoardUpdates, loadBoardUpdates, maxBoardUpdateSeq, replaceBoardUpdates,
  type NewBoardUpdate,
} from '../db/board-updates';

/**
 * A board's content lives as Yjs updates in `board_updates`. This service loads and stores them, and
 * reads / writes a whole board file — through the live room when one is open (so connected screens
 * update), else straight in the database. Rooms (server/collab) register themselves here.
 */

/** What the service needs of the app context. */
export interface BoardDocsContext {
  db: Db;
}

/** The origin of changes the server makes itself (import, seed, restore); `userId` is who asked. */
export class ServerOrigin {
  constructor(readonly userId: number | null, readonly reason: string) {}
}

/** A board open in a live room. */
export interface LiveBoard {
  doc: Y.Doc;
  /** Resolves when every applied update is in the database. */
  flush(): Promise<void>;
}
/** Looks up open rooms; the collaboration server registers one per app context. */
export type LiveBoards = (boardId: number) => LiveBoard | undefined;

const liveByCtx = new WeakMap<object, LiveBoards>();
const locksByCtx = new WeakMap<object, Map<number, Promise<unknown>>>();

/** Registers the collaboration server's room lookup for this context. */
export function registerLiveBoards(ctx: BoardDocsContext, lookup: LiveBoards): void {
  liveByCtx.set(ctx, lookup);
}

/**
 * Runs `fn` while holding the board's lock, so that opening a room, unloading it and writing a file
 * never interleave (a file written while a room loads would otherwise be missed by the room).
 */
export async function withBoardLock<T>(ctx: BoardDocsContext, boardId: number, fn: () => Promise<T>): Promise<T> {
  let locks = locksByCtx.get(ctx);
  if (!locks) locksByCtx.set(ctx, (locks = new Map()));
  const before = locks.get(boardId) ?? Promise.resolve();
  const run = before.catch(() => undefined).then(fn);
  const tail = run.catch(() => undefined);
  locks.set(boardId, tail);
  void tail.then(() => {
    if (locks.get(boardId) === tail) locks.delete(boardId);
  });
  return run;
}

/** A loaded board: a fresh document holding the merge of its rows, the last seq and the row count. */
export interface LoadedBoard {
  doc: Y.Doc;
  seq: number;
  rows: number;
}

/** Loads a board's stored updates into a fresh Y.Doc (an unknown board gives an empty document). */
export async function loadBoardDoc(ctx: BoardDocsContext, boardId: number): Promise<LoadedBoard> {
  const rows = await loadBoardUpdates(ctx.db, boardId);
  const doc = new Y.Doc();
  doc.transact(() => {
    for (const row of rows) Y.applyUpdate(doc, row.data);
  });
  return { doc, seq: rows.length ? rows[rows.length - 1].seq : 0, rows: rows.length };
}

/** Whether the board row still exists (a deleted board's queued updates are dropped, not written). */
export async function boardStillExists(ctx: BoardDocsContext, boardId: number): Promise<boolean> {
  return boardRowExists(ctx.db, boardId);
}

/** Appends updates to a board's stored history. */
export async function appendBoardChanges(ctx: BoardDocsContext, boardId: number, updates: NewBoardUpdate[]): Promise<void> {
  if (!updates.length) return;
  await appendBoardUpdates(ctx.db, boardId, updates);
  await touchBoard(ctx.db, boardId, updates[updates.length - 1].createdAt); // board lists sort it first
}

/**
 * A collaborator changed the title or family in the document: copy it to the board row, so lists and
 * the REST API agree with the canvas. Values the row does not allow are ignored.
 */
export async function recordBoardMeta(ctx: BoardDocsContext, boardId: number, meta: { title?: unknown; family?: unknown }): Promise<void> {
  const patch: { title?: string; family?: string; now: string } = { now: nowIso() };
  if (typeof meta.title === 'string' && meta.title.trim() && meta.title.length <= 200) patch.title = meta.title.trim();
  if (FamilySchema.safeParse(meta.family).success) patch.family = meta.family as string;
  if (patch.title !== undefined || patch.family !== undefined) await updateBoard(ctx.db, boardId, patch);
}

/** The board row's title or family changed through the API: put it into the document (live or stored). */
export async function writeBoardMeta(ctx: BoardDocsContext, boardId: number, meta: { title: string; family: FamilyId }): Promise<void> {
  await withBoardLock(ctx, boardId, async () => {
    const origin = new ServerOrigin(null, 'board-row');
    const live = liveByCtx.get(ctx)?.(boardId);
    if (live) {
      setMeta(live.doc, meta, origin);
      return live.flush();
    }
    const { doc } = await loadBoardDoc(ctx, boardId);
    const updates: Uint8Array[] = [];
    doc.on('update', (u: Uint8Array) => updates.push(u));
    setMeta(doc, meta, origin);
    doc.destroy();
    let seq = await maxBoardUpdateSeq(ctx.db, boardId);
    const now = nowIso();
    await appendBoardChanges(ctx, boardId, updates.map((data) => ({ seq: ++seq, data, userId: null, createdAt: now })));
  });
}

/**
 * Compaction: `doc` (which holds at least every row up to `uptoSeq`) re-encoded as one update replaces
 * those rows. Re-encoding from a Y.Doc (not Y.mergeUpdates) drops garbage-collected deleted content.
 */
export async function compactBoardRows(ctx: BoardDocsContext, boardId: number, doc: Y.Doc, uptoSeq: number): Promise<void> {
  await replaceBoardUpdates(ctx.db, boardId, uptoSeq, Y.encodeStateAsUpdate(doc), nowIso());
}

/** Compacts a board that is not open in a room; returns the remaining row count. */
export async function compactStoredBoard(ctx: BoardDocsContext, boardId: number): Promise<number> {
  return withBoardLock(ctx, boardId, async () => {
    if (liveByCtx.get(ctx)?.(boardId)) return countBoardUpdates(ctx.db, boardId);
    const { doc, seq, rows } = await loadBoardDoc(ctx, boardId);
    if (rows > 1) await compactBoardRows(ctx, boardId, doc, seq);
    doc.destroy();
    return countBoardUpdates(ctx.db, boardId);
  });
}

/**
 * A board made through the API has a title and family in its row but nothing yet in its document:
 * write them into the document (with `origin`) so that clients and exports show them.
 */
export async function ensureBoardMeta(ctx: BoardDocsContext, boardId: number, doc: Y.Doc, origin: unknown): Promise<void> {
  if (typeof metaMap(doc).get('title') === 'string') return;
  const row = await getBoardTitle(ctx.db, boardId);
  if (row) setMeta(doc, { title: row.title, family: row.family as FamilyId }, origin);
}

/** The board file of a board: from its live room if open, else from the database. */
export async function readBoardFile(ctx: BoardDocsContext, boardId: number): Promise<BoardFile> {
  const live = liveByCtx.get(ctx)?.(boardId);
  if (live) return docToBoard(live.doc);
  return withBoardLock(ctx, boardId, async () => {
    const open = liveByCtx.get(ctx)?.(boardId);
    if (open) return docToBoard(open.doc);
    const { doc } = await loadBoardDoc(ctx, boardId);
    await ensureBoardMeta(ctx, boardId, doc, null);
    const board = docToBoard(doc);
    doc.destroy();
    return board;
  });
}

/**
 * Makes the board's content `file`: an empty board gets it directly; a board with content (live or
 * stored) is turned into it by `replaceWithBoard`, an ordinary change every connected screen receives.
 */
export async function writeBoardFile(ctx: BoardDocsContext, boardId: number, file: BoardFile, userId: number | null): Promise<void> {
  await withBoardLock(ctx, boardId, async () => {
    const origin = new ServerOrigin(userId, 'write-board-file');
    const live = liveByCtx.get(ctx)?.(boardId);
    if (live) {
      replaceWithBoard(live.doc, file, origin);
      await live.flush();
      return;
    }
    const { doc } = await loadBoardDoc(ctx, boardId);
    const empty = partsMap(doc).size === 0 && wiresMap(doc).size === 0;
    const updates: Uint8Array[] = [];
    doc.on('update', (u: Uint8Array) => updates.push(u));
    if (empty) boardToDoc(file, doc, origin);
    else replaceWithBoard(doc, file, origin);
    doc.destroy();
    let seq = await maxBoardUpdateSeq(ctx.db, boardId);
    const now = nowIso();
    await appendBoardChanges(ctx, boardId, updates.map((data) => ({ seq: ++seq, data, userId, createdAt: now })));
  });
}

/** Reads `examples/<slug>.gatefold.json` (the demo boards' content), checked like an import. */
export function readExampleBoard(slug: string): BoardFile {
  if (!/^[a-z0-9-]+$/.test(slug)) throw new Error(`bad example name "${slug}"`);
  const raw: unknown = JSON.parse(readFileSync(new URL(`../../examples/${slug}.gatefold.json`, import.meta.url), 'utf8'));
  const parsed = parseBoardFile(raw);
  if (!parsed.ok) throw new Error(`examples/${slug}.gatefold.json: ${parsed.problems.map((p) => p.message).join('; ')}`);
  return parsed.board;
}

/** The `ctx.boardContent` hook of the demo seed: each demo board gets its example file. */
export function exampleBoardContent(ctx: BoardDocsContext): { seed(boardId: number, slug: string, ownerId: number): Promise<void> } {
  return {
    async seed(boardId, slug, ownerId) {
      await writeBoardFile(ctx, boardId, readExampleBoard(slug), ownerId);
    },
  };
}
