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

/** One change of an input port at a time (time units of the exported netlist). */
export interface Stimulus { time: number; port: string; value: 0 | 1 }

/**
 * Drives the ports by the stimulus (sorted by time, all inputs given at time 0), runs to `until`, and
 * returns every change of the watched ports as `PORT@time=level` in order.
 */
export function runIverilogTrace(verilog: string, inputs: string[], watch: string[], stimulus: Stimulus[], until: number): string[] {
  const module = /^module\s+([A-Za-z_][A-Za-z0-9_]*)/m.exec(verilog)?.[1];
  if (!module) throw new Error('no module in the Verilog text');
  const outputs = [...new Set(watch)].filter((w) => !inputs.includes(w));
  const steps: string[] = [];
  let now = 0;
  for (const s of [...stimulus].sort((a, b) => a.time - b.time)) {
    if (s.time > now) { steps.push(`    #${s.time - now};`); now = s.time; }
    steps.push(`    ${s.port} = 1'b${s.value};`);
  }
  steps.push(`    #${until - now} $finish;`);
  // the testbench counts in the netlist's own time unit
  const timescale = /^`timescale\s+\S+/m.exec(verilog)?.[0] ?? '`timescale 1ns/1ps';
  const tb = [
    timescale,
    'module tb;',
    ...inputs.map((i) => `  reg ${i};`),
    ...outputs.map((o) => `  wire ${o};`),
    `  ${module} dut (${[...inputs, ...outputs].map((p) => `.${p}(${p})`).join(', ')});`,
    '  initial begin',
    ...steps,
    '  end',
    ...watch.map((w) => `  always @(${w}) $display("%s@%0d=%b", "${w}", $time, ${w});`),
    'endmodule',
  ].join('\n');
  const dir = mkdtempSync(join(tmpdir(), 'gatefold-ivt-'));
  try {
    writeFileSync(join(dir, 'a.v'), verilog);
    writeFileSync(join(dir, 'tb.v'), tb);
    execFileSync(IVERILOG, ['-o', join(dir, 'sim'), join(dir, 'a.v'), join(dir, 'tb.v')], { stdio: 'pipe' });
    const out = execFileSync('/usr/bin/vvp', ['-n', join(dir, 'sim')], { encoding: 'utf8' });
    return out.split('\n').map((l) => l.trim()).filter((l) => /^\w+@\d+=[01xzXZ]$/.test(l)).map((l) => l.toUpperCase().replace(/=([01XZ])$/, '=$1'));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
