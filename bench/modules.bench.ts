/**
 * Modules: compile and settle of a 2,000-gate hierarchical board (issue 14's target ≤ 8 ms warm), beside
 * the same circuit drawn flat, compiled and settled. "Warm" means only that the code is warmed up (30
 * runs first): every run compiles a fresh board object, as after an edit, and nothing is cached from one
 * compile to the next — compileBoard lays each module's inside out once per compile and copies it per
 * instance (shared/sim/compile-levels.ts). The figure is CPU time of this process (user + system, which
 * also counts the collector's helper threads, so on a quiet machine it is at least the wall time); the
 * wall time is in the note, since on a shared machine it counts whatever else the cores were doing.
 */
import { flattenBoard, parseBoardFile, type BoardFile, type Module, type Part, type Wire } from '../shared/board';
import { compileBoard, Simulator } from '../shared/sim';
import { randomCircuit } from '../tests/helpers/random-circuit';
import type { BenchRow } from './run';

/** A 50-gate random block as a module: its switches become ports in, its lamps ports out. */
function blockModule(): Module {
  const c = randomCircuit({ seed: 21, inputs: 4, gates: 50, outputs: 4 });
  const parts: Part[] = c.parts.map((p) => (p.kind === 'switch' ? { id: p.id, kind: 'port', dir: 'in', label: p.label, x: p.x, y: p.y }
    : p.kind === 'lamp' ? { id: p.id, kind: 'port', dir: 'out', label: p.label, x: p.x, y: p.y } : p));
  return { id: 'block', title: 'Block', parts, wires: c.wires };
}

/** Two blocks in a row, as a module of its own (nesting). */
function pairModule(): Module {
  const ins = ['I0', 'I1', 'I2', 'I3'];
  const parts: Part[] = [
    ...ins.map((l, k): Part => ({ id: `p${k}`, kind: 'port', dir: 'in', label: l, x: 0, y: k * 40 })),
    { id: 'a', kind: 'module', module: 'block', x: 100, y: 0 },
    { id: 'b', kind: 'module', module: 'block', x: 300, y: 0 },
    ...ins.map((_, k): Part => ({ id: `q${k}`, kind: 'port', dir: 'out', label: `O${k}`, x: 500, y: k * 40 })),
  ];
  const wires: Wire[] = ins.flatMap((l, k): Wire[] => [
    { id: `wa${k}`, from: `p${k}.out`, to: `a.${l}` },
    { id: `wb${k}`, from: `a.O${k}`, to: `b.${l}` },
    { id: `wc${k}`, from: `b.O${k}`, to: `q${k}.in` },
  ]);
  return { id: 'pair', title: 'Pair', parts, wires };
}

/** 20 pairs in a chain: 2,000 gates in 40 block instances, two levels deep. */
function hierarchicalBoard(): BoardFile {
  const parts: Part[] = [];
  const wires: Wire[] = [];
  for (let k = 0; k < 4; k++) parts.push({ id: `s${k}`, kind: 'switch', label: `S${k}`, on: k % 2 === 0, x: 0, y: k * 40 });
  for (let i = 0; i < 20; i++) {
    parts.push({ id: `u${i}`, kind: 'module', module: 'pair', x: 100 + i * 200, y: 0 });
    for (let k = 0; k < 4; k++) wires.push({ id: `w${i}_${k}`, from: i === 0 ? `s${k}.out` : `u${i - 1}.O${k}`, to: `u${i}.I${k}` });
  }
  for (let k = 0; k < 4; k++) {
    parts.push({ id: `l${k}`, kind: 'lamp', label: `L${k}`, x: 4200, y: k * 40 });
    wires.push({ id: `wl${k}`, from: `u19.O${k}`, to: `l${k}.in` });
  }
  const parsed = parseBoardFile({ format: 'gatefold-board', version: 1, title: 'Hierarchy bench', family: 'ideal', parts, wires, modules: [blockModule(), pairModule()] });
  if (!parsed.ok) throw new Error(parsed.problems[0].message);
  return parsed.board;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** CPU and wall time of f, in ms. */
function timed(f: () => void): { cpu: number; wall: number } {
  const c = process.cpuUsage();
  const t = performance.now();
  f();
  const wall = performance.now() - t;
  const d = process.cpuUsage(c);
  return { cpu: (d.user + d.system) / 1000, wall };
}

export default async (): Promise<BenchRow[]> => {
  const board = hierarchicalBoard();
  const flat = flattenBoard(board);
  const gates = flat.parts.filter((p) => p.kind !== 'switch' && p.kind !== 'lamp').length;
  // a fresh object each run: nothing may be reused from an earlier compile of the same object
  const run = (b: BoardFile) => { const sim = new Simulator(compileBoard({ ...b })); sim.settle(); };
  const cold = timed(() => run(board)).wall;
  for (let i = 0; i < 30; i++) { run(board); run(flat); }
  // interleaved, so that both see the same machine
  const ours: { cpu: number; wall: number }[] = [];
  const ref: { cpu: number; wall: number }[] = [];
  for (let i = 0; i < 40; i++) { ours.push(timed(() => run(board))); ref.push(timed(() => run(flat))); }
  const flattening = Array.from({ length: 40 }, () => timed(() => flattenBoard({ ...board })).cpu);
  const cpu = (xs: { cpu: number }[]) => median(xs.map((x) => x.cpu));
  const wall = (xs: { wall: number }[]) => median(xs.map((x) => x.wall));
  return [{
    name: `compile + settle, ${gates}-gate hierarchical board`, value: cpu(ours), unit: 'ms CPU', goal: { max: 8 },
    reference: { name: 'same circuit drawn flat', value: cpu(ref) },
    note: `40 block instances in 20 nested pairs; median of 40 warm runs, CPU time (wall ${wall(ours).toFixed(1)} ms, flat ${wall(ref).toFixed(1)} ms; first run ${cold.toFixed(1)} ms wall); flattenBoard alone, which compile no longer needs, ${median(flattening).toFixed(1)} ms CPU`,
  }];
};
