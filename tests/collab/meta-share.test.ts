import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { addPart, setMeta } from '../../shared/board/edits';
import { metaMap } from '../../shared/board/ydoc';
import type { CollabContext } from '../../server/collab';
import { api, connectClient, createBoard, exportText, signUp, sleep, waitFor, type Client, type User } from './helpers';

const ME = { local: 'test' };
let server: TestServer;
let owner: User;
const clients: Client[] = [];

beforeAll(async () => {
  server = await startTestServer();
  owner = await signUp(server, 'Owner');
});
afterAll(async () => {
  clients.forEach((c) => c.destroy());
  await server.close();
});

const boardRow = async (boardId: number) =>
  ((await (await api(server, 'GET', `/api/boards/${boardId}`, owner.cookie)).json()) as { board: { title: string; family: string } }).board;

describe('title and family stay in step between the board row and the document', () => {
  it('a rename on the canvas reaches the board row; a rename through the API reaches every screen', async () => {
    const boardId = await createBoard(server, owner, 'First name');
    const c = connectClient(server, boardId, owner.cookie);
    clients.push(c);
    await c.synced;
    await waitFor(() => metaMap(c.doc).get('title') === 'First name', 'the row title in the document');
    setMeta(c.doc, { title: 'Canvas name', family: 'relay' }, ME);
    await waitFor(async () => (await boardRow(boardId)).title === 'Canvas name', 'the row to follow');
    expect((await boardRow(boardId)).family).toBe('relay');
    const patch = await api(server, 'PATCH', `/api/boards/${boardId}`, owner.cookie, { title: 'API name' });
    expect(patch.status).toBe(200);
    await waitFor(() => metaMap(c.doc).get('title') === 'API name', 'the screen to follow');
    c.destroy();
    // with no room open, a rename still reaches the stored document (and so the export)
    await sleep(100);
    expect((await api(server, 'PATCH', `/api/boards/${boardId}`, owner.cookie, { title: 'Offline name' })).status).toBe(200);
    await waitFor(async () => JSON.parse(await exportText(server, owner, boardId)).title === 'Offline name', 'the stored title');
  });
});

describe('share-link hook', () => {
  it('a guest with a token the resolver accepts joins as a viewer; others are refused', async () => {
    const boardId = await createBoard(server, owner, 'Class demo');
    (server.ctx as CollabContext).shareLinks = {
      resolve: (token) => (token === 'room14-token' ? { boardId, role: 'viewer' } : null),
    };
    const teacher = connectClient(server, boardId, owner.cookie);
    const guest = connectClient(server, boardId, '', { share: 'room14-token' });
    clients.push(teacher, guest);
    await Promise.all([teacher.synced, guest.synced]);
    addPart(teacher.doc, { id: 'sw1', kind: 'switch', label: 'A', x: 0, y: 0, on: false }, ME);
    await waitFor(() => guest.doc.getMap('parts').has('sw1'), 'the guest to see the teacher’s edit');
    addPart(guest.doc, { id: 'graffiti', kind: 'note', x: 0, y: 0, text: 'hi' }, ME);
    addPart(teacher.doc, { id: 'marker', kind: 'note', x: 0, y: 0, text: '' }, ME);
    await waitFor(() => guest.doc.getMap('parts').has('marker'), 'the marker');
    await sleep(100);
    expect(teacher.doc.getMap('parts').has('graffiti')).toBe(false);
    // a token for another board, or an unknown token, without a session: 401
    const other = connectClient(server, boardId + 1000, '', { share: 'room14-token' });
    const closed = new Promise<void>((r) => other.provider.once('connection-error', () => r()));
    await closed;
    expect(other.provider.wsconnected).toBe(false);
    other.destroy();
    delete (server.ctx as CollabContext).shareLinks;
  });
});
