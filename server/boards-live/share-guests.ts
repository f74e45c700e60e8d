import type { BoardRegistry } from './registry';
import { CLOSE } from './types';

/** Sockets open through share link `linkId` on the board right now (the class page's audience count). */
export function linkAudience(registry: Pick<BoardRegistry, 'rooms'>, boardId: number, linkId: number): number {
  const room = registry.rooms.get(boardId);
  if (!room) return 0;
  let n = 0;
  for (const conn of room.conns.values()) if (conn.peer.linkId === linkId) n++;
  return n;
}

/** A share link was revoked: every socket that came through it closes at once (4403, like a removed member). */
export function closeLinkGuests(registry: Pick<BoardRegistry, 'rooms'>, { boardId, linkId }: { boardId: number; linkId: number }): void {
  const room = registry.rooms.get(boardId);
  if (!room) return;
  for (const conn of [...room.conns.values()]) if (conn.peer.linkId === linkId) conn.ws.close(CLOSE.removed, 'share link revoked');
}
