import type * as Y from 'yjs';
import type { BoardFile } from '../../shared/board';
import {
  compactStoredBoard, editBoardDoc, ensureBoardMeta, loadBoardDoc, readBoardFile, writeBoardFile, writeBoardMeta, type BoardDocsDeps,
} from './board-docs';
import { BoardLocks } from './locks';
import { Room } from './room';
import { ServerOrigin, type BoardFanout, type BoardMeta, type BoardStore } from './store';
import { CLOSE, DEFAULT_COLLAB_OPTIONS, type CollabOptions } from './types';

/**
 * Something happened on a board's live side: a live room applied an update (any origin), or a room
 * unloaded after its last socket left and everything was stored. Features listen (automatic snapshots).
 */
export type BoardActivity = { type: 'update'; boardId: number; origin: unknown } | { type: 'unloaded'; boardId: number };

export interface BoardRegistryDeps {
  store: BoardStore;
  options?: Partial<CollabOptions>;
  logErrors: boolean;
  fanout?: BoardFanout;
}

/**
 * The open rooms of one app context (created once in createApp, passed explicitly) and the way to a
 * board's content for everyone else: routes and services read, write and rename boards here, through
 * the live room when one is open. A room is opened for its first socket and unloads, after storing
 * everything, when its last socket leaves.
 */
export class BoardRegistry {
  /** Live limits; tests and operators may change them while running. */
  readonly options: CollabOptions;
  readonly store: BoardStore;
  private readonly open = new Map<number, Room>();
  private readonly opening = new Map<number, Promise<Room>>();
  // A room is claimed the moment a socket is promised to it, so that an unload running between the
  // room lookup and the finished upgrade cannot destroy it under the newcomer.
  private readonly claims = new Map<Room, number>();
  private readonly locks = new BoardLocks();
  private readonly docs: BoardDocsDeps;
  private closing = false;
  private readonly listeners = new Set<(activity: BoardActivity) => void>();

  constructor(private readonly deps: BoardRegistryDeps) {
    this.options = { ...DEFAULT_COLLAB_OPTIONS, ...deps.options };
    this.store = deps.store;
    this.docs = { store: deps.store, locks: this.locks, live: (boardId) => this.open.get(boardId) };
  }

  /** Open rooms by board id. */
  get rooms(): ReadonlyMap<number, Room> {
    return this.open;
  }

  get isClosing(): boolean {
    return this.closing;
  }

  /** The board's room, opened (loaded from the store) if needed and claimed for one socket: `release` it. */
  claim(boardId: number): Promise<Room> {
    const room = this.open.get(boardId);
    if (room) return Promise.resolve(this.addClaim(room));
    let p = this.opening.get(boardId);
    if (!p) {
      p = this.locks.run(boardId, () => this.load(boardId)).finally(() => this.opening.delete(boardId));
      this.opening.set(boardId, p);
    }
    return p.then((r) => this.addClaim(r));
  }

  /** The socket a claim was for is in the room (or never came): an empty room may unload now. */
  release(room: Room): void {
    const n = (this.claims.get(room) ?? 1) - 1;
    if (n > 0) this.claims.set(room, n);
    else this.claims.delete(room);
    if (!n) this.unloadIfIdle(room);
  }

  /** A socket left: the room unloads when it was the last one. */
  unloadIfIdle(room: Room): void {
    if (room.conns.size || this.claims.has(room) || this.closing) return;
    void this.unload(room).catch((err) => console.error('boards-live: unloading failed:', err));
  }

  /** The board was deleted: drop its room's queued updates and close its sockets. */
  discardBoard(boardId: number): void {
    const room = this.open.get(boardId);
    if (!room) return;
    room.discard();
    room.closeAll(CLOSE.boardDeleted, 'board deleted');
  }

  readBoardFile(boardId: number): Promise<BoardFile> {
    return readBoardFile(this.docs, boardId);
  }

  writeBoardFile(boardId: number, file: BoardFile, userId: number | null): Promise<void> {
    return writeBoardFile(this.docs, boardId, file, userId);
  }

  /** Renames the board or changes its family in its document; the board row follows. */
  writeMeta(boardId: number, meta: Partial<BoardMeta>, userId: number | null): Promise<void> {
    return writeBoardMeta(this.docs, boardId, meta, userId);
  }

  /**
   * A server edit of the board's document (`editBoardDoc`): live in its room when open, checked and
   * repaired in the same transaction; resolves once stored.
   */
  editBoardDoc(boardId: number, userId: number | null, reason: string, edit: (doc: Y.Doc) => void): Promise<void> {
    return editBoardDoc(this.docs, boardId, userId, reason, edit);
  }

  /** Compacts a board that has no open room; returns its remaining row count. */
  compactStored(boardId: number): Promise<number> {
    return compactStoredBoard(this.docs, boardId);
  }

  /** Calls `listener` on every update a live room applies and when a room unloads; returns the unsubscribe. */
  onActivity(listener: (activity: BoardActivity) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  private emit(activity: BoardActivity): void {
    for (const listener of this.listeners) {
      try {
        listener(activity);
      } catch (err) {
        console.error('boards-live: an activity listener failed:', err);
      }
    }
  }

  /** Resolves when every open room has stored all its updates. */
  async flushAll(): Promise<void> {
    await Promise.all([...this.open.values()].map((r) => r.flush()));
  }

  /** Closes every socket, stores everything, destroys the rooms. Safe to call twice. */
  async close(): Promise<void> {
    if (this.closing) return;
    this.closing = true;
    await Promise.allSettled([...this.opening.values()]);
    for (const room of this.open.values()) room.closeAll(CLOSE.goingAway, 'server shutting down');
    await this.flushAll();
    for (const room of this.open.values()) room.destroy();
    this.open.clear();
  }

  private addClaim(room: Room): Room {
    this.claims.set(room, (this.claims.get(room) ?? 0) + 1);
    return room;
  }

  private async load(boardId: number): Promise<Room> {
    const { doc, seq, rows } = await loadBoardDoc(this.store, boardId);
    const room = new Room({ store: this.store, options: () => this.options, logErrors: this.deps.logErrors, fanout: this.deps.fanout }, boardId, doc, seq, rows);
    this.open.set(boardId, room);
    doc.on('update', (_update: Uint8Array, origin: unknown) => this.emit({ type: 'update', boardId, origin }));
    await ensureBoardMeta(this.store, boardId, doc, new ServerOrigin(null, 'board-row'));
    return room;
  }

  private unload(room: Room): Promise<void> {
    return this.locks.run(room.boardId, async () => {
      await room.flush();
      if (room.conns.size || this.claims.has(room) || this.open.get(room.boardId) !== room) return;
      this.open.delete(room.boardId);
      room.destroy();
      this.emit({ type: 'unloaded', boardId: room.boardId });
    });
  }
}
