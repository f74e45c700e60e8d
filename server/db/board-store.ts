import * as Y from 'yjs';
import type { BoardStore } from '../boards-live/store';
import { FamilySchema } from '../../shared/board';
import type { Db } from './knex';
import { nowIso } from './knex';
import {
  appendBoardUpdates, boardRowExists, countBoardUpdates, loadBoardUpdates, maxBoardUpdateSeq, replaceBoardUpdates,
} from './board-updates';

/**
 * The Knex board store (SQLite or PostgreSQL): the only code that touches `board_updates` and the only
 * writer of the `boards` row's title and family after the row is created. Seqs are given by the
 * database under the board's lock (board-updates.ts), so several servers may append to one board.
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
      await appendBoardUpdates(db, boardId, updates, updates[updates.length - 1].createdAt);
    },
    lastSeq: (boardId) => maxBoardUpdateSeq(db, boardId),
    count: (boardId) => countBoardUpdates(db, boardId),
    compact: (boardId, uptoSeq, state) => replaceBoardUpdates(db, boardId, uptoSeq, (rows) => mergeState(state, rows), nowIso()),
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

/**
 * The compacted row: `state` with the rows it replaces applied, re-encoded from a Y.Doc (which drops
 * garbage-collected content, unlike Y.mergeUpdates). Applying an update twice changes nothing in Yjs.
 */
function mergeState(state: Uint8Array, rows: Uint8Array[]): Uint8Array {
  const doc = new Y.Doc();
  try {
    doc.transact(() => {
      Y.applyUpdate(doc, state);
      for (const r of rows) Y.applyUpdate(doc, r);
    });
    return Y.encodeStateAsUpdate(doc);
  } finally {
    doc.destroy();
  }
}
