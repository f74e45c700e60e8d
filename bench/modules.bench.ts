/**
 * Modules: compile and settle of a 2,000-gate hierarchical board (issue 14's target ≤ 8 ms warm), each
 * run on a fresh board object so that the flattening (docs/decisions/004-modules.md) runs every time, as
 * it does after every edit; beside it the same circuit drawn flat, compiled and settled.
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

/** Time of the flattening alone (for the note). */
function flattenOnly(board: BoardFile): number {
  for (let i = 0; i < 20; i++) flattenBoard({ ...board });
  return median(Array.from({ length: 40 }, () => { const t = performance.now(); flattenBoard({ ...board }); return performance.now() - t; }));
}

export default async (): Promise<BenchRow[]> => {
  const board = hierarchicalBoard();
  const flat = flattenBoard(board);
  const gates = flat.parts.filter((p) => p.kind !== 'switch' && p.kind !== 'lamp').length;
  // a fresh object each run: the flattening is cached per board object, and an edit makes a new one
  const run = (b: BoardFile) => { const sim = new Simulator(compileBoard({ ...b })); sim.settle(); };
  const c0 = performance.now();
  run(board);
  const cold = performance.now() - c0;
  for (let i = 0; i < 30; i++) { run(board); run(flat); }
  const ours = median(Array.from({ length: 40 }, () => { const t = performance.now(); run(board); return performance.now() - t; }));
  const ref = median(Array.from({ length: 40 }, () => { const t = performance.now(); run(flat); return performance.now() - t; }));
  return [{
    name: `compile + settle, ${gates}-gate hierarchical board`, value: ours, unit: 'ms', goal: { max: 8 },
    reference: { name: 'same circuit drawn flat', value: ref },
    note: `40 block instances in 20 nested pairs; median of 40 warm runs (first run ${cold.toFixed(1)} ms); flattening alone ${flattenOnly(board).toFixed(1)} ms`,
  }];
};
