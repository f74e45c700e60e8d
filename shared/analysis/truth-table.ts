import { Simulator, type Netlist } from '../sim';
import { BitParallelEvaluator } from './bit-parallel';
import { WasmEvaluator } from './wasm-kernel';
import { compileBitProgram } from './bit-program';
import { tableCone } from './cone';
import { familyFloating } from './floating';
import type { TableSpec } from './table-spec';

/** Level codes in a table: 0, 1, 2 = X, 3 = Z (as in the simulator). */
export { LEVELS as CODE_CHARS } from '../sim';

/** A truth table: per output one level code per row; row r spells the inputs in binary, first most significant. */
export interface TruthTable {
  inputs: string[];
  outputs: string[];
  inputIds: string[];
  outputIds: string[];
  rowCount: number;
  /** per output, Uint8Array of codes (0, 1, 2 = X, 3 = Z) */
  values: Uint8Array[];
  /** per output: its value can depend on stored state (storage part or feedback loop in its fan-in) */
  sequential: boolean[];
  /** per output: the path that computed it */
  method: ('bit-parallel' | 'event')[];
  /** which kernel ran the bit-parallel outputs (absent when none did) */
  kernel?: TableKernel;
}

/** The bit-parallel kernels: WebAssembly (`wasm-kernel.ts`) or the JS loops (`bit-kernel.ts`). */
export type TableKernel = 'wasm' | 'js';

/** Progress of an enumeration. */
export interface TableProgress { done: number; total: number }

/** Options of the enumeration. */
export interface EnumerateOptions {
  /** rows per chunk between progress reports (rounded to whole words; default 8,192) */
  chunkRows?: number;
  /** force the event simulator for every output (the reference path, used by tests and the benchmark) */
  eventOnly?: boolean;
  /** keep the four-valued planes where the two-valued path would do (tests and the benchmark compare them) */
  fourValued?: boolean;
  /** the kernel to use; default: WebAssembly where it compiles here, else JS */
  kernel?: TableKernel;
  /**
   * Arrays to write the codes into, one per output, instead of new ones: the table's `values` are then
   * these arrays (every row written), and the next table given them overwrites it. For a caller that
   * makes large tables one after another and keeps none (a benchmark, a server answering and dropping
   * them): a new array (1 MiB per output at 20 inputs) is memory new to the process, and the page faults
   * of its first write (and the collections that give it back) cost more than the kernel. An array whose
   * length is not the table's row count, or given twice, is left alone (a new one is made).
   */
  into?: readonly Uint8Array[];
}

/**
 * Enumerates a truth table in chunks: a generator that yields progress after each chunk and returns
 * the table. Combinational outputs use the bit-parallel path (a compiled program, two-valued when no X
 * or Z can reach them); outputs that depend on stored state use
 * the event simulator, each row from power-on with the inputs set, so a held value shows the power-on
 * state (a storage part's `init`, a gate loop's resolved level — decision 002 — or X where it stays X).
 */
export function* enumerateChunks(netlist: Netlist, spec: TableSpec, opts: EnumerateOptions = {}): Generator<TableProgress, TruthTable> {
  const k = spec.inputs.length;
  const rowCount = 2 ** k;
  const cone = tableCone(netlist, spec.outputs.map((o) => o.inputs[0]));
  const sequential = spec.outputs.map((_, i) => cone.stateful[i] === 1);
  const useEvent = spec.outputs.map((_, i) => opts.eventOnly === true || sequential[i]);
  const values = outputArrays(spec.outputs.length, rowCount, opts.into);
  const chunk = Math.max(32, Math.ceil((opts.chunkRows ?? 8192) / 32) * 32);
  const total = rowCount * (useEvent.some((u) => !u) ? 1 : 0) + rowCount * (useEvent.some((u) => u) ? 1 : 0);
  let done = 0;
  let kernel: TableKernel | undefined;
  const direct = spec.outputs.flatMap((o, i) => (useEvent[i] ? [] : [i]));
  if (direct.length) {
    const totalWords = Math.ceil(rowCount / 32);
    const prog = compileBitProgram(netlist, cone, spec.inputs, direct.map((i) => spec.outputs[i].inputs[0]), familyFloating(netlist.family), totalWords, opts.fourValued);
    const bp = (opts.kernel !== 'js' ? WasmEvaluator.create(prog) : undefined) ?? new BitParallelEvaluator(prog);
    kernel = bp instanceof WasmEvaluator ? 'wasm' : 'js';
    const out = direct.map((i) => values[i]);
    const wordsPer = chunk / 32;
    for (let w0 = 0; w0 < totalWords; w0 += wordsPer) {
      const count = Math.min(wordsPer, totalWords - w0);
      bp.evaluate(w0, count, out, rowCount);
      done += Math.min(count * 32, rowCount - w0 * 32);
      yield { done, total };
    }
  }
  if (useEvent.some((u) => u)) {
    const sim = new Simulator(netlist);
    for (let r = 0; r < rowCount; r++) {
      spec.inputs.forEach((p, i) => sim.setInput(p.id, ((r >>> (k - 1 - i)) & 1) as 0 | 1));
      sim.resetState();
      const report = sim.settle();
      const wobbly = new Set(report.oscillating);
      spec.outputs.forEach((o, i) => {
        if (!useEvent[i]) return;
        const net = o.inputs[0];
        values[i][r] = wobbly.has(netlist.nets[net].name) ? 2 : codeOf(sim.level(net));
      });
      done++;
      if (done % chunk === 0) yield { done, total };
    }
    yield { done, total };
  }
  return {
    inputs: spec.inputs.map((p) => p.name), outputs: spec.outputs.map((p) => p.name),
    inputIds: spec.inputs.map((p) => p.id), outputIds: spec.outputs.map((p) => p.id),
    rowCount, values, sequential, method: useEvent.map((u) => (u ? 'event' : 'bit-parallel')),
    ...(kernel ? { kernel } : {}),
  };
}

/** The table's arrays: the caller's where given with the right length (each once), else new ones. */
function outputArrays(n: number, rowCount: number, into: readonly Uint8Array[] = []): Uint8Array[] {
  const taken = new Set<Uint8Array>();
  return Array.from({ length: n }, (_, i) => {
    const given = into[i];
    if (given?.length !== rowCount || taken.has(given)) return new Uint8Array(rowCount);
    taken.add(given);
    return given;
  });
}

function codeOf(l: string): number {
  return l === '0' ? 0 : l === '1' ? 1 : l === 'Z' ? 3 : 2;
}

/** The whole table at once. */
export function enumerateTable(netlist: Netlist, spec: TableSpec, opts: EnumerateOptions = {}): TruthTable {
  const gen = enumerateChunks(netlist, spec, opts);
  for (;;) {
    const step = gen.next();
    if (step.done) return step.value;
  }
}

/**
 * The table with progress reports and cancellation, yielding to the event loop between chunks (so a
 * worker can hear its cancel message). Rejects with an AbortError-named Error when `signal` aborts.
 */
export async function enumerateTableAsync(
  netlist: Netlist, spec: TableSpec,
  opts: EnumerateOptions & { onProgress?: (p: TableProgress) => void; signal?: AbortSignal } = {},
): Promise<TruthTable> {
  const gen = enumerateChunks(netlist, spec, opts);
  for (;;) {
    if (opts.signal?.aborted) { const e = new Error('enumeration cancelled'); e.name = 'AbortError'; throw e; }
    const step = gen.next();
    if (step.done) return step.value;
    opts.onProgress?.(step.value);
    await new Promise((resolve) => setTimeout(resolve, 0));
  }
}
