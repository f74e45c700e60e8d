import * as Y from 'yjs';
import * as syncProtocol from 'y-protocols/sync';
import * as awarenessProtocol from 'y-protocols/awareness';
import * as encoding from 'lib0/encoding';
import * as decoding from 'lib0/decoding';
import { WebSocket } from 'ws';
import { metaOf } from './board-docs';
import { ServerOrigin, type BoardFanout, type BoardStore } from './store';
import { UpdateLog } from './update-log';
import { checkDocChanges, metaMap, quarantineDoc, repairBoard, touchedBy, type Quarantine } from '../../shared/board';
import { MSG, SYNC } from './protocol';
import { Presence } from './presence';
import { UpdateGuard } from './update-guard';
import { CLOSE, CollabError, SocketRefusal, closeReason, type CollabOptions, type Peer } from './types';

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

/** What a room removed from its stored board when it opened it (content stored before updates were checked). */
export interface QuarantineReport extends Quarantine {
  at: string;
}

/** An update another server applied first (it stores it; this room only applies and broadcasts it). */
class RemoteOrigin {}
const REMOTE = new RemoteOrigin();

/**
 * One board's live document and its sockets. The guarantee (decision notes 001 and 003): an update
 * is broadcast to the other sockets in the tick it is applied, and queued for the store in that same
 * tick, in order; the queue is written at once and flushed before the room unloads and at shutdown.
 * So a collaborator may see an update a moment before it is stored, and an update counts as kept
 * once `flush()` has resolved. Updates from viewers are never applied. An editor's update is checked
 * before it is applied (update-guard.ts): one that would make the board invalid or pass a limit is
 * refused and closes its socket. A malformed message closes only its own socket; nothing a socket
 * sends makes the room throw. Presence is fanned out by presence.ts.
 */
export class Room {
  readonly conns = new Map<WebSocket, Conn>();
  readonly awareness: awarenessProtocol.Awareness;
  readonly presence: Presence;
  /** What was removed from the stored board when the room opened, if anything (a log line says so too). */
  readonly quarantine: QuarantineReport | null = null;
  private readonly log: UpdateLog;
  private readonly guard: UpdateGuard;
  private destroyed = false;
  private metaChanged = false;
  /** a server write happened and its check and repair has not run yet */
  private serverWritePending = false;
  /** `serverWrite` is running: its check and repair is part of its own transaction */
  private writing = false;
  /** the origins of the room's own repairs (their edits need no repair after them) */
  private readonly ownOrigins = { repair: new ServerOrigin(null, 'repair'), quarantine: new ServerOrigin(null, 'quarantine') };
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
    this.presence = new Presence(this.awareness, this.conns, deps.options, (conn, data) => this.send(conn as Conn, data));
    doc.on('update', this.onDocUpdate);
    metaMap(doc).observe(this.onMetaChange);
    doc.on('afterTransaction', this.onAfterTransaction);
    this.quarantine = this.quarantineStored();
    this.guard = new UpdateGuard(doc, deps.options);
    this.unsubscribe = deps.fanout?.subscribe(boardId, (update) => Y.applyUpdate(doc, update, REMOTE)) ?? (() => undefined);
  }

  /**
   * A board stored before updates were checked may hold parts or wires no board file allows: they are
   * removed by a server edit (stored like any other) and reported, so the room and its export work.
   */
  private quarantineStored(): QuarantineReport | null {
    return this.settle(this.ownOrigins.quarantine, 'the stored board did not pass the board check', true);
  }

  /**
   * Runs the whole board check and repair (`quarantineDoc`: shape problems removed, then the merge repair
   * inside modules and on the top level) with `origin`; logs and returns what changed (and, with
   * `reportProblems`, problems it leaves, such as content outside the board). Total: a failure is
   * logged, never thrown.
   */
  private settle(origin: ServerOrigin, what: string, reportProblems: boolean): QuarantineReport | null {
    try {
      const q = quarantineDoc(this.doc, origin);
      const { wires, relabelled, parts } = q.repaired;
      // content outside the board's roots is reported, never removed: said once, when the room opens
      if (!q.removed.length && !wires.length && !relabelled.length && !parts.length && !(reportProblems && q.problems.length)) return null;
      // entries inside a module are named <module>/<id>
      console.warn(
        `collab: board ${this.boardId}: ${what}; removed ${q.removed.length} entr${q.removed.length === 1 ? 'y' : 'ies'}` +
          ` (${q.removed.map((r) => `${r.where} ${JSON.stringify(r.key).slice(0, 40)}`).join(', ')}), repaired ${wires.length} wire(s) and ${relabelled.length} label(s)` +
          `${parts.length ? `, removed ${parts.length} part(s) the modules' hierarchy does not allow (${parts.slice(0, 10).join(', ')})` : ''}:` +
          ` ${q.problems.slice(0, 5).map((p) => p.message).join('; ')}`,
      );
      return { ...q, at: new Date().toISOString() };
    } catch (err) {
      console.error(`collab: board ${this.boardId}: checking the board (${what}) failed:`, err);
      return null;
    }
  }

  /**
   * A server write (a whole board file, a restore or import, a rename, a library origin: board-docs.ts):
   * `edit` and the whole check and repair after it run in ONE transaction with `origin`, so the room, its
   * sockets and its stored rows only ever see the repaired board, as one update. Returns what the repair
   * changed, if anything (also logged). Total as to the repair; an `edit` that throws still gets it.
   */
  serverWrite(origin: ServerOrigin, edit: (doc: Y.Doc) => void): QuarantineReport | null {
    let report: QuarantineReport | null = null;
    this.writing = true;
    try {
      this.doc.transact((tr) => {
        try {
          edit(this.doc);
        } finally {
          // A rename touches the meta alone: on a board that passed the check before (every write to the
          // room is checked), only what it touched can be wrong — checked in O(1) instead of O(board).
          const touched = touchedBy(tr);
          const metaOnly = !this.serverWritePending && !touched.parts.size && !touched.wires.size && !touched.strays.size;
          if (!metaOnly || checkDocChanges(this.doc, touched).length) report = this.settle(origin, 'a server write left the board invalid', false);
        }
      }, origin);
    } finally {
      this.writing = false;
    }
    return report;
  }

  /**
   * Any other server edit of the room's document (a `ServerOrigin` transaction made straight on
   * `room.doc`) is not checked like a socket's update: after it, the whole check and repair runs as its
   * own edit, so the room never keeps a board it would refuse to export. It runs in a microtask after
   * the write, or at once when the writer flushes, so that what `flush()` resolves for includes it.
   * Returns what it changed, if anything.
   */
  settleServerWrite = (): QuarantineReport | null => {
    if (!this.serverWritePending) return null;
    this.serverWritePending = false;
    if (this.log.isDiscarded || this.destroyed) return null;
    return this.settle(this.ownOrigins.repair, 'a server write left the board invalid', false);
  };

  /** The merge repair, total: a failure is logged, never thrown. */
  private repair = (): void => {
    if (this.log.isDiscarded || this.destroyed) return;
    try {
      repairBoard(this.doc, this.ownOrigins.repair);
    } catch (err) {
      console.error(`collab: board ${this.boardId}: the repair pass failed:`, err);
    }
  };

  /**
   * Concurrent edits can each be valid and still merge into a board that is not: two inputs given one
   * label, a wire drawn to a part another user deleted. The server, which sees every edit in one order,
   * repairs the merge as an ordinary edit everyone receives.
   */
  private onAfterTransaction = (tr: Y.Transaction): void => {
    if (tr.origin instanceof ServerOrigin) {
      if (this.writing || tr.origin === this.ownOrigins.repair || tr.origin === this.ownOrigins.quarantine || this.serverWritePending) return;
      this.serverWritePending = true;
      queueMicrotask(this.settleServerWrite);
      return;
    }
    if (!this.conns.has(tr.origin as WebSocket)) return;
    const lists = new Set<unknown>([this.doc.getMap('parts'), this.doc.getMap('wires')]);
    // inside a module too: a wire to a part someone deleted there, two ports given one label, a nesting cycle
    const modules = this.doc.share.get('modules') ?? null; // a root, as the transaction names it
    const touched = (modules !== null && tr.changedParentTypes.has(modules))
      || [...tr.changed.entries()].some(([type, keys]) => keys.has('label') || keys.has('inputs') || (lists.has(type) && keys.size > 0));
    if (touched) queueMicrotask(this.repair);
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

  /** Resolves when every applied update is in the database (a server write's repair included). */
  flush(): Promise<void> {
    this.settleServerWrite();
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
    const presence = this.presence.snapshot();
    if (presence) this.send(conn, presence);
    this.presence.audienceChanged();
    return conn;
  }

  /** Removes a socket and the awareness states it spoke for. */
  leave(ws: WebSocket): void {
    const conn = this.conns.get(ws);
    if (!conn) return;
    this.conns.delete(ws);
    this.presence.leave(conn);
  }

  /** Handles one message; a bad one is logged and closes that socket only. */
  receive(conn: Conn, data: Uint8Array): void {
    try {
      const reply = this.handle(conn, data);
      if (reply) this.send(conn, reply);
    } catch (err) {
      if (err instanceof SocketRefusal) {
        console.warn(`collab: board ${this.boardId}: refused a message of user ${conn.peer.userId} and closed the socket (${err.closeCode} ${err.code}): ${err.message}`);
        return conn.ws.close(err.closeCode, closeReason(`${err.code}: ${err.message}`));
      }
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
        this.guard.check(update); // throws on a malformed, invalid or over-limit update: nothing applied
        try {
          Y.applyUpdate(this.doc, update, conn.ws);
        } catch (err) {
          this.guard.rebuild();
          throw err;
        }
        return null;
      }
      case MSG.awareness: {
        this.presence.receive(conn, decoding.readVarUint8Array(decoder));
        return null;
      }
      case MSG.queryAwareness:
        return this.presence.snapshot();
      case MSG.auth:
        throw new CollabError('unknown_message', 'auth messages are not used; the session decides');
      default:
        throw new CollabError('unknown_message', `unknown message type ${type}`);
    }
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
    this.guard.destroy();
    this.presence.destroy();
    this.awareness.destroy();
    this.doc.destroy();
  }
}
