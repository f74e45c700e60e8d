import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CODE_CHARS, enumerateTable, levelise, resolveSpec } from '../../shared/analysis';
import { compileBoard } from '../../shared/sim';
import { toVerilog } from '../../shared/sim';
import { randomBoardArb } from './random-board';
import { randomCircuit, type RandomKind } from '../helpers/random-circuit';

const ALL_KINDS: RandomKind[] = ['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'buffer', 'mux2', 'mux4'];
/** Seeded circuits of the simulation tests' generator: wider and deeper than randomBoardArb's. */
const seededArb = fc.record({ seed: fc.integer(), inputs: fc.integer({ min: 1, max: 9 }), gates: fc.integer({ min: 1, max: 80 }) })
  .map((o) => randomCircuit({ ...o, kinds: ALL_KINDS, maxFanIn: 4 }));

const column = (values: Uint8Array) => Array.from(values, (v) => CODE_CHARS[v]).join('');

describe('bit-parallel truth tables', () => {
  // Reference: our own event-driven simulator, row by row (an independent path through the same rules).
  it('equal row-by-row event simulation on random circuits', () => {
    fc.assert(fc.property(randomBoardArb({ loose: true, conflicts: true }), (board) => {
      const netlist = compileBoard(board);
      expect(levelise(netlist).loopParts).toEqual([]);
      const spec = resolveSpec(netlist);
      const fast = enumerateTable(netlist, spec, { chunkRows: 32 });
      const slow = enumerateTable(netlist, spec, { eventOnly: true });
      expect(fast.method.every((m) => m === 'bit-parallel')).toBe(true);
      fast.values.forEach((v, i) => expect(column(v), fast.outputs[i]).toBe(column(slow.values[i])));
    }), { numRuns: 200 });
  });

  it('equal row-by-row event simulation on seeded random circuits (the shared generator)', () => {
    fc.assert(fc.property(seededArb, (board) => {
      const netlist = compileBoard(board);
      const spec = resolveSpec(netlist);
      const fast = enumerateTable(netlist, spec);
      const slow = enumerateTable(netlist, spec, { eventOnly: true });
      fast.values.forEach((v, i) => expect(column(v), fast.outputs[i]).toBe(column(slow.values[i])));
    }), { numRuns: 60 });
  });

  // Independent reference: Icarus Verilog (`iverilog`, `vvp`; CHECKS.md "Formats": "Icarus Verilog simulates
  // an exported netlist as an independent check") on the structural Verilog (IEEE Std 1364) of toVerilog.
  // Open inputs included: IEEE Std 1364 gate primitives read z as x and a controlling value still wins,
  // as ours do (an undriven lamp shows z / Z in both); see randomBoardArb's verilogSafe for the limits.
  it('agree with Icarus Verilog on the exported netlist', () => {
    const dir = mkdtempSync(join(tmpdir(), 'gatefold-iv-'));
    try {
      const boards = fc.oneof(randomBoardArb({ maxInputs: 5, maxGates: 16, loose: true, verilogSafe: true }), seededArb);
      fc.assert(fc.property(boards, (board) => {
        const netlist = compileBoard(board);
        const table = enumerateTable(netlist, resolveSpec(netlist));
        const verilog = toVerilog(board, netlist);
        const top = /module\s+(\w+)/.exec(verilog)![1];
        const k = table.inputs.length;
        const tb = [
          '`timescale 1ns/1ns', 'module tb;', `  reg [${Math.max(k - 1, 0)}:0] v;`,
          ...table.outputs.map((o) => `  wire ${o};`),
          `  ${top} dut (${[...table.inputs.map((n, i) => `.${n}(v[${k - 1 - i}])`), ...table.outputs.map((o) => `.${o}(${o})`)].join(', ')});`,
          `  integer i;`, '  initial begin',
          `    for (i = 0; i < ${2 ** k}; i = i + 1) begin v = i; #100; $display("%b", {${table.outputs.join(', ')}}); end`,
          '    $finish;', '  end', 'endmodule', '',
        ].join('\n');
        writeFileSync(join(dir, 'dut.v'), verilog);
        writeFileSync(join(dir, 'tb.v'), tb);
        execFileSync('iverilog', ['-o', join(dir, 'sim'), join(dir, 'dut.v'), join(dir, 'tb.v')]);
        const lines = execFileSync('vvp', ['-n', join(dir, 'sim')], { encoding: 'utf8' }).split('\n').filter((l) => /^[01xz]+$/i.test(l.trim()));
        expect(lines).toHaveLength(table.rowCount);
        lines.forEach((line, r) => {
          const ours = table.values.map((v) => CODE_CHARS[v[r]]).join('');
          expect(line.trim().toUpperCase(), `row ${r}`).toBe(ours);
        });
      }), { numRuns: 30 });
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
