/**
 * What checking an editor's update costs the room (server/boards-live/update-guard.ts), on a board of
 * 1,000 parts and 1,000 wires: 500 one-part moves and 100 part additions, each as its own update,
 * (a) applied with no check (the room before), (b) checked in the shadow document — what was
 * touched only — then applied (the room now), (c) applied and followed by a full checkDoc of the
 * whole board (what checking without the shadow's touched set would cost).
 */
import { performance } from 'node:perf_hooks';
import WebSocket from 'ws';
import * as Y from 'yjs';
import type { BenchRow } from './run';
import { addPart, checkDoc, connect, movePart } from '../shared/board';
import { UpdateGuard } from '../server/boards-live/update-guard';
import { DEFAULT_COLLAB_OPTIONS } from '../server/boards-live';

const PARTS = 1000;
const ME = { local: 'check-bench' };

function bigBoard(): Y.Doc {
  const doc = new Y.Doc();
  for (let i = 0; i < PARTS / 2; i++) {
    addPart(doc, { id: `s${i}`, kind: 'switch', label: `S${i}`, x: 0, y: i * 40, on: false }, ME);
    addPart(doc, { id: `g${i}`, kind: 'and', inputs: 2, x: 200, y: i * 40 }, ME);
    connect(doc, `s${i}.out`, `g${i}.in0`, ME);
    connect(doc, `s${i}.outn`, `g${i}.in1`, ME);
  }
  return doc;
}

/** The updates an editor's client would send: one per move or addition. */
function editorUpdates(base: Y.Doc): Uint8Array[] {
  const editor = new Y.Doc();
  Y.applyUpdate(editor, Y.encodeStateAsUpdate(base));
  const out: Uint8Array[] = [];
  editor.on('update', (u: Uint8Array) => out.push(u));
  for (let i = 0; i < 500; i++) movePart(editor, [{ id: `g${i % (PARTS / 2)}`, x: 220 + i, y: 40 }], ME);
  for (let i = 0; i < 100; i++) addPart(editor, { id: `n${i}`, kind: 'not', x: 400, y: i * 40 }, ME);
  return out;
}

function perUpdate(updates: Uint8Array[], run: (u: Uint8Array) => void): number {
  const t0 = performance.now();
  for (const u of updates) run(u);
  return ((performance.now() - t0) / updates.length) * 1000;
}

export default async function collabCheckBench(): Promise<BenchRow[]> {
  const seed = bigBoard();
  const updates = editorUpdates(seed);
  const state = Y.encodeStateAsUpdate(seed);
  const fresh = () => {
    const d = new Y.Doc();
    Y.applyUpdate(d, state);
    return d;
  };
  // an origin the guard recognises as a socket's (its shadow already has the update)
  const socket = Object.create(WebSocket.prototype) as WebSocket;

  const plain = fresh();
  const none = perUpdate(updates, (u) => Y.applyUpdate(plain, u, socket));

  const guarded = fresh();
  const guard = new UpdateGuard(guarded, () => DEFAULT_COLLAB_OPTIONS);
  const checked = perUpdate(updates, (u) => {
    guard.check(u);
    Y.applyUpdate(guarded, u, socket);
  });
  guard.destroy();

  const full = fresh();
  const fullCheck = perUpdate(updates, (u) => {
    Y.applyUpdate(full, u, socket);
    if (checkDoc(full).some((p) => p.kind === 'shape')) throw new Error('the bench board became invalid');
  });
  const ratio = (a: number) => `${(a / none).toFixed(1)}× of no check`;
  return [
    { name: `apply an editor's update, no check (${PARTS} parts, ${PARTS} wires)`, value: none, unit: 'µs/update', note: `${updates.length} updates: 500 moves, 100 additions` },
    { name: 'check in the shadow (touched entries only), then apply', value: checked, unit: 'µs/update', note: ratio(checked) },
    { name: 'apply, then full checkDoc of the board', value: fullCheck, unit: 'µs/update', note: ratio(fullCheck) },
  ];
}
