/**
 * Truth-table speed: the levelised bit-parallel path against row-by-row event simulation on the same
 * 16-input, 1,000-gate combinational circuit, and the time of a 20-input (1,048,576-row) table.
 */
import type { BenchRow } from './run';
import { compileBoard, Simulator } from '../shared/sim';
import { randomCircuit } from '../tests/helpers/random-circuit';
import { enumerateTable, minimalForms, resolveSpec } from '../shared/analysis';
import { minimiseOnes, minimiseZeros } from '../shared/analysis';

/** mulberry32 (common practice, no source): the same functions on every run. */
function seeded(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Minimises `count` random n-input functions of the given density; proven counts and times. */
function randomMinimisation(n: number, count: number, density: number): { proven: number; forms: number; totalMs: number; worstMs: number } {
  let proven = 0;
  let totalMs = 0;
  let worstMs = 0;
  for (let k = 0; k < count; k++) {
    const rnd = seeded(1000 * n + k);
    const fn = Uint8Array.from({ length: 1 << n }, () => (rnd() < density ? 1 : 0));
    for (const run of [minimiseOnes, minimiseZeros]) {
      const t0 = performance.now();
      if (run(n, fn).exact) proven++;
      const ms = performance.now() - t0;
      totalMs += ms;
      worstMs = Math.max(worstMs, ms);
    }
  }
  return { proven, forms: 2 * count, totalMs, worstMs };
}

export default async function analysisBench(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const board = randomCircuit({ seed: 7, inputs: 16, gates: 1000, outputs: 8 });
  const netlist = compileBoard(board);
  const spec = resolveSpec(netlist);
  let t0 = performance.now();
  enumerateTable(netlist, spec);
  const cold = performance.now() - t0;
  // the figure is the warm run (compiled code), as when the panel recomputes after an edit
  t0 = performance.now();
  const table = enumerateTable(netlist, spec);
  const fast = performance.now() - t0;

  // the reference: one settle per row, inputs changed from the previous row (no power-on reset)
  const sample = 4096;
  const sim = new Simulator(netlist);
  let mismatches = 0;
  t0 = performance.now();
  for (let r = 0; r < sample; r++) {
    spec.inputs.forEach((p, i) => sim.setInput(p.id, ((r >>> (15 - i)) & 1) as 0 | 1));
    sim.settle();
    spec.outputs.forEach((o, i) => { if (sim.level(o.inputs[0]) !== '01XZ'[table.values[i][r]]) mismatches++; });
  }
  const slowSample = performance.now() - t0;
  const slow = (slowSample * table.rowCount) / sample;
  rows.push({ name: '16 inputs × 1,000 gates: bit-parallel table', value: fast, unit: 'ms', note: `65,536 rows, 8 outputs; first run ${cold.toFixed(0)} ms; event simulation ${slow.toFixed(0)} ms (ratio ${(slow / fast).toFixed(1)}x; timed on the first ${sample} rows and scaled; ${mismatches} mismatches)` });

  const wide = randomCircuit({ seed: 11, inputs: 20, gates: 300, outputs: 8 });
  const wideNet = compileBoard(wide);
  t0 = performance.now();
  enumerateTable(wideNet, resolveSpec(wideNet));
  rows.push({ name: '20 inputs × 300 gates: bit-parallel table', value: performance.now() - t0, unit: 'ms', note: '1,048,576 rows, 8 outputs' });

  // minimisation of a 10-input output
  const small = randomCircuit({ seed: 3, inputs: 10, gates: 60, outputs: 1 });
  const smallNet = compileBoard(small);
  const smallTable = enumerateTable(smallNet, resolveSpec(smallNet));
  t0 = performance.now();
  const { forms } = minimalForms(smallTable.inputs, smallTable.values[0]);
  rows.push({ name: '10-input output: minimal SOP and POS', value: performance.now() - t0, unit: 'ms', note: `${forms.exact ? 'exact' : 'not proven minimal'}, SOP of ${forms.sop.split(' | ').length} terms` });

  // dense random functions (density 0.5, seeded): the hard case for the exact cover search. Before the
  // two-phase bitset search (one budget for proving and listing ties): 11 of 100 8-input forms and 0 of
  // 40 10-input forms proven, in 9.5–22 s and 1.8–8 s (measured 2026-12-01 on the shared, busy 2-core machine).
  for (const [n, count] of [[8, 50], [10, 20]] as const) {
    const r = randomMinimisation(n, count, 0.5);
    rows.push({ name: `${count} random ${n}-input functions: proven minimal`, value: r.proven, unit: `of ${r.forms} forms`, note: 'SOP and POS each; density 0.5, seeded' });
    rows.push({ name: `${count} random ${n}-input functions: exact SOP and POS`, value: r.totalMs / count, unit: 'ms per function', note: `worst form ${r.worstMs.toFixed(0)} ms; total ${(r.totalMs / 1000).toFixed(1)} s` });
  }
  return rows;
}
