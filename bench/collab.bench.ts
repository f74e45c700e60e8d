/**
 * Edit-to-remote latency: two Node clients on one board through the real server (real sockets,
 * real SQLite file); 200 moves by one client, each timed until the other client's document has it.
 * Also: how long a board with many stored updates takes to load and to compact.
 */
import { performance } from 'node:perf_hooks';
import * as Y from 'yjs';
import type { BenchRow } from './run';
import { startTestServer } from '../tests/helpers/test-app';
import { addMember, connectClient, createBoard, signUp } from '../tests/collab/helpers';
import { addPart, movePart } from '../shared/board';
import { loadBoardDoc } from '../server/boards-live';
import { quantile } from './stats';

const EDITS = 200;
const ME = { local: 'bench' };

export default async function collabBench(): Promise<BenchRow[]> {
  const server = await startTestServer();
  try {
    const a = await signUp(server, 'Bench A');
    const b = await signUp(server, 'Bench B');
    const boardId = await createBoard(server, a, 'Latency bench');
    await addMember(server, a, boardId, b, 'editor');
    const ca = connectClient(server, boardId, a.cookie);
    const cb = connectClient(server, boardId, b.cookie);
    await Promise.all([ca.synced, cb.synced]);
    addPart(ca.doc, { id: 'g1', kind: 'nand', inputs: 2, x: 0, y: 0 }, ME);
    const partsB = cb.doc.getMap<Y.Map<unknown>>('parts');
    await new Promise<void>((resolve) => {
      const check = () => (partsB.has('g1') ? (partsB.unobserveDeep(check), resolve()) : undefined);
      partsB.observeDeep(check);
      check();
    });
    const times: number[] = [];
    for (let i = 1; i <= EDITS; i++) {
      const arrived = new Promise<void>((resolve) => {
        const check = () => {
          if (partsB.get('g1')?.get('x') === i * 20) {
            partsB.unobserveDeep(check);
            resolve();
          }
        };
        partsB.observeDeep(check);
      });
      const t0 = performance.now();
      movePart(ca.doc, [{ id: 'g1', x: i * 20, y: 0 }], ME);
      await arrived;
      times.push(performance.now() - t0);
    }
    ca.destroy();
    cb.destroy();
    await server.ctx.boardRegistry.flushAll();
    await new Promise((r) => setTimeout(r, 100)); // let the room unload after its last socket

    const sorted = [...times].sort((x, y) => x - y);
    const t1 = performance.now();
    const loaded = await loadBoardDoc(server.ctx.boardRegistry.store, boardId);
    const loadMs = performance.now() - t1;
    loaded.doc.destroy();
    const t2 = performance.now();
    await server.ctx.boardRegistry.compactStored(boardId);
    const compactMs = performance.now() - t2;
    return [
      { name: `edit→remote latency, median (${EDITS} moves)`, value: quantile(sorted, 0.5), unit: 'ms', note: 'two Node clients, real server and SQLite' },
      { name: `edit→remote latency, p95 (${EDITS} moves)`, value: quantile(sorted, 0.95), unit: 'ms' },
      { name: `load board from ${loaded.rows} stored updates`, value: loadMs, unit: 'ms' },
      { name: `compact ${loaded.rows} stored updates to 1`, value: compactMs, unit: 'ms' },
    ];
  } finally {
    await server.close();
  }
}
