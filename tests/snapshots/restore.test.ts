import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addPart, connect, deleteSelection, disconnect, docToBoard, metaMap, movePart, relabelPart, replaceWithBoard, type BoardFile } from '../../shared/board';
import { RESTORE_NOTICE_KEY, type RestoreNotice } from '../../shared/api';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { contractHalfAdder } from '../helpers/boards';
import { addMember, connectClient, createBoard, exportText, signUp, waitFor, type Client, type User } from '../collab/helpers';
import { restore, same, snapshotBoard, takeSnapshot } from './helpers';

const ME = { local: 'snapshot-test' };
let server: TestServer;
let owner: User;
let editor: User;
let third: User;
const open: Client[] = [];

beforeAll(async () => {
  server = await startTestServer();
  [owner, editor, third] = await Promise.all(['Owner', 'Editor', 'Third'].map((n) => signUp(server, n)));
});
afterAll(async () => {
  open.forEach((c) => c.destroy());
  await server.close();
});

async function boardWithClients(title: string): Promise<{ boardId: number; a: Client; b: Client; c: Client }> {
  const boardId = await createBoard(server, owner, title);
  await addMember(server, owner, boardId, editor, 'editor');
  await addMember(server, owner, boardId, third, 'editor');
  const [a, b, c] = [owner, editor, third].map((u) => connectClient(server, boardId, u.cookie));
  open.push(a, b, c);
  await Promise.all([a.synced, b.synced, c.synced]);
  replaceWithBoard(a.doc, { ...contractHalfAdder(), title }, ME);
  await waitFor(() => [b, c].every((x) => same(docToBoard(x.doc), docToBoard(a.doc))), 'the half adder on every client');
  return { boardId, a, b, c };
}

/** Delete, move, rewire and relabel on client `x`. */
function scramble(x: Client): void {
  deleteSelection(x.doc, ['g2'], [], ME);
  movePart(x.doc, [{ id: 'g1', x: 400, y: 300 }], ME);
  disconnect(x.doc, ['w5'], ME);
  const wired = connect(x.doc, 'b.out', 's.in', ME);
  if (!wired.ok) throw new Error(wired.reason);
  relabelPart(x.doc, 'a', 'X', ME);
}

describe('restoring a snapshot on a live board', () => {
  it('updates both connected clients, merges later edits, and a client offline during the restore converges', async () => {
    const { boardId, a, b, c } = await boardWithClients('Live restore');
    const s = await takeSnapshot(server, owner, boardId, 'S');
    const sBoard = await snapshotBoard(server, owner, boardId, s.id);
    expect(same(sBoard, docToBoard(a.doc))).toBe(true);

    c.provider.disconnect();
    scramble(a);
    await waitFor(() => same(docToBoard(b.doc), docToBoard(a.doc)), 'the edits on the second client');
    expect(same(docToBoard(a.doc), sBoard)).toBe(false);

    const { restored, beforeRestore } = await restore(server, owner, boardId, s.id);
    expect(restored.id).toBe(s.id);
    expect(beforeRestore.kind).toBe('before-restore');
    await waitFor(() => same(docToBoard(a.doc), sBoard) && same(docToBoard(b.doc), sBoard), 'both clients equal to S', 1000);
    const notice = metaMap(b.doc).get(RESTORE_NOTICE_KEY) as RestoreNotice;
    expect(notice).toMatchObject({ snapshotId: s.id, snapshotName: 'S', byUserId: owner.id, byName: 'Owner' });

    // the offline client edits, then comes back: it converges on the restored board plus its own edit
    addPart(c.doc, { id: 'n9', kind: 'note', x: 40, y: 400, text: 'written offline' }, ME);
    c.provider.connect();
    const withNote = (d: BoardFile) => same({ ...d, parts: d.parts.filter((p) => p.id !== 'n9') }, sBoard) && d.parts.some((p) => p.id === 'n9');
    await waitFor(() => [a, b, c].every((x) => withNote(docToBoard(x.doc))), 'all three clients on S plus the offline note');

    // edits after the restore, from both sides, merge
    movePart(a.doc, [{ id: 'g1', x: 220, y: 80 }], ME);
    addPart(b.doc, { id: 'l9', kind: 'lamp', label: 'L9', x: 500, y: 60 }, ME);
    await waitFor(() => [a, b, c].every((x) => {
      const d = docToBoard(x.doc);
      return d.parts.some((p) => p.id === 'l9') && d.parts.find((p) => p.id === 'g1')?.x === 220;
    }), 'later edits of both clients everywhere');
    await waitFor(() => same(docToBoard(a.doc), docToBoard(b.doc)) && same(docToBoard(b.doc), docToBoard(c.doc)), 'one board on all clients');
    await server.ctx.boardRegistry.flushAll();
    expect(JSON.parse(await exportText(server, owner, boardId))).toEqual(docToBoard(a.doc));
  });

  it('brings back deleted, moved, rewired and relabelled parts; restoring the before-restore snapshot brings the later state back', async () => {
    const { boardId, a, b } = await boardWithClients('Undo a restore');
    const s = await takeSnapshot(server, owner, boardId, 'Known good');
    const sBoard = await snapshotBoard(server, owner, boardId, s.id);
    scramble(b);
    await waitFor(() => same(docToBoard(a.doc), docToBoard(b.doc)), 'scramble everywhere');
    const later = docToBoard(a.doc);
    expect(later.parts.find((p) => p.id === 'g2')).toBeUndefined();
    expect(later.parts.find((p) => p.id === 'a')?.label).toBe('X');

    const { beforeRestore } = await restore(server, owner, boardId, s.id);
    await waitFor(() => same(docToBoard(a.doc), sBoard) && same(docToBoard(b.doc), sBoard), 'restored everywhere');
    const back = docToBoard(a.doc);
    expect(back.parts.find((p) => p.id === 'g2')).toMatchObject({ kind: 'and', x: 200, y: 140 });
    expect(back.parts.find((p) => p.id === 'g1')).toMatchObject({ x: 200, y: 60 });
    expect(back.parts.find((p) => p.id === 'a')?.label).toBe('A');
    expect(back.wires.find((w) => w.id === 'w5')).toEqual({ id: 'w5', from: 'g1.out', to: 's.in' });

    await restore(server, owner, boardId, beforeRestore.id);
    await waitFor(() => same(docToBoard(a.doc), later) && same(docToBoard(b.doc), later), 'the later state back everywhere');
  });

  it('restores a board nobody has open, through its stored updates', async () => {
    const boardId = await createBoard(server, owner, 'Closed board');
    const x = connectClient(server, boardId, owner.cookie);
    await x.synced;
    replaceWithBoard(x.doc, { ...contractHalfAdder(), title: 'Closed board' }, ME);
    await waitFor(async () => JSON.parse(await exportText(server, owner, boardId)).parts.length === contractHalfAdder().parts.length, 'content stored');
    const s = await takeSnapshot(server, owner, boardId, 'S');
    deleteSelection(x.doc, ['a', 'b'], [], ME);
    await waitFor(async () => JSON.parse(await exportText(server, owner, boardId)).parts.length === contractHalfAdder().parts.length - 2, 'deletion stored');
    x.destroy();
    await waitFor(() => !server.ctx.boardRegistry.rooms.has(boardId), 'the room unloaded');
    await restore(server, owner, boardId, s.id);
    expect(JSON.parse(await exportText(server, owner, boardId))).toEqual(await snapshotBoard(server, owner, boardId, s.id));
  });
});
