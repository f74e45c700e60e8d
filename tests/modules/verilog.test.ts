/**
 * The hierarchical Verilog export (one Verilog module per Gatefold module, instantiated by name) run by
 * Icarus Verilog (Debian's iverilog, an independent IEEE Std 1364 simulator) agrees row by row with our
 * analysis; the VCD of `simulate` scopes the signals inside an instance under its path.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { analyzeBoard } from '../../shared/analysis';
import { toHierarchicalVerilog } from '../../shared/sim';
import { simulate } from '../../server/cli/commands/simulate';
import { runIverilog } from '../sim/iverilog';
import { randomCircuit } from '../helpers/random-circuit';
import { splitIntoModules } from '../helpers/module-split';
import { fullAdderOfModules } from './boards';
import type { BoardFile } from '../../shared/board';

function agreesWithIcarus(board: BoardFile): void {
  const verilog = toHierarchicalVerilog(board);
  const table = analyzeBoard(board);
  const rows = table.rows.map((r) => [...r.in].map(Number));
  const icarus = runIverilog(verilog, table.inputs, table.outputs, rows);
  expect(icarus).toEqual(table.rows.map((r) => r.out));
}

describe('hierarchical Verilog', () => {
  it('writes one module per Gatefold module, instantiated by name, the board first', () => {
    const verilog = toHierarchicalVerilog(fullAdderOfModules());
    const modules = [...verilog.matchAll(/^module (\S+)/gm)].map((m) => m[1]);
    expect(modules).toEqual(['Full_adder_of_half_adders', 'gf_half']);
    expect(verilog).toMatch(/^module gf_half \(A, B, S, C\);$/m);
    expect(verilog.match(/^ {2}gf_half u[12] \(/gm)).toHaveLength(2);
    expect(verilog.match(/`timescale/g)).toHaveLength(1);
  });

  it('runs under Icarus Verilog with the full adder table', () => {
    agreesWithIcarus(fullAdderOfModules());
  });

  it('runs under Icarus Verilog row by row for random module splits, nested ones included', () => {
    for (const seed of [11, 12, 13, 14, 15, 16]) {
      const flat = randomCircuit({ seed, inputs: 4, gates: 28, outputs: 3, kinds: ['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'mux2'] });
      agreesWithIcarus(splitIntoModules(flat, seed * 7, 4));
    }
  });
});

describe('VCD of a board with modules', () => {
  const dir = mkdtempSync(join(tmpdir(), 'gatefold-modules-vcd-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  it('scopes the nets inside an instance under the instance', () => {
    const file = join(dir, 'fa.gatefold.json');
    writeFileSync(file, JSON.stringify(fullAdderOfModules()));
    const written: Record<string, string> = {};
    void simulate.run([file, '--set', 'A=1', '--vcd', join(dir, 'fa.vcd')], { stdout: () => undefined, writeFile: (p, t) => { written[p] = t; } });
    const vcd = written[join(dir, 'fa.vcd')];
    // IEEE Std 1364 §18.2: $scope module <name> … $upscope nest the hierarchy
    expect(vcd).toMatch(/\$scope module u1 \$end\n(\$var wire 1 \S+ \S+ \$end\n)+\$upscope \$end/);
    // u2/g1 drives S, which the top scope shows by its label; the carry of u2 is inside
    expect(vcd).toMatch(/\$scope module u2 \$end\n\$var wire 1 \S+ g2_out \$end/);
    expect(readFileSync(file, 'utf8')).toContain('"modules"');
  });
});
