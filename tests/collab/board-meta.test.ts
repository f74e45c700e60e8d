import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { setMeta } from '../../shared/board';
import { metaMap } from '../../shared/board';
import { addMember, api, connectClient, createBoard, signUp, waitFor, type Client, type User } from './helpers';

// The title and family have one owner, the board's document; the boards row is its projection.
const ME = { local: 'test' };
let server: TestServer;
let owner: User;
let editor: User;
const clients: Client[] = [];

beforeAll(async () => {
  server = await startTestServer();
  owner = await signUp(server, 'Owner');
  editor = await signUp(server, 'Editor');
});
afterAll(async () => {
  clients.forEach((c) => c.destroy());
  await server.close();
});

const listed = async (user: User, boardId: number) => {
  const { boards } = (await (await api(server, 'GET', '/api/boards', user.cookie)).json()) as { boards: { id: number; title: string; family: string }[] };
  return boards.find((b) => b.id === boardId);
};

describe('board meta lives in the document', () => {
  it('a REST rename reaches every connected document, pushed by the room (no client asks again)', async () => {
    const boardId = await createBoard(server, owner, 'Shift register');
    await addMember(server, owner, boardId, editor, 'editor');
    const a = connectClient(server, boardId, owner.cookie);
    const b = connectClient(server, boardId, editor.cookie);
    clients.push(a, b);
    await Promise.all([a.synced, b.synced]);
    await waitFor(() => metaMap(a.doc).get('title') === 'Shift register' && metaMap(b.doc).get('title') === 'Shift register', 'the first title');
    const seen: string[] = [];
    metaMap(b.doc).observe(() => seen.push(String(metaMap(b.doc).get('title'))));

    const res = await api(server, 'PATCH', `/api/boards/${boardId}`, editor.cookie, { title: 'Shift register, Room 14', family: 'ttl-74ls' });
    expect(res.status).toBe(200);
    expect(((await res.json()) as { board: { title: string; family: string } }).board).toMatchObject({ title: 'Shift register, Room 14', family: 'ttl-74ls' });
    await waitFor(() => metaMap(a.doc).get('title') === 'Shift register, Room 14' && metaMap(b.doc).get('title') === 'Shift register, Room 14', 'both screens to show the new title');
    expect(metaMap(a.doc).get('family')).toBe('ttl-74ls');
    expect(metaMap(b.doc).get('family')).toBe('ttl-74ls');
    // the change arrived as one document update from the room, not through a second request
    expect(seen).toEqual(['Shift register, Room 14']);
  });

  it('a title changed on the canvas shows in the board list and the board row', async () => {
    const boardId = await createBoard(server, owner, 'Traffic light');
    const c = connectClient(server, boardId, owner.cookie);
    clients.push(c);
    await c.synced;
    await waitFor(() => metaMap(c.doc).get('title') === 'Traffic light', 'the row title in the document');
    setMeta(c.doc, { title: 'Traffic light, debounced', family: 'relay' }, ME);
    await waitFor(async () => (await listed(owner, boardId))?.title === 'Traffic light, debounced', 'the list to show the canvas title');
    expect((await listed(owner, boardId))?.family).toBe('relay');
    const row = (await (await api(server, 'GET', `/api/boards/${boardId}`, owner.cookie)).json()) as { board: { title: string } };
    expect(row.board.title).toBe('Traffic light, debounced');
  });
});
