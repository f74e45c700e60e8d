import type { BoardStore } from '../boards-live/store';
import { FamilySchema } from '../../shared/board';
import type { Db } from './knex';
import { nowIso } from './knex';
import {
  appendBoardUpdates, boardRowExists, countBoardUpdates, loadBoardUpdates, maxBoardUpdateSeq, replaceBoardUpdates,
} from './board-updates';

/**
 * The SQLite (Knex) board store: the only code that touches `board_updates` and the only writer of
 * the `boards` row's title and family after the row is created. Nothing in it is SQLite-only, so a
 * PostgreSQL database through the same Knex uses it as it is.
 */
export function createKnexBoardStore(db: Db): BoardStore {
  return {
    exists: (boardId) => boardRowExists(db, boardId),
    async load(boardId) {
      const rows = await loadBoardUpdates(db, boardId);
      return { updates: rows.map((r) => r.data), seq: rows.length ? rows[rows.length - 1].seq : 0 };
    },
    async append(boardId, updates) {
      if (!updates.length) return;
      await appendBoardUpdates(db, boardId, updates);
      await db('boards').where({ id: boardId }).update({ updated_at: updates[updates.length - 1].createdAt });
    },
    lastSeq: (boardId) => maxBoardUpdateSeq(db, boardId),
    count: (boardId) => countBoardUpdates(db, boardId),
    compact: (boardId, uptoSeq, state) => replaceBoardUpdates(db, boardId, uptoSeq, state, nowIso()),
    async readMeta(boardId) {
      const row = (await db('boards').where({ id: boardId }).first('title', 'family')) as { title: string; family: string } | undefined;
      const family = FamilySchema.safeParse(row?.family);
      return row && family.success ? { title: row.title, family: family.data } : undefined;
    },
    async writeMeta(boardId, meta) {
      const changes: Record<string, string> = {};
      if (typeof meta.title === 'string' && meta.title.trim() && meta.title.length <= 200) changes.title = meta.title.trim();
      const family = FamilySchema.safeParse(meta.family);
      if (family.success) changes.family = family.data;
      if (Object.keys(changes).length) await db('boards').where({ id: boardId }).update(changes);
    },
  };
}
