import { Router, type Request, type RequestHandler } from 'express';
import { z } from 'zod';
import { CreateShareLinkSchema, IdParamSchema, JoinShareSchema, type ApiShareInfo } from '../../../shared/api';
import type { AppConfig } from '../../config';
import type { Services } from '../../services';
import type { LiveShareLink, ShareLinksService } from '../../services/share-links';
import type { BoardRegistry } from '../../boards-live';
import { boardRoleGuard } from '../middleware/board-role';
import { requireLinkOrigin } from '../middleware/origin';
import { notFound, parseInput } from '../errors';
import { slugify } from './board-file';

declare module 'express-session' {
  interface SessionData {
    /** A guest who came through a share link: that one board, read-only, nothing else. */
    guest?: { boardId: number; linkId: number; name: string };
  }
}

const LinkParams = z.object({ linkId: IdParamSchema });
const TokenParams = z.object({ token: z.string().max(200) });

function regenerate(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
}

/**
 * Share links (CONTRACTS §3) and what a guest may do with one. Owners create, list and revoke links;
 * anyone with a live token may read what it opens and join as a guest (a session scoped to that board,
 * read-only). A guest's session opens exactly two routes beyond these: `GET /api/boards/:id` and
 * `GET /api/boards/:id/export` of that board — what the board page reads. Everything else stays 401.
 * Mounted before the boards routes so that the guest's two reads are answered here; anyone else goes on.
 */
export function shareLinksRouter(services: Services, shareLinks: ShareLinksService, config: AppConfig, boards: Pick<BoardRegistry, 'readBoardFile'>): Router {
  const r = Router();
  const requireBoardRole = boardRoleGuard(services.authz);

  r.get('/boards/:id/share-links', requireBoardRole('owner'), async (_req, res) => {
    res.json({ links: await shareLinks.list(res.locals.boardId) });
  });

  r.post('/boards/:id/share-links', requireBoardRole('owner'), requireLinkOrigin(config), async (req, res) => {
    const body = parseInput(CreateShareLinkSchema, req.body);
    res.status(201).json({ link: await shareLinks.create(res.locals.boardId, res.locals.userId, body, res.locals.linkOrigin as string) });
  });

  r.delete('/boards/:id/share-links/:linkId', requireBoardRole('owner'), async (req, res) => {
    const { linkId } = parseInput(LinkParams, req.params);
    await shareLinks.revoke(res.locals.boardId, linkId);
    res.status(204).end();
  });

  const openLink = async (req: Request): Promise<LiveShareLink> => {
    const { token } = parseInput(TokenParams, req.params);
    const link = await shareLinks.resolve(token);
    if (!link) throw notFound('link_not_found', 'This share link does not work: it was revoked, it expired, or it was copied wrong');
    return link;
  };
  const memberRole = async (req: Request, boardId: number) => (req.session.userId ? services.authz.roleOf(boardId, req.session.userId) : null);

  r.get('/share/:token', async (req, res) => {
    const link = await openLink(req);
    const guest = req.session.guest;
    const info: ApiShareInfo = {
      boardId: link.boardId,
      title: await shareLinks.boardTitle(link.boardId),
      expiresAt: link.expiresAt,
      guest: guest && guest.linkId === link.linkId ? { name: guest.name } : null,
      memberRole: await memberRole(req, link.boardId),
    };
    res.json({ share: info });
  });

  // Members who use a link keep their own role: nothing changes for them. Everyone else becomes a
  // guest of this board alone (a fresh session for the anonymous, so no id chosen beforehand is kept).
  r.post('/share/:token/join', async (req, res) => {
    const link = await openLink(req);
    const { name } = parseInput(JoinShareSchema, req.body);
    const role = await memberRole(req, link.boardId);
    if (role) return res.json({ join: { boardId: link.boardId, role, guest: null } });
    if (!req.session.userId) await regenerate(req);
    req.session.guest = { boardId: link.boardId, linkId: link.linkId, name };
    res.json({ join: { boardId: link.boardId, role: 'viewer', guest: { name } } });
  });

  /** Answers only a guest of this board whose link still works and who is not a member; anyone else goes on. */
  const asGuest: RequestHandler = async (req, res, next) => {
    const guest = req.session?.guest;
    const boardId = IdParamSchema.safeParse(req.params.id);
    if (!guest || !boardId.success || guest.boardId !== boardId.data) return next('route');
    if (req.session.userId && (await services.authz.roleOf(boardId.data, req.session.userId))) return next('route');
    const link = await shareLinks.live(guest.linkId);
    if (!link || link.boardId !== boardId.data) return next('route');
    res.locals.boardId = boardId.data;
    next();
  };

  r.get('/boards/:id', asGuest, async (_req, res) => {
    res.json({ board: await shareLinks.guestBoard(res.locals.boardId) });
  });

  r.get('/boards/:id/export', asGuest, async (_req, res) => {
    const board = await shareLinks.guestBoard(res.locals.boardId);
    const file = await boards.readBoardFile(res.locals.boardId);
    res.setHeader('Content-Disposition', `attachment; filename="${slugify(board.title)}.gatefold.json"`);
    res.type('application/json').send(JSON.stringify(file, null, 2) + '\n');
  });

  return r;
}
