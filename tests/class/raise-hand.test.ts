import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { addMember, api, connectClient, createBoard, signUp, waitFor, type Client, type User } from '../collab/helpers';

let server: TestServer;
let owner: User;
let editor: User;
const clients: Client[] = [];
const open = (boardId: number, cookie: string, params: Record<string, string> = {}) => {
  const c = connectClient(server, boardId, cookie, params);
  clients.push(c);
  return c;
};

beforeAll(async () => {
  server = await startTestServer({ logErrors: false });
  [owner, editor] = await Promise.all(['Mara', 'Ines'].map((n) => signUp(server, n)));
});
afterAll(async () => {
  clients.forEach((c) => c.destroy());
  await server.close();
});

interface Audience { viewers: number; hands: { id: number; name: string }[] }
const audience = (c: Client) => [...c.provider.awareness.getStates().values()].find((s) => 'audience' in s)?.audience as Audience | undefined;
const hands = (c: Client) => audience(c)?.hands ?? [];

async function guestCookie(token: string, name: string): Promise<string> {
  const res = await api(server, 'POST', `/api/share/${token}/join`, undefined, { name });
  expect(res.status).toBe(200);
  return (res.headers.getSetCookie()[0] ?? '').split(';')[0];
}

describe('raise hand (through the server\'s audience entry)', () => {
  it('a guest raises a hand, the editors see it with its name, an editor clears it, it disappears until raised again', async () => {
    const boardId = await createBoard(server, owner, 'Larkspur Street Makerspace, Room 14: 4-bit counter');
    await addMember(server, owner, boardId, editor, 'editor');
    const link = ((await (await api(server, 'POST', `/api/boards/${boardId}/share-links`, owner.cookie, {})).json()) as { link: { token: string } }).link;
    const o = open(boardId, owner.cookie);
    const e = open(boardId, editor.cookie);
    const robin = open(boardId, await guestCookie(link.token, 'Robin'), { share: link.token });
    const sam = open(boardId, '', { share: link.token });
    await Promise.all([o.synced, e.synced, robin.synced, sam.synced]);
    robin.provider.awareness.setLocalState({ user: { id: 'g1', name: 'Robin', color: '#888888' } });
    sam.provider.awareness.setLocalState({ user: { id: 'g2', name: 'Sam', color: '#888888' } });
    await waitFor(() => audience(o)?.viewers === 2, 'the audience count of 2');
    expect(hands(o)).toEqual([]);

    robin.provider.awareness.setLocalStateField('hand', true);
    await waitFor(() => hands(o).length === 1 && hands(e).length === 1, 'both editors to see the hand');
    expect(hands(o)).toEqual([{ id: robin.doc.clientID, name: 'Robin' }]);
    // the guests see it too (the server's entry goes to everyone), but never each other's own states
    await waitFor(() => hands(sam).length === 1, 'the other guest to see the hand list');
    expect(sam.provider.awareness.getStates().has(robin.doc.clientID)).toBe(false);

    sam.provider.awareness.setLocalStateField('hand', true);
    await waitFor(() => hands(o).length === 2, 'the second hand');
    expect(hands(o).map((h) => h.name)).toEqual(['Robin', 'Sam']);

    // the owner clears Robin's hand only
    o.provider.awareness.setLocalState({ user: { id: 'o', name: 'Mara', color: '#3b82f6' }, clearHands: { seq: 1, ids: [robin.doc.clientID] } });
    await waitFor(() => hands(e).length === 1, 'Robin\'s hand to go from the editor\'s list');
    expect(hands(e)).toEqual([{ id: sam.doc.clientID, name: 'Sam' }]);
    // Robin's state still says hand: true; a renewal or another field change does not bring it back
    robin.provider.awareness.setLocalStateField('cursor', { x: 1, y: 2 });
    await new Promise((r) => setTimeout(r, 200));
    expect(hands(o).map((h) => h.name)).toEqual(['Sam']);

    // lowering and raising again shows it again; Sam lowering removes Sam's
    robin.provider.awareness.setLocalStateField('hand', false);
    sam.provider.awareness.setLocalStateField('hand', false);
    await waitFor(() => hands(o).length === 0, 'both hands down');
    robin.provider.awareness.setLocalStateField('hand', true);
    await waitFor(() => hands(o).length === 1, 'Robin\'s hand up again');

    // clear all (a new seq), from the other editor
    e.provider.awareness.setLocalState({ user: { id: 'e', name: 'Ines', color: '#3b82f6' }, clearHands: { seq: 7, ids: 'all' } });
    await waitFor(() => hands(o).length === 0 && hands(robin).length === 0, 'every hand cleared on every screen');

    // a guest who leaves with a hand up takes it away
    sam.provider.awareness.setLocalStateField('hand', true);
    await waitFor(() => hands(o).length === 1, 'Sam\'s hand');
    sam.destroy();
    await waitFor(() => hands(o).length === 0 && audience(o)?.viewers === 1, 'Sam\'s hand to go with Sam');
  });
});
