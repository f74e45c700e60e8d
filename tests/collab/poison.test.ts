import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { startTestServer, type TestServer } from '../helpers/test-app';
import { addPart, checkDoc, metaMap, parseBoardFile, partToYMap, partsMap, relabelPart, wireToYMap, wiresMap } from '../../shared/board';
import { addMember, connectClient, createBoard, exportText, signUp, waitFor, type Client, type User } from './helpers';
import { RawPeer } from './raw-peer';

const ME = { local: 'test' };
const dir = mkdtempSync(join(tmpdir(), 'gatefold-collab-poison-'));
const databaseFile = join(dir, 'poison.sqlite');
let server: TestServer;
let owner: User;
let editor: User;
let boardId: number;
let witness: Client;

/** A part map with arbitrary fields, bypassing the edits' checks (what a hostile client can send). */
function rawPart(fields: Record<string, unknown>): Y.Map<unknown> {
  const m = new Y.Map<unknown>();
  for (const [k, v] of Object.entries(fields)) m.set(k, v);
  return m;
}

/** Every poison update of the issue, each a raw Yjs edit an editor's client could make. */
const POISON: [string, (doc: Y.Doc) => void][] = [
  ["parts['x'] set to a string", (doc) => partsMap(doc).set('x', 'str' as never)],
  ['a wired part of an unknown kind', (doc) => doc.transact(() => {
    partsMap(doc).set('u1', rawPart({ id: 'u1', kind: 'flux-capacitor', x: 0, y: 0, order: 99 }) as never);
    wiresMap(doc).set('wu', wireToYMap({ id: 'wu', from: 'g1.out', to: 'u1.in0' }, 99));
  })],
  ['a number in wires', (doc) => wiresMap(doc).set('w9', 42 as never)],
  ['x: "left"', (doc) => partsMap(doc).get('g1')!.set('x', 'left')],
  ['inputs: 1000', (doc) => partsMap(doc).get('g1')!.set('inputs', 1000)],
  ['a part without a kind', (doc) => partsMap(doc).set('nokind', rawPart({ id: 'nokind', x: 0, y: 0, order: 50 }) as never)],
  ['a 100,000-character title', (doc) => metaMap(doc).set('title', 'T'.repeat(100_000))],
  ['a label that is not an identifier on an input', (doc) => partsMap(doc).get('sw1')!.set('label', 'A B')],
  ['a part map whose id is not its key', (doc) => partsMap(doc).set('p1', partToYMap({ id: 'p2', kind: 'lamp', x: 0, y: 0 }, 60) as never)],
  ['content outside parts, wires and meta', (doc) => doc.getMap('elsewhere').set('junk', 'x'.repeat(1000))],
  ['list content in the parts map', (doc) => {
    const other = new Y.Doc();
    other.getArray('parts').push(['junk']);
    Y.applyUpdate(doc, Y.encodeStateAsUpdate(other));
  }],
];

/** The export passes the import's own check, and the server's document has no shape problem. */
async function expectValid(): Promise<void> {
  const text = await exportText(server, owner, boardId);
  const parsed = parseBoardFile(JSON.parse(text));
  expect(parsed.ok ? [] : parsed.problems).toEqual([]);
  const room = server.ctx.boardRegistry.rooms.get(boardId);
  if (room) expect(checkDoc(room.doc).filter((p) => p.kind === 'shape' && p.where !== 'root')).toEqual([]);
}

beforeAll(async () => {
  server = await startTestServer({ databaseFile, logErrors: false });
  [owner, editor] = await Promise.all([signUp(server, 'Owner'), signUp(server, 'Editor')]);
  boardId = await createBoard(server, owner, 'Poison board');
  await addMember(server, owner, boardId, editor, 'editor');
  witness = connectClient(server, boardId, owner.cookie);
  await witness.synced;
  addPart(witness.doc, { id: 'sw1', kind: 'switch', label: 'A', x: 0, y: 0, on: false }, ME);
  addPart(witness.doc, { id: 'g1', kind: 'nand', inputs: 2, x: 100, y: 0 }, ME);
  await waitFor(async () => (await exportText(server, owner, boardId)).includes('"g1"'), 'the first parts');
});
afterAll(async () => {
  witness?.destroy();
  await server?.close();
  rmSync(dir, { recursive: true, force: true });
});

describe('poison updates from an editor', () => {
  it.each(POISON)('%s: the socket is closed with 4400, nothing is applied, the others keep working', async (what, poison) => {
    const peer = await RawPeer.open(server, boardId, editor.cookie);
    const before = JSON.stringify(server.ctx.boardRegistry.rooms.get(boardId)!.doc.toJSON());
    peer.edit(poison);
    const closed = await peer.closed;
    expect(closed.code).toBe(4400);
    expect(closed.reason).toMatch(/^invalid_board: /);
    expect(JSON.stringify(server.ctx.boardRegistry.rooms.get(boardId)!.doc.toJSON())).toBe(before);
    // the room still takes ordinary edits and passes them on
    const x = 200 + POISON.findIndex(([w]) => w === what);
    const other = await RawPeer.open(server, boardId, editor.cookie);
    other.edit((doc) => partsMap(doc).get('g1')!.set('x', x));
    await waitFor(() => partsMap(witness.doc).get('g1')?.get('x') === x, 'an ordinary edit after the poison');
    expect(witness.provider.wsconnected).toBe(true);
    other.close();
    await expectValid();
  });

  it('duplicate labels (two inputs named alike) are repaired, not refused, as after a concurrent merge', async () => {
    const peer = await RawPeer.open(server, boardId, editor.cookie);
    peer.edit((doc) => partsMap(doc).set('sw2', partToYMap({ id: 'sw2', kind: 'switch', label: 'A', x: 0, y: 40, on: false }, 70) as never));
    expect(await peer.roundTrip()).toBe('answered');
    await waitFor(() => partsMap(witness.doc).get('sw2')?.get('label') === 'A_2', 'the repaired label');
    peer.close();
    await expectValid();
  });

  it('bit-flipped updates: each is refused or is a valid edit; the board stays valid', async () => {
    // A valid update: a gate and a wire to it. Flipping bits of it makes garbage that still often decodes.
    const scratch = new Y.Doc();
    Y.applyUpdate(scratch, Y.encodeStateAsUpdate(witness.doc));
    const sv = Y.encodeStateVector(scratch);
    scratch.transact(() => {
      partsMap(scratch).set('g9', partToYMap({ id: 'g9', kind: 'and', inputs: 2, x: 40, y: 80 }, 80));
      wiresMap(scratch).set('w9', wireToYMap({ id: 'w9', from: 'sw1.out', to: 'g9.in0' }, 80));
    });
    const good = Y.encodeStateAsUpdate(scratch, sv);
    let seed = 12345; // a fixed seed: the same 100 flips every run
    const rand = () => ((seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x80000000);
    const outcomes = new Map<number | 'applied', number>();
    for (let i = 0; i < 100; i++) {
      const bad = good.slice();
      for (let f = 0; f < 1 + (i % 3); f++) {
        const at = Math.floor(rand() * bad.length);
        bad[at] ^= 1 << Math.floor(rand() * 8);
      }
      const peer = await RawPeer.open(server, boardId, editor.cookie);
      peer.sendUpdate(bad);
      const result = await peer.roundTrip();
      const key = result === 'closed' ? (await peer.closed).code : 'applied';
      outcomes.set(key, (outcomes.get(key) ?? 0) + 1);
      if (result === 'answered') peer.close();
      // remove whatever a flip let in, so that the next flip starts from the same board
      const room = server.ctx.boardRegistry.rooms.get(boardId)!;
      expect(checkDoc(room.doc).filter((p) => p.kind === 'shape' && p.where !== 'root')).toEqual([]);
    }
    expect([...outcomes.keys()].every((k) => k === 'applied' || k === 1007 || k === 4400)).toBe(true);
    expect((outcomes.get(1007) ?? 0) + (outcomes.get(4400) ?? 0)).toBeGreaterThan(0);
    await expectValid();
  });

  it('after a restart the stored board loads valid, without any poison', async () => {
    await server.ctx.boardRegistry.flushAll();
    const beforeRestart = await exportText(server, owner, boardId);
    witness.destroy();
    await server.close();
    server = await startTestServer({ databaseFile, logErrors: false });
    const reloaded = await exportText(server, owner, boardId);
    expect(reloaded).toBe(beforeRestart);
    const parsed = parseBoardFile(JSON.parse(reloaded));
    expect(parsed.ok).toBe(true);
    for (const bad of ['flux-capacitor', 'nokind', '"left"', 'TTTTTTTTTT', '1000']) expect(reloaded).not.toContain(bad);
    // and a live room opened on it finds nothing to quarantine
    witness = connectClient(server, boardId, owner.cookie);
    await witness.synced;
    expect(server.ctx.boardRegistry.rooms.get(boardId)!.quarantine).toBeNull();
    relabelPart(witness.doc, 'sw1', 'B', ME);
    await waitFor(async () => (await exportText(server, owner, boardId)).includes('"B"'), 'an edit after the restart');
  });
});
