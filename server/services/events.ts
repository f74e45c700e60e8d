import { EventEmitter } from 'node:events';
import type { BoardRole } from '../../shared/api';

/** Events other features listen to (e.g. websocket rooms close or downgrade sockets). */
export interface AppEventMap {
  /** A user's role on a board changed; `role` null = no longer a member. */
  'membership-changed': [{ boardId: number; userId: number; role: BoardRole | null }];
  /** A board was deleted (its rows are gone). */
  'board-deleted': [{ boardId: number }];
  /** Sessions of a user ended (sign-out: that session; password reset: every session, no `sessionIds`). */
  'sessions-ended': [{ userId: number; sessionIds?: string[] }];
  /** A share link was revoked: the guests who came through it leave at once. */
  'share-link-revoked': [{ boardId: number; linkId: number }];
}

export type AppEvents = EventEmitter<AppEventMap>;

export function createEvents(): AppEvents {
  const events = new EventEmitter<AppEventMap>();
  // Every open board room may listen; do not warn at the default of 10.
  events.setMaxListeners(0);
  return events;
}
