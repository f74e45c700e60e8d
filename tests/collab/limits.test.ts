import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { partToYMap, partsMap, wireToYMap, wiresMap } from '../../shared/board';
import { pendingBytes } from '../../server/boards-live/update-guard';
import { createBoard, exportText, signUp, type User } from './helpers';
import { RawPeer, awarenessPayload } from './raw-peer';

// Limits lowered so that a test reaches them quickly; the defaults are in server/boards-live/types.ts.
const LIMITS = { maxParts: 20, maxWires: 30, maxPendingBytes: 20_000, maxAwarenessBytes: 4_000, maxAwarenessClients: 2, awarenessPerSecond: 20 };
let server: TestServer;
let owner: User;

beforeAll(async () => {
  server = await startTestServer({ collab: LIMITS, logErrors: false });
  owner = await signUp(server, 'Owner');
});
afterAll(async () => {
  await server.close();
});

describe('limits of a live board', () => {
  it('parts per board: the update that passes maxParts closes with 4413; the board keeps maxParts', async () => {
    const boardId = await createBoard(server, owner);
    const peer = await RawPeer.open(server, boardId, owner.cookie);
    peer.edit((doc) => doc.transact(() => {
      for (let i = 0; i < LIMITS.maxParts; i++) partsMap(doc).set(`g${i}`, partToYMap({ id: `g${i}`, kind: 'not', x: i * 20, y: 0 }, i + 1));
    }));
    expect(await peer.roundTrip()).toBe('answered');
    peer.edit((doc) => partsMap(doc).set('one-more', partToYMap({ id: 'one-more', kind: 'not', x: 0, y: 40 }, 99)));
    const closed = await peer.closed;
    expect(closed).toEqual({ code: 4413, reason: `board_too_large: ${LIMITS.maxParts + 1} parts (limit ${LIMITS.maxParts})` });
    const board = JSON.parse(await exportText(server, owner, boardId)) as { parts: unknown[] };
    expect(board.parts).toHaveLength(LIMITS.maxParts);
  });

  it('wires per board: 4413 as well', async () => {
    const boardId = await createBoard(server, owner);
    const peer = await RawPeer.open(server, boardId, owner.cookie);
    peer.edit((doc) => doc.transact(() => {
      partsMap(doc).set('s', partToYMap({ id: 's', kind: 'switch', x: 0, y: 0, on: false }, 1));
      for (let i = 0; i < 10; i++) partsMap(doc).set(`l${i}`, partToYMap({ id: `l${i}`, kind: 'lamp', x: 100, y: i * 20 }, i + 2));
      for (let i = 0; i <= LIMITS.maxWires; i++) wiresMap(doc).set(`w${i}`, wireToYMap({ id: `w${i}`, from: 's.out', to: `l${i % 10}.in` }, i + 1));
    }));
    expect(await peer.closed).toEqual({ code: 4413, reason: `board_too_large: ${LIMITS.maxWires + 1} wires (limit ${LIMITS.maxWires})` });
  });

  it('pending (missing-dependency) bytes per room: a flood closes with 4414 and the room never holds more than the limit', async () => {
    const boardId = await createBoard(server, owner);
    const peer = await RawPeer.open(server, boardId, owner.cookie);
    // Updates that depend on one the server never gets: Yjs would keep them all, waiting.
    const hidden = new Y.Doc();
    hidden.getMap('parts').set('base', partToYMap({ id: 'base', kind: 'note', x: 0, y: 0, text: '' }, 1));
    let code = 0;
    for (let i = 0; i < 100 && !code; i++) {
      const sv = Y.encodeStateVector(hidden);
      hidden.getMap<Y.Map<unknown>>('parts').get('base')!.set('text', 'x'.repeat(1000) + i);
      peer.sendUpdate(Y.encodeStateAsUpdate(hidden, sv));
      if ((await peer.roundTrip()) === 'closed') code = (await peer.closed).code;
    }
    expect(code).toBe(4414);
    const room = server.ctx.boardRegistry.rooms.get(boardId);
    expect(room ? pendingBytes(room.doc) : 0).toBeLessThanOrEqual(LIMITS.maxPendingBytes);
  });

  it('awareness state size (4415), client ids per socket (4415) and rate (4429)', async () => {
    const boardId = await createBoard(server, owner);
    const big = await RawPeer.open(server, boardId, owner.cookie);
    big.sendAwareness(awarenessPayload([{ clientId: 9001, clock: 1, state: { pad: 'x'.repeat(LIMITS.maxAwarenessBytes) } }]));
    expect((await big.closed).code).toBe(4415);

    const many = await RawPeer.open(server, boardId, owner.cookie);
    many.sendAwareness(awarenessPayload([1, 2, 3].map((n) => ({ clientId: 9100 + n, clock: 1, state: { n } }))));
    expect(await many.closed).toMatchObject({ code: 4415, reason: expect.stringMatching(/^awareness_too_large: speaks for 3/) as unknown as string });

    const flood = await RawPeer.open(server, boardId, owner.cookie);
    for (let clock = 1; clock <= 10 * LIMITS.awarenessPerSecond; clock++) {
      flood.sendAwareness(awarenessPayload([{ clientId: 9200, clock, state: { cursor: { x: clock, y: 0 } } }]));
    }
    expect((await flood.closed).code).toBe(4429);

    // a well-behaved socket on the same board is untouched
    const calm = await RawPeer.open(server, boardId, owner.cookie);
    calm.sendAwareness(awarenessPayload([{ clientId: 9300, clock: 1, state: { cursor: { x: 1, y: 1 } } }]));
    expect(await calm.roundTrip()).toBe('answered');
    calm.close();
  });
});
