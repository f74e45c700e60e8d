/**
 * Several servers (docs/decisions/006-several-servers.md): three Gatefold processes on one PostgreSQL
 * and one Redis (Debian's, on loopback ports in a temp folder, as tests/multi-server starts them).
 * - Edit-to-remote latency: 200 moves by one client, each timed until a client on another server has
 *   it, beside the same with both clients on one server of the same cluster.
 * - Throughput of one board: 300 sockets (30 editors, 270 watching sockets), spread over the three
 *   servers; the editors send 50 moves each as fast as their sockets take them; edits per second until
 *   every socket has every edit. Reference: the same 300 sockets all on one server of the cluster.
 * Bounded: about a minute on an idle 2-core machine, loopback only.
 */
import { performance } from 'node:perf_hooks';
import WebSocket from 'ws';
import * as Y from 'yjs';
import type { BenchRow } from './run';
import { addPart, movePart } from '../shared/board';
import { backingServicesMissing } from '../tests/helpers/backing-services';
import { addMember, connectClient, createBoard, signUp, type User } from '../tests/collab/helpers';
import { RawPeer } from '../tests/collab/raw-peer';
import { at, startCluster, type Cluster } from '../tests/multi-server/cluster';
import { quantile } from './stats';

const MOVES = 200;
const EDITORS = 30;
const SOCKETS = 300;
const EDITS_EACH = 50;
const ME = { local: 'bench' };

/** Times MOVES moves by a client on `from` until a client on `to` has each; sorted ms. */
async function latency(cluster: Cluster, owner: User, other: User, from: number, to: number): Promise<number[]> {
  const s = cluster.servers;
  const boardId = await createBoard(at(s[0]), owner, 'Latency across servers');
  await addMember(at(s[0]), owner, boardId, other, 'editor');
  const a = connectClient(at(s[from]), boardId, owner.cookie);
  const b = connectClient(at(s[to]), boardId, other.cookie);
  try {
    await Promise.all([a.synced, b.synced]);
    addPart(a.doc, { id: 'g1', kind: 'nand', inputs: 2, x: 0, y: 0 }, ME);
    const parts = b.doc.getMap<Y.Map<unknown>>('parts');
    const until = (ok: () => boolean) =>
      new Promise<void>((resolve) => {
        const check = () => (ok() ? (parts.unobserveDeep(check), resolve()) : undefined);
        parts.observeDeep(check);
        check();
      });
    await until(() => parts.has('g1'));
    const times: number[] = [];
    for (let i = 1; i <= MOVES; i++) {
      const arrived = until(() => parts.get('g1')?.get('x') === i * 20);
      const t0 = performance.now();
      movePart(a.doc, [{ id: 'g1', x: i * 20, y: 0 }], ME);
      await arrived;
      times.push(performance.now() - t0);
    }
    return times.sort((x, y) => x - y);
  } finally {
    a.destroy();
    b.destroy();
  }
}

/** A socket that only counts the document updates it receives, and when the last one came. */
async function watcher(url: string, boardId: number, cookie: string): Promise<{ count: () => number; lastAt: () => number; close(): void }> {
  const ws = new WebSocket(url.replace(/^http/, 'ws') + `/collab/${boardId}`, { headers: { Cookie: cookie } });
  let n = 0;
  let last = 0;
  ws.on('message', (data: Buffer) => {
    // [0 sync, 2 update, …]: one message per edit the room applied
    if (data[0] === 0 && data[1] === 2) {
      n++;
      last = performance.now();
    }
  });
  await new Promise<void>((resolve, reject) => {
    ws.once('open', () => resolve());
    ws.once('error', reject);
  });
  return { count: () => n, lastAt: () => last, close: () => ws.terminate() };
}

/** 300 sockets on one board (placed by `serverOf(i)`); edits per second until all have every edit. */
async function throughput(cluster: Cluster, owner: User, serverOf: (i: number) => number): Promise<{ perSecond: number; seconds: number; stored: number }> {
  const s = cluster.servers;
  const boardId = await createBoard(at(s[0]), owner, 'Throughput');
  const editors: RawPeer[] = [];
  for (let i = 0; i < EDITORS; i++) editors.push(await RawPeer.open(at(s[serverOf(i)]), boardId, owner.cookie));
  const watchers: Awaited<ReturnType<typeof watcher>>[] = [];
  for (let i = EDITORS; i < SOCKETS; i++) watchers.push(await watcher(s[serverOf(i)].url, boardId, owner.cookie));
  try {
    const ids = editors.map((e, i) => {
      let id = '';
      e.edit((doc) => (id = addPart(doc, { id: '', kind: 'not', x: i * 40, y: 0 }, ME)));
      return id;
    });
    const firstEdits = EDITORS;
    const until = async (ok: () => boolean, ms: number) => {
      const end = Date.now() + ms;
      while (!ok() && Date.now() < end) await new Promise((r) => setTimeout(r, 20));
      return ok();
    };
    await until(() => watchers.every((w) => w.count() >= firstEdits), 30_000);
    const base = watchers.map((w) => w.count());
    const total = EDITORS * EDITS_EACH;
    const t0 = performance.now();
    await Promise.all(
      editors.map(async (e, i) => {
        for (let k = 1; k <= EDITS_EACH; k++) {
          e.edit((doc) => movePart(doc, [{ id: ids[i], x: i * 40, y: k * 10 }], ME));
          if (k % 10 === 0) await new Promise((r) => setImmediate(r));
        }
      }),
    );
    const all = await until(() => watchers.every((w, i) => w.count() - base[i] >= total), 300_000);
    const seconds = (Math.max(...watchers.map((w) => w.lastAt())) - t0) / 1000;
    if (!all) {
      const got = watchers.map((w, i) => w.count() - base[i]);
      throw new Error(`not every socket got all ${total} edits within 300 s (fewest ${Math.min(...got)}, most ${Math.max(...got)}; ${serverOf(1) === serverOf(0) ? 'one server' : 'three servers'})`);
    }
    await new Promise((r) => setTimeout(r, 1000));
    const row = (await cluster.db('board_updates').where({ board_id: boardId }).count({ n: '*' }).first()) as { n: string | number };
    return { perSecond: total / seconds, seconds, stored: Number(row.n) };
  } finally {
    for (const e of editors) e.ws.terminate();
    for (const w of watchers) w.close();
  }
}

export default async function multiServerBench(): Promise<BenchRow[]> {
  const missing = backingServicesMissing();
  if (missing) return [{ name: 'skipped', value: NaN, unit: '', note: missing }];
  const cluster = await startCluster(3, { RATE_LIMIT_SIGNUP: '10000' });
  try {
    const s = cluster.servers;
    const owner = await signUp(at(s[0]), 'Bench owner');
    const other = await signUp(at(s[1]), 'Bench editor');
    const same = await latency(cluster, owner, other, 0, 0);
    const across = await latency(cluster, owner, other, 0, 1);
    const spread = await throughput(cluster, owner, (i) => i % 3);
    const one = await throughput(cluster, owner, () => 0);
    const note = `${MOVES} moves, Node clients, loopback; one PostgreSQL, one Redis`;
    return [
      { name: 'edit→remote latency across servers, median', value: quantile(across, 0.5), unit: 'ms', goal: { max: 25 }, reference: { name: 'both on one server', value: quantile(same, 0.5) }, note },
      { name: 'edit→remote latency across servers, p95', value: quantile(across, 0.95), unit: 'ms', goal: { max: 50 }, reference: { name: 'both on one server', value: quantile(same, 0.95) }, note },
      {
        name: `one board, ${SOCKETS} sockets over 3 servers: edits/s to every socket`, value: spread.perSecond, unit: 'edits/s', goal: { min: 200 },
        reference: { name: `${SOCKETS} sockets on one server`, value: one.perSecond },
        note: `${EDITORS} editors × ${EDITS_EACH} moves in ${spread.seconds.toFixed(1)} s (one server: ${one.seconds.toFixed(1)} s); rows stored ${spread.stored} (one server: ${one.stored})`,
      },
    ];
  } finally {
    await cluster.close();
  }
}
