/**
 * Analysis speed. Truth tables: the compiled bit-parallel program against the four-valued planes, the
 * row-by-row event simulator and Icarus Verilog on the same board. Scaling: `analyze` on rings of gates
 * and shift registers of six-NAND flip-flops, each size against the previous one (the goal: at most
 * ×2.2 per doubling). Heavy rows (`npm run bench analysis`): the 8,000-gate sizes and exact minimisation
 * of random functions.
 */
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import type { BenchOptions, BenchRow } from './run';
import { compileBoard, Simulator } from '../shared/sim';
import { analyzeBoard, CODE_CHARS, enumerateTable, resolveSpec } from '../shared/analysis';
import v8 from 'node:v8';
import { runInNewContext } from 'node:vm';
import { board16, board20, icarusTable, median } from './boards';
import { ringBoard, shiftRegisterBoard } from './scaling-boards';
import { minimisationRows } from './minimise-rows';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
/** Fresh processes per kernel for the cold row. */
const COLD_RUNS = 7;

function tableRows(): BenchRow[] {
  const board = board16();
  const netlist = compileBoard(board);
  const spec = resolveSpec(netlist);
  // cold: fresh processes, WebAssembly kernel and JS kernel taking turns (the machine is shared: medians)
  const coldRun = (js: boolean) => JSON.parse(execFileSync(process.execPath, ['--import', 'tsx', 'bench/cold-table.ts', ...(js ? ['js'] : [])], { cwd: ROOT, encoding: 'utf8' })) as { ms: number; cpuMs: number; kernel: string };
  const colds = Array.from({ length: COLD_RUNS }, () => [coldRun(false), coldRun(true)] as const);
  const cold = median(colds.map(([w]) => w.ms));
  const coldCpu = median(colds.map(([w]) => w.cpuMs));
  const coldJs = median(colds.map(([, j]) => j.ms));
  const coldJsCpu = median(colds.map(([, j]) => j.cpuMs));
  const coldKernel = colds[0][0].kernel;
  const table = enumerateTable(netlist, spec);
  const warm = median(Array.from({ length: 21 }, () => { const t = performance.now(); enumerateTable(netlist, spec); return performance.now() - t; }));
  enumerateTable(netlist, spec, { kernel: 'js' });
  const warmJs = median(Array.from({ length: 21 }, () => { const t = performance.now(); enumerateTable(netlist, spec, { kernel: 'js' }); return performance.now() - t; }));
  const four = median(Array.from({ length: 9 }, () => { const t = performance.now(); enumerateTable(netlist, spec, { fourValued: true }); return performance.now() - t; }));

  // the event simulator, one settle per row from the previous row's state, timed on 4,096 rows and scaled
  const sample = 4096;
  const sim = new Simulator(netlist);
  let simMismatches = 0;
  let t0 = performance.now();
  for (let r = 0; r < sample; r++) {
    spec.inputs.forEach((p, i) => sim.setInput(p.id, ((r >>> (15 - i)) & 1) as 0 | 1));
    sim.settle();
    spec.outputs.forEach((o, i) => { if (sim.level(o.inputs[0]) !== CODE_CHARS[table.values[i][r]]) simMismatches++; });
  }
  const event = ((performance.now() - t0) * table.rowCount) / sample;
  const icarus = icarusTable(board);
  const ivMismatches = icarus.lines.filter((line, r) => line !== table.values.map((v) => CODE_CHARS[v[r]]).join('')).length + Math.abs(icarus.lines.length - table.rowCount);

  const wide = board20();
  const wideNet = compileBoard(wide);
  const wideSpec = resolveSpec(wideNet);
  // two-valued and four-valued taking turns, so both meet the same state of the allocator: each table
  // writes 8 MiB of fresh row codes, and until the engine collects earlier tables those pages are new
  // to the process (first-touch page faults: tens of ms on this VM, whichever kernel runs)
  // A third turn writes into the same arrays each time (EnumerateOptions.into), as a caller that keeps no
  // table can: no new memory, so it shows what the fresh arrays cost the other two.
  const wideTable = enumerateTable(wideNet, wideSpec);
  enumerateTable(wideNet, wideSpec, { fourValued: true });
  const into = wideSpec.outputs.map(() => new Uint8Array(wideTable.rowCount));
  enumerateTable(wideNet, wideSpec, { into });
  const wideRuns: number[] = [];
  const wideFourRuns: number[] = [];
  const wideIntoRuns: number[] = [];
  for (let i = 0; i < 7; i++) {
    t0 = performance.now();
    enumerateTable(wideNet, wideSpec);
    wideRuns.push(performance.now() - t0);
    t0 = performance.now();
    enumerateTable(wideNet, wideSpec, { fourValued: true });
    wideFourRuns.push(performance.now() - t0);
    t0 = performance.now();
    enumerateTable(wideNet, wideSpec, { into });
    wideIntoRuns.push(performance.now() - t0);
  }
  const wideMs = median(wideRuns);
  const wideFour = median(wideFourRuns);
  const wideInto = median(wideIntoRuns);
  return [
    { name: '16 inputs × 1,000 gates: table, warm', value: warm, unit: 'ms', goal: { max: 5 }, reference: { name: 'Icarus Verilog (compile + enumerate)', value: icarus.ms },
      note: `65,536 rows, 8 outputs; ${table.kernel ?? 'no'} kernel, median of 21 (JS kernel ${warmJs.toFixed(1)} ms); ${ivMismatches} rows differ from Icarus; event simulation ${event.toFixed(0)} ms (${simMismatches} mismatches; 4,096 rows timed, scaled); four-valued planes ${four.toFixed(1)} ms` },
    { name: '16 inputs × 1,000 gates: table, cold', value: cold, unit: 'ms', goal: { max: 15 }, reference: { name: 'JS kernel, cold', value: coldJs },
      note: `first table in a fresh process (cone, program, ${coldKernel} kernel: emit + compile + run), wall, median of ${COLD_RUNS} processes taking turns with the JS kernel; CPU of the process ${coldCpu.toFixed(1)} ms (JS kernel ${coldJsCpu.toFixed(1)} ms, all threads); warm ${warm.toFixed(1)} ms` },
    { name: '20 inputs × 300 gates: table, warm', value: wideMs, unit: 'ms', goal: { max: 40 }, reference: { name: 'four-valued planes', value: wideFour },
      note: `1,048,576 rows, 8 outputs; ${wideTable.kernel ?? 'no'} kernel, median of 7 taking turns with the four-valued planes (two-valued in order ${wideRuns.map((x) => x.toFixed(0)).join(' ')} ms, four-valued ${wideFourRuns.map((x) => x.toFixed(0)).join(' ')} ms: the slow turns write their 8 MiB of codes into memory new to the process)` },
    { name: '20 inputs × 300 gates: table into reused arrays', value: wideInto, unit: 'ms', goal: { max: 40 }, reference: { name: 'new arrays (row above)', value: wideMs },
      note: `the same table written into the same 8 arrays each time (EnumerateOptions.into), in turn with the two rows above; in order ${wideIntoRuns.map((x) => x.toFixed(0)).join(' ')} ms` },
  ];
}

/**
 * `analyze` (compile, levelise, table, forms) in this process: the medians of `runs` of its CPU time
 * (user + system of this process) and of its wall time. The rows compare sizes by CPU time, since on a
 * shared machine the wall time of a run counts whatever else the cores were doing.
 */
/** A full collection between runs (V8's gc(), made callable here without a node flag). */
const collectGarbage: () => void = (() => {
  v8.setFlagsFromString('--expose-gc');
  return runInNewContext('gc') as () => void;
})();

async function analyzeMs(board: ReturnType<typeof ringBoard>, runs: number): Promise<{ cpu: number; wall: number }> {
  const cpu: number[] = [];
  const wall: number[] = [];
  for (let i = 0; i < runs; i++) {
    // each run starts after a full collection whose concurrent sweeping has had time to end: it pays for its
    // own garbage, not an earlier run's (process CPU time counts V8's helper threads too)
    collectGarbage();
    await new Promise((r) => setTimeout(r, 25));
    const c = process.cpuUsage();
    const t = performance.now();
    analyzeBoard(board);
    wall.push(performance.now() - t);
    const d = process.cpuUsage(c);
    cpu.push((d.user + d.system) / 1000);
  }
  return { cpu: median(cpu), wall: median(wall) };
}

const SCALING_ROUNDS = 11;

/**
 * Each size is warmed twice, then the sizes take turns for SCALING_ROUNDS rounds (one run of each size per
 * round) and each row is the median of its runs. Taking turns puts every size in the same state of the
 * JIT and the heap and under the same load; a size measured in one block after another (as before) let a
 * collection of the previous size's garbage land on the next size's runs, which made ratios of 0.5 and 2.9
 * between neighbours in one quiet run.
 */
async function scalingRows(full: boolean): Promise<BenchRow[]> {
  const sizes = full ? [1000, 2000, 4000, 8000] : [1000, 2000, 4000];
  const rows: BenchRow[] = [];
  for (const [what, make] of [['ring of gates', ringBoard], ['shift register of six-NAND flip-flops', shiftRegisterBoard]] as const) {
    const boards = sizes.map((n) => make(n));
    for (let i = 0; i < 2; i++) for (const b of boards) await analyzeMs(b, 1); // warm the code at every size
    const cpu: number[][] = sizes.map(() => []);
    const wall: number[][] = sizes.map(() => []);
    for (let r = 0; r < SCALING_ROUNDS; r++) {
      for (const [k, b] of boards.entries()) { const m = await analyzeMs(b, 1); cpu[k].push(m.cpu); wall[k].push(m.wall); }
    }
    let prev: number | undefined;
    sizes.forEach((n, k) => {
      const c = median(cpu[k]);
      rows.push({ name: `analyze, ${what}: ${n.toLocaleString('en')} gates`, value: c, unit: 'ms CPU',
        ...(prev !== undefined ? { goal: { max: 2.2, on: 'ratio' as const }, reference: { name: `${(n / 2).toLocaleString('en')} gates`, value: prev } } : {}),
        note: `in process, CPU time, median of ${SCALING_ROUNDS}, the sizes taking turns (wall ${median(wall[k]).toFixed(0)} ms); the outputs come from the event simulator (loops)` });
      prev = c;
    });
  }
  return rows;
}

export default async function analysisBench(opts: BenchOptions): Promise<BenchRow[]> {
  return [...tableRows(), ...(await scalingRows(opts.full)), ...(opts.full ? minimisationRows() : [])];
}
