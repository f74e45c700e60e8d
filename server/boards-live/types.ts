import type { RequestHandler } from 'express';
import type { BoardRole } from '../../shared/api';
import type { AuthzService } from '../services/authz';
import type { AppEvents } from '../services/events';
import type { BoardRegistry } from './registry';

/** Tunable limits of the collaboration server. */
export interface CollabOptions {
  /** A socket sending a larger message is closed with 1009 (message too big). */
  maxMessageBytes: number;
  /** Stored rows of one board past which they are compacted into one. */
  compactThreshold: number;
  /** Ping interval for dropping dead sockets. */
  pingIntervalMs: number;
}

export const DEFAULT_COLLAB_OPTIONS: CollabOptions = {
  maxMessageBytes: 2 * 1024 * 1024,
  compactThreshold: 500,
  pingIntervalMs: 30_000,
};

/** What the socket side needs of the app context (the real AppContext has all of it). */
export interface SocketContext {
  config: { publicUrl?: string; logErrors: boolean };
  sessionMiddleware: RequestHandler;
  events: AppEvents;
  onClose: (() => Promise<void>)[];
  services: { authz: Pick<AuthzService, 'roleOf'> };
  boardRegistry: BoardRegistry;
}

/** Who is on the other end of a socket. */
export interface Peer {
  userId: number;
  role: BoardRole;
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
  removed: 4403,
  boardDeleted: 4404,
} as const;
