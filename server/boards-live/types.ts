import type { RequestHandler } from 'express';
import type { BoardRole } from '../../shared/api';
import type { AuthzService } from '../services/authz';
import type { ShareLinksService } from '../services/share-links';
import type { AppEvents } from '../services/events';
import type { BoardRegistry } from './registry';

/** Tunable limits of the collaboration server. */
export interface CollabOptions {
  /** A socket sending a larger message is closed with 1009 (message too big). */
  maxMessageBytes: number;
  /** Stored rows of one board past which they are compacted into one. */
  compactThreshold: number;
  /** Ping interval for dropping dead sockets; each socket's session is re-checked on the same tick. */
  pingIntervalMs: number;
  /** An update that would leave more parts on the board is refused: close 4413 board_too_large. */
  maxParts: number;
  /** An update that would leave more wires on the board is refused: close 4413 board_too_large. */
  maxWires: number;
  /**
   * Bytes of updates waiting for missing dependencies (Yjs pending structs and deletes) a room keeps;
   * an update that would hold more is refused and its pending content dropped: close 4414 pending_too_large.
   */
  maxPendingBytes: number;
  /** One awareness message (a socket's presence state) larger than this: close 4415 awareness_too_large. */
  maxAwarenessBytes: number;
  /** Awareness client ids one socket may speak for (a y-websocket client uses one): close 4415. */
  maxAwarenessClients: number;
  /** Awareness messages per second per socket, on average (bursts of twice this pass): close 4429 awareness_rate. */
  awarenessPerSecond: number;
  /** Editors' presence changes are coalesced and sent to everyone at most once per this many ms. */
  awarenessFrameMs: number;
  /** Renewals (same state, newer clock) of editors' presence are gathered and sent at most once per this many ms. */
  awarenessRenewalMs: number;
}

export const DEFAULT_COLLAB_OPTIONS: CollabOptions = {
  maxMessageBytes: 2 * 1024 * 1024,
  compactThreshold: 500,
  pingIntervalMs: 30_000,
  maxParts: 5_000,
  maxWires: 20_000,
  maxPendingBytes: 1024 * 1024,
  maxAwarenessBytes: 256 * 1024,
  maxAwarenessClients: 4,
  awarenessPerSecond: 100,
  awarenessFrameMs: 50,
  awarenessRenewalMs: 5_000,
};

/** What the socket side needs of the app context (the real AppContext has all of it). */
export interface SocketContext {
  config: { publicUrl?: string; logErrors: boolean };
  sessionMiddleware: RequestHandler;
  events: AppEvents;
  onClose: (() => Promise<void>)[];
  services: { authz: Pick<AuthzService, 'roleOf'> };
  boardRegistry: BoardRegistry;
  /** share links: guests join with `?share=<token>` or their guest session (absent: members only) */
  shareLinks?: Pick<ShareLinksService, 'resolve' | 'live'>;
}

/** Who is on the other end of a socket. */
export interface Peer {
  /** null for a guest without an account */
  userId: number | null;
  role: BoardRole;
  /** the share link a guest came through (its revocation closes the socket) */
  linkId?: number;
  /** the session the socket was opened with (its sockets close when it ends) */
  sessionId?: string;
}

/** Why a message or a connection was refused; `code` is stable for logs and tests. */
export class CollabError extends Error {
  constructor(
    readonly code: 'bad_path' | 'not_signed_in' | 'forbidden' | 'bad_origin' | 'malformed_message' | 'unknown_message',
    message: string,
  ) {
    super(message);
    this.name = 'CollabError';
  }
}

/** Close codes we send (1000–1015 are the WebSocket standard's, 4000+ are application codes). */
export const CLOSE = {
  goingAway: 1001,
  invalidData: 1007,
  tooBig: 1009,
  roleChanged: 4001,
  /** the update would make the board invalid (reason names the problem); it was not applied or stored */
  invalidBoard: 4400,
  /** the socket's session ended (sign-out, password reset, expiry) */
  sessionEnded: 4401,
  removed: 4403,
  boardDeleted: 4404,
  /** more parts or wires than `maxParts` / `maxWires` */
  boardTooLarge: 4413,
  /** more bytes waiting for missing dependencies than `maxPendingBytes` */
  pendingTooLarge: 4414,
  /** an awareness message over `maxAwarenessBytes`, or more than `maxAwarenessClients` ids */
  awarenessTooLarge: 4415,
  /** more awareness messages than `awarenessPerSecond` allows */
  awarenessRate: 4429,
} as const;

/** A socket refused for a reason with its own close code (see CLOSE). */
export class SocketRefusal extends Error {
  constructor(readonly closeCode: number, readonly code: string, message: string) {
    super(message);
    this.name = 'SocketRefusal';
  }
}

/** A close reason: at most 123 bytes of UTF-8 (the WebSocket limit), cut on a character boundary. */
export function closeReason(text: string): string {
  if (Buffer.byteLength(text) <= 123) return text;
  let out = text.slice(0, 122);
  while (Buffer.byteLength(out + '…') > 123) out = out.slice(0, -1);
  return out + '…';
}
