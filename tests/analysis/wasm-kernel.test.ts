import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CODE_CHARS, enumerateChunks, enumerateTable, resolveSpec } from '../../shared/analysis';
import { compileBitProgram } from '../../shared/analysis/bit-program';
import { tableCone } from '../../shared/analysis/cone';
import { WasmEvaluator } from '../../shared/analysis/wasm-kernel';
import { compileBoard, familyOf } from '../../shared/sim';
import type { BoardFile } from '../../shared/board';
import { board16, board20, icarusTable } from '../../bench/boards';
import { randomCircuit, type RandomKind } from '../helpers/random-circuit';
import { randomBoardArb } from './random-board';

const ALL_KINDS: RandomKind[] = ['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'buffer', 'mux2', 'mux4'];
const FAMILIES = ['ideal', 'rtl', 'dtl'] as const; // floating inputs read X, 0 and 1
const column = (values: Uint8Array) => Array.from(values, (v) => CODE_CHARS[v]).join('');
/** The first row where two columns differ (−1: none), as `row: a ≠ b` for the message. */
function firstDiff(a: Uint8Array, b: Uint8Array): string {
  if (a.length !== b.length) return `lengths ${a.length} ≠ ${b.length}`;
  for (let r = 0; r < a.length; r++) if (a[r] !== b[r]) return `row ${r}: ${CODE_CHARS[a[r]]} ≠ ${CODE_CHARS[b[r]]}`;
  return 'same';
}

/**
 * The WebAssembly kernel against the JS kernel on the same board, two-valued and four-valued, with the
 * given chunk size: same codes on every row, and the WebAssembly kernel really ran.
 */
function sameTables(board: BoardFile, chunkRows?: number): void {
  const netlist = compileBoard(board);
  const spec = resolveSpec(netlist);
  for (const fourValued of [false, true]) {
    const wasm = enumerateTable(netlist, spec, { fourValued, chunkRows });
    const js = enumerateTable(netlist, spec, { fourValued, chunkRows, kernel: 'js' });
    if (!wasm.method.includes('bit-parallel')) continue;
    expect(wasm.kernel).toBe('wasm');
    expect(js.kernel).toBe('js');
    wasm.values.forEach((v, i) => expect(firstDiff(v, js.values[i]), `${wasm.outputs[i]}, four-valued ${fourValued}`).toBe('same'));
  }
}

describe('WebAssembly truth-table kernel', () => {
  // Reference: the JS kernel (bit-kernel.ts), itself checked against the event simulator and Icarus
  // Verilog in bit-parallel.test.ts. Row counts from 2 (below one 32-row word and one 128-row turn) up to
  // 4,096; chunks of 32 rows upwards, so partial turns and partial chunks are both met.
  it('equals the JS kernel on random circuits of every combinational kind (two-valued and four-valued)', () => {
    const arb = fc.record({
      seed: fc.integer(), inputs: fc.integer({ min: 1, max: 12 }), gates: fc.integer({ min: 1, max: 150 }),
      outputs: fc.integer({ min: 1, max: 8 }), maxFanIn: fc.integer({ min: 2, max: 6 }), family: fc.constantFrom(...FAMILIES),
      chunk: fc.constantFrom(undefined, 32, 96, 4096),
    });
    fc.assert(fc.property(arb, ({ chunk, ...o }) => sameTables(randomCircuit({ ...o, kinds: ALL_KINDS }), chunk)), { numRuns: 120 });
  });

  it('equals the JS kernel with open inputs, unconnected lamps and two drivers on a net (X and Z)', () => {
    const arb = fc.tuple(randomBoardArb({ maxInputs: 9, maxGates: 40, loose: true, conflicts: true }), fc.constantFrom(...FAMILIES), fc.constantFrom(undefined, 32, 160));
    fc.assert(fc.property(arb, ([board, family, chunk]) => sameTables({ ...board, family }, chunk)), { numRuns: 200 });
  });

  it('equals the JS kernel on the benchmark boards (16 inputs × 1,000 gates, 20 inputs × 300 gates)', () => {
    sameTables(board16());
    sameTables(board20());
  });

  // Independent reference: Icarus Verilog (`iverilog`, `vvp`; CHECKS.md "Formats") enumerating the exported
  // structural Verilog (IEEE Std 1364) of the 16-input, 1,000-gate benchmark board, every one of its 65,536 rows.
  it('agrees with Icarus Verilog on the 16-input, 1,000-gate board', () => {
    const board = board16();
    const netlist = compileBoard(board);
    const table = enumerateTable(netlist, resolveSpec(netlist));
    expect(table.kernel).toBe('wasm');
    const { lines } = icarusTable(board);
    expect(lines).toHaveLength(table.rowCount);
    let differ = 0;
    lines.forEach((line, r) => { if (line !== table.values.map((v) => CODE_CHARS[v[r]]).join('')) differ++; });
    expect(differ).toBe(0);
  }, 120_000);

  it('gives each table its own rows when tables of one thread take turns chunk by chunk (one shared memory)', () => {
    // two modules on the one memory, their calls interleaved: each call must write every slot it reads
    const boards = [randomCircuit({ seed: 21, inputs: 14, gates: 60, outputs: 2 }), randomCircuit({ seed: 22, inputs: 15, gates: 400, outputs: 40, kinds: ALL_KINDS })];
    const nets = boards.map((b) => compileBoard(b));
    const gens = nets.map((n) => enumerateChunks(n, resolveSpec(n), { chunkRows: 4096 }));
    const done: (ReturnType<typeof enumerateTable> | undefined)[] = [undefined, undefined];
    while (done.some((d) => !d)) {
      gens.forEach((g, i) => { if (done[i]) return; const step = g.next(); if (step.done) done[i] = step.value; });
    }
    done.forEach((table, i) => {
      expect(table!.kernel).toBe('wasm');
      const js = enumerateTable(nets[i], resolveSpec(nets[i]), { kernel: 'js' });
      table!.values.forEach((v, o) => expect(firstDiff(v, js.values[o]), `board ${i}, ${table!.outputs[o]}`).toBe('same'));
    });
  });

  it('leaves a program whose module would be too large to the JS kernel', () => {
    // 300 outputs × 8,192 row codes each pass the module's 2 MiB memory
    const board = randomCircuit({ seed: 3, inputs: 4, gates: 320, outputs: 300, kinds: ALL_KINDS });
    const netlist = compileBoard(board);
    const spec = resolveSpec(netlist);
    const nets = spec.outputs.map((o) => o.inputs[0]);
    const prog = compileBitProgram(netlist, tableCone(netlist, nets), spec.inputs, nets, familyOf(netlist.family).floating, 1);
    expect(WasmEvaluator.create(prog)).toBeUndefined();
    const table = enumerateTable(netlist, spec);
    expect(table.kernel).toBe('js');
    const slow = enumerateTable(netlist, spec, { eventOnly: true });
    table.values.forEach((v, i) => expect(column(v)).toBe(column(slow.values[i])));
    // a later small table still gets the WebAssembly kernel
    const small = compileBoard(randomCircuit({ seed: 4, inputs: 5, gates: 20 }));
    expect(enumerateTable(small, resolveSpec(small)).kernel).toBe('wasm');
  });
});
