/** Runs an exported Verilog module under Icarus Verilog with a generated row-by-row testbench. */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export const IVERILOG = '/usr/bin/iverilog';

/**
 * Applies each row (input levels in `inputs` order, 0/1), waits 10 time units, prints the outputs.
 * Returns one string per row, outputs in `outputs` order, as `0 1 X Z` characters.
 */
export function runIverilog(verilog: string, inputs: string[], outputs: string[], rows: number[][]): string[] {
  if (!existsSync(IVERILOG)) throw new Error('Icarus Verilog is missing: apt-get install -y iverilog');
  const module = /^module\s+([A-Za-z_][A-Za-z0-9_]*)/m.exec(verilog)?.[1];
  if (!module) throw new Error('no module in the Verilog text');
  const tb = [
    '`timescale 1ns/1ns',
    'module tb;',
    ...inputs.map((i) => `  reg ${i};`),
    ...outputs.map((o) => `  wire ${o};`),
    `  ${module} dut (${[...inputs, ...outputs].map((p) => `.${p}(${p})`).join(', ')});`,
    '  initial begin',
    ...rows.map((row) => `    ${inputs.map((i, k) => `${i} = 1'b${row[k]};`).join(' ')} #10 $display("%b", {${outputs.join(', ')}});`),
    '    $finish;',
    '  end',
    'endmodule',
  ].join('\n');
  const dir = mkdtempSync(join(tmpdir(), 'gatefold-iv-'));
  try {
    writeFileSync(join(dir, 'a.v'), verilog);
    writeFileSync(join(dir, 'tb.v'), tb);
    execFileSync(IVERILOG, ['-o', join(dir, 'sim'), join(dir, 'a.v'), join(dir, 'tb.v')], { stdio: 'pipe' });
    const out = execFileSync('/usr/bin/vvp', ['-n', join(dir, 'sim')], { encoding: 'utf8' });
    return out.split('\n').filter((l) => /^[01xzXZ]+$/.test(l.trim())).map((l) => l.trim().toUpperCase());
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
