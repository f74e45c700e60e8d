/**
 * Who may do what on a board's socket, one row per role: may the socket open, is an update from it
 * applied (and stored), does it receive others' edits. The HTTP half of the table is tests/api.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { addPart, partToYMap, partsMap } from '../../shared/board';
import { addMember, connectClient, createBoard, exportText, rawUpgrade, signUp, waitFor, type User } from './helpers';
import { RawPeer } from './raw-peer';

type Who = 'owner' | 'editor' | 'viewer' | 'non-member' | 'anonymous';
const TABLE: { who: Who; upgrade: number; applied: boolean }[] = [
  { who: 'owner', upgrade: 101, applied: true },
  { who: 'editor', upgrade: 101, applied: true },
  { who: 'viewer', upgrade: 101, applied: false },
  { who: 'non-member', upgrade: 403, applied: false },
  { who: 'anonymous', upgrade: 401, applied: false },
];

let server: TestServer;
let boardId: number;
const users = {} as Record<Exclude<Who, 'anonymous'>, User>;

beforeAll(async () => {
  server = await startTestServer({ logErrors: false });
  [users.owner, users.editor, users.viewer, users['non-member']] = await Promise.all(['Owner', 'Editor', 'Viewer', 'Stranger'].map((n) => signUp(server, n)));
  boardId = await createBoard(server, users.owner, 'Role table');
  await addMember(server, users.owner, boardId, users.editor, 'editor');
  await addMember(server, users.owner, boardId, users.viewer, 'viewer');
});
afterAll(async () => {
  await server.close();
});

describe('roles on a board socket', () => {
  it.each(TABLE)('$who: upgrade $upgrade, update applied: $applied', async ({ who, upgrade, applied }) => {
    const cookie = who === 'anonymous' ? undefined : users[who].cookie;
    const up = await rawUpgrade(server, `/collab/${boardId}`, cookie);
    expect(up.status).toBe(upgrade);
    if (upgrade !== 101) {
      expect(up.bytes).toBe(0); // refused before any document byte
      return;
    }
    const id = `from-${who}`;
    const peer = await RawPeer.open(server, boardId, cookie!);
    peer.edit((doc) => partsMap(doc).set(id, partToYMap({ id, kind: 'note', x: 0, y: 0, text: who }, 100)));
    expect(await peer.roundTrip()).toBe('answered'); // handled (a viewer's update is ignored, not refused)
    await server.ctx.boardRegistry.flushAll();
    expect((await exportText(server, users.owner, boardId)).includes(`"${id}"`)).toBe(applied);
    // every member's socket receives the others' edits
    const marker = `marker-for-${who}`;
    const o = connectClient(server, boardId, users.owner.cookie);
    await o.synced;
    addPart(o.doc, { id: marker, kind: 'note', x: 0, y: 0, text: '' }, { local: 'test' });
    await waitFor(() => partsMap(peer.doc).has(marker), `${who} to receive the owner's edit`);
    o.destroy();
    peer.close();
  });
});
