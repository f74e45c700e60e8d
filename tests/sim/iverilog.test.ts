/**
 * Cross-check against Icarus Verilog (Debian package `iverilog`: an independent IEEE Std 1364
 * simulator): the exported Verilog, driven by a generated testbench, gives the same outputs as
 * Gatefold on every input row.
 */
import { describe, expect, it } from 'vitest';
import type { BoardFile } from '../../shared/board';
import { compileBoard, Simulator, toVerilog } from '../../shared/sim';
import { randomCircuit } from '../helpers/random-circuit';
import { BoardBuilder } from './board-builder';
import { norSrLatch } from './circuits';
import { runIverilog } from './iverilog';

/** Gatefold's outputs for each row, applied in order to one simulator. */
function gatefoldRows(board: BoardFile, rows: number[][]): { inputs: string[]; outputs: string[]; results: string[] } {
  const netlist = compileBoard(board);
  const ins = netlist.inputs.filter((p) => p.kind !== 'const');
  // default power-on resolution: every compared row comes after the first row has set or reset each
  // gate loop, so the rows mean the same as in Icarus Verilog (whose loops start at X)
  const sim = new Simulator(netlist);
  sim.settle();
  const results = rows.map((row) => {
    ins.forEach((p, k) => sim.setInput(p.id, row[k] as 0 | 1));
    expect(sim.settle().settled).toBe(true);
    const out = sim.outputValues();
    return netlist.outputs.map((p) => out[p.name]).join('');
  });
  return { inputs: ins.map((p) => p.name), outputs: netlist.outputs.map((p) => p.name), results };
}

function allRows(n: number): number[][] {
  return Array.from({ length: 2 ** n }, (_, r) => Array.from({ length: n }, (_, k) => (r >> (n - 1 - k)) & 1));
}

function crossCheck(board: BoardFile, rows: number[][]): string[] {
  const ours = gatefoldRows(board, rows);
  const verilog = toVerilog(board, compileBoard(board));
  const theirs = runIverilog(verilog, ours.inputs, ours.outputs, rows);
  expect(theirs).toEqual(ours.results);
  return ours.results;
}

describe('exported Verilog agrees with Icarus Verilog', () => {
  it('half adder (S = A xor B, C = A and B; truth table, any digital-logic textbook)', () => {
    const b = new BoardBuilder('ideal', 'Half adder').switch('a').switch('b')
      .gate('x', 'xor', ['a.out', 'b.out']).gate('n', 'and', ['a.out', 'b.out']).lamp('s', 'S', 'x.out').lamp('c', 'C', 'n.out');
    expect(crossCheck(b.board(), allRows(2))).toEqual(['00', '10', '10', '01']);
  });

  it('full adder (S = Σm(1,2,4,7), Cout = Σm(3,5,6,7); any digital-logic textbook; also integer addition, common practice)', () => {
    const b = new BoardBuilder('ideal', 'Full adder').switch('a').switch('b').switch('ci', 'CIN')
      .gate('x', 'xor', ['a.out', 'b.out', 'ci.out'])
      .gate('m1', 'and', ['a.out', 'b.out']).gate('m2', 'and', ['a.out', 'ci.out']).gate('m3', 'and', ['b.out', 'ci.out'])
      .gate('co', 'or', ['m1.out', 'm2.out', 'm3.out']).lamp('s', 'S', 'x.out').lamp('c', 'COUT', 'co.out');
    const rows = allRows(3);
    const results = crossCheck(b.board(), rows);
    rows.forEach((row, r) => {
      const sum = row[0] + row[1] + row[2];
      expect(results[r]).toBe(`${sum & 1}${sum >> 1}`);
      expect(results[r][0] === '1').toBe([1, 2, 4, 7].includes(r));
      expect(results[r][1] === '1').toBe([3, 5, 6, 7].includes(r));
    });
  });

  it('4:1 multiplexer on all 64 rows (Y = S1\'S0\'D0 + S1\'S0D1 + S1S0\'D2 + S1S0D3, textbook standard)', () => {
    const b = new BoardBuilder('ideal', 'Mux four');
    ['s1', 's0', 'd0', 'd1', 'd2', 'd3'].forEach((id) => b.switch(id));
    b.part({ id: 'm', kind: 'mux4' }).wire('s0.out', 'm.sel0').wire('s1.out', 'm.sel1');
    [0, 1, 2, 3].forEach((i) => b.wire(`d${i}.out`, `m.d${i}`));
    b.lamp('y', 'Y', 'm.out');
    const rows = allRows(6);
    const results = crossCheck(b.board(), rows);
    rows.forEach((row, r) => expect(results[r]).toBe(String(row[2 + row[0] * 2 + row[1]])));
  });

  it('SR NOR latch of gates through set, hold, reset, both-active and single releases', () => {
    // SR NOR latch: 00 hold, 01 → Q=0, 10 → Q=1, 11 → Q = Q' = 0 (CHECKS.md "Sequential references", textbook classic)
    const rows = [[1, 0], [0, 0], [0, 1], [0, 0], [1, 0], [1, 1], [1, 0], [0, 0], [0, 1], [1, 1], [0, 1], [0, 0]];
    expect(crossCheck(norSrLatch(new BoardBuilder('ideal', 'Latch')).board(), rows))
      .toEqual(['10', '10', '01', '01', '10', '00', '10', '10', '01', '00', '01', '01']);
  });

  it('built-in storage parts (dff, dlatch, srlatch) over a clocked sequence', () => {
    const b = new BoardBuilder('ideal', 'Storage').switch('d').switch('c').switch('s').switch('r')
      .part({ id: 'f', kind: 'dff' }).wire('d.out', 'f.d').wire('c.out', 'f.clk')
      .part({ id: 'l', kind: 'dlatch', init: 1 }).wire('d.out', 'l.d').wire('c.out', 'l.en')
      .part({ id: 'sr', kind: 'srlatch' }).wire('s.out', 'sr.s').wire('r.out', 'sr.r')
      .lamp('q1', 'FQ', 'f.q').lamp('q2', 'LQ', 'l.q').lamp('q3', 'LQN', 'l.qn').lamp('q4', 'SQ', 'sr.q');
    const rnd = (k: number) => ((k * 2654435761) >>> 7) & 15;
    const rows = Array.from({ length: 40 }, (_, k) => { const v = rnd(k); return [v & 1, (v >> 1) & 1, (v >> 2) & 1 & ~(v >> 3) & 1, (v >> 3) & 1]; });
    crossCheck(b.board(), rows);
  });

  for (const seed of [1, 2, 3]) {
    it(`a random 40-gate combinational circuit (seed ${seed}) on all 64 rows`, () => {
      crossCheck(randomCircuit({ seed, inputs: 6, gates: 40, outputs: 5, kinds: ['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'buffer', 'mux2'] }), allRows(6));
    });
  }
});
