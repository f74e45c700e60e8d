/**
 * The boards and references the analysis and command-line benchmarks share: the 16-input, 1,000-gate
 * and 20-input, 300-gate random circuits, and Icarus Verilog (Debian's `iverilog` + `vvp`, an outside
 * reference) enumerating the exported netlist of a board, timed as a whole process.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { BoardFile } from '../shared/board';
import { compileBoard, toVerilog } from '../shared/sim';
import { randomCircuit } from '../tests/helpers/random-circuit';

export const TABLE_16 = { seed: 7, inputs: 16, gates: 1000, outputs: 8 };
export const TABLE_20 = { seed: 11, inputs: 20, gates: 300, outputs: 8 };

export const board16 = (): BoardFile => randomCircuit(TABLE_16);
export const board20 = (): BoardFile => randomCircuit(TABLE_20);

export function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

/** Icarus Verilog's rows of a board: one line of output bits per row, first input most significant. */
export interface IcarusRun { ms: number; lines: string[] }

const cache = new Map<string, IcarusRun>();

/**
 * Icarus Verilog enumerating every row of the board's exported netlist (a test bench counting the
 * inputs, one $display per row): compile plus simulation, wall time. Measured once per board per run.
 */
export function icarusTable(board: BoardFile): IcarusRun {
  const key = JSON.stringify(board);
  const hit = cache.get(key);
  if (hit) return hit;
  const netlist = compileBoard(board);
  const inputs = netlist.inputs.filter((p) => p.kind === 'switch' || p.kind === 'button').map((p) => p.name);
  const outputs = netlist.outputs.map((p) => p.name);
  const k = inputs.length;
  const verilog = toVerilog(board, netlist);
  const top = /module\s+(\w+)/.exec(verilog)![1];
  const tb = [
    '`timescale 1ns/1ns', 'module tb;', `  reg [${Math.max(k - 1, 0)}:0] v;`,
    ...outputs.map((o) => `  wire ${o};`),
    `  ${top} dut (${[...inputs.map((n, i) => `.${n}(v[${k - 1 - i}])`), ...outputs.map((o) => `.${o}(${o})`)].join(', ')});`,
    '  integer i;', '  initial begin',
    `    for (i = 0; i < ${2 ** k}; i = i + 1) begin v = i; #100; $display("%b", {${outputs.join(', ')}}); end`,
    '    $finish;', '  end', 'endmodule', '',
  ].join('\n');
  const dir = mkdtempSync(join(tmpdir(), 'gatefold-bench-iv-'));
  try {
    writeFileSync(join(dir, 'dut.v'), verilog);
    writeFileSync(join(dir, 'tb.v'), tb);
    const t0 = performance.now();
    execFileSync('iverilog', ['-o', join(dir, 'sim'), join(dir, 'dut.v'), join(dir, 'tb.v')]);
    const out = execFileSync('vvp', ['-n', join(dir, 'sim')], { encoding: 'utf8', maxBuffer: 1 << 30 });
    const ms = performance.now() - t0;
    const run = { ms, lines: out.split('\n').filter((l) => /^[01xz]+$/i.test(l.trim())).map((l) => l.trim().toUpperCase()) };
    cache.set(key, run);
    return run;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
