/**
 * Load on one board, against Gatefold's server and against the protocol's bare reference server
 * (@y/websocket-server), side by side: 30 editors (y-websocket clients) and 200 viewers, each editor
 * moving its cursor at 5 Hz and moving a part once a second, for GATEFOLD_BENCH_SECONDS (default 60)
 * per server. Measures edit→viewer latency (every viewer, every edit, after a 2 s warm-up), the server
 * process's peak RSS (it runs in its own process, bench/collab-load-server.ts), and the messages each
 * viewer receives per second. Loopback only. All clients share this process, so viewers are lean
 * protocol clients (sync into a Y.Doc, their own presence state renewed every 15 s as y-protocols
 * does, presence they receive counted, not parsed): 200 full providers would measure this process.
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

const EDITORS = 30;
const VIEWERS = 200;
const CURSOR_HZ = 5;
const SECONDS = Number(process.env.GATEFOLD_BENCH_SECONDS ?? 60);
const ME = { local: 'load-bench' };

interface ServerInfo {
  url: string;
  room: string;
  editorCookie: string;
  viewerCookie: string;
}

interface RunResult {
  latencies: number[];
  peakRssMb: number;
  viewerMsgsPerSec: number;
  edits: number;
}

let received = 0;
/** A ws client with the account's cookie that counts what it receives. */
function socketClass(cookie: string, counted: boolean) {
  return class BenchSocket extends WebSocket {
    constructor(url: string | URL, protocols?: string | string[]) {
      super(url, protocols, { headers: cookie ? { Cookie: cookie } : {} });
      if (counted) this.on('message', () => received++);
    }
  };
}

function startServer(which: 'gatefold' | 'reference'): Promise<{ child: ChildProcess; info: ServerInfo }> {
  const script = fileURLToPath(new URL('./collab-load-server.ts', import.meta.url));
  const child = spawn(process.execPath, ['--import', 'tsx', script, which], { stdio: ['ignore', 'pipe', 'inherit'] });
  return new Promise((resolve, reject) => {
    const lines = createInterface({ input: child.stdout! });
    lines.once('line', (line) => resolve({ child, info: JSON.parse(line) as ServerInfo }));
    child.once('exit', (code) => reject(new Error(`${which} server exited with ${code}`)));
  });
}

function client(info: ServerInfo, cookie: string, counted = false): { doc: Y.Doc; provider: WebsocketProvider; synced: Promise<void> } {
  const doc = new Y.Doc();
  const provider = new WebsocketProvider(info.url, info.room, doc, { WebSocketPolyfill: socketClass(cookie, counted) as never, disableBc: true });
  const synced = new Promise<void>((resolve) => (provider.synced ? resolve() : provider.once('sync', () => resolve())));
  return { doc, provider, synced };
}

/** A lean viewer: the sync protocol into a Y.Doc, its presence sent and renewed, received presence counted. */
function leanViewer(info: ServerInfo, index: number): { doc: Y.Doc; synced: Promise<void>; close(): void } {
  const doc = new Y.Doc();
  const ws = new WebSocket(`${info.url}/${info.room}`, { headers: info.viewerCookie ? { Cookie: info.viewerCookie } : {} });
  let clock = 0;
  const presence = () => {
    const enc = encoding.createEncoder();
    encoding.writeVarUint(enc, 1);
    const inner = encoding.createEncoder();
    encoding.writeVarUint(inner, 1);
    encoding.writeVarUint(inner, doc.clientID);
    encoding.writeVarUint(inner, ++clock);
    encoding.writeVarString(inner, JSON.stringify({ user: { id: `v${index}`, name: `Viewer ${index}`, color: '#888888' }, cursor: null, selection: [] }));
    encoding.writeVarUint8Array(enc, encoding.toUint8Array(inner));
    ws.send(encoding.toUint8Array(enc));
  };
  const renew = setInterval(() => ws.readyState === WebSocket.OPEN && presence(), 15_000);
  const synced = new Promise<void>((resolve) => {
    ws.on('open', () => {
      const enc = encoding.createEncoder();
      encoding.writeVarUint(enc, 0);
      syncProtocol.writeSyncStep1(enc, doc);
      ws.send(encoding.toUint8Array(enc));
      presence();
    });
    ws.on('message', (data: Buffer) => {
      received++;
      const d = decoding.createDecoder(new Uint8Array(data));
      if (decoding.readVarUint(d) !== 0) return;
      const step = decoding.readVarUint(d);
      if (step === 0) return;
      Y.applyUpdate(doc, decoding.readVarUint8Array(d));
      if (step === 1) resolve();
    });
  });
  return { doc, synced, close: () => (clearInterval(renew), ws.close()) };
}

async function run(which: 'gatefold' | 'reference'): Promise<RunResult> {
  const { child, info } = await startServer(which);
  const all: ReturnType<typeof client>[] = [];
  const lean: ReturnType<typeof leanViewer>[] = [];
  let measuring = false;
  const timers: ReturnType<typeof setInterval>[] = [];
  try {
    const editors = Array.from({ length: EDITORS }, () => client(info, info.editorCookie));
    all.push(...editors);
    await Promise.all(editors.map((e) => e.synced));
    editors.forEach((e, i) => e.provider.awareness.setLocalState({ user: { id: `e${i}`, name: `Editor ${i}`, color: '#3b82f6' }, cursor: null, selection: [] }));
    for (let i = 0; i < EDITORS; i++) addPart(editors[0].doc, { id: `p${i}`, kind: 'not', x: 0, y: i * 40 }, ME);
    const viewers: ReturnType<typeof leanViewer>[] = [];
    for (let i = 0; i < VIEWERS; i += 25) {
      const batch = Array.from({ length: Math.min(25, VIEWERS - i) }, (_, k) => leanViewer(info, i + k));
      viewers.push(...batch);
      await Promise.all(batch.map((v) => v.synced));
    }
    lean.push(...viewers);
    await new Promise<void>((resolve) => {
      const check = setInterval(() => {
        if (!viewers.every((v) => partsMap(v.doc).size === EDITORS)) return;
        clearInterval(check);
        resolve();
      }, 50);
    });

    const sent = new Map<number, number>();
    const latencies: number[] = [];
    for (const v of viewers) {
      partsMap(v.doc).observeDeep((events) => {
        const now = performance.now();
        for (const ev of events) {
          if (!(ev instanceof Y.YMapEvent) || !ev.keysChanged.has('x')) continue;
          const t0 = sent.get((ev.target as Y.Map<unknown>).get('x') as number);
          if (t0 !== undefined && measuring) latencies.push(now - t0);
        }
      });
    }
    let seq = 1000;
    let edits = 0;
    editors.forEach((e, i) => {
      // staggered so that edits and cursor moves spread over the second
      setTimeout(() => {
        timers.push(setInterval(() => {
          const x = ++seq;
          sent.set(x, performance.now());
          movePart(e.doc, [{ id: `p${i}`, x, y: i * 40 }], ME);
          edits++;
        }, 1000));
        let k = 0;
        timers.push(setInterval(() => e.provider.awareness.setLocalStateField('cursor', { x: (k += 7) % 800, y: (i * 13 + k) % 600 }), 1000 / CURSOR_HZ));
      }, (1000 * i) / EDITORS);
    });
    await new Promise((r) => setTimeout(r, 2000)); // warm-up: every editor's timers are running
    received = 0;
    measuring = true;
    const started = performance.now();
    let peakRssMb = rssMb(child.pid!);
    await new Promise<void>((resolve) => {
      const sample = setInterval(() => {
        peakRssMb = Math.max(peakRssMb, rssMb(child.pid!));
        if (performance.now() - started < SECONDS * 1000) return;
        clearInterval(sample);
        resolve();
      }, 1000);
    });
    measuring = false;
    const elapsed = (performance.now() - started) / 1000;
    const viewerMsgsPerSec = received / VIEWERS / elapsed;
    timers.forEach(clearInterval);
    return { latencies: [...latencies].sort((a, b) => a - b), peakRssMb, viewerMsgsPerSec, edits };
  } finally {
    timers.forEach(clearInterval);
    lean.forEach((v) => v.close());
    for (const c of all) {
      c.provider.destroy();
      c.doc.destroy();
    }
    child.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 300));
  }
}

export default async function collabLoadBench(): Promise<BenchRow[]> {
  const ours = await run('gatefold');
  const ref = await run('reference');
  const setup = `${EDITORS} editors + ${VIEWERS} viewers, cursors ${CURSOR_HZ} Hz, ${SECONDS} s`;
  const row = (name: string, unit: string, a: number, b: number, note = ''): BenchRow => ({
    name, value: a, unit, note: `${note}reference server: ${b.toFixed(b >= 100 ? 0 : 2)} ${unit} (ratio ours/reference ${(a / b).toFixed(2)}×)`,
  });
  const q = (r: RunResult, p: number) => quantile(r.latencies, p);
  return [
    row(`edit→viewer latency median (${setup})`, 'ms', q(ours, 0.5), q(ref, 0.5), `${ours.latencies.length} samples; target p95 ≤ 20 ms; `),
    row('edit→viewer latency p95', 'ms', q(ours, 0.95), q(ref, 0.95)),
    row('edit→viewer latency p99', 'ms', q(ours, 0.99), q(ref, 0.99)),
    row('server peak RSS', 'MB', ours.peakRssMb, ref.peakRssMb),
    row('messages received per viewer', 'msg/s', ours.viewerMsgsPerSec, ref.viewerMsgsPerSec),
  ];
}
