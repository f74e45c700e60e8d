/**
 * Random well-formed but mostly invalid Yjs edits (fast-check), each sent by an editor over a real
 * socket to the real server: the server refuses exactly those that would leave a shape problem
 * (4400), applies the others, stays up, and its export stays a valid board file.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import * as Y from 'yjs';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { checkDoc, parseBoardFile } from '../../shared/board';
import { connectClient, createBoard, exportText, signUp, type User } from './helpers';
import { RawPeer } from './raw-peer';
import { applyRawEdits, rawEdit, startingBoard } from './random-edits';

let server: TestServer;
let owner: User;

beforeAll(async () => {
  server = await startTestServer({ logErrors: false });
  owner = await signUp(server, 'Owner');
});
afterAll(async () => {
  await server.close();
});

describe('random raw edits from an editor', () => {
  it('are refused (4400) exactly when they would break the board; the export stays valid', async () => {
    const boardId = await createBoard(server, owner, 'Property board');
    const seed = connectClient(server, boardId, owner.cookie);
    await seed.synced;
    startingBoard(seed.doc);
    const ready = await RawPeer.open(server, boardId, owner.cookie);
    while (!ready.doc.getMap('wires').size) await ready.roundTrip();
    ready.close();
    seed.destroy();
    let peer = await RawPeer.open(server, boardId, owner.cookie);
    const seen = { refused: 0, applied: 0 };
    await fc.assert(
      fc.asyncProperty(fc.array(rawEdit, { minLength: 1, maxLength: 3 }), async (edits) => {
        if (!peer.isOpen) peer = await RawPeer.open(server, boardId, owner.cookie);
        // what the edit would make, judged on a copy of the client's board
        const probe = new Y.Doc();
        Y.applyUpdate(probe, Y.encodeStateAsUpdate(peer.doc));
        applyRawEdits(probe, edits);
        const breaks = checkDoc(probe).some((p) => p.kind === 'shape');
        probe.destroy();
        peer.edit((doc) => applyRawEdits(doc, edits));
        const result = await peer.roundTrip();
        if (result === 'closed') expect(await peer.closed).toMatchObject({ code: 4400, reason: breaks ? expect.any(String) as unknown as string : 'not refused' });
        expect(result === 'closed').toBe(breaks);
        seen[breaks ? 'refused' : 'applied']++;
        const room = server.ctx.boardRegistry.rooms.get(boardId)!;
        expect(checkDoc(room.doc).filter((p) => p.kind === 'shape')).toEqual([]);
      }),
      { numRuns: 120, seed: 4400 },
    );
    // both kinds happened, or the property proved little
    expect(seen.refused).toBeGreaterThan(10);
    expect(seen.applied).toBeGreaterThan(10);
    peer.close();
    const parsed = parseBoardFile(JSON.parse(await exportText(server, owner, boardId)));
    expect(parsed.ok ? [] : parsed.problems).toEqual([]);
  });
});
