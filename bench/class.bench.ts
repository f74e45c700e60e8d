/**
 * A class on one board, loopback: one leader (the board's owner, a full y-websocket client) and 200
 * guests who all join through one share link (`?share=<token>`, no account, no cookie). The leader's
 * pointer (awareness cursor) moves at 20 Hz while the leader makes 500 edits (moving a part, one every
 * 20 ms). Measures edit→guest latency (every guest, every edit), the server process's peak RSS (the
 * server runs in its own process: this file started with `serve`), and checks at the end that every
 * guest's document equals the leader's. Bounded: the edits stop after 500 or after
 * GATEFOLD_BENCH_SECONDS (default 60), whichever comes first, and convergence is awaited for 10 s at
 * most. Guests are lean protocol clients (sync into a Y.Doc, their presence sent once), as in
 * collab-load.bench.ts: 200 full providers would measure this process rather than the server.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import { createInterface } from 'node:readline';
import WebSocket from 'ws';
import * as Y from 'yjs';
import { WebsocketProvider } from 'y-websocket';
import * as encoding from 'lib0/encoding';
import * as decoding from 'lib0/decoding';
import * as syncProtocol from 'y-protocols/sync';
import type { BenchRow } from './run';
import { addPart, movePart, partsMap } from '../shared/board';
import { quantile, rssMb } from './stats';

const GUESTS = 200;
const EDITS = 500;
const EDIT_EVERY_MS = 20;
const CURSOR_HZ = 20;
const SECONDS = Number(process.env.GATEFOLD_BENCH_SECONDS ?? 60);
const ME = { local: 'class-bench' };

interface ServerInfo {
  url: string;
  room: string;
  ownerCookie: string;
  token: string;
}

const self = fileURLToPath(import.meta.url);

/** The server process: the real app with an owner, one board and one share link. */
async function serve(): Promise<void> {
  const { startTestServer } = await import('../tests/helpers/test-app');
  const { api, createBoard, signUp } = await import('../tests/collab/helpers');
  const server = await startTestServer({ logErrors: false });
  const owner = await signUp(server, 'Mara (Room 14)');
  const boardId = await createBoard(server, owner, 'Larkspur Street Makerspace, Room 14: counter');
  const res = await api(server, 'POST', `/api/boards/${boardId}/share-links`, owner.cookie, {});
  const { link } = (await res.json()) as { link: { token: string } };
  console.log(JSON.stringify({ url: server.url.replace(/^http/, 'ws') + '/collab', room: String(boardId), ownerCookie: owner.cookie, token: link.token } satisfies ServerInfo));
  process.on('SIGTERM', () => void server.close().finally(() => process.exit(0)));
}

if (process.argv[1] === self && process.argv[2] === 'serve') await serve();

function startServer(): Promise<{ child: ChildProcess; info: ServerInfo }> {
  const child = spawn(process.execPath, ['--import', 'tsx', self, 'serve'], { stdio: ['ignore', 'pipe', 'inherit'] });
  return new Promise((resolve, reject) => {
    const lines = createInterface({ input: child.stdout! });
    lines.once('line', (line) => resolve({ child, info: JSON.parse(line) as ServerInfo }));
    child.once('exit', (code) => reject(new Error(`class bench server exited with ${code}`)));
  });
}

/** A lean guest through the share link: sync into a Y.Doc, its presence (display name) sent once. */
function leanGuest(info: ServerInfo, index: number): { doc: Y.Doc; synced: Promise<void>; close(): void } {
  const doc = new Y.Doc();
  const ws = new WebSocket(`${info.url}/${info.room}?share=${encodeURIComponent(info.token)}`);
  const synced = new Promise<void>((resolve, reject) => {
    ws.on('error', reject);
    ws.on('open', () => {
      const enc = encoding.createEncoder();
      encoding.writeVarUint(enc, 0);
      syncProtocol.writeSyncStep1(enc, doc);
      ws.send(encoding.toUint8Array(enc));
      const aw = encoding.createEncoder();
      encoding.writeVarUint(aw, 1);
      const inner = encoding.createEncoder();
      encoding.writeVarUint(inner, 1);
      encoding.writeVarUint(inner, doc.clientID);
      encoding.writeVarUint(inner, 1);
      encoding.writeVarString(inner, JSON.stringify({ user: { id: `g${index}`, name: `Guest ${index}`, color: '#888888' }, cursor: null, selection: [] }));
      encoding.writeVarUint8Array(aw, encoding.toUint8Array(inner));
      ws.send(encoding.toUint8Array(aw));
    });
    ws.on('message', (data: Buffer) => {
      const d = decoding.createDecoder(new Uint8Array(data));
      if (decoding.readVarUint(d) !== 0) return;
      const step = decoding.readVarUint(d);
      if (step === 0) return;
      Y.applyUpdate(doc, decoding.readVarUint8Array(d));
      if (step === 1) resolve();
    });
  });
  return { doc, synced, close: () => ws.close() };
}

interface Result {
  latencies: number[];
  peakRssMb: number;
  edits: number;
  converged: number;
  seconds: number;
}

async function run(): Promise<Result> {
  const { child, info } = await startServer();
  const guests: ReturnType<typeof leanGuest>[] = [];
  let cursorTimer: ReturnType<typeof setInterval> | undefined;
  const doc = new Y.Doc();
  const provider = new WebsocketProvider(info.url, info.room, doc, {
    WebSocketPolyfill: class extends WebSocket {
      constructor(url: string | URL, protocols?: string | string[]) {
        super(url, protocols, { headers: { Cookie: info.ownerCookie } });
      }
    } as never,
    disableBc: true,
  });
  try {
    await new Promise<void>((resolve) => (provider.synced ? resolve() : provider.once('sync', () => resolve())));
    provider.awareness.setLocalState({ user: { id: 'leader', name: 'Mara', color: '#3b82f6' }, cursor: null, selection: [] });
    addPart(doc, { id: 'clk', kind: 'switch', label: 'CLK', x: 0, y: 0, on: false }, ME);
    for (let i = 0; i < GUESTS; i += 25) {
      const batch = Array.from({ length: Math.min(25, GUESTS - i) }, (_, k) => leanGuest(info, i + k));
      guests.push(...batch);
      await Promise.all(batch.map((g) => g.synced));
    }
    const until = async (check: () => boolean, ms: number) => {
      const end = performance.now() + ms;
      while (!check() && performance.now() < end) await new Promise((r) => setTimeout(r, 50));
      return check();
    };
    if (!(await until(() => guests.every((g) => partsMap(g.doc).has('clk')), 10_000))) throw new Error('guests did not receive the first part');

    const sent = new Map<number, number>();
    const latencies: number[] = [];
    for (const g of guests) {
      partsMap(g.doc).observeDeep((events) => {
        const now = performance.now();
        for (const ev of events) {
          if (!(ev instanceof Y.YMapEvent) || !ev.keysChanged.has('x')) continue;
          const t0 = sent.get((ev.target as Y.Map<unknown>).get('x') as number);
          if (t0 !== undefined) latencies.push(now - t0);
        }
      });
    }
    let k = 0;
    cursorTimer = setInterval(() => provider.awareness.setLocalStateField('cursor', { x: (k += 7) % 800, y: (k * 3) % 600 }), 1000 / CURSOR_HZ);
    const started = performance.now();
    let peakRssMb = rssMb(child.pid!);
    let edits = 0;
    while (edits < EDITS && performance.now() - started < SECONDS * 1000) {
      const x = 1000 + edits;
      sent.set(x, performance.now());
      movePart(doc, [{ id: 'clk', x, y: 0 }], ME);
      edits++;
      if (edits % 25 === 0) peakRssMb = Math.max(peakRssMb, rssMb(child.pid!));
      await new Promise((r) => setTimeout(r, EDIT_EVERY_MS));
    }
    const want = Buffer.from(Y.encodeStateVector(doc));
    const same = (g: { doc: Y.Doc }) => want.equals(Buffer.from(Y.encodeStateVector(g.doc))) && JSON.stringify(partsMap(g.doc).toJSON()) === JSON.stringify(partsMap(doc).toJSON());
    await until(() => guests.every(same), 10_000);
    peakRssMb = Math.max(peakRssMb, rssMb(child.pid!));
    const seconds = (performance.now() - started) / 1000;
    return { latencies: latencies.sort((a, b) => a - b), peakRssMb, edits, converged: guests.filter(same).length, seconds };
  } finally {
    if (cursorTimer) clearInterval(cursorTimer);
    guests.forEach((g) => g.close());
    provider.destroy();
    doc.destroy();
    child.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 300));
  }
}

export default async function classBench(): Promise<BenchRow[]> {
  const r = await run();
  const setup = `1 leader + ${GUESTS} guests by one share link, leader's pointer ${CURSOR_HZ} Hz, ${r.edits} edits in ${r.seconds.toFixed(1)} s`;
  const q = (p: number) => quantile(r.latencies, p);
  if (r.converged !== GUESTS) throw new Error(`only ${r.converged} of ${GUESTS} guests converged to the leader's document`);
  return [
    { name: `edit→guest latency median (${setup})`, value: q(0.5), unit: 'ms', note: `${r.latencies.length} samples (of ${r.edits * GUESTS})` },
    { name: 'edit→guest latency p95', value: q(0.95), unit: 'ms', goal: { max: 20 } },
    { name: 'edit→guest latency p99', value: q(0.99), unit: 'ms' },
    { name: 'server peak RSS', value: r.peakRssMb, unit: 'MB' },
    { name: 'guests whose document equals the leader\'s at the end', value: r.converged, unit: 'guests', goal: { min: GUESTS } },
  ];
}
