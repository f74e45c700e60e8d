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

/** A guest's socket lives as long as its link (revoked or expired: closed at the next check). */
function linkCheck(ctx: SocketContext, linkId: number): SessionCheck {
  return async () => {
    try {
      return (await ctx.shareLinks!.live(linkId)) !== null;
    } catch {
      return true; // a store error is not proof that the link ended
    }
  };
}

/**
 * A guest's way in: `?share=<token>` of the upgrade URL, or the guest session a share link's join
 * page gave (CONTRACTS §4). Either must name this board's live link; the role is always viewer.
 */
async function guestPeer(ctx: SocketContext, r: Request, boardId: number): Promise<{ peer: Peer; sessionAlive: SessionCheck } | null> {
  if (!ctx.shareLinks) return null;
  const token = new URL(r.url ?? '', 'http://upgrade.invalid').searchParams.get('share');
  const guest = r.session?.guest;
  const link = token ? await ctx.shareLinks.resolve(token) : guest?.boardId === boardId ? await ctx.shareLinks.live(guest.linkId) : null;
  if (!link || link.boardId !== boardId) return null;
  const peer: Peer = { userId: r.session?.userId ?? null, role: 'viewer', linkId: link.linkId, sessionId: r.sessionID };
  return { peer, sessionAlive: linkCheck(ctx, link.linkId) };
}

/**
 * Decides who may join the board's room: a signed-in member, with their role and session (whose
 * end closes the socket) — a member who also brings a share link keeps their own role — or a guest
 * of a share link, as viewer, for as long as the link lives. Throws CollabError `not_signed_in`
 * (→ 401) or `forbidden` / `bad_origin` (→ 403).
 */
export async function authorizeUpgrade(ctx: SocketContext, req: IncomingMessage, boardId: number): Promise<{ peer: Peer; sessionAlive: SessionCheck }> {
  if (!originAllowed(ctx, req)) throw new CollabError('bad_origin', `origin ${req.headers.origin} is not allowed`);
  await loadSession(ctx, req);
  const r = req as Request;
  const userId = r.session?.userId;
  const role = userId ? await ctx.services.authz.roleOf(boardId, userId) : null;
  if (userId && role) return { peer: { userId, role, sessionId: r.sessionID }, sessionAlive: sessionCheck(r.sessionStore, r.sessionID, userId) };
  const guest = await guestPeer(ctx, r, boardId);
  if (guest) return guest;
  if (!userId) throw new CollabError('not_signed_in', 'sign in first');
  throw new CollabError('forbidden', `user ${userId} is not a member of board ${boardId}`);
}
