/**
 * A flip-flop clocked by a gate that rises out of its power-on X. IEEE Std 1364 treats X→1 as a `posedge`;
 * for an edge that may or may not have happened, the outcome is certain only when D equals the stored Q
 * (the edge rules of a sequential UDP, 1364-2005 §8.6 — from memory). Icarus Verilog (Debian package
 * `iverilog`), an independent simulator, runs the zero-delay export: there D has settled when the clock
 * rises, so it shows what the edge rule gives once the gates feeding D are evaluated.
 */
import { describe, expect, it } from 'vitest';
import { compileBoard, Simulator, toVerilog } from '../../shared/sim';
import { BoardBuilder } from './board-builder';
import { runIverilog } from './iverilog';

/**
 * Clock = NOT(A) (X at power-on, then 1 with A = 0); D = NOT(NOT(constant)), two gate delays behind the
 * clock. D comes from a constant so that Icarus's testbench setting A at time 0 cannot race it.
 */
function board(dOn: boolean) {
  return new BoardBuilder().switch('a', 'A').part({ id: 'd', kind: 'const', label: 'DV', value: dOn ? 1 : 0 })
    .gate('g', 'not', ['a.out']).gate('n1', 'not', ['d.out']).gate('n2', 'not', ['n1.out'])
    .part({ id: 'ff', kind: 'dff' }).wire('g.out', 'ff.clk').wire('n2.out', 'ff.d').lamp('q', 'Q', 'ff.q')
    .board();
}

function gatefoldQ(dOn: boolean): string {
  const sim = new Simulator(compileBoard(board(dOn)));
  expect(sim.settle().settled).toBe(true);
  return sim.outputValues().Q;
}

describe('flip-flop on an X→1 clock at power-on', () => {
  it('keeps Q when D settles to Q, as Icarus Verilog shows on the export', () => {
    const b = board(false);
    const icarus = runIverilog(toVerilog(b, compileBoard(b)), ['A'], ['Q'], [[0]]);
    expect(icarus).toEqual(['0']);
    expect(gatefoldQ(false)).toBe(icarus[0]);
  });

  it('gives X when D settles to the other level (the edge may or may not have loaded it)', () => {
    expect(gatefoldQ(true)).toBe('X');
  });

  it('still loads D on an ordinary 0→1 edge afterwards', () => {
    const sim = new Simulator(compileBoard(board(true)));
    sim.settle();
    sim.setInput('a', 1); sim.settle(); // clock falls
    sim.setInput('a', 0); sim.settle(); // clock rises 0→1: loads D = 1
    expect(sim.outputValues().Q).toBe('1');
  });
});
