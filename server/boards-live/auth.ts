import { ServerResponse, type IncomingMessage } from 'node:http';
import type { Request } from 'express';
import { CollabError, type SocketContext, type Peer } from './types';

const PATH_RE = /^\/collab\/([1-9][0-9]{0,15})\/?$/;

/** The board id of an upgrade URL, or null when the path is not ours. */
export function boardIdOfPath(url: string | undefined): number | null {
  const path = (url ?? '').split('?')[0];
  const m = PATH_RE.exec(path);
  return m ? Number(m[1]) : null;
}

/** Runs the app's session middleware on the upgrade request, exactly as for an HTTP request. */
function loadSession(ctx: SocketContext, req: IncomingMessage): Promise<void> {
  return new Promise((resolve, reject) => {
    const res = new ServerResponse(req);
    ctx.sessionMiddleware(req as Request, res as never, (err?: unknown) => (err ? reject(err) : resolve()));
  });
}

/**
 * A browser on another site cannot open a socket with our cookie: the Origin, when sent, must be this
 * host or the configured public URL. (Node clients send no Origin.)
 */
function originAllowed(ctx: SocketContext, req: IncomingMessage): boolean {
  const origin = req.headers.origin;
  if (!origin) return true;
  if (ctx.config.publicUrl && origin === ctx.config.publicUrl) return true;
  try {
    return new URL(origin).host === req.headers.host;
  } catch {
    return false;
  }
}

/**
 * Decides who may join the board's room: a signed-in member, with their role. Throws CollabError
 * `not_signed_in` (→ 401) or `forbidden` / `bad_origin` (→ 403).
 */
export async function authorizeUpgrade(ctx: SocketContext, req: IncomingMessage, boardId: number): Promise<Peer> {
  if (!originAllowed(ctx, req)) throw new CollabError('bad_origin', `origin ${req.headers.origin} is not allowed`);
  await loadSession(ctx, req);
  const userId = (req as Request).session?.userId;
  if (!userId) throw new CollabError('not_signed_in', 'sign in first');
  const role = await ctx.services.authz.roleOf(boardId, userId);
  if (!role) throw new CollabError('forbidden', `user ${userId} is not a member of board ${boardId}`);
  return { userId, role };
}
