import { randomBytes } from 'node:crypto';
import type { ApiBoard, ApiNewShareLink, ApiShareLink } from '../../shared/api';
import type { FamilyId } from '../../shared/board';
import type { Db } from '../db/knex';
import { nowIso } from '../db/knex';
import * as linksDb from '../db/share-links';
import { getBoardTitle } from '../db/boards';
import { notFound } from '../lib/errors';
import type { AppEvents } from './events';
import { hashToken } from './tokens';

/** A share link that may be used now. */
export interface LiveShareLink {
  linkId: number;
  boardId: number;
  expiresAt: string | null;
}

export interface ShareLinksService {
  /** A new link to the board; its token is returned only here. */
  create(boardId: number, userId: number, opts: { expiresInMinutes?: number }, origin: string): Promise<ApiNewShareLink>;
  list(boardId: number): Promise<ApiShareLink[]>;
  /** Deletes the link (404 `link_not_found` if the board has no such link) and tells the sockets. */
  revoke(boardId: number, linkId: number): Promise<void>;
  /** The link a token opens, or null (unknown, revoked or expired). */
  resolve(token: string): Promise<LiveShareLink | null>;
  /** The link by id, or null once revoked or expired (checked on each guest request and socket tick). */
  live(linkId: number): Promise<LiveShareLink | null>;
  /** The board's title, for the join page. */
  boardTitle(boardId: number): Promise<string>;
  /** The board as a guest sees it: role viewer, no members. */
  guestBoard(boardId: number): Promise<ApiBoard>;
}

/** 192 random bits (above the 128 asked for), URL-safe: short enough for a QR code a class can scan. */
const TOKEN_BYTES = 24;
/** Tokens are base64url of TOKEN_BYTES; anything else is refused before hashing. */
const TOKEN_RE = /^[A-Za-z0-9_-]{16,128}$/;

function liveRow(row: linksDb.ShareLinkRow | undefined, now = Date.now()): LiveShareLink | null {
  if (!row) return null;
  if (row.expires_at && Date.parse(row.expires_at) <= now) return null;
  return { linkId: row.id, boardId: row.board_id, expiresAt: row.expires_at };
}

/**
 * Share links (class mode): guests open one board read-only with a link's token. `audienceOf` counts
 * the sockets open through a link right now (the live room knows).
 */
export function createShareLinksService(db: Db, events: AppEvents, audienceOf: (boardId: number, linkId: number) => number): ShareLinksService {
  return {
    async create(boardId, userId, { expiresInMinutes }, origin) {
      const token = randomBytes(TOKEN_BYTES).toString('base64url');
      const createdAt = nowIso();
      const expiresAt = expiresInMinutes ? new Date(Date.now() + expiresInMinutes * 60_000).toISOString() : null;
      const id = await linksDb.insertShareLink(db, { board_id: boardId, token_hash: hashToken(token), created_by: userId, created_at: createdAt, expires_at: expiresAt });
      return { id, token, url: `${origin}/s/${token}`, createdAt, expiresAt };
    },
    async list(boardId) {
      const rows = await linksDb.listShareLinks(db, boardId);
      return rows.map((r) => ({ id: r.id, createdAt: r.created_at, expiresAt: r.expires_at, audience: audienceOf(boardId, r.id) }));
    },
    async revoke(boardId, linkId) {
      if (!(await linksDb.deleteShareLink(db, boardId, linkId))) throw notFound('link_not_found', 'No such share link on this board');
      events.emit('share-link-revoked', { boardId, linkId });
    },
    async resolve(token) {
      if (!TOKEN_RE.test(token)) return null;
      return liveRow(await linksDb.findShareLinkByHash(db, hashToken(token)));
    },
    async live(linkId) {
      return liveRow(await linksDb.findShareLink(db, linkId));
    },
    async boardTitle(boardId) {
      return (await getBoardTitle(db, boardId))?.title ?? '';
    },
    async guestBoard(boardId) {
      const row = await linksDb.boardRowForGuest(db, boardId);
      if (!row) throw notFound('board_not_found', 'No such board');
      return { id: row.id, title: row.title, family: row.family as FamilyId, ownerId: row.owner_id, role: 'viewer', createdAt: row.created_at, updatedAt: row.updated_at, memberCount: 0 };
    },
  };
}
