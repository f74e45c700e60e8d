import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { setMeta } from '../../shared/board';
import { metaMap } from '../../shared/board';
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

describe('no share-link way in', () => {
  it('a `?share=` token without a session is refused like any socket without one', async () => {
    const boardId = await createBoard(server, owner, 'Class demo');
    const other = connectClient(server, boardId, '', { share: 'room14-token' });
    const closed = new Promise<void>((r) => other.provider.once('connection-error', () => r()));
    await closed;
    expect(other.provider.wsconnected).toBe(false);
    expect(other.doc.getMap('parts').size).toBe(0);
    other.destroy();
  });
});
