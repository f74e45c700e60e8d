/**
 * Snapshots of boards: taking them (named, automatic, before a restore, the first of a copy),
 * listing, renaming, deleting, thinning, restoring one into the live board, comparing one with it,
 * and copying a board or a snapshot into a new board. Board content goes through the registry: the
 * live room's document when one is open, else the stored updates.
 */
import * as Y from 'yjs';
import type { ApiBoard, ApiSnapshot, RestoreNotice, SnapshotKind } from '../../shared/api';
import { RESTORE_NOTICE_KEY } from '../../shared/api';
import { docToBoard, metaMap, setMeta, type BoardFile } from '../../shared/board';
import { diffBoards, renderBoardSvg, type BoardDiff } from '../../shared/render';
import { loadBoardDoc, ServerOrigin, type BoardRegistry } from '../boards-live';
import type { Db } from '../db/knex';
import { nowIso } from '../db/knex';
import * as snapshotsDb from '../db/snapshots';
import { findUserById } from '../db/users';
import { notFound } from '../lib/errors';
import type { BoardsService } from '../services/boards';
import { snapshotsToThin, type RetentionRule } from './retention';

/** Thumbnails of boards with more parts than this are drawn as plain boxes (smaller, faster). */
const THUMB_DETAIL_LIMIT = 150;
const THUMB_SIZE = 320;

export interface TakeOptions {
  kind: SnapshotKind;
  name?: string;
  authorId: number | null;
  source?: snapshotsDb.NewSnapshot['source'];
}

export interface SnapshotsService {
  list(boardId: number): Promise<ApiSnapshot[]>;
  get(boardId: number, id: number): Promise<{ snapshot: ApiSnapshot; board: BoardFile }>;
  thumbnail(boardId: number, id: number): Promise<string>;
  take(boardId: number, options: TakeOptions): Promise<ApiSnapshot>;
  rename(boardId: number, id: number, name: string): Promise<ApiSnapshot>;
  remove(boardId: number, id: number): Promise<void>;
  restore(boardId: number, id: number, userId: number): Promise<{ restored: ApiSnapshot; beforeRestore: ApiSnapshot }>;
  compare(boardId: number, id: number): Promise<BoardDiff>;
  copy(boardId: number, userId: number, snapshotId?: number): Promise<ApiBoard>;
  /** Deletes automatic snapshots the retention rule no longer keeps; returns how many. */
  thin(boardId: number, now?: number): Promise<number>;
}

export interface SnapshotsDeps {
  db: Db;
  registry: BoardRegistry;
  boards: BoardsService;
  retention?: RetentionRule;
  /** told after every snapshot taken (the automatic scheduler counts edits from there) */
  onTaken?(boardId: number): void;
}

function toApi(row: snapshotsDb.SnapshotRow): ApiSnapshot {
  return {
    id: row.id,
    boardId: row.board_id,
    name: row.name,
    kind: row.kind as SnapshotKind,
    authorId: row.author_id,
    authorName: row.author_name,
    createdAt: row.created_at,
    partCount: Number(row.part_count),
    wireCount: Number(row.wire_count),
    thumbnailUrl: `/api/boards/${row.board_id}/snapshots/${row.id}/thumbnail.svg`,
    source: row.source_board_id === null ? null : {
      boardId: row.source_board_id, boardTitle: row.source_board_title ?? '', snapshotId: row.source_snapshot_id, snapshotName: row.source_snapshot_name,
    },
  };
}

/** The board file a stored snapshot state holds. */
export function boardOfState(state: Uint8Array): BoardFile {
  const doc = new Y.Doc();
  try {
    Y.applyUpdate(doc, state);
    return docToBoard(doc);
  } finally {
    doc.destroy();
  }
}

const snapshotNotFound = () => notFound('snapshot_not_found', 'No such snapshot on this board');

export function createSnapshotsService({ db, registry, boards, retention, onTaken }: SnapshotsDeps): SnapshotsService {
  /** The board's whole Yjs state and its board file, from the live room or the store. */
  const current = async (boardId: number): Promise<{ state: Uint8Array; board: BoardFile }> => {
    const room = registry.rooms.get(boardId);
    if (room) return { state: Y.encodeStateAsUpdate(room.doc), board: docToBoard(room.doc) };
    const { doc } = await loadBoardDoc(registry.store, boardId);
    try {
      // a board never opened yet has its first title and family in its row only
      if (typeof metaMap(doc).get('title') !== 'string') {
        const meta = await registry.store.readMeta(boardId);
        if (meta) setMeta(doc, meta, null);
      }
      return { state: Y.encodeStateAsUpdate(doc), board: docToBoard(doc) };
    } finally {
      doc.destroy();
    }
  };

  const row = async (boardId: number, id: number) => {
    const r = await snapshotsDb.getSnapshot(db, boardId, id);
    if (!r) throw snapshotNotFound();
    return r;
  };

  const boardOf = async (boardId: number, id: number) => {
    const state = await snapshotsDb.getSnapshotState(db, boardId, id);
    if (!state) throw snapshotNotFound();
    return boardOfState(state);
  };

  const thin = async (boardId: number, now = Date.now()) => {
    const autos = await snapshotsDb.listSnapshotTimes(db, boardId, 'automatic');
    const drop = snapshotsToThin(autos.map((a) => ({ id: a.id, createdAt: a.created_at })), now, retention);
    return snapshotsDb.deleteSnapshots(db, boardId, drop);
  };

  /** Stores a captured state as a snapshot (the board file is decoded from the state when not given). */
  const store = async (boardId: number, captured: { state: Uint8Array; board?: BoardFile }, o: TakeOptions): Promise<ApiSnapshot> => {
    const board = captured.board ?? boardOfState(captured.state);
    const createdAt = nowIso();
    const detail = board.parts.length > THUMB_DETAIL_LIMIT ? 'outline' : 'full';
    const id = await snapshotsDb.insertSnapshot(db, {
      boardId, name: (o.name ?? defaultName(o.kind, createdAt)).slice(0, 120), authorId: o.authorId, createdAt, kind: o.kind,
      partCount: board.parts.length, wireCount: board.wires.length, state: captured.state,
      thumbnailSvg: renderBoardSvg(board, { maxSize: THUMB_SIZE, detail, margin: 20 }).svg, source: o.source,
    });
    onTaken?.(boardId);
    if (o.kind === 'automatic') await thin(boardId);
    return toApi(await row(boardId, id));
  };

  const take = async (boardId: number, o: TakeOptions): Promise<ApiSnapshot> => store(boardId, await current(boardId), o);

  return {
    async list(boardId) {
      return (await snapshotsDb.listSnapshots(db, boardId)).map(toApi);
    },
    async get(boardId, id) {
      const snapshot = toApi(await row(boardId, id));
      return { snapshot, board: await boardOf(boardId, id) };
    },
    async thumbnail(boardId, id) {
      const svg = await snapshotsDb.getSnapshotThumbnail(db, boardId, id);
      if (svg === undefined) throw snapshotNotFound();
      return svg;
    },
    take,
    async rename(boardId, id, name) {
      if (!(await snapshotsDb.renameSnapshot(db, boardId, id, name))) throw snapshotNotFound();
      return toApi(await row(boardId, id));
    },
    async remove(boardId, id) {
      if (!(await snapshotsDb.deleteSnapshots(db, boardId, [id]))) throw snapshotNotFound();
    },
    async restore(boardId, id, userId) {
      const restored = toApi(await row(boardId, id));
      const target = await boardOf(boardId, id);
      // The before-restore snapshot holds the board as it is now: its state is captured before the
      // change and stored right after it, so drawing its picture and writing it do not delay the screens.
      const room = registry.rooms.get(boardId);
      const before = room ? { state: Y.encodeStateAsUpdate(room.doc), board: docToBoard(room.doc) } : await current(boardId);
      // One ordinary change computed against the live document (replaceWithBoard): every connected
      // screen receives it as an edit and later edits merge; the stored state is never swapped.
      await registry.writeBoardFile(boardId, target, userId);
      const user = await findUserById(db, userId);
      const notice: RestoreNotice = { snapshotId: id, snapshotName: restored.name, byUserId: userId, byName: user?.name ?? 'The owner', at: nowIso() };
      const live = registry.rooms.get(boardId);
      if (live) live.doc.transact(() => metaMap(live.doc).set(RESTORE_NOTICE_KEY, notice), new ServerOrigin(userId, 'restore-notice'));
      const beforeRestore = await store(boardId, before, { kind: 'before-restore', name: `Before restoring “${restored.name}”`, authorId: userId });
      return { restored, beforeRestore };
    },
    async compare(boardId, id) {
      const snapshotBoard = await boardOf(boardId, id);
      return diffBoards(snapshotBoard, (await current(boardId)).board);
    },
    async copy(boardId, userId, snapshotId) {
      const from = await boards.get(boardId, userId);
      const snap = snapshotId === undefined ? null : toApi(await row(boardId, snapshotId));
      const content = snap ? await boardOf(boardId, snap.id) : (await current(boardId)).board;
      const title = `${from.title} (copy)`.slice(0, 200);
      const created = await boards.create(userId, { title, family: content.family });
      await registry.writeBoardFile(created.id, { ...content, title }, userId);
      await take(created.id, {
        kind: 'copied-from', authorId: userId,
        name: snap ? `Copied from “${from.title}”, snapshot “${snap.name}”` : `Copied from “${from.title}”`,
        source: { boardId, boardTitle: from.title, snapshotId: snap?.id ?? null, snapshotName: snap?.name ?? null },
      });
      return boards.get(created.id, userId);
    },
    thin,
  };
}

function defaultName(kind: SnapshotKind, at: string): string {
  const when = at.slice(0, 16).replace('T', ' ');
  return kind === 'automatic' ? `Automatic ${when} UTC` : `Snapshot ${when} UTC`;
}
