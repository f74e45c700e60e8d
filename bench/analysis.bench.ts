/**
 * Truth-table speed: the levelised bit-parallel path against row-by-row event simulation on the same
 * 16-input, 1,000-gate combinational circuit, and the time of a 20-input (1,048,576-row) table.
 */
import type { BenchRow } from './run';
import type { BoardFile, Part, Wire } from '../shared/board';
import { compileBoard, mulberry32, Simulator } from '../shared/sim';
import { enumerateTable, minimalForms, resolveSpec } from '../shared/analysis';

const KINDS = ['and', 'or', 'nand', 'nor', 'xor', 'xnor'] as const;

/** A random layered combinational board: `inputs` switches, `gates` 2–3-input gates, 8 lamps. */
function randomBoard(inputs: number, gates: number, seed: number): BoardFile {
  const rnd = mulberry32(seed);
  const pick = (n: number) => Math.floor(rnd() * n);
  const parts: Part[] = [];
  const wires: Wire[] = [];
  const sources: string[] = [];
  for (let i = 0; i < inputs; i++) { parts.push({ id: `s${i}`, kind: 'switch', label: `I${i}`, x: 0, y: 0, on: false }); sources.push(`s${i}.out`); }
  for (let g = 0; g < gates; g++) {
    const n = 2 + pick(2);
    parts.push({ id: `g${g}`, kind: KINDS[pick(KINDS.length)], inputs: n, x: 0, y: 0 });
    for (let k = 0; k < n; k++) {
      // mostly recent signals, so the circuit is deep as well as wide
      const from = rnd() < 0.7 ? sources[Math.max(0, sources.length - 1 - pick(40))] : sources[pick(sources.length)];
      wires.push({ id: `w${g}_${k}`, from, to: `g${g}.in${k}` });
    }
    sources.push(`g${g}.out`);
  }
  for (let o = 0; o < 8; o++) {
    parts.push({ id: `l${o}`, kind: 'lamp', label: `O${o}`, x: 0, y: 0 });
    wires.push({ id: `wl${o}`, from: `g${gates - 1 - o * 7}.out`, to: `l${o}.in` });
  }
  return { format: 'gatefold-board', version: 1, title: 'bench', family: 'ideal', parts, wires };
}

export default async function analysisBench(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const board = randomBoard(16, 1000, 7);
  const netlist = compileBoard(board);
  const spec = resolveSpec(netlist);
  let t0 = performance.now();
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
  rows.push({ name: '16 inputs × 1,000 gates: bit-parallel table', value: fast, unit: 'ms', note: `65,536 rows, 8 outputs; event simulation ${slow.toFixed(0)} ms (ratio ${(slow / fast).toFixed(1)}x; timed on the first ${sample} rows and scaled; ${mismatches} mismatches)` });

  const wide = randomBoard(20, 300, 11);
  const wideNet = compileBoard(wide);
  t0 = performance.now();
  enumerateTable(wideNet, resolveSpec(wideNet));
  rows.push({ name: '20 inputs × 300 gates: bit-parallel table', value: performance.now() - t0, unit: 'ms', note: '1,048,576 rows, 8 outputs' });

  // minimisation of a 10-input table of the bench circuit's first output
  const small = randomBoard(10, 60, 3);
  const smallNet = compileBoard(small);
  const smallTable = enumerateTable(smallNet, resolveSpec(smallNet));
  t0 = performance.now();
  const { forms } = minimalForms(smallTable.inputs, smallTable.values[0]);
  rows.push({ name: '10-input output: minimal SOP and POS', value: performance.now() - t0, unit: 'ms', note: `${forms.exact ? 'exact' : 'not proven minimal'}, SOP of ${forms.sop.split(' | ').length} terms` });
  return rows;
}
