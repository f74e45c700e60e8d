/**
 * `simulate` and `export-verilog` through the real command line (CONTRACTS §2).
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { inverterRing, rippleCounter, norSrLatch, ringOscillator } from '../sim/circuits';
import { readVcd } from '../sim/vcd-read';
import { runCli } from './run-cli';
import { contractHalfAdder } from '../helpers/boards';

const dir = mkdtempSync(join(tmpdir(), 'gatefold-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function file(name: string, content: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content));
  return path;
}

const halfAdder = contractHalfAdder();

describe('simulate', () => {
  it('prints {settled, oscillating, conflicts, outputs, trace} for --set (half adder truth table, textbook)', async () => {
    const path = file('ha.gatefold.json', halfAdder);
    const rows = await Promise.all(['A=0,B=0', 'A=0,B=1', 'A=1,B=0', 'A=1,B=1'].map((set) => runCli(['simulate', path, '--set', set])));
    rows.forEach((r) => { expect(r.code).toBe(0); expect(r.stderr).toBe(''); });
    const out = rows.map((r) => JSON.parse(r.stdout));
    expect(Object.keys(out[0]).slice(0, 5)).toEqual(['settled', 'oscillating', 'conflicts', 'outputs', 'trace']);
    expect(out.map((o) => `${o.outputs.S}${o.outputs.C}`)).toEqual(['00', '10', '10', '01']);
    expect(out[3]).toMatchObject({ settled: true, oscillating: [], conflicts: [], trace: [] });
  });

  it('a 4-bit ripple counter reads k mod 16 after k cycles (common practice, no source)', async () => {
    const path = file('counter.gatefold.json', rippleCounter().board());
    const vcd = join(dir, 'counter.vcd');
    const r = await runCli(['simulate', path, '--clock', 'CLK', '--cycles', '20', '--vcd', vcd]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.settled).toBe(true);
    expect(out.trace).toHaveLength(20);
    out.trace.forEach((row: { cycle: number; outputs: Record<string, string> }, i: number) => {
      expect(row.cycle).toBe(i + 1);
      const bits = ['Q3', 'Q2', 'Q1', 'Q0'].map((q) => row.outputs[q]).join('');
      expect(bits).toBe(((i + 1) % 16).toString(2).padStart(4, '0'));
    });
    // the dump holds the clock and every output; Q0 changes once per cycle, CLK twice
    const read = await readVcd(readFileSync(vcd, 'utf8'));
    for (const name of ['CLK', 'Q0', 'Q1', 'Q2', 'Q3']) expect(read.signals.has(`board/${name}`)).toBe(true);
    const changes = (name: string) => read.changes.get(read.signals.get(`board/${name}`)!)!;
    expect(changes('CLK').filter(([, l]) => l === '1')).toHaveLength(20);
    expect(changes('Q0').slice(1).map(([, l]) => l).join('')).toBe('10'.repeat(10));
    expect(changes('Q3').slice(1).map(([, l]) => l).join('')).toBe('10');
  });

  it('reports the SR latch release race as oscillating nets', async () => {
    const board = norSrLatch().board();
    const path = file('latch.gatefold.json', board);
    const both = await runCli(['simulate', path, '--set', 'S=1,R=1']);
    expect(JSON.parse(both.stdout).outputs).toEqual({ Q: '0', QN: '0' });
    // S and R both 1 in the file, released together by --set
    const held = structuredClone(board);
    for (const p of held.parts) if (p.kind === 'switch') p.on = true;
    const r = await runCli(['simulate', file('latch11.gatefold.json', held), '--set', 'S=0,R=0']);
    const out = JSON.parse(r.stdout);
    expect(out.settled).toBe(false);
    expect(out.oscillating.sort()).toEqual(['Q', 'QN']);
  });

  it('clocks an oscillating board for many cycles quickly and names the ring nets', async () => {
    // ring oscillator: N (odd) inverting stages never settle (Rabaey et al. 2003, from memory)
    const board = ringOscillator(3).part({ id: 'ck', kind: 'clock', label: 'CLK' }).board();
    const started = Date.now();
    const r = await runCli(['simulate', file('ring.gatefold.json', board), '--set', 'EN=1', '--clock', 'CLK', '--cycles', '500']);
    const out = JSON.parse(r.stdout);
    expect(out.settled).toBe(false);
    expect(out.oscillating.sort()).toEqual(['Y', 'r0_out', 'r1_out']);
    expect(out.trace).toHaveLength(500);
    expect(Date.now() - started).toBeLessThan(20_000);
  });

  it('a ring of three plain inverters powers on, oscillates and is reported with its nets; --power-on x keeps X', async () => {
    // ring oscillator: N (odd) inverters never settle (Rabaey et al., Digital Integrated Circuits, 2nd ed.,
    // 2003 — from memory); the first inverter listed powers on low (decision 002)
    const path = file('ring3.gatefold.json', inverterRing(3).board());
    const r = await runCli(['simulate', path]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.settled).toBe(false);
    expect(out.oscillating.sort()).toEqual(['Y', 'i0_out', 'i1_out']);
    expect(out.powerOn).toEqual(['i0_out']);
    const strict = JSON.parse((await runCli(['simulate', path, '--power-on', 'x'])).stdout);
    expect(strict).toMatchObject({ settled: true, oscillating: [], powerOn: [], outputs: { Y: 'X' } });
    const even = JSON.parse((await runCli(['simulate', file('ring2.gatefold.json', inverterRing(2).board()), '--power-on', 'resolve'])).stdout);
    expect(even).toMatchObject({ settled: true, oscillating: [], powerOn: ['i0_out'], outputs: { Y: '1' } });
  });

  it('adds the safety caution for a tube board and defers to local codes', async () => {
    const r = await runCli(['simulate', file('tube.gatefold.json', { ...halfAdder, family: 'tube-drl-nor' })]);
    expect(JSON.parse(r.stdout).caution).toMatch(/dangerous voltages.*local electrical codes and qualified practice/);
    const plain = await runCli(['simulate', file('ha3.gatefold.json', halfAdder)]);
    expect(JSON.parse(plain.stdout).caution).toBeUndefined();
  });
});

describe('export-verilog', () => {
  it('writes one module with a port per input and output label', async () => {
    const r = await runCli(['export-verilog', file('ha2.gatefold.json', halfAdder)]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/module Half_adder \(A, B, S, C\);/);
    expect(r.stdout).toContain('input wire A;');
    expect(r.stdout).toContain('output wire C;');
    expect(r.stdout).toMatch(/xor \w+ \(S, A, B\);/);
    expect(r.stdout.trim().endsWith('endmodule')).toBe(true);
    expect(r.stdout).not.toContain('#(');
    const timed = await runCli(['export-verilog', file('ha4.gatefold.json', { ...halfAdder, family: 'ttl-74ls' }), '--delays']);
    expect(timed.stdout).toContain('`timescale 1ns/1ps');
    expect(timed.stdout).toMatch(/xor #\(9, 10\) \w+ \(S, A, B\);/);
  });
});
