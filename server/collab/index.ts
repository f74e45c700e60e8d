import type { Server, IncomingMessage } from 'node:http';
import type { Duplex } from 'node:stream';
import { WebSocketServer, type WebSocket } from 'ws';
import type { FamilyId } from '../../shared/board/schema';
import { ServerOrigin, ensureBoardMeta, loadBoardDoc, registerLiveBoards, withBoardLock, writeBoardMeta } from '../services/board-docs';
import { authorizeUpgrade, boardIdOfPath } from './auth';
import { Room } from './room';
import { CLOSE, CollabError, DEFAULT_COLLAB_OPTIONS, type CollabContext, type CollabOptions, type Peer } from './types';

export { CollabError, DEFAULT_COLLAB_OPTIONS, type CollabContext, type CollabOptions } from './types';

/** The running collaboration server. */
export interface CollabHandle {
  /** Live limits; tests and operators may change them while running. */
  options: CollabOptions;
  /** Open rooms by board id. */
  rooms: ReadonlyMap<number, Room>;
  /** Resolves when every open room has stored all its updates. */
  flushAll(): Promise<void>;
  /** Closes every socket, stores everything, stops listening for upgrades. */
  close(): Promise<void>;
}

const handles = new WeakMap<object, CollabHandle>();
/** The collaboration server attached for an app context (if any). */
export function collabOf(ctx: object): CollabHandle | undefined {
  return handles.get(ctx);
}

function refuse(socket: Duplex, status: 401 | 403 | 404 | 500, text: string): void {
  socket.write(`HTTP/1.1 ${status} ${text}\r\nConnection: close\r\nContent-Length: 0\r\n\r\n`);
  socket.destroy();
}

/**
 * Serves the y-websocket protocol at `/collab/<boardId>` on `server`'s upgrade event. A connection is
 * authenticated from the session cookie (or a share token) before any document byte is sent; viewers
 * are read-only on the server; membership changes close or downgrade open sockets.
 */
export function attachCollab(server: Server, ctx: CollabContext): CollabHandle {
  const options: CollabOptions = { ...DEFAULT_COLLAB_OPTIONS, ...ctx.config.collab };
  const wss = new WebSocketServer({ noServer: true, maxPayload: options.maxMessageBytes });
  const rooms = new Map<number, Room>();
  const opening = new Map<number, Promise<Room>>();
  let closing = false;

  registerLiveBoards(ctx, (boardId) => rooms.get(boardId));

  // A room is claimed (joining++) the moment a socket is promised to it, so that an unload running
  // between the room lookup and the finished upgrade cannot destroy it under the newcomer.
  const joining = new Map<Room, number>();
  const claim = (room: Room): Room => (joining.set(room, (joining.get(room) ?? 0) + 1), room);
  const release = (room: Room): void => {
    const n = (joining.get(room) ?? 1) - 1;
    if (n > 0) joining.set(room, n);
    else joining.delete(room);
    if (!n && !room.conns.size && !closing) void maybeUnload(room).catch((err) => console.error('collab: unloading failed:', err));
  };

  const openRoom = (boardId: number): Promise<Room> => {
    const open = rooms.get(boardId);
    if (open) return Promise.resolve(claim(open));
    let p = opening.get(boardId);
    if (!p) {
      p = withBoardLock(ctx, boardId, async () => {
        const { doc, seq, rows } = await loadBoardDoc(ctx, boardId);
        const room = new Room(ctx, boardId, doc, seq, rows, () => options);
        rooms.set(boardId, room);
        await ensureBoardMeta(ctx, boardId, doc, new ServerOrigin(null, 'board-row'));
        return room;
      }).finally(() => opening.delete(boardId));
      opening.set(boardId, p);
    }
    return p.then(claim);
  };

  // Rooms unload when their last socket leaves, after everything is stored.
  const maybeUnload = (room: Room): Promise<void> =>
    withBoardLock(ctx, room.boardId, async () => {
      await room.flush();
      if (room.conns.size || joining.has(room) || rooms.get(room.boardId) !== room) return;
      rooms.delete(room.boardId);
      room.destroy();
    });

  const connect = (ws: WebSocket, room: Room, peer: Peer): void => {
    const conn = room.join(ws, peer);
    let alive = true;
    ws.on('pong', () => (alive = true));
    const ping = setInterval(() => {
      if (!alive) return ws.terminate();
      alive = false;
      ws.ping();
    }, options.pingIntervalMs);
    ws.on('message', (data: Buffer, isBinary: boolean) => {
      if (!isBinary) return room.receive(conn, new Uint8Array()); // text frames are not the protocol: close
      room.receive(conn, new Uint8Array(data.buffer, data.byteOffset, data.byteLength));
    });
    ws.on('error', (err) => {
      if (ctx.config.logErrors) console.warn(`collab: board ${room.boardId}: socket error: ${err.message}`);
    });
    ws.on('close', () => {
      clearInterval(ping);
      room.leave(ws);
      if (!room.conns.size && !closing) void maybeUnload(room).catch((err) => console.error('collab: unloading failed:', err));
    });
  };

  const onUpgrade = (req: IncomingMessage, socket: Duplex, head: Buffer): void => {
    const boardId = boardIdOfPath(req.url);
    if (boardId === null) {
      if ((req.url ?? '').startsWith('/collab')) refuse(socket, 404, 'Not Found');
      return; // other upgrade paths (e.g. a dev server) are not ours
    }
    if (closing) return refuse(socket, 500, 'Server Closing');
    authorizeUpgrade(ctx, req, boardId)
      .then(async (peer) => {
        const room = await openRoom(boardId);
        let released = false;
        const releaseOnce = () => {
          if (released) return;
          released = true;
          release(room);
        };
        // ws gives up silently on a socket that went away meanwhile: release the claim then too
        socket.once('close', releaseOnce);
        try {
          wss.handleUpgrade(req, socket, head, (ws) => {
            connect(ws, room, peer);
            releaseOnce();
          });
        } finally {
          if (socket.destroyed) releaseOnce();
        }
      })
      .catch((err: unknown) => {
        if (err instanceof CollabError) {
          refuse(socket, err.code === 'not_signed_in' ? 401 : 403, err.code === 'not_signed_in' ? 'Unauthorized' : 'Forbidden');
        } else {
          console.error('collab: upgrade failed:', err);
          refuse(socket, 500, 'Internal Server Error');
        }
      });
  };
  server.on('upgrade', onUpgrade);

  const onMembership = ({ boardId, userId, role }: { boardId: number; userId: number; role: Peer['role'] | null }) => {
    const room = rooms.get(boardId);
    if (!room) return;
    for (const conn of room.conns.values()) {
      if (conn.peer.userId !== userId) continue;
      if (role === null) conn.ws.close(CLOSE.removed, 'removed from the board');
      // A viewer made editor reconnects (the client does so by itself) so that the full sync runs again:
      // edits of theirs the server ignored so far would otherwise leave later ones without their base.
      else if (conn.peer.role === 'viewer' && role !== 'viewer') conn.ws.close(CLOSE.roleChanged, 'role changed');
      else conn.peer.role = role;
    }
  };
  const onDeleted = ({ boardId }: { boardId: number }) => {
    const room = rooms.get(boardId);
    if (!room) return;
    room.discard();
    room.closeAll(CLOSE.boardDeleted, 'board deleted');
  };
  const onUpdated = ({ boardId, title, family }: { boardId: number; title: string; family: string }) => {
    void writeBoardMeta(ctx, boardId, { title, family: family as FamilyId }).catch((err) => console.error(`collab: board ${boardId}: storing the new title failed:`, err));
  };
  ctx.events.on('membership-changed', onMembership);
  ctx.events.on('board-deleted', onDeleted);
  ctx.events.on('board-updated', onUpdated);

  const flushAll = async () => {
    await Promise.all([...rooms.values()].map((r) => r.flush()));
  };
  const close = async () => {
    if (closing) return;
    closing = true;
    server.off('upgrade', onUpgrade);
    ctx.events.off('membership-changed', onMembership);
    ctx.events.off('board-deleted', onDeleted);
    ctx.events.off('board-updated', onUpdated);
    await Promise.allSettled([...opening.values()]);
    for (const room of rooms.values()) room.closeAll(CLOSE.goingAway, 'server shutting down');
    await flushAll();
    for (const room of rooms.values()) room.destroy();
    rooms.clear();
    for (const ws of wss.clients) ws.terminate();
    await new Promise<void>((resolve) => wss.close(() => resolve()));
  };
  ctx.onClose.push(close);

  const handle: CollabHandle = { options, rooms, flushAll, close };
  handles.set(ctx, handle);
  return handle;
}
