/**
 * Snapshots: restore of a 1,000-part board, from the owner's request to both connected clients holding
 * the snapshot's content (real server, sockets and SQLite file; target ≤ 300 ms on loopback), and the
 * stored size of a snapshot per 1,000 parts.
 */
import { performance } from 'node:perf_hooks';
import type * as Y from 'yjs';
import type { BenchRow } from './run';
import { startTestServer } from '../tests/helpers/test-app';
import { addMember, api, connectClient, createBoard, signUp, waitFor, type Client } from '../tests/collab/helpers';
import { docToBoard, movePart, partsMap, replaceWithBoard, type BoardFile, type Part } from '../shared/board';
import { snapshotStateBytes } from '../server/db/snapshots';

const PARTS = 1000;
const RUNS = 6;
const ME = { local: 'bench' };

function bigBoard(): BoardFile {
  const parts: Part[] = Array.from({ length: PARTS }, (_, i) => ({ id: `g${i}`, kind: 'nand', inputs: 2, x: (i % 40) * 140, y: Math.floor(i / 40) * 80 }));
  const wires = Array.from({ length: PARTS - 1 }, (_, i) => ({ id: `w${i}`, from: `g${i}.out`, to: `g${i + 1}.in0` }));
  return { format: 'gatefold-board', version: 1, title: 'Thousand gates', family: 'ideal', parts, wires };
}

/** Resolves with the time when `doc` first satisfies `done` (checked after each update). */
function whenDone(doc: Y.Doc, done: () => boolean): Promise<number> {
  return new Promise((resolve) => {
    const check = () => {
      if (!done()) return;
      doc.off('update', check);
      resolve(performance.now());
    };
    doc.on('update', check);
  });
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

export default async function snapshotsBench(): Promise<BenchRow[]> {
  const server = await startTestServer();
  const clients: Client[] = [];
  try {
    const owner = await signUp(server, 'Bench owner');
    const editor = await signUp(server, 'Bench editor');
    const boardId = await createBoard(server, owner, 'Thousand gates');
    await addMember(server, owner, boardId, editor, 'editor');
    const a = connectClient(server, boardId, owner.cookie);
    const b = connectClient(server, boardId, editor.cookie);
    clients.push(a, b);
    await Promise.all([a.synced, b.synced]);
    const board = bigBoard();
    replaceWithBoard(a.doc, board, ME);
    await waitFor(() => partsMap(b.doc).size === PARTS, 'the board on the second client', 30_000);

    const take = await api(server, 'POST', `/api/boards/${boardId}/snapshots`, owner.cookie, { name: 'S' });
    const s = ((await take.json()) as { snapshot: { id: number } }).snapshot;
    const stateBytes = await snapshotStateBytes(server.ctx.db, s.id);
    const thumb = await (await api(server, 'GET', `/api/boards/${boardId}/snapshots/${s.id}/thumbnail.svg`, owner.cookie)).text();

    const times: number[] = [];
    const edits: number[] = [];
    for (let run = 0; run < RUNS; run++) {
      // every part moved: the restore has to move all 1,000 back
      const last = board.parts[PARTS - 1];
      const te = performance.now();
      const moved = whenDone(b.doc, () => partsMap(b.doc).get(last.id)?.get('x') === last.x + 20 * (run + 1));
      movePart(a.doc, board.parts.map((p) => ({ id: p.id, x: p.x + 20 * (run + 1), y: p.y })), ME);
      edits.push((await moved) - te);
      const back = (c: Client) => () => partsMap(c.doc).get(last.id)?.get('x') === last.x && partsMap(c.doc).get('g0')?.get('x') === 0;
      const t0 = performance.now();
      const arrived = Promise.all([whenDone(a.doc, back(a)), whenDone(b.doc, back(b))]);
      const res = await api(server, 'POST', `/api/boards/${boardId}/snapshots/${s.id}/restore`, owner.cookie);
      if (res.status !== 200) throw new Error(`restore answered ${res.status}`);
      const [ta, tb] = await arrived;
      times.push(Math.max(ta, tb) - t0);
      const expected = JSON.stringify(docToBoard(a.doc));
      if (expected !== JSON.stringify({ ...board, title: 'Thousand gates' }) || JSON.stringify(docToBoard(b.doc)) !== expected) throw new Error('clients did not converge on the snapshot');
    }
    return [
      {
        name: `restore ${PARTS}-part board, request → both clients converged (median of ${RUNS})`, value: median(times), unit: 'ms', goal: { max: 300 },
        reference: { name: `a client moving all ${PARTS} parts → the other client`, value: median(edits), unit: 'ms' },
        note: `max ${Math.max(...times).toFixed(0)} ms; clients in the server's process; the before-restore state is captured first and stored after the change is sent`,
      },
      { name: `snapshot state per ${PARTS} parts (+${PARTS - 1} wires)`, value: stateBytes / 1024, unit: 'KiB', note: 'full Yjs state as stored' },
      { name: `snapshot thumbnail per ${PARTS} parts`, value: thumb.length / 1024, unit: 'KiB', note: 'SVG, outline detail above 150 parts' },
    ];
  } finally {
    clients.forEach((c) => c.destroy());
    await server.close();
  }
}
