/**
 * Simulator speed: events per second on a 10,000-gate random circuit, and recompile-plus-settle time of a
 * 1,000-gate board (the bench recompiles on every edit and must stay well inside a 16 ms frame). Each
 * figure stands beside a deliberately naive reference measured in the same run: pins and nets as strings
 * in Maps, levels as strings, every gate re-evaluated in sweeps until nothing changes.
 */
import type { BoardFile, Part } from '../shared/board';
import { compileBoard, mulberry32, Simulator } from '../shared/sim';
import { randomCircuit } from '../tests/helpers/random-circuit';
import type { BenchRow } from './run';

type L = '0' | '1' | 'X';

/** The naive reference: a board read into objects keyed by strings. */
class NaiveSim {
  net = new Map<string, string>(); // "part.pin" → net name
  levels = new Map<string, L>();
  gates: { part: Part; ins: string[]; out: string }[] = [];
  changes = 0;

  constructor(board: BoardFile) {
    for (const p of board.parts) {
      for (const pin of ['out', 'outn', 'in', 'sel', 'sel0', 'sel1', 'd0', 'd1', 'd2', 'd3', ...Array.from({ length: 8 }, (_, i) => `in${i}`)]) this.net.set(`${p.id}.${pin}`, `${p.id}.${pin}`);
    }
    // join nets through a string-keyed parent map
    const root = (k: string): string => { let r = k; while (this.net.get(r) !== r) r = this.net.get(r)!; return r; };
    for (const w of board.wires) {
      const a = root(w.from);
      const b = root(w.to);
      if (a !== b) this.net.set(b, a);
    }
    for (const k of [...this.net.keys()]) this.net.set(k, root(k));
    for (const p of board.parts) {
      const n = 'inputs' in p ? p.inputs : 1;
      const pins = p.kind === 'mux2' ? ['sel', 'd0', 'd1'] : Array.from({ length: n }, (_, i) => `in${i}`);
      if (p.kind !== 'switch' && p.kind !== 'lamp') this.gates.push({ part: p, ins: pins.map((pin) => this.net.get(`${p.id}.${pin}`)!), out: this.net.get(`${p.id}.out`)! });
    }
  }

  set(id: string, v: L) { this.levels.set(this.net.get(`${id}.out`)!, v); }

  eval(kind: string, ins: L[]): L {
    const has = (v: L) => ins.includes(v);
    const inv = (v: L): L => (v === 'X' ? 'X' : v === '1' ? '0' : '1');
    const and: L = has('0') ? '0' : has('X') ? 'X' : '1';
    const or: L = has('1') ? '1' : has('X') ? 'X' : '0';
    const xor: L = has('X') ? 'X' : ins.filter((v) => v === '1').length % 2 ? '1' : '0';
    switch (kind) {
      case 'and': return and;
      case 'nand': return inv(and);
      case 'or': return or;
      case 'nor': return inv(or);
      case 'xor': return xor;
      case 'xnor': return inv(xor);
      case 'not': return inv(ins[0]);
      case 'mux2': return ins[0] === '0' ? ins[1] : ins[0] === '1' ? ins[2] : ins[1] === ins[2] ? ins[1] : 'X';
      default: return ins[0];
    }
  }

  settle(): void {
    for (let sweep = 0; sweep < 100000; sweep++) {
      let changed = false;
      for (const g of this.gates) {
        const v = this.eval(g.part.kind, g.ins.map((n) => this.levels.get(n) ?? 'X'));
        if (this.levels.get(g.out) !== v) { this.levels.set(g.out, v); this.changes++; changed = true; }
      }
      if (!changed) return;
    }
  }
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function eventsPerSecond(): BenchRow[] {
  const board = randomCircuit({ seed: 10, inputs: 32, gates: 10_000, outputs: 16 });
  const sim = new Simulator(compileBoard(board));
  sim.settle();
  const rnd = mulberry32(5);
  const toggles = Array.from({ length: 400 }, () => [`i${Math.floor(rnd() * 32)}`, rnd() < 0.5 ? 1 : 0] as [string, 0 | 1]);
  const e0 = sim.stats.events;
  const t0 = performance.now();
  for (const [id, v] of toggles) { sim.setInput(id, v); sim.settle(); }
  const ours = (sim.stats.events - e0) / ((performance.now() - t0) / 1000);

  const naive = new NaiveSim(board);
  for (let i = 0; i < 32; i++) naive.set(`i${i}`, '0');
  naive.settle();
  const few = toggles.slice(0, 4);
  const c0 = naive.changes;
  const t1 = performance.now();
  for (const [id, v] of few) { naive.set(id, v ? '1' : '0'); naive.settle(); }
  const ref = (naive.changes - c0) / ((performance.now() - t1) / 1000);
  return [{ name: 'events per second, 10,000-gate random circuit', value: ours, unit: 'events/s',
    note: `naive sweeps: ${ref.toFixed(0)} changes/s (ratio ${(ours / ref).toFixed(1)}x)` }];
}

function recompileAndSettle(): BenchRow[] {
  const board = randomCircuit({ seed: 11, inputs: 16, gates: 1_000, outputs: 8 });
  const run = () => { const sim = new Simulator(compileBoard(board)); sim.settle(); };
  const c0 = performance.now();
  run();
  const cold = performance.now() - c0;
  // warm: the bench recompiles on every edit, so the code is optimised after the first few edits
  for (let i = 0; i < 50; i++) run();
  const ours = median(Array.from({ length: 50 }, () => { const t = performance.now(); run(); return performance.now() - t; }));
  const naiveRun = () => { const n = new NaiveSim(board); for (let i = 0; i < 16; i++) n.set(`i${i}`, '0'); n.settle(); };
  naiveRun();
  const ref = median(Array.from({ length: 3 }, () => { const t = performance.now(); naiveRun(); return performance.now() - t; }));
  return [{ name: 'recompile + settle, 1,000-gate board', value: ours, unit: 'ms',
    note: `median of 50 warm runs (first run ${cold.toFixed(1)} ms); frame budget 16 ms; naive: ${ref.toFixed(1)} ms (ratio ${(ref / ours).toFixed(1)}x)` }];
}

// the frame-time figure first, before the big naive maps of the other measure fill the heap
export default async (): Promise<BenchRow[]> => { const frame = recompileAndSettle(); return [...eventsPerSecond(), ...frame]; };
