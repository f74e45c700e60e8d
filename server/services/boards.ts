import type { ApiBoard, BoardRole } from '../../shared/api';
import type { FamilyId } from '../../shared/board';
import type { CreateBoardBody, UpdateBoardBody } from '../../shared/api';
import type { Db } from '../db/knex';
import { nowIso } from '../db/knex';
import * as boardsDb from '../db/boards';
import { notFound } from '../lib/errors';
import type { AppEvents } from './events';

export function toApiBoard(row: boardsDb.BoardViewRow): ApiBoard {
  return {
    id: row.id,
    title: row.title,
    family: row.family as FamilyId,
    ownerId: row.owner_id,
    role: row.role as BoardRole,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
    memberCount: Number(row.member_count),
  };
}

export interface BoardsService {
  list(userId: number): Promise<ApiBoard[]>;
  /** The board as `userId` sees it; 404 when that user is not a member. */
  get(boardId: number, userId: number): Promise<ApiBoard>;
  /** Creates a board owned by `ownerId`. */
  create(ownerId: number, body: CreateBoardBody): Promise<ApiBoard>;
  /**
   * Renames or changes the family (the caller checked editor+): written into the board's document
   * (every open screen shows it at once); the row, their projection, follows before this resolves.
   */
  update(boardId: number, userId: number, body: UpdateBoardBody): Promise<ApiBoard>;
  /** Deletes the board (the caller checked owner) and tells listeners. */
  remove(boardId: number): Promise<void>;
}

/** Where a board's title and family are written: its document (server/boards-live's registry). */
export interface BoardMetaWriter {
  writeMeta(boardId: number, meta: { title?: string; family?: FamilyId }, userId: number | null): Promise<void>;
}

export function createBoardsService(db: Db, events: AppEvents, meta: BoardMetaWriter): BoardsService {
  const get = async (boardId: number, userId: number) => {
    const row = await boardsDb.getBoardForUser(db, boardId, userId);
    if (!row) throw notFound('board_not_found', 'No such board');
    return toApiBoard(row);
  };
  return {
    async list(userId) {
      return (await boardsDb.listBoardsForUser(db, userId)).map(toApiBoard);
    },
    get,
    async create(ownerId, body) {
      const id = await boardsDb.insertBoard(db, { title: body.title, family: body.family ?? 'ideal', ownerId, now: nowIso() });
      return get(id, ownerId);
    },
    async update(boardId, userId, body) {
      await meta.writeMeta(boardId, body, userId);
      return get(boardId, userId);
    },
    async remove(boardId) {
      await boardsDb.deleteBoard(db, boardId);
      events.emit('board-deleted', { boardId });
    },
  };
}
