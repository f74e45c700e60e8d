import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseBoardFile, type BoardFile, type Module } from '../../shared/board';
import type { ApiLibraryContent, ApiLibraryModule } from '../../shared/api';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { api, connectClient, createBoard, exportText, signUp, type User } from '../collab/helpers';
import { HALF_ADDER_MODULE } from '../modules/boards';
import { openDb, isUniqueViolation } from '../../server/db/knex';
import { migrateLatest } from '../../server/db/migrate';
import { down as dropSourceIndex, up as addSourceIndex } from '../../migrations/20261221000100_library_source_unique';

// Publishes that arrive at the same instant, on the server's real database (a SQLite file; PostgreSQL
// when GATEFOLD_TEST_PG names a server, as the API suite's second run does).
let server: TestServer;
let owner: User;

beforeAll(async () => {
  server = await startTestServer({ logErrors: false });
  owner = await signUp(server, 'Owner');
});
afterAll(async () => {
  await server.close();
});

function halfAdderBoard(origin?: { library: string; version: number }): BoardFile {
  const parsed = parseBoardFile({
    format: 'gatefold-board', version: 1, title: 'Larkspur adder', family: 'ideal',
    parts: [{ id: 'u1', kind: 'module', module: 'half', x: 100, y: 100 }], wires: [],
    modules: [{ ...HALF_ADDER_MODULE, ...(origin ? { origin } : {}) } as Module],
  });
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
  return parsed.board;
}

async function boardWith(file: BoardFile): Promise<number> {
  const boardId = await createBoard(server, owner, file.title);
  await server.ctx.boardRegistry.writeBoardFile(boardId, file, owner.id);
  return boardId;
}

/**
 * Publishes of the board's module `half`, all started in the same tick through the service (so they interleave
 * at every database call, as requests on a busy server do): whether each made a new entry, and the entry.
 */
async function publishAtOnce(boardIds: number[]): Promise<Array<{ created: boolean; module: ApiLibraryContent }>> {
  const library = server.ctx.services.library;
  const answers = await Promise.all(boardIds.map((boardId) => library.publish(owner.id, { boardId, moduleId: 'half' })));
  return answers.map((a) => ({ created: a.created, module: a.entry }));
}

const entries = async () => ((await (await api(server, 'GET', '/api/library', owner.cookie)).json()) as { modules: ApiLibraryModule[] }).modules;
const originOf = async (boardId: number) => (JSON.parse(await exportText(server, owner, boardId)) as BoardFile).modules![0].origin;

describe('team library: publishes at the same instant', () => {
  it('eight first publishes of one module make one entry and eight distinct versions, 1 to 8', async () => {
    const boardId = await boardWith(halfAdderBoard());
    // with the board open on a screen every publish reads it at once from the live room (no per-board load queue)
    const client = connectClient(server, boardId, owner.cookie);
    await client.synced;
    const answers = await publishAtOnce(Array(8).fill(boardId)).finally(() => client.destroy());
    expect(answers.filter((a) => a.created)).toHaveLength(1);
    expect(new Set(answers.map((a) => a.module.id)).size).toBe(1);
    expect(answers.map((a) => a.module.version).sort((a, b) => a - b)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    const mine = (await entries()).filter((e) => e.sourceBoardId === boardId);
    expect(mine.map((e) => [e.id, e.version])).toEqual([[answers[0].module.id, 8]]);
    // the board's module records the last version (recording never lowers it)
    expect(await originOf(boardId)).toEqual({ library: String(answers[0].module.id), version: 8 });
  });

  it('republishes from the source board and from copies on other boards at once raise the one entry without repeats', async () => {
    const source = await boardWith(halfAdderBoard());
    const [first] = await publishAtOnce([source]);
    const copies = await Promise.all([1, 2, 3].map(() => boardWith(halfAdderBoard({ library: String(first.module.id), version: 1 }))));
    const answers = await publishAtOnce([source, ...copies, source, ...copies]);
    expect(answers.every((a) => !a.created && a.module.id === first.module.id)).toBe(true);
    expect(answers.map((a) => a.module.version).sort((a, b) => a - b)).toEqual([2, 3, 4, 5, 6, 7, 8, 9]);
    const entry = (await entries()).find((e) => e.id === first.module.id)!;
    expect(entry.version).toBe(9);
    // each source board module names at most one entry: the one it was last published into
    const bySource = new Map<string, number>();
    for (const e of await entries()) {
      if (e.sourceBoardId === null) continue;
      const key = `${e.sourceBoardId}/${e.sourceModuleId}`;
      expect(bySource.has(key), key).toBe(false);
      bySource.set(key, e.id);
    }
  });
});

describe('migration 20261221000100: one entry per source module', () => {
  it('keeps the source on the entry published last, clears it on the older ones, then refuses a second entry from the same module', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'gatefold-library-'));
    const db = openDb(join(dir, 'gf.sqlite'));
    try {
      await migrateLatest(db);
      await dropSourceIndex(db);
      const [user] = await db('users').insert({ email: 'mara@larkspur.example', name: 'Mara Quinn', password_hash: 'x', created_at: '2026-12-01T00:00:00.000Z' }).returning('id');
      const [board] = await db('boards').insert({ title: 'Adder', owner_id: user.id, created_at: '2026-12-01T00:00:00.000Z', updated_at: '2026-12-01T00:00:00.000Z' }).returning('id');
      const row = (at: string, moduleId = 'half') => ({ owner_id: user.id, title: 'Half adder', version: 1, content: '[]', source_board_id: board.id, source_module_id: moduleId, created_at: at, updated_at: at });
      // what the race left behind: two entries from one module, and an older one from another board module
      await db('library_modules').insert([row('2026-12-02T10:00:00.000Z'), row('2026-12-02T10:00:05.000Z'), row('2026-12-02T09:00:00.000Z', 'full')]);
      await addSourceIndex(db);
      const rows = await db('library_modules').orderBy('id').select('source_module_id');
      expect(rows.map((r) => r.source_module_id)).toEqual([null, 'half', 'full']);
      const again = await db('library_modules').insert(row('2026-12-02T11:00:00.000Z')).then(() => undefined, (err: unknown) => err);
      expect(isUniqueViolation(again)).toBe(true);
      // entries whose board is gone have no source and never collide
      await db('library_modules').insert([{ ...row('2026-12-02T12:00:00.000Z'), source_board_id: null }, { ...row('2026-12-02T12:00:00.000Z'), source_board_id: null }]);
    } finally {
      await db.destroy();
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
