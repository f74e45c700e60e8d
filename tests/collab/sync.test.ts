import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import WebSocket from 'ws';
import * as encoding from 'lib0/encoding';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { addPart, connect, deleteSelection, movePart, relabelPart } from '../../shared/board';
import { docToBoard } from '../../shared/board';
import { addMember, connectClient, createBoard, signUp, waitFor, type Client, type User } from './helpers';

const ME = { local: 'test' };
let server: TestServer;
let owner: User;
let editor: User;
const clients: Client[] = [];
const open = (boardId: number, user: User) => {
  const c = connectClient(server, boardId, user.cookie);
  clients.push(c);
  return c;
};
const same = (a: Client, b: Client) => JSON.stringify(docToBoard(a.doc)) === JSON.stringify(docToBoard(b.doc));

beforeAll(async () => {
  server = await startTestServer();
  owner = await signUp(server, 'Owner');
  editor = await signUp(server, 'Editor');
});
afterAll(async () => {
  clients.forEach((c) => c.destroy());
  await server.close();
});

describe('live board sync', () => {
  it('two clients converge after concurrent edits of different parts and of the same part', async () => {
    const boardId = await createBoard(server, owner);
    await addMember(server, owner, boardId, editor, 'editor');
    const a = open(boardId, owner);
    const b = open(boardId, editor);
    await Promise.all([a.synced, b.synced]);
    addPart(a.doc, { id: 'sw1', kind: 'switch', label: 'A', x: 0, y: 0, on: false }, ME);
    await waitFor(() => b.doc.getMap('parts').has('sw1'), 'b to see sw1');
    // concurrent: different parts and the same part's position and label, before either hears the other
    addPart(a.doc, { id: 'l1', kind: 'lamp', label: 'Y', x: 200, y: 0 }, ME);
    addPart(b.doc, { id: 'g1', kind: 'not', x: 100, y: 0 }, ME);
    movePart(a.doc, [{ id: 'sw1', x: 20, y: 40 }], ME);
    movePart(b.doc, [{ id: 'sw1', x: 60, y: 80 }], ME);
    relabelPart(b.doc, 'sw1', 'IN', ME);
    await waitFor(() => a.doc.getMap('parts').size === 3 && b.doc.getMap('parts').size === 3 && same(a, b), 'convergence');
    expect(connect(a.doc, 'sw1.out', 'g1.in0', ME).ok).toBe(true);
    expect(connect(b.doc, 'g1.out', 'l1.in', ME).ok).toBe(true);
    await waitFor(() => a.doc.getMap('wires').size === 2 && b.doc.getMap('wires').size === 2 && same(a, b), 'wires to converge');
    const board = docToBoard(a.doc);
    expect(board.parts.find((p) => p.id === 'sw1')!.label).toBe('IN');
    // A late joiner gets the same document from the server's room.
    const c = open(boardId, owner);
    await c.synced;
    await waitFor(() => same(a, c), 'late joiner');
  });

  it('rapid joins and leaves (rooms unloading and reloading) never lose an edit', async () => {
    const boardId = await createBoard(server, owner);
    for (let round = 0; round < 8; round++) {
      const c = connectClient(server, boardId, owner.cookie);
      await c.synced;
      addPart(c.doc, { id: `n${round}`, kind: 'note', x: round * 20, y: 0, text: `round ${round}` }, ME);
      // leave at once, while a second client joins: the room may be unloading as it is looked up
      const d = connectClient(server, boardId, owner.cookie);
      c.destroy();
      await d.synced;
      await waitFor(() => d.doc.getMap('parts').has(`n${round}`), `round ${round} to arrive`);
      d.destroy();
    }
    const last = open(boardId, owner);
    await last.synced;
    await waitFor(() => last.doc.getMap('parts').size === 8, 'all eight edits');
  });

  it('a malformed frame closes only that socket; the room keeps working for the others', async () => {
    const boardId = await createBoard(server, owner);
    await addMember(server, owner, boardId, editor, 'editor');
    const a = open(boardId, owner);
    const b = open(boardId, editor);
    await Promise.all([a.synced, b.synced]);
    const raw = new WebSocket(server.url.replace(/^http/, 'ws') + `/collab/${boardId}`, { headers: { Cookie: editor.cookie } });
    await new Promise((r) => raw.once('open', r));
    const closed = new Promise<number>((r) => raw.once('close', (code) => r(code)));
    // message type sync (0), step "update" (2), then a length prefix promising bytes that are garbage
    raw.send(new Uint8Array([0, 2, 5, 0xff, 0xff, 0xff, 0xff, 0xff]));
    expect(await closed).toBe(1007);
    const raw2 = new WebSocket(server.url.replace(/^http/, 'ws') + `/collab/${boardId}`, { headers: { Cookie: editor.cookie } });
    await new Promise((r) => raw2.once('open', r));
    const closed2 = new Promise<number>((r) => raw2.once('close', (code) => r(code)));
    raw2.send(new Uint8Array([42, 1, 2, 3])); // unknown message type
    expect(await closed2).toBe(1007);
    // well framed, but the update inside is not a Yjs update
    const raw3 = new WebSocket(server.url.replace(/^http/, 'ws') + `/collab/${boardId}`, { headers: { Cookie: editor.cookie } });
    await new Promise((r) => raw3.once('open', r));
    const closed3 = new Promise<number>((r) => raw3.once('close', (code) => r(code)));
    raw3.send(new Uint8Array([0, 2, 6, 9, 200, 7, 7, 7, 7]));
    expect(await closed3).toBe(1007);
    addPart(a.doc, { id: 'k1', kind: 'const', value: 1, x: 0, y: 0 }, ME);
    await waitFor(() => b.doc.getMap('parts').has('k1'), 'the room to keep working');
    expect(a.provider.wsconnected && b.provider.wsconnected).toBe(true);
  });

  it('a message over the size limit closes the socket with 1009', async () => {
    const boardId = await createBoard(server, owner);
    const raw = new WebSocket(server.url.replace(/^http/, 'ws') + `/collab/${boardId}`, { headers: { Cookie: owner.cookie } });
    await new Promise((r) => raw.once('open', r));
    const closed = new Promise<number>((r) => raw.once('close', (code) => r(code)));
    raw.send(new Uint8Array(2 * 1024 * 1024 + 10));
    expect(await closed).toBe(1009);
  });

  it("awareness (cursors) passes between editors; nobody speaks for another's client", async () => {
    const boardId = await createBoard(server, owner);
    await addMember(server, owner, boardId, editor, 'editor');
    const a = open(boardId, owner);
    const b = open(boardId, editor);
    await Promise.all([a.synced, b.synced]);
    b.provider.awareness.setLocalState({ user: { id: editor.id, name: 'Editor', color: '#888' }, cursor: { x: 5, y: 6 }, selection: [] });
    await waitFor(() => [...a.provider.awareness.getStates().values()].some((s) => s.cursor?.x === 5), 'an editor cursor to arrive');
    // a third socket cannot remove or move b's cursor by speaking for b's client id
    const raw = new WebSocket(server.url.replace(/^http/, 'ws') + `/collab/${boardId}`, { headers: { Cookie: owner.cookie } });
    await new Promise((r) => raw.once('open', r));
    const spoof = encoding.createEncoder();
    encoding.writeVarUint(spoof, 1);
    encoding.writeVarUint(spoof, b.doc.clientID);
    encoding.writeVarUint(spoof, 1000);
    encoding.writeVarString(spoof, JSON.stringify({ cursor: { x: 666, y: 0 } }));
    const frame = encoding.createEncoder();
    encoding.writeVarUint(frame, 1);
    encoding.writeVarUint8Array(frame, encoding.toUint8Array(spoof));
    raw.send(encoding.toUint8Array(frame));
    b.provider.awareness.setLocalStateField('cursor', { x: 7, y: 6 });
    await waitFor(() => a.provider.awareness.getStates().get(b.doc.clientID)?.cursor?.x === 7, 'b’s own next cursor');
    expect([...a.provider.awareness.getStates().values()].some((s) => s.cursor?.x === 666)).toBe(false);
    raw.close();
  });
});

describe('server repairs of concurrent edits', () => {
  it('two users labelling two switches alike at the same moment end with unique labels on both screens', async () => {
    const boardId = await createBoard(server, owner);
    await addMember(server, owner, boardId, editor, 'editor');
    const a = open(boardId, owner);
    const b = open(boardId, editor);
    await Promise.all([a.synced, b.synced]);
    addPart(a.doc, { id: 'sw1', kind: 'switch', label: 'P', x: 0, y: 0, on: false }, ME);
    addPart(a.doc, { id: 'sw2', kind: 'switch', label: 'Q', x: 0, y: 40, on: false }, ME);
    await waitFor(() => b.doc.getMap('parts').size === 2, 'both switches');
    relabelPart(a.doc, 'sw1', 'EN', ME);
    relabelPart(b.doc, 'sw2', 'EN', ME);
    const labels = (c: Client) => docToBoard(c.doc).parts.map((p) => p.label).join(',');
    await waitFor(() => labels(a) === 'EN,EN_2' && labels(b) === 'EN,EN_2', 'the repaired labels on both');
  });

  it('a wire drawn to a part another user deletes at the same moment is removed everywhere', async () => {
    const boardId = await createBoard(server, owner);
    await addMember(server, owner, boardId, editor, 'editor');
    const a = open(boardId, owner);
    const b = open(boardId, editor);
    await Promise.all([a.synced, b.synced]);
    addPart(a.doc, { id: 'sw1', kind: 'switch', label: 'P', x: 0, y: 0, on: false }, ME);
    addPart(a.doc, { id: 'g1', kind: 'not', x: 100, y: 0 }, ME);
    await waitFor(() => b.doc.getMap('parts').size === 2, 'both parts');
    deleteSelection(a.doc, ['g1'], [], ME);
    expect(connect(b.doc, 'sw1.out', 'g1.in0', ME).ok).toBe(true);
    await waitFor(() => !a.doc.getMap('parts').has('g1') && !b.doc.getMap('parts').has('g1'), 'the delete on both');
    await waitFor(() => a.doc.getMap('wires').size === 0 && b.doc.getMap('wires').size === 0, 'the dangling wire to go');
  });
});
