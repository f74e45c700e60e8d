import * as Y from 'yjs';
import * as syncProtocol from 'y-protocols/sync';
import * as awarenessProtocol from 'y-protocols/awareness';
import * as encoding from 'lib0/encoding';
import * as decoding from 'lib0/decoding';
import { WebSocket } from 'ws';
import { metaOf } from './board-docs';
import { ServerOrigin, type BoardFanout, type BoardStore } from './store';
import { UpdateLog } from './update-log';
import { metaMap } from '../../shared/board';
import { repairBoard } from '../../shared/board';
import { MSG, SYNC, awarenessClients } from './protocol';
import { CLOSE, CollabError, type CollabOptions, type Peer } from './types';

/** One open socket in a room. */
export interface Conn {
  ws: WebSocket;
  peer: Peer;
  /** awareness client ids this socket speaks for (removed when it leaves) */
  clients: Set<number>;
}

/** What a room is given: where it stores, its limits, and (later) the other servers' updates. */
export interface RoomDeps {
  store: BoardStore;
  options: () => CollabOptions;
  logErrors: boolean;
  /** Cross-server fan-out (store.ts); absent on a single server. */
  fanout?: BoardFanout;
}

/** An update another server applied first (it stores it; this room only applies and broadcasts it). */
class RemoteOrigin {}
const REMOTE = new RemoteOrigin();

/**
 * One board's live document and its sockets. The guarantee (decision notes 001 and 003): an update
 * is broadcast to the other sockets in the tick it is applied, and queued for the store in that same
 * tick, in order; the queue is written at once and flushed before the room unloads and at shutdown.
 * So a collaborator may see an update a moment before it is stored, and an update counts as kept
 * once `flush()` has resolved. Updates from viewers are never applied. A malformed message closes
 * only its own socket.
 */
export class Room {
  readonly conns = new Map<WebSocket, Conn>();
  readonly awareness: awarenessProtocol.Awareness;
  private readonly log: UpdateLog;
  private destroyed = false;
  private metaChanged = false;
  private readonly unsubscribe: () => void;

  constructor(
    private readonly deps: RoomDeps,
    readonly boardId: number,
    readonly doc: Y.Doc,
    seq: number,
    rows: number,
  ) {
    this.log = new UpdateLog(deps.store, boardId, doc, seq, rows, () => deps.options().compactThreshold);
    this.awareness = new awarenessProtocol.Awareness(doc);
    this.awareness.setLocalState(null);
    doc.on('update', this.onDocUpdate);
    this.awareness.on('update', this.onAwarenessUpdate);
    metaMap(doc).observe(this.onMetaChange);
    doc.on('afterTransaction', this.onAfterTransaction);
    this.unsubscribe = deps.fanout?.subscribe(boardId, (update) => Y.applyUpdate(doc, update, REMOTE)) ?? (() => undefined);
  }

  /**
   * Concurrent edits can each be valid and still merge into a board that is not: two inputs given one
   * label, a wire drawn to a part another user deleted. The server, which sees every edit in one order,
   * repairs the merge as an ordinary edit everyone receives.
   */
  private onAfterTransaction = (tr: Y.Transaction): void => {
    if (!this.conns.has(tr.origin as WebSocket)) return;
    const lists = new Set<unknown>([this.doc.getMap('parts'), this.doc.getMap('wires')]);
    const touched = [...tr.changed.entries()].some(([type, keys]) => keys.has('label') || keys.has('inputs') || (lists.has(type) && keys.size > 0));
    if (touched) queueMicrotask(() => !this.log.isDiscarded && !this.destroyed && repairBoard(this.doc, new ServerOrigin(null, 'repair')));
  };

  /**
   * The title or family changed (on a canvas, through the API, anywhere): the board row, their
   * projection for lists, follows once the update itself is stored (see onDocUpdate).
   */
  private onMetaChange = (): void => {
    this.metaChanged = true;
  };

  // Yjs calls observers before it emits the transaction's update, so the meta flag is set by now.
  private onDocUpdate = (update: Uint8Array, origin: unknown): void => {
    if (origin !== REMOTE) {
      const userId = origin instanceof ServerOrigin ? origin.userId : (this.conns.get(origin as WebSocket)?.peer.userId ?? null);
      this.log.append(update, userId);
      this.deps.fanout?.publish(this.boardId, update);
    }
    if (this.metaChanged) {
      this.metaChanged = false;
      const meta = metaOf(this.doc);
      this.log.after(() => this.deps.store.writeMeta(this.boardId, meta), 'projecting the title and family into the board row');
    }
    const enc = encoding.createEncoder();
    encoding.writeVarUint(enc, MSG.sync);
    syncProtocol.writeUpdate(enc, update);
    this.broadcast(encoding.toUint8Array(enc), origin);
  };

  private onAwarenessUpdate = (
    { added, updated, removed }: { added: number[]; updated: number[]; removed: number[] }, origin: unknown,
  ): void => {
    const conn = this.conns.get(origin as WebSocket);
    if (conn) {
      added.forEach((id) => conn.clients.add(id));
      removed.forEach((id) => conn.clients.delete(id));
    }
    const changed = [...added, ...updated, ...removed];
    const enc = encoding.createEncoder();
    encoding.writeVarUint(enc, MSG.awareness);
    encoding.writeVarUint8Array(enc, awarenessProtocol.encodeAwarenessUpdate(this.awareness, changed));
    // To everyone, the sender too: a lone client's own renewals are what keep its socket from timing out.
    this.broadcast(encoding.toUint8Array(enc), null);
  };

  /** Resolves when every applied update is in the database. */
  flush(): Promise<void> {
    return this.log.flush();
  }

  /** Adds a socket: it gets our sync step 1 and everyone's awareness at once. */
  join(ws: WebSocket, peer: Peer): Conn {
    const conn: Conn = { ws, peer, clients: new Set() };
    this.conns.set(ws, conn);
    const enc = encoding.createEncoder();
    encoding.writeVarUint(enc, MSG.sync);
    syncProtocol.writeSyncStep1(enc, this.doc);
    this.send(conn, encoding.toUint8Array(enc));
    const states = [...this.awareness.getStates().keys()];
    if (states.length) this.send(conn, this.awarenessMessage(states));
    return conn;
  }

  /** Removes a socket and the awareness states it spoke for. */
  leave(ws: WebSocket): void {
    const conn = this.conns.get(ws);
    if (!conn) return;
    this.conns.delete(ws);
    awarenessProtocol.removeAwarenessStates(this.awareness, [...conn.clients], null);
  }

  /** Handles one message; a bad one is logged and closes that socket only. */
  receive(conn: Conn, data: Uint8Array): void {
    try {
      const reply = this.handle(conn, data);
      if (reply) this.send(conn, reply);
    } catch (err) {
      const code = err instanceof CollabError ? err.code : 'malformed_message';
      if (this.deps.logErrors) console.warn(`collab: board ${this.boardId}: closing a socket after a bad message (${code}): ${(err as Error).message}`);
      conn.ws.close(CLOSE.invalidData, code);
    }
  }

  private handle(conn: Conn, data: Uint8Array): Uint8Array | null {
    const decoder = decoding.createDecoder(data);
    const type = decoding.readVarUint(decoder);
    switch (type) {
      case MSG.sync: {
        const step = decoding.readVarUint(decoder);
        const enc = encoding.createEncoder();
        encoding.writeVarUint(enc, MSG.sync);
        if (step === SYNC.step1) {
          syncProtocol.readSyncStep1(decoder, enc, this.doc);
          return encoding.toUint8Array(enc);
        }
        if (step !== SYNC.step2 && step !== SYNC.update) throw new CollabError('unknown_message', `unknown sync step ${step}`);
        const update = decoding.readVarUint8Array(decoder);
        // Read-only on the server: a viewer's document changes are never applied (y-protocols PROTOCOL.md).
        if (conn.peer.role === 'viewer') return null;
        Y.decodeUpdate(update); // throws on a malformed update before anything touches the document
        Y.applyUpdate(this.doc, update, conn.ws);
        return null;
      }
      case MSG.awareness: {
        const update = decoding.readVarUint8Array(decoder);
        // A socket speaks only for its own clients: never move or hide someone else's cursor.
        if (awarenessClients(update).some((id) => this.ownerOf(id, conn))) return null;
        awarenessProtocol.applyAwarenessUpdate(this.awareness, update, conn.ws);
        return null;
      }
      case MSG.queryAwareness:
        return this.awarenessMessage([...this.awareness.getStates().keys()]);
      case MSG.auth:
        throw new CollabError('unknown_message', 'auth messages are not used; the session decides');
      default:
        throw new CollabError('unknown_message', `unknown message type ${type}`);
    }
  }

  /** True when awareness client `id` belongs to a socket other than `conn`. */
  private ownerOf(id: number, conn: Conn): boolean {
    for (const other of this.conns.values()) if (other !== conn && other.clients.has(id)) return true;
    return false;
  }

  private awarenessMessage(clients: number[]): Uint8Array {
    const enc = encoding.createEncoder();
    encoding.writeVarUint(enc, MSG.awareness);
    encoding.writeVarUint8Array(enc, awarenessProtocol.encodeAwarenessUpdate(this.awareness, clients));
    return encoding.toUint8Array(enc);
  }

  private send(conn: Conn, data: Uint8Array): void {
    if (conn.ws.readyState !== WebSocket.OPEN) return;
    conn.ws.send(data, (err) => {
      if (err) conn.ws.terminate();
    });
  }

  private broadcast(data: Uint8Array, except: unknown): void {
    for (const conn of this.conns.values()) if (conn.ws !== except) this.send(conn, data);
  }

  /** Closes every socket with `code`. */
  closeAll(code: number, reason: string): void {
    for (const conn of [...this.conns.values()]) conn.ws.close(code, reason);
  }

  /** The board is gone: drop queued updates (their rows would have no board) and stop writing. */
  discard(): void {
    this.log.discard();
  }

  destroy(): void {
    this.destroyed = true;
    this.unsubscribe();
    this.doc.off('update', this.onDocUpdate);
    metaMap(this.doc).unobserve(this.onMetaChange);
    this.doc.off('afterTransaction', this.onAfterTransaction);
    this.awareness.destroy();
    this.doc.destroy();
  }
}
