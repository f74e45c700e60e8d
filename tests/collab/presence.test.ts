import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { addMember, connectClient, createBoard, signUp, sleep, waitFor, type Client, type User } from './helpers';
import { RawPeer, awarenessEntries, awarenessPayload } from './raw-peer';

const FRAME_MS = 50;
const RENEWAL_MS = 400;
let server: TestServer;
let owner: User;
let editor: User;
let viewer: User;
let viewer2: User;
const clients: Client[] = [];

beforeAll(async () => {
  server = await startTestServer({ collab: { awarenessFrameMs: FRAME_MS, awarenessRenewalMs: RENEWAL_MS }, logErrors: false });
  [owner, editor, viewer, viewer2] = await Promise.all(['Owner', 'Editor', 'Viewer', 'Viewer Two'].map((n) => signUp(server, n)));
});
afterAll(async () => {
  clients.forEach((c) => c.destroy());
  await server.close();
});

async function board(): Promise<number> {
  const boardId = await createBoard(server, owner);
  await addMember(server, owner, boardId, editor, 'editor');
  await addMember(server, owner, boardId, viewer, 'viewer');
  await addMember(server, owner, boardId, viewer2, 'viewer');
  return boardId;
}

/** Every entry of every awareness message a raw peer got, for one client id. */
const entriesFor = (peer: RawPeer, clientId: number) => peer.awareness.flatMap(awarenessEntries).filter((e) => e.clientId === clientId);

describe('presence without the square', () => {
  it("cursors are coalesced per frame: 20 moves in one frame reach the other editor as one or two messages, ending at the last", async () => {
    const boardId = await board();
    const mover = await RawPeer.open(server, boardId, owner.cookie);
    const watcher = await RawPeer.open(server, boardId, editor.cookie);
    for (let x = 1; x <= 20; x++) mover.sendAwareness(awarenessPayload([{ clientId: 501, clock: x, state: { user: { id: 'o', name: 'O', color: '#f00' }, cursor: { x, y: 0 } } }]));
    await waitFor(() => entriesFor(watcher, 501).some((e) => (e.state as { cursor: { x: number } }).cursor.x === 20), 'the last cursor');
    await sleep(3 * FRAME_MS);
    const got = entriesFor(watcher, 501);
    expect(got.length).toBeLessThanOrEqual(2);
    expect(got.at(-1)!.clock).toBe(20);
    mover.close();
    watcher.close();
  });

  it('renewals (same state, new clock) are not sent on one by one: gathered into one message per renewal window', async () => {
    const boardId = await board();
    const a = await RawPeer.open(server, boardId, owner.cookie);
    const watcher = await RawPeer.open(server, boardId, editor.cookie);
    const state = { user: { id: 'o', name: 'O', color: '#f00' }, cursor: null };
    a.sendAwareness(awarenessPayload([{ clientId: 601, clock: 1, state }]));
    await waitFor(() => entriesFor(watcher, 601).length === 1, 'the first state');
    for (let clock = 2; clock <= 11; clock++) a.sendAwareness(awarenessPayload([{ clientId: 601, clock, state }]));
    await sleep(FRAME_MS * 3);
    expect(entriesFor(watcher, 601)).toHaveLength(1); // nothing yet: renewals wait for the window
    await waitFor(() => entriesFor(watcher, 601).length === 2, 'the gathered renewal', RENEWAL_MS * 5);
    expect(entriesFor(watcher, 601)[1].clock).toBe(11);
    a.close();
    watcher.close();
  });

  it("viewers' states are not fanned out; everyone sees the audience count instead", async () => {
    const boardId = await board();
    const e = connectClient(server, boardId, editor.cookie);
    const v1 = connectClient(server, boardId, viewer.cookie);
    const v2 = connectClient(server, boardId, viewer2.cookie);
    clients.push(e, v1, v2);
    await Promise.all([e.synced, v1.synced, v2.synced]);
    const audience = (c: Client) => [...c.provider.awareness.getStates().values()].find((s) => 'audience' in s)?.audience as { viewers: number } | undefined;
    await waitFor(() => audience(e)?.viewers === 2 && audience(v1)?.viewers === 2, 'the audience count of 2');
    v1.provider.awareness.setLocalStateField('cursor', { x: 11, y: 12 });
    e.provider.awareness.setLocalStateField('cursor', { x: 21, y: 22 });
    await waitFor(() => v2.provider.awareness.getStates().get(e.doc.clientID)?.cursor?.x === 21, "the editor's cursor at a viewer");
    await sleep(3 * FRAME_MS);
    expect(e.provider.awareness.getStates().has(v1.doc.clientID)).toBe(false);
    expect(v2.provider.awareness.getStates().has(v1.doc.clientID)).toBe(false);
    v2.destroy();
    await waitFor(() => audience(e)?.viewers === 1, 'the audience count to drop to 1');
  });

  it('an editor leaving takes its cursor from every screen', async () => {
    const boardId = await board();
    const e = connectClient(server, boardId, editor.cookie);
    const o = connectClient(server, boardId, owner.cookie);
    clients.push(e, o);
    await Promise.all([e.synced, o.synced]);
    e.provider.awareness.setLocalStateField('cursor', { x: 3, y: 4 });
    await waitFor(() => o.provider.awareness.getStates().get(e.doc.clientID)?.cursor?.x === 3, 'the cursor');
    e.destroy();
    await waitFor(() => !o.provider.awareness.getStates().has(e.doc.clientID), 'the cursor to go');
  });
});
