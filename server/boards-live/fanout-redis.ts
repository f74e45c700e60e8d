import { randomBytes } from 'node:crypto';
import { Redis } from 'ioredis';
import * as Y from 'yjs';
import * as awarenessProtocol from 'y-protocols/awareness';
import * as encoding from 'lib0/encoding';
import type { WebSocket } from 'ws';
import { decodeFanout, encodeFanout, updateId, type FanoutMessage } from './fanout-wire';
import { MSG } from './protocol';
import type { Room } from './room';
import type { BoardFanout, BoardStore, NewBoardUpdate } from './store';

/** What the fan-out needs of the registry: the open rooms (their documents, presence and sockets). */
export interface OpenRooms {
  readonly rooms: ReadonlyMap<number, Room>;
}

export interface RedisFanoutOptions {
  /** An update another server applied and has not confirmed as stored after this long is stored here. */
  takeoverMs?: number;
  /** Presence from this server's editors is sent to the other servers at most once per this many ms. */
  awarenessFrameMs?: number;
  logErrors?: boolean;
}

interface Unconfirmed {
  boardId: number;
  /** the server that published it */
  from: string;
  data: Uint8Array;
  at: number;
}

const REMOTE_AWARENESS = Symbol('remote-awareness');
const channelOf = (boardId: number) => `gatefold:board:${boardId}`;
const BOARD_CHANNEL = /^gatefold:board:(\d+)$/;
/** Every server says it is alive here, so that a slow database is not taken for a dead server. */
const ALIVE_CHANNEL = 'gatefold:alive';

/**
 * Several servers serving one board (decision note 006): one Redis pub/sub channel per board.
 * - Each server stores the updates its own sockets and its own server edits produced (its rooms' write
 *   queues, unchanged), publishes each with its content hash, and says so (`stored`) once it is in the
 *   database. Rooms apply other servers' updates with a remote origin: broadcast, never queued.
 * - An update another server published and never confirmed, when that server has not been heard on the
 *   alive channel for `takeoverMs` (it died), is stored by each server that applied it: Yjs applies an
 *   item once, so a second copy of a row costs space (compaction folds it), never content. A live
 *   server with a slow database keeps its own writes (no copies under load).
 * - A room that opens asks the servers that have the board open for what its stored copy lacks (an
 *   update published before it subscribed but not yet stored).
 * - Editors' presence goes to the other servers' sockets, gathered per frame.
 * Without REDIS_URL none of this exists and a single server works as before.
 */
export class RedisBoardFanout implements BoardFanout {
  readonly serverId = randomBytes(9).toString('base64url');
  readonly pub: Redis;
  readonly sub: Redis;
  private readonly listeners = new Map<number, (update: Uint8Array) => void>();
  private readonly unsubscribeTimers = new Map<number, ReturnType<typeof setTimeout>>();
  private readonly publishedHere = new Set<string>();
  private readonly unconfirmed = new Map<string, Unconfirmed>();
  private readonly awarenessOff = new Map<number, () => void>();
  /** when each other server was last heard on the alive channel */
  private readonly lastHeard = new Map<string, number>();
  private readonly takeoverMs: number;
  private readonly awarenessFrameMs: number;
  private readonly timer: ReturnType<typeof setInterval>;
  private rooms: OpenRooms | undefined;
  private inner: BoardStore | undefined;
  private closed = false;

  constructor(url: string, private readonly options: RedisFanoutOptions = {}) {
    this.takeoverMs = options.takeoverMs ?? 2000;
    this.awarenessFrameMs = options.awarenessFrameMs ?? 50;
    // commands wait for a reconnect instead of failing at once; the ready route reports the link
    this.pub = new Redis(url, { lazyConnect: false, maxRetriesPerRequest: 20, enableAutoPipelining: true });
    this.sub = this.pub.duplicate();
    for (const c of [this.pub, this.sub]) c.on('error', (err: Error) => this.warn(`redis: ${err.message}`));
    this.sub.on('messageBuffer', (channel: Buffer, message: Buffer) => this.onMessage(channel.toString(), message));
    // After Redis was away (ioredis subscribes again by itself) every open room asks for what it
    // missed meanwhile, as when it opened; the other servers do the same, so each side catches up.
    let connectedBefore = false;
    this.sub.on('ready', () => {
      if (connectedBefore) for (const boardId of this.listeners.keys()) this.roomOpened(boardId);
      connectedBefore = true;
    });
    // each server waits a little more than the others before taking over, so that usually one stores
    const jitter = Math.floor(Math.random() * this.takeoverMs);
    this.timer = setInterval(() => {
      void this.pub.publish(ALIVE_CHANNEL, this.serverId).catch(() => undefined);
      void this.takeOver(this.takeoverMs + jitter);
    }, Math.max(100, this.takeoverMs / 4));
    this.timer.unref();
  }

  /** Resolves once both connections are up (createApp waits for it, so a bad REDIS_URL fails the start). */
  async ready(): Promise<void> {
    await Promise.all([this.pub.ping(), this.sub.subscribe(ALIVE_CHANNEL)]);
  }

  /** The registry whose rooms answer sync requests and carry presence. */
  attach(rooms: OpenRooms): void {
    this.rooms = rooms;
  }

  /**
   * The store rooms and server edits write through: after each stored batch the other servers hear
   * `stored`; an update stored here that no room published (a server edit of a board not open here)
   * is published first, so the rooms open elsewhere apply it.
   */
  wrapStore(store: BoardStore): BoardStore {
    this.inner = store;
    return {
      ...store,
      append: async (boardId: number, updates: NewBoardUpdate[]) => {
        await store.append(boardId, updates);
        const ids = updates.map((u) => updateId(u.data));
        updates.forEach((u, i) => {
          if (!this.publishedHere.delete(ids[i])) this.send(boardId, { type: 'update', from: this.serverId, id: ids[i], data: u.data });
        });
        this.send(boardId, { type: 'stored', from: this.serverId, ids });
      },
    };
  }

  publish(boardId: number, update: Uint8Array): void {
    const id = updateId(update);
    this.publishedHere.add(id);
    this.send(boardId, { type: 'update', from: this.serverId, id, data: update });
  }

  subscribe(boardId: number, onRemoteUpdate: (update: Uint8Array) => void): () => void {
    this.listeners.set(boardId, onRemoteUpdate);
    const pendingOff = this.unsubscribeTimers.get(boardId);
    if (pendingOff) {
      clearTimeout(pendingOff);
      this.unsubscribeTimers.delete(boardId);
      queueMicrotask(() => this.roomOpened(boardId));
    } else {
      this.sub.subscribe(channelOf(boardId)).then(
        () => this.roomOpened(boardId),
        (err: Error) => this.warn(`board ${boardId}: subscribing failed: ${err.message}`),
      );
    }
    return () => {
      if (this.listeners.get(boardId) !== onRemoteUpdate) return;
      this.listeners.delete(boardId);
      this.awarenessOff.get(boardId)?.();
      this.awarenessOff.delete(boardId);
      // stay on the channel a little longer: confirmations of updates applied here may still come
      const t = setTimeout(() => {
        this.unsubscribeTimers.delete(boardId);
        if (!this.listeners.has(boardId) && !this.closed) void this.sub.unsubscribe(channelOf(boardId)).catch(() => undefined);
      }, this.takeoverMs * 3);
      t.unref();
      this.unsubscribeTimers.set(boardId, t);
    };
  }

  /** Stores what is still unconfirmed (best effort), then closes both connections. */
  async close(): Promise<void> {
    if (this.closed) return;
    await this.takeOver(0).catch(() => undefined);
    this.closed = true;
    clearInterval(this.timer);
    for (const t of this.unsubscribeTimers.values()) clearTimeout(t);
    for (const off of this.awarenessOff.values()) off();
    await Promise.allSettled([this.sub.quit(), this.pub.quit()]);
  }

  private send(boardId: number, m: FanoutMessage): void {
    if (this.closed) return;
    this.pub.publish(channelOf(boardId), Buffer.from(encodeFanout(m))).catch((err: Error) => this.warn(`board ${boardId}: publishing failed: ${err.message}`));
  }

  private room(boardId: number): Room | undefined {
    return this.listeners.has(boardId) ? this.rooms?.rooms.get(boardId) : undefined;
  }

  /**
   * A room opened here and its channel is live: what was published before then is asked for (from the
   * rooms open elsewhere) and read again (stored meanwhile by a server whose room has closed since).
   */
  private roomOpened(boardId: number): void {
    const room = this.room(boardId);
    if (!room) return;
    this.send(boardId, { type: 'sync-request', from: this.serverId, stateVector: Y.encodeStateVector(room.doc) });
    if (!this.awarenessOff.has(boardId)) this.awarenessOff.set(boardId, this.carryPresence(boardId, room));
    this.inner?.load(boardId).then(
      ({ updates }) => {
        const apply = this.listeners.get(boardId);
        if (apply && updates.length && this.room(boardId) === room) this.applyRemote(boardId, apply, Y.mergeUpdates(updates));
      },
      (err: Error) => this.warn(`board ${boardId}: reading it again failed: ${err.message}`),
    );
  }

  private onMessage(channel: string, raw: Buffer): void {
    if (channel === ALIVE_CHANNEL) {
      this.lastHeard.set(raw.toString(), Date.now());
      return;
    }
    const match = BOARD_CHANNEL.exec(channel);
    if (!match) return;
    const boardId = Number(match[1]);
    let m: FanoutMessage;
    try {
      m = decodeFanout(new Uint8Array(raw.buffer, raw.byteOffset, raw.byteLength));
    } catch (err) {
      return this.warn(`board ${boardId}: a bad fan-out message: ${(err as Error).message}`);
    }
    if (m.from === this.serverId) return;
    switch (m.type) {
      case 'update': {
        const apply = this.listeners.get(boardId);
        if (!apply) return;
        this.unconfirmed.set(m.id, { boardId, from: m.from, data: m.data, at: Date.now() });
        return this.applyRemote(boardId, apply, m.data);
      }
      case 'stored':
        for (const id of m.ids) this.unconfirmed.delete(id);
        return;
      case 'sync-request': {
        const room = this.room(boardId);
        if (!room) return;
        const diff = Y.encodeStateAsUpdate(room.doc, m.stateVector);
        // an update with no structs and no deletes is 2 bytes long
        if (diff.byteLength > 2) this.send(boardId, { type: 'sync-reply', from: this.serverId, to: m.from, data: diff });
        return;
      }
      case 'sync-reply': {
        const apply = this.listeners.get(boardId);
        if (m.to === this.serverId && apply) this.applyRemote(boardId, apply, m.data);
        return;
      }
      case 'awareness':
        return this.forwardPresence(boardId, m.data);
      default: {
        const never: never = m;
        return this.warn(`unknown fan-out message ${JSON.stringify(never)}`);
      }
    }
  }

  private applyRemote(boardId: number, apply: (update: Uint8Array) => void, data: Uint8Array): void {
    try {
      apply(data);
    } catch (err) {
      this.warn(`board ${boardId}: applying another server's update failed: ${(err as Error).message}`);
    }
  }

  /**
   * Stores the remote updates older than `ageMs` whose server never said it stored them and has not
   * been heard for `takeoverMs` (it died; a live server with a slow database keeps its own writes).
   */
  private async takeOver(ageMs: number): Promise<void> {
    if (!this.inner || !this.unconfirmed.size) return;
    const now = Date.now();
    const byBoard = new Map<number, [string, Unconfirmed][]>();
    for (const [id, u] of this.unconfirmed) {
      if (now - u.at < ageMs || now - (this.lastHeard.get(u.from) ?? 0) < this.takeoverMs) continue;
      this.unconfirmed.delete(id);
      byBoard.set(u.boardId, [...(byBoard.get(u.boardId) ?? []), [id, u]]);
    }
    for (const [boardId, list] of byBoard) {
      try {
        if (!(await this.inner.exists(boardId))) continue;
        const createdAt = new Date().toISOString();
        await this.inner.append(boardId, list.map(([, u]) => ({ seq: 0, data: u.data, userId: null, createdAt })));
        this.send(boardId, { type: 'stored', from: this.serverId, ids: list.map(([id]) => id) });
        console.warn(`boards-live: board ${boardId}: stored ${list.length} update(s) another server applied but never confirmed`);
      } catch (err) {
        for (const [id, u] of list) this.unconfirmed.set(id, u);
        this.warn(`board ${boardId}: storing unconfirmed updates failed; will retry: ${(err as Error).message}`);
      }
    }
  }

  /** Sends this server's editors' presence changes to the other servers, gathered per frame. */
  private carryPresence(boardId: number, room: Room): () => void {
    const ids = new Set<number>();
    let frame: ReturnType<typeof setTimeout> | null = null;
    const flush = () => {
      frame = null;
      const list = [...ids].filter((id) => room.awareness.meta.has(id));
      ids.clear();
      if (list.length) this.send(boardId, { type: 'awareness', from: this.serverId, data: awarenessProtocol.encodeAwarenessUpdate(room.awareness, list) });
    };
    const onUpdate = ({ added, updated, removed }: { added: number[]; updated: number[]; removed: number[] }, origin: unknown) => {
      if (origin === REMOTE_AWARENESS || origin === 'local') return;
      const conn = room.conns.get(origin as WebSocket);
      // viewers' presence stays on their server (presence.ts); removals of leaving sockets have no origin
      if (conn && conn.peer.role === 'viewer') return;
      if (!conn && origin !== null && origin !== 'timeout') return;
      for (const id of conn ? [...added, ...updated, ...removed] : removed) ids.add(id);
      frame ??= setTimeout(flush, this.awarenessFrameMs);
    };
    room.awareness.on('update', onUpdate);
    return () => {
      room.awareness.off('update', onUpdate);
      if (frame) clearTimeout(frame);
    };
  }

  /** Another server's editors' presence: straight to this server's sockets on the board. */
  private forwardPresence(boardId: number, update: Uint8Array): void {
    const room = this.room(boardId);
    if (!room) return;
    const enc = encoding.createEncoder();
    encoding.writeVarUint(enc, MSG.awareness);
    encoding.writeVarUint8Array(enc, update);
    const frame = encoding.toUint8Array(enc);
    for (const conn of room.conns.values()) if (conn.ws.readyState === conn.ws.OPEN) conn.ws.send(frame);
  }

  private warn(message: string): void {
    if (this.options.logErrors !== false) console.warn(`boards-live fan-out: ${message}`);
  }
}
