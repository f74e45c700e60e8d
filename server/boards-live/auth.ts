import { ServerResponse, type IncomingMessage } from 'node:http';
import type { Request } from 'express';
import type { Store } from 'express-session';
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

/** Asks the session store whether a socket's session still exists and still belongs to its user. */
export type SessionCheck = () => Promise<boolean>;

function sessionCheck(store: Store | undefined, sessionId: string, userId: number): SessionCheck {
  return () =>
    new Promise((resolve) => {
      if (!store) return resolve(true);
      // A store error is not proof that the session ended: the socket stays until the next check.
      store.get(sessionId, (err, sess) => resolve(Boolean(err) || (sess as { userId?: number } | null | undefined)?.userId === userId));
    });
}

/**
 * Decides who may join the board's room: a signed-in member, with their role and session (whose
 * end closes the socket). Throws CollabError `not_signed_in` (→ 401) or `forbidden` / `bad_origin` (→ 403).
 */
export async function authorizeUpgrade(ctx: SocketContext, req: IncomingMessage, boardId: number): Promise<{ peer: Peer; sessionAlive: SessionCheck }> {
  if (!originAllowed(ctx, req)) throw new CollabError('bad_origin', `origin ${req.headers.origin} is not allowed`);
  await loadSession(ctx, req);
  const r = req as Request;
  const userId = r.session?.userId;
  if (!userId) throw new CollabError('not_signed_in', 'sign in first');
  const role = await ctx.services.authz.roleOf(boardId, userId);
  if (!role) throw new CollabError('forbidden', `user ${userId} is not a member of board ${boardId}`);
  return { peer: { userId, role, sessionId: r.sessionID }, sessionAlive: sessionCheck(r.sessionStore, r.sessionID, userId) };
}
