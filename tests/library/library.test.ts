import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { moduleMaps, modulesMap, parseBoardFile, type BoardFile, type Module } from '../../shared/board';
import type { ApiLibraryContent, ApiLibraryModule } from '../../shared/api';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { addMember, api, connectClient, createBoard, exportText, signUp, waitFor, type User } from '../collab/helpers';
import { HALF_ADDER_MODULE } from '../modules/boards';
import { checkLibraryContent } from '../../server/services/library';
import { HttpError } from '../../server/lib/errors';
import { libraryStanding, standingText } from '../../src/features/library/library-status';

let server: TestServer;
let owner: User;
let editor: User;
let viewer: User;
let stranger: User;

beforeAll(async () => {
  server = await startTestServer({ logErrors: false });
  [owner, editor, viewer, stranger] = await Promise.all(['Owner', 'Editor', 'Viewer', 'Stranger'].map((n) => signUp(server, n)));
});
afterAll(async () => {
  await server.close();
});

/** A full adder module made of two half-adder instances and an OR: `full` nests `half`. */
const FULL_ADDER_MODULE: Module = {
  id: 'full', title: 'Full adder',
  parts: [
    { id: 'a', kind: 'port', dir: 'in', label: 'A', x: 0, y: 0 },
    { id: 'b', kind: 'port', dir: 'in', label: 'B', x: 0, y: 80 },
    { id: 'ci', kind: 'port', dir: 'in', label: 'CI', x: 0, y: 160 },
    { id: 'u1', kind: 'module', module: 'half', x: 160, y: 0 },
    { id: 'u2', kind: 'module', module: 'half', x: 360, y: 80 },
    { id: 'g1', kind: 'or', inputs: 2, x: 560, y: 120 },
    { id: 's', kind: 'port', dir: 'out', label: 'S', x: 720, y: 40 },
    { id: 'co', kind: 'port', dir: 'out', label: 'CO', x: 720, y: 120 },
  ],
  wires: [
    { id: 'w1', from: 'a.out', to: 'u1.A' }, { id: 'w2', from: 'b.out', to: 'u1.B' },
    { id: 'w3', from: 'u1.S', to: 'u2.A' }, { id: 'w4', from: 'ci.out', to: 'u2.B' },
    { id: 'w5', from: 'u2.S', to: 's.in' }, { id: 'w6', from: 'u1.C', to: 'g1.in0' },
    { id: 'w7', from: 'u2.C', to: 'g1.in1' }, { id: 'w8', from: 'g1.out', to: 'co.in' },
  ],
} as Module;

/** A Room 14 board holding the full adder module (and the half adder it uses), with one instance on top. */
function adderBoard(full: Module = FULL_ADDER_MODULE): BoardFile {
  const parsed = parseBoardFile({
    format: 'gatefold-board', version: 1, title: 'Room 14 adder', family: 'ideal',
    parts: [{ id: 'u1', kind: 'module', module: 'full', x: 100, y: 100 }],
    wires: [],
    modules: [full, HALF_ADDER_MODULE],
  });
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
  return parsed.board;
}

async function boardWith(file: BoardFile, by: User = owner): Promise<number> {
  const boardId = await createBoard(server, by, file.title);
  await server.ctx.boardRegistry.writeBoardFile(boardId, file, by.id);
  return boardId;
}

async function json<T>(res: Response, status: number): Promise<T> {
  const text = await res.text();
  expect(res.status, text).toBe(status);
  return (text ? JSON.parse(text) : {}) as T;
}

const publish = (user: User, body: unknown) => api(server, 'POST', '/api/library', user.cookie, body);
const list = async (user: User) => (await json<{ modules: ApiLibraryModule[] }>(await api(server, 'GET', '/api/library', user.cookie), 200)).modules;

describe('team library: publish, list, get', () => {
  it('publishes a module with the modules it nests, at version 1, into the board owner library; members read it, others get 404', async () => {
    const boardId = await boardWith(adderBoard());
    await addMember(server, owner, boardId, editor, 'editor');
    await addMember(server, owner, boardId, viewer, 'viewer');

    const { module: entry } = await json<{ module: ApiLibraryContent }>(await publish(editor, { boardId, moduleId: 'full' }), 201);
    expect(entry).toMatchObject({ ownerId: owner.id, title: 'Full adder', version: 1, sourceBoardId: boardId, sourceModuleId: 'full', moduleId: 'full', mine: false });
    expect(entry.origin).toEqual({ library: String(entry.id), version: 1 });
    // the module first, then the module it nests, exactly as on the board
    expect(entry.modules.map((m) => m.id)).toEqual(['full', 'half']);
    expect(entry.modules[0].parts).toEqual(FULL_ADDER_MODULE.parts);
    expect(entry.modules[1].wires).toEqual(HALF_ADDER_MODULE.wires);

    // the content is a valid set of modules in the board file's shape
    const asBoard = parseBoardFile({ format: 'gatefold-board', version: 1, parts: [], wires: [], modules: entry.modules });
    expect(asBoard.ok).toBe(true);

    for (const reader of [owner, editor, viewer]) {
      const listed = await list(reader);
      expect(listed.map((m) => m.id)).toContain(entry.id);
      const got = await json<{ module: ApiLibraryContent }>(await api(server, 'GET', `/api/library/${entry.id}`, reader.cookie), 200);
      expect(got.module.modules).toEqual(entry.modules);
      expect(got.module.mine).toBe(reader === owner);
    }
    expect((await list(stranger)).map((m) => m.id)).not.toContain(entry.id);
    const hidden = await json<{ error: { code: string } }>(await api(server, 'GET', `/api/library/${entry.id}`, stranger.cookie), 404);
    expect(hidden.error.code).toBe('library_module_not_found');
    expect((await api(server, 'DELETE', `/api/library/${entry.id}`, stranger.cookie)).status).toBe(404);
    expect((await api(server, 'GET', '/api/library')).status).toBe(401);
  });

  it('republishing the same module raises the version of the same entry, with the new content', async () => {
    const boardId = await boardWith(adderBoard());
    const first = (await json<{ module: ApiLibraryContent }>(await publish(owner, { boardId, moduleId: 'full' }), 201)).module;
    // the module is edited the way the canvas edits it: a change of the live document through the websocket
    const client = connectClient(server, boardId, owner.cookie);
    try {
      await client.synced;
      client.doc.transact(() => {
        modulesMap(client.doc).get('full')!.set('title', 'Full adder (NOR carry)');
        moduleMaps(client.doc, 'full')!.parts.get('g1')!.set('x', 600);
      });
      await waitFor(async () => (await server.ctx.boardRegistry.readBoardFile(boardId)).modules?.[0].title === 'Full adder (NOR carry)', 'the edit on the server');
    } finally {
      client.destroy();
    }
    const second = (await json<{ module: ApiLibraryContent }>(await publish(owner, { boardId, moduleId: 'full' }), 200)).module;
    expect(second.id).toBe(first.id);
    expect(second.version).toBe(2);
    expect(second.title).toBe('Full adder (NOR carry)');
    expect(second.modules[0].parts.find((p) => p.id === 'g1')?.x).toBe(600);
    const third = (await json<{ module: ApiLibraryContent }>(await publish(owner, { boardId, moduleId: 'full' }), 200)).module;
    expect(third.version).toBe(3);
    const listed = (await list(owner)).filter((m) => m.id === first.id);
    expect(listed).toHaveLength(1);
    expect(listed[0].version).toBe(3);

    // a copy on another board (its origin names the entry) publishes into the same entry too
    const copy = adderBoard({ ...FULL_ADDER_MODULE, origin: { library: String(first.id), version: 3 } } as Module);
    const otherBoard = await boardWith(copy);
    const fourth = (await json<{ module: ApiLibraryContent }>(await publish(owner, { boardId: otherBoard, moduleId: 'full' }), 200)).module;
    expect(fourth).toMatchObject({ id: first.id, version: 4, sourceBoardId: otherBoard });
    // the origin of the board's copy is not part of the entry's content
    expect(fourth.modules[0].origin).toBeUndefined();
  });
});

describe('team library: the published module records its origin', () => {
  const exported = async (boardId: number) => JSON.parse(await exportText(server, owner, boardId)) as BoardFile;
  const moduleOf = async (boardId: number, id: string) => (await exported(boardId)).modules!.find((m) => m.id === id)!;
  /** What the Library drawer says of the board's module, from the library list the client reads. */
  const standing = async (boardId: number, id: string) => libraryStanding(await list(owner), boardId, await moduleOf(boardId, id));

  it('publish records {library, version} on the board module (stored board, then live in an open room); publishing again raises both; the board is up to date', async () => {
    const boardId = await boardWith(adderBoard());
    // no room open: the origin is written into the stored board
    const first = (await json<{ module: ApiLibraryContent }>(await publish(owner, { boardId, moduleId: 'full' }), 201)).module;
    expect(server.ctx.boardRegistry.rooms.has(boardId)).toBe(false);
    expect((await moduleOf(boardId, 'full')).origin).toEqual({ library: String(first.id), version: 1 });
    // only the module that was published: the one it nests keeps none
    expect((await moduleOf(boardId, 'half')).origin).toBeUndefined();
    // the entry's own content carries no origin (a copy records where it came from)
    expect(first.modules[0].origin).toBeUndefined();
    let s = await standing(boardId, 'full');
    expect(s.stale).toBe(false);
    expect(standingText(s)).toBe('library v1');

    // an open screen gets the new origin as an edit when the module is published again
    const client = connectClient(server, boardId, owner.cookie);
    try {
      await client.synced;
      const second = (await json<{ module: ApiLibraryContent }>(await publish(owner, { boardId, moduleId: 'full' }), 200)).module;
      expect([second.id, second.version]).toEqual([first.id, 2]);
      expect((await moduleOf(boardId, 'full')).origin).toEqual({ library: String(first.id), version: 2 });
      await waitFor(() => (modulesMap(client.doc).get('full')?.get('origin') as { version?: number } | undefined)?.version === 2, 'the open screen to get origin v2');
      expect(parseBoardFile(await exported(boardId)).ok).toBe(true);
      s = await standing(boardId, 'full');
      expect(s).toMatchObject({ stale: false });
      expect(s.entry?.version).toBe(2);
      expect(standingText(s)).toBe('library v2');
    } finally {
      client.destroy();
    }
  });

  it('a copy published again records the new version; the board it was last published from now holds an older copy', async () => {
    const boardA = await boardWith(adderBoard());
    const v1 = (await json<{ module: ApiLibraryContent }>(await publish(owner, { boardId: boardA, moduleId: 'full' }), 201)).module;
    // board B holds a copy of v1 (as placing it from the library records it), edited and published again
    const boardB = await boardWith(adderBoard({ ...FULL_ADDER_MODULE, title: 'Full adder, Room 14 bench', origin: { library: String(v1.id), version: 1 } } as Module));
    expect(standingText(await standing(boardB, 'full'))).toBe('copy v1 · library v1');
    const v2 = (await json<{ module: ApiLibraryContent }>(await publish(owner, { boardId: boardB, moduleId: 'full' }), 200)).module;
    expect([v2.id, v2.version, v2.sourceBoardId]).toEqual([v1.id, 2, boardB]);
    // board B holds v2 itself: no "update from library" for it
    expect((await moduleOf(boardB, 'full')).origin).toEqual({ library: String(v1.id), version: 2 });
    const b = await standing(boardB, 'full');
    expect(b.stale).toBe(false);
    expect(standingText(b)).toBe('library v2');
    // board A's module is v1 of an entry that now holds board B's v2: an update applies there
    expect((await moduleOf(boardA, 'full')).origin).toEqual({ library: String(v1.id), version: 1 });
    const a = await standing(boardA, 'full');
    expect(a.stale).toBe(true);
    expect(standingText(a)).toBe('copy v1 · library v2');
  });
});

describe('team library: roles and bad input', () => {
  it('deletes by the library owner only', async () => {
    const boardId = await boardWith(adderBoard());
    await addMember(server, owner, boardId, editor, 'editor');
    const entry = (await json<{ module: ApiLibraryContent }>(await publish(editor, { boardId, moduleId: 'half' }), 201)).module;
    const refused = await json<{ error: { code: string } }>(await api(server, 'DELETE', `/api/library/${entry.id}`, editor.cookie), 403);
    expect(refused.error.code).toBe('not_library_owner');
    expect((await api(server, 'GET', `/api/library/${entry.id}`, owner.cookie)).status).toBe(200);
    expect((await api(server, 'DELETE', `/api/library/${entry.id}`, owner.cookie)).status).toBe(204);
    expect((await api(server, 'GET', `/api/library/${entry.id}`, owner.cookie)).status).toBe(404);
    expect((await list(owner)).map((m) => m.id)).not.toContain(entry.id);
    expect((await api(server, 'DELETE', `/api/library/${entry.id}`, owner.cookie)).status).toBe(404);
  });

  it('a viewer cannot publish from a board, nor a non-member', async () => {
    const boardId = await boardWith(adderBoard());
    await addMember(server, owner, boardId, viewer, 'viewer');
    const before = (await list(owner)).length;
    const low = await json<{ error: { code: string } }>(await publish(viewer, { boardId, moduleId: 'full' }), 403);
    expect(low.error.code).toBe('role_too_low');
    const outsider = await json<{ error: { code: string } }>(await publish(stranger, { boardId, moduleId: 'full' }), 403);
    expect(outsider.error.code).toBe('not_a_member');
    expect((await list(owner)).length).toBe(before);
  });

  it('bad input is a 400 with fields', async () => {
    const boardId = await boardWith(adderBoard());
    const noBody = await json<{ error: { code: string; fields: Record<string, string> } }>(await publish(owner, {}), 400);
    expect(noBody.error.code).toBe('invalid_input');
    expect(Object.keys(noBody.error.fields).sort()).toEqual(['boardId', 'moduleId']);
    const badId = await json<{ error: { fields: Record<string, string> } }>(await publish(owner, { boardId: 'x', moduleId: 'full' }), 400);
    expect(Object.keys(badId.error.fields)).toEqual(['boardId']);
    const missing = await json<{ error: { code: string; fields: Record<string, string> } }>(await publish(owner, { boardId, moduleId: 'nope' }), 400);
    expect(missing.error.fields.moduleId).toContain('nope');
    const path = await json<{ error: { fields: Record<string, string> } }>(await api(server, 'GET', '/api/library/abc', owner.cookie), 400);
    expect(Object.keys(path.error.fields)).toEqual(['id']);
  });

  it('a board written with a nesting cycle and a missing module is repaired before the library reads it; the library refuses such content itself', async () => {
    const loopA = { id: 'loop_a', title: 'A', parts: [{ id: 'p', kind: 'port', dir: 'in', label: 'X', x: 0, y: 0 }, { id: 'i1', kind: 'module', module: 'loop_b', x: 100, y: 0 }], wires: [] };
    const loopB = { id: 'loop_b', title: 'B', parts: [{ id: 'q', kind: 'port', dir: 'in', label: 'X', x: 0, y: 0 }, { id: 'i2', kind: 'module', module: 'loop_a', x: 100, y: 0 }], wires: [] };
    const orphan = { id: 'orphan', title: 'Orphan', parts: [{ id: 'i3', kind: 'module', module: 'gone', x: 0, y: 0 }], wires: [] };
    const modules = [loopA, loopB, orphan] as unknown as Module[];
    const raw = { format: 'gatefold-board', version: 1, title: 'Room 14 broken', family: 'ideal', parts: [], wires: [], modules } as unknown as BoardFile;
    expect(parseBoardFile(raw).ok).toBe(false);

    // the server writes it into an open room, bypassing the import check: the write is repaired in its own
    // transaction (tests/collab/server-writes.test.ts), so the board the library reads is a valid one
    const boardId = await createBoard(server, owner, raw.title);
    const client = connectClient(server, boardId, owner.cookie);
    await client.synced;
    const warn = vi.spyOn(console, 'warn').mockImplementation(() => undefined);
    try {
      await server.ctx.boardRegistry.writeBoardFile(boardId, raw, owner.id);
    } finally {
      warn.mockRestore();
    }
    const stored = await server.ctx.boardRegistry.readBoardFile(boardId);
    expect(parseBoardFile(stored).ok).toBe(true);
    expect(stored.modules?.map((m) => [m.id, m.parts.map((p) => p.id)])).toEqual([['loop_a', ['p', 'i1']], ['loop_b', ['q']], ['orphan', []]]);
    const published = (await json<{ module: ApiLibraryContent }>(await publish(owner, { boardId, moduleId: 'loop_a' }), 201)).module;
    expect(published.modules.map((m) => m.id)).toEqual(['loop_a', 'loop_b']);
    client.destroy();

    // the library's own check of what it stores: the same content as it would be unrepaired is a 400 naming the ids
    const refusal = (content: Module[]): HttpError => {
      try {
        checkLibraryContent(content, 'ideal');
      } catch (err) {
        if (err instanceof HttpError) return err;
        throw err;
      }
      throw new Error('the content was accepted');
    };
    const cycle = refusal([loopA, loopB] as unknown as Module[]);
    expect([cycle.status, cycle.code]).toEqual([400, 'invalid_module']);
    expect(cycle.message).toContain('loop_a → loop_b → loop_a');
    expect(Object.keys(cycle.fields ?? {})).toContain('loop_a');
    const gone = refusal([orphan] as unknown as Module[]);
    expect([gone.status, gone.code]).toEqual([400, 'invalid_module']);
    expect(gone.fields?.i3).toContain('missing module "gone"');
  });
});
