/**
 * What a board's live side needs from storage, and nothing more. Rooms, the registry and the routes
 * see only these interfaces; `server/db/board-store.ts` implements `BoardStore` on SQLite through Knex.
 * A PostgreSQL store is the same module on another Knex client (the SQL is plain Knex); a cross-server
 * fan-out implements `BoardFanout`. Neither needs a change to rooms or routes.
 */
import type { FamilyId } from '../../shared/board';

/** One Yjs update to store, numbered in the order the room applied it. */
export interface NewBoardUpdate {
  seq: number;
  data: Uint8Array;
  /** who made it (null: the server itself, or unknown) */
  userId: number | null;
  /** ISO time */
  createdAt: string;
}

/** A board's stored history: its updates in order and the last seq (0 for none). */
export interface StoredBoard {
  updates: Uint8Array[];
  seq: number;
}

/** The title and family of a board: owned by its document's `meta` map, projected into the board row. */
export interface BoardMeta {
  title: string;
  family: FamilyId;
}

export interface BoardStore {
  /** Whether the board still exists (a deleted board's queued updates are dropped, not written). */
  exists(boardId: number): Promise<boolean>;
  /** The board's stored updates in the order they were applied (none for an unknown board). */
  load(boardId: number): Promise<StoredBoard>;
  /**
   * Appends updates after the stored ones, all or nothing, and marks the board changed now (lists
   * sort it first). The store numbers them after the highest stored seq, in the given order (several
   * servers may append to one board); a caller's `seq` is its own count and may be lower.
   */
  append(boardId: number, updates: NewBoardUpdate[]): Promise<void>;
  /** The highest stored seq (0 when none). */
  lastSeq(boardId: number): Promise<number>;
  /** How many stored rows the board has. */
  count(boardId: number): Promise<number>;
  /**
   * Replaces every update up to `uptoSeq` by `state` (the document holding at least all of them,
   * re-encoded), atomically: a reader sees the old rows or the new one, never neither.
   */
  compact(boardId: number, uptoSeq: number, state: Uint8Array): Promise<void>;
  /** The projection's title and family (what lists show), for a document that has none yet. */
  readMeta(boardId: number): Promise<BoardMeta | undefined>;
  /**
   * Projects the document's meta into the board row. Called by this folder only, whenever the
   * document's meta changes, whatever the origin; values the row cannot hold are skipped.
   */
  writeMeta(boardId: number, meta: { title?: unknown; family?: unknown }): Promise<void>;
}

/**
 * Cross-server fan-out, for several servers serving one board (a later issue; not implemented yet).
 * The seam: a room would `publish` every update it applied from its own sockets or the server, and
 * apply what `subscribe` delivers with a remote origin, broadcasting it to its sockets but not storing
 * it again (the server that received it stores it). Rooms take it as an optional dependency, so adding
 * one touches neither the rooms' protocol handling nor the routes.
 */
export interface BoardFanout {
  publish(boardId: number, update: Uint8Array): void;
  /** Calls `onRemoteUpdate` for each update another server published; returns the unsubscribe. */
  subscribe(boardId: number, onRemoteUpdate: (update: Uint8Array) => void): () => void;
}

/** The origin of changes the server makes itself (import, seed, rename, repair); `userId` is who asked. */
export class ServerOrigin {
  constructor(readonly userId: number | null, readonly reason: string) {}
}
