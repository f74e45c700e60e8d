import type { ApiBoard, BoardRole } from '../../shared/api/types';
import type { FamilyId } from '../../shared/board/schema';
import type { CreateBoardBody, UpdateBoardBody } from '../../shared/api/schemas';
import type { Db } from '../db/knex';
import { nowIso } from '../db/knex';
import * as boardsDb from '../db/boards';
import { notFound } from '../http/errors';
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
  /** Renames or changes the family (the caller checked editor+). */
  update(boardId: number, userId: number, body: UpdateBoardBody): Promise<ApiBoard>;
  /** Deletes the board (the caller checked owner) and tells listeners. */
  remove(boardId: number): Promise<void>;
  /** Marks the board as changed now (for features that edit its content). */
  touch(boardId: number): Promise<void>;
}

export function createBoardsService(db: Db, events: AppEvents): BoardsService {
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
      await boardsDb.updateBoard(db, boardId, { ...body, now: nowIso() });
      const board = await get(boardId, userId);
      events.emit('board-updated', { boardId, title: board.title, family: board.family });
      return board;
    },
    async remove(boardId) {
      await boardsDb.deleteBoard(db, boardId);
      events.emit('board-deleted', { boardId });
    },
    async touch(boardId) {
      await boardsDb.touchBoard(db, boardId, nowIso());
    },
  };
}
