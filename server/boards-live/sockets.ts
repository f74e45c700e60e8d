import type { Server, IncomingMessage } from 'node:http';
import type { Duplex } from 'node:stream';
import { WebSocketServer, type WebSocket } from 'ws';
import type { BoardRole } from '../../shared/api';
import { authorizeUpgrade, boardIdOfPath, type SessionCheck } from './auth';
import type { BoardRegistry } from './registry';
import type { Room } from './room';
import { closeLinkGuests } from './share-guests';
import { CLOSE, CollabError, type CollabOptions, type Peer, type SocketContext } from './types';

/** The running websocket side. */
export interface SocketsHandle {
  /** Stops taking sockets, closes the open ones and the rooms (after storing everything). */
  close(): Promise<void>;
}

function refuse(socket: Duplex, status: 401 | 403 | 404 | 500, text: string): void {
  socket.write(`HTTP/1.1 ${status} ${text}\r\nConnection: close\r\nContent-Length: 0\r\n\r\n`);
  socket.destroy();
}

/**
 * Wires one accepted socket to its room: messages in, keep-alive pings, leaving. On each ping tick the
 * socket's session is asked for again: one that expired or was destroyed closes the socket (4401).
 */
function connect(ws: WebSocket, room: Room, peer: Peer, sessionAlive: SessionCheck, registry: BoardRegistry, options: CollabOptions, logErrors: boolean): void {
  const conn = room.join(ws, peer);
  let alive = true;
  ws.on('pong', () => (alive = true));
  const ping = setInterval(() => {
    if (!alive) return ws.terminate();
    alive = false;
    ws.ping();
    void sessionAlive().then((ok) => {
      if (!ok && ws.readyState === ws.OPEN) ws.close(CLOSE.sessionEnded, 'session_ended');
    });
  }, options.pingIntervalMs);
  ws.on('message', (data: Buffer, isBinary: boolean) => {
    if (!isBinary) return room.receive(conn, new Uint8Array()); // text frames are not the protocol: close
    room.receive(conn, new Uint8Array(data.buffer, data.byteOffset, data.byteLength));
  });
  ws.on('error', (err) => {
    if (logErrors) console.warn(`collab: board ${room.boardId}: socket error: ${err.message}`);
  });
  ws.on('close', () => {
    clearInterval(ping);
    room.leave(ws);
    registry.unloadIfIdle(room);
  });
}

/** Finishes the upgrade into `room`; the registry claim is released once the socket is in (or gone). */
function accept(wss: WebSocketServer, req: IncomingMessage, socket: Duplex, head: Buffer, join: (ws: WebSocket) => void, release: () => void): void {
  let released = false;
  const releaseOnce = () => {
    if (released) return;
    released = true;
    release();
  };
  // ws gives up silently on a socket that went away meanwhile: release the claim then too
  socket.once('close', releaseOnce);
  try {
    wss.handleUpgrade(req, socket, head, (ws) => {
      join(ws);
      releaseOnce();
    });
  } finally {
    if (socket.destroyed) releaseOnce();
  }
}

/** Membership changes reach open sockets at once: removed members are closed, roles follow. */
function applyMembership(registry: BoardRegistry, { boardId, userId, role }: { boardId: number; userId: number; role: BoardRole | null }): void {
  const room = registry.rooms.get(boardId);
  if (!room) return;
  for (const conn of room.conns.values()) {
    if (conn.peer.userId !== userId) continue;
    if (role === null) conn.ws.close(CLOSE.removed, 'removed from the board');
    // A viewer made editor reconnects (the client does so by itself) so that the full sync runs again:
    // edits of theirs the server ignored so far would otherwise leave later ones without their base.
    else if (conn.peer.role === 'viewer' && role !== 'viewer') conn.ws.close(CLOSE.roleChanged, 'role changed');
    else {
      conn.peer.role = role;
      room.presence.audienceChanged();
    }
  }
}

/** Sessions ended (sign-out, password reset): their sockets close at once, on every board. */
function endSessions(registry: BoardRegistry, { userId, sessionIds }: { userId: number; sessionIds?: string[] }): void {
  for (const room of registry.rooms.values()) {
    for (const conn of room.conns.values()) {
      if (conn.peer.userId !== userId) continue;
      if (sessionIds && !(conn.peer.sessionId && sessionIds.includes(conn.peer.sessionId))) continue;
      conn.ws.close(CLOSE.sessionEnded, 'session_ended');
    }
  }
}

/**
 * Serves the y-websocket protocol at `/collab/<boardId>` on `server`'s upgrade event, with the rooms
 * of `ctx.boardRegistry`. A connection is authenticated from the session cookie before any document
 * byte is sent; viewers are read-only on the server; membership changes close or downgrade sockets.
 */
export function attachBoardSockets(server: Server, ctx: SocketContext): SocketsHandle {
  const registry = ctx.boardRegistry;
  const options = registry.options;
  const wss = new WebSocketServer({ noServer: true, maxPayload: options.maxMessageBytes });

  const onUpgrade = (req: IncomingMessage, socket: Duplex, head: Buffer): void => {
    const boardId = boardIdOfPath(req.url);
    if (boardId === null) {
      if ((req.url ?? '').startsWith('/collab')) refuse(socket, 404, 'Not Found');
      return; // other upgrade paths (e.g. a dev server) are not ours
    }
    if (registry.isClosing) return refuse(socket, 500, 'Server Closing');
    authorizeUpgrade(ctx, req, boardId)
      .then(async ({ peer, sessionAlive }) => {
        const room = await registry.claim(boardId);
        accept(wss, req, socket, head, (ws) => connect(ws, room, peer, sessionAlive, registry, options, ctx.config.logErrors), () => registry.release(room));
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
  const onMembership = (change: { boardId: number; userId: number; role: BoardRole | null }) => applyMembership(registry, change);
  const onDeleted = ({ boardId }: { boardId: number }) => registry.discardBoard(boardId);
  const onSessionsEnded = (ended: { userId: number; sessionIds?: string[] }) => endSessions(registry, ended);
  const onLinkRevoked = (revoked: { boardId: number; linkId: number }) => closeLinkGuests(registry, revoked);

  server.on('upgrade', onUpgrade);
  ctx.events.on('membership-changed', onMembership);
  ctx.events.on('board-deleted', onDeleted);
  ctx.events.on('sessions-ended', onSessionsEnded);
  ctx.events.on('share-link-revoked', onLinkRevoked);

  let closed: Promise<void> | undefined;
  const close = () =>
    (closed ??= (async () => {
      server.off('upgrade', onUpgrade);
      ctx.events.off('membership-changed', onMembership);
      ctx.events.off('board-deleted', onDeleted);
      ctx.events.off('sessions-ended', onSessionsEnded);
      ctx.events.off('share-link-revoked', onLinkRevoked);
      await registry.close();
      for (const ws of wss.clients) ws.terminate();
      await new Promise<void>((resolve) => wss.close(() => resolve()));
    })());
  ctx.onClose.push(close);
  return { close };
}
