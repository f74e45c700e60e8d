import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addModules, moduleMaps, modulesMap, parseBoardFile, placeInstance, replaceModule, type BoardFile, type Module } from '../../shared/board';
import type { ApiLibraryContent } from '../../shared/api';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { api, connectClient, createBoard, signUp, waitFor, type Client, type User } from '../collab/helpers';
import { HALF_ADDER_MODULE } from '../modules/boards';

let server: TestServer;
let owner: User;
const clients: Client[] = [];

beforeAll(async () => {
  server = await startTestServer({ logErrors: false });
  owner = await signUp(server, 'Owner');
});
afterAll(async () => {
  clients.forEach((c) => c.destroy());
  await server.close();
});

function board(title: string, modules: unknown[], parts: unknown[] = []): BoardFile {
  const parsed = parseBoardFile({ format: 'gatefold-board', version: 1, title, family: 'ideal', parts, wires: [], modules });
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
  return parsed.board;
}

async function boardWith(file: BoardFile): Promise<number> {
  const boardId = await createBoard(server, owner, file.title);
  await server.ctx.boardRegistry.writeBoardFile(boardId, file, owner.id);
  return boardId;
}

async function open(boardId: number): Promise<Client> {
  const c = connectClient(server, boardId, owner.cookie);
  clients.push(c);
  await c.synced;
  return c;
}

async function publish(boardId: number, moduleId: string, status: number): Promise<ApiLibraryContent> {
  const res = await api(server, 'POST', '/api/library', owner.cookie, { boardId, moduleId });
  const text = await res.text();
  expect(res.status, text).toBe(status);
  return (JSON.parse(text) as { module: ApiLibraryContent }).module;
}

/** A module of two chained half adders (it nests `half`), for the Room 14 bench. */
const PAIR: Module = {
  id: 'pair', title: 'Two half adders',
  parts: [
    { id: 'a', kind: 'port', dir: 'in', label: 'A', x: 0, y: 0 },
    { id: 'b', kind: 'port', dir: 'in', label: 'B', x: 0, y: 80 },
    { id: 'u1', kind: 'module', module: 'half', x: 160, y: 0 },
    { id: 'u2', kind: 'module', module: 'half', x: 360, y: 0 },
    { id: 's', kind: 'port', dir: 'out', label: 'S', x: 560, y: 0 },
  ],
  wires: [
    { id: 'w1', from: 'a.out', to: 'u1.A' }, { id: 'w2', from: 'b.out', to: 'u1.B' },
    { id: 'w3', from: 'u1.S', to: 'u2.A' }, { id: 'w4', from: 'u1.C', to: 'u2.B' },
    { id: 'w5', from: 'u2.S', to: 's.in' },
  ],
} as Module;

describe('team library: placing and updating through the named edits', () => {
  it('a copy placed on another board records its origin; "update from library" takes the next version', async () => {
    const source = await boardWith(board('Room 14 source', [PAIR, HALF_ADDER_MODULE]));
    const v1 = await publish(source, 'pair', 201);

    // the target already has a module "half" of its own: the copy's nested module gets a new id
    const ownHalf = { id: 'half', title: 'Our own half', parts: [{ id: 'x', kind: 'port', dir: 'in', label: 'X', x: 0, y: 0 }], wires: [] };
    const target = await boardWith(board('Room 14 target', [ownHalf]));
    const got = await (await api(server, 'GET', `/api/library/${v1.id}`, owner.cookie)).json() as { module: ApiLibraryContent };
    const client = await open(target);
    const renamed = addModules(client.doc, got.module.modules, 'library', got.module.origin);
    const placedId = renamed.get(got.module.moduleId)!;
    const instance = placeInstance(client.doc, placedId, 200, 120, 'library');

    let file: BoardFile | undefined;
    await waitFor(async () => (file = await server.ctx.boardRegistry.readBoardFile(target)).parts.length === 1, 'the placed copy on the server');
    const checked = parseBoardFile(file);
    expect(checked.ok, JSON.stringify(checked)).toBe(true);
    expect(file!.parts[0]).toMatchObject({ id: instance, kind: 'module', module: 'pair' });
    const copy = file!.modules!.find((m) => m.id === 'pair')!;
    expect(copy.origin).toEqual({ library: String(v1.id), version: 1 });
    expect(renamed.get('half')).toBe('half_2');
    expect(copy.parts.filter((p) => p.kind === 'module').map((p) => (p as { module: string }).module)).toEqual(['half_2', 'half_2']);
    expect(file!.modules!.find((m) => m.id === 'half')!.title).toBe('Our own half');

    // the source changes its module and publishes again: version 2
    const src = await open(source);
    src.doc.transact(() => {
      modulesMap(src.doc).get('pair')!.set('title', 'Two half adders, rev B');
      moduleMaps(src.doc, 'pair')!.parts.get('u2')!.set('x', 400);
    });
    await waitFor(async () => (await server.ctx.boardRegistry.readBoardFile(source)).modules?.[0].title === 'Two half adders, rev B', 'the source edit');
    const v2 = await publish(source, 'pair', 200);
    expect(v2).toMatchObject({ id: v1.id, version: 2 });
    expect(v2.version).toBeGreaterThan(copy.origin!.version);

    // update from library: the board's copy is replaced (instances stay), its nested ids kept as on the board
    const next = v2.modules[0];
    replaceModule(client.doc, 'pair', { ...next, parts: next.parts.map((p) => (p.kind === 'module' ? { ...p, module: renamed.get(p.module) ?? p.module } : p)), origin: v2.origin }, 'library');
    await waitFor(async () => (file = await server.ctx.boardRegistry.readBoardFile(target)).modules?.find((m) => m.id === 'pair')?.origin?.version === 2, 'the update on the server');
    const updated = file!.modules!.find((m) => m.id === 'pair')!;
    expect(updated.title).toBe('Two half adders, rev B');
    expect(updated.parts.find((p) => p.id === 'u2')).toMatchObject({ x: 400, module: 'half_2' });
    expect(file!.parts[0]).toMatchObject({ id: instance, module: 'pair' });
    expect(parseBoardFile(file).ok).toBe(true);
  });

  it('a module too large for the library is a 413', async () => {
    const text = 'Room 14 bench note. '.repeat(190); // 3,800 characters
    const notes = Array.from({ length: 300 }, (_, i) => ({ id: `n${i}`, kind: 'note', text, x: 0, y: i * 40 }));
    const big = { id: 'big', title: 'Annotated', parts: [{ id: 'p', kind: 'port', dir: 'in', label: 'A', x: 0, y: 0 }, ...notes], wires: [] };
    const boardId = await boardWith(board('Room 14 notes', [big]));
    const res = await api(server, 'POST', '/api/library', owner.cookie, { boardId, moduleId: 'big' });
    expect(res.status).toBe(413);
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe('too_large');
  });
});
