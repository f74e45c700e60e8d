/**
 * Feedback circuits built of gates, against published traces, and the built-in storage parts.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { compileBoard, Simulator } from '../../shared/sim';
import { BoardBuilder } from './board-builder';
import { norSrLatch, sixNandDff } from './circuits';

function gates(sim: Simulator): string {
  return ['g1', 'g2', 'g3', 'g4', 'g5', 'g6'].map((g) => sim.pinLevel(g, 'out')).join('');
}

/** The published trace after the start state: D↑, CLK↑, CLK↓, D↓, CLK↑. */
function followTrace(sim: Simulator): void {
  const steps: [string, 0 | 1, string][] = [
    ['d', 1, '111001'], // D↑
    ['clk', 1, '101010'], // CLK↑
    ['clk', 0, '111010'], // CLK↓
    ['d', 0, '011110'], // D↓
    ['clk', 1, '010101'], // CLK↑
  ];
  for (const [input, v, expected] of steps) {
    sim.setInput(input, v);
    const r = sim.settle();
    expect(r.settled).toBe(true);
    expect(gates(sim), `${input}=${v}`).toBe(expected);
  }
}

describe('six-NAND edge-triggered D flip-flop', () => {
  // Source: NJIT Digital Commons "dld-animations" 84, Fig. 6.18, 2023 (trace G1..G6, PRE' = CLR' = 1):
  // start CLK=0,D=0 → 011101; D↑ → 111001; CLK↑ → 101010; CLK↓ → 111010; D↓ → 011110; CLK↑ → 010101.
  it('reaches the published start state at power-on (Q resolved low) and follows the trace, no priming clock', () => {
    const sim = new Simulator(compileBoard(sixNandDff().board()));
    const r = sim.settle();
    expect(r.settled).toBe(true);
    expect(r.powerOn).toEqual(['Q']); // G5 = Q powers on low, G6 = Q' follows high
    expect(gates(sim)).toBe('011101'); // start CLK=0, D=0
    followTrace(sim);
  });

  it('after resetState() the power-on choice is made again', () => {
    const sim = new Simulator(compileBoard(sixNandDff().board()));
    sim.settle();
    sim.setInput('d', 1); sim.settle();
    sim.setInput('clk', 1); sim.settle();
    expect(sim.outputValues()).toEqual({ Q: '1', QN: '0' });
    expect(sim.settle().powerOn).toEqual([]); // only the first settle after power-on chooses
    sim.setInput('d', 0); sim.setInput('clk', 0); sim.resetState();
    expect(sim.settle().powerOn).toEqual(['Q']);
    expect(gates(sim)).toBe('011101');
  });

  it('with powerOn: \'x\' reproduces the published trace after one priming clock with D = 0', () => {
    const sim = new Simulator(compileBoard(sixNandDff().board()), { powerOn: 'x' });
    expect(sim.settle().settled).toBe(true);
    // from all-X with CLK = 0 the output latch (G5, G6) stays unknown until a clock edge loads it
    expect(gates(sim)).toBe('0111XX');
    sim.setInput('clk', 1); sim.settle();
    sim.setInput('clk', 0); sim.settle();
    expect(gates(sim)).toBe('011101'); // start CLK=0, D=0
    followTrace(sim);
  });

  it('ignores D while the clock is high', () => {
    const sim = new Simulator(compileBoard(sixNandDff().board()));
    sim.setInput('d', 1); sim.setInput('clk', 0); sim.settle();
    sim.setInput('clk', 1); sim.settle();
    expect(sim.outputValues()).toEqual({ Q: '1', QN: '0' });
    for (const d of [0, 1, 0] as const) {
      sim.setInput('d', d); sim.settle();
      expect(sim.outputValues()).toEqual({ Q: '1', QN: '0' });
    }
  });

  // Rising-edge D flip-flop behaviour (common practice, no source), the built-in part as the reference.
  for (const primed of [true, false]) {
    it(`agrees with the built-in dff over random D/CLK sequences (fast-check, ${primed ? 'after a priming clock' : 'from power-on'})`, () => {
      const b = sixNandDff();
      b.part({ id: 'ff', kind: 'dff' }).wire('d.out', 'ff.d').wire('clk.out', 'ff.clk').lamp('q2', 'Q2', 'ff.q');
      const netlist = compileBoard(b.board());
      fc.assert(fc.property(fc.array(fc.record({ d: fc.integer({ min: 0, max: 1 }), clk: fc.integer({ min: 0, max: 1 }) }), { minLength: 1, maxLength: 40 }), (seq) => {
        const sim = new Simulator(netlist);
        // power on: the built-in starts at 0, the gate version resolves Q low; primed: clock in D = 0 first
        sim.settle();
        if (sim.outputValues().Q !== sim.outputValues().Q2) return false;
        if (primed) { sim.setInput('clk', 1); sim.settle(); sim.setInput('clk', 0); sim.settle(); }
        for (const { d, clk } of seq) {
          // D first, then the clock, each settled: the gate flip-flop needs its setup time
          sim.setInput('d', d as 0 | 1); sim.settle();
          sim.setInput('clk', clk as 0 | 1); sim.settle();
          const out = sim.outputValues();
          if (out.Q !== out.Q2) return false;
        }
        return true;
      }), { numRuns: 200, seed: 42 });
    });
  }
});

describe('SR NOR latch of gates', () => {
  // SR NOR latch: S,R = 00 hold; 01 → Q=0; 10 → Q=1; 11 → Q = Q' = 0; releasing both at once is a race
  // (common practice, textbook classic; CHECKS.md "Sequential references").
  it('sets, resets, holds, and gives Q = Q\' = 0 with both active', () => {
    const sim = new Simulator(compileBoard(norSrLatch().board()));
    sim.setInput('s', 1); sim.settle();
    expect(sim.outputValues()).toEqual({ Q: '1', QN: '0' });
    sim.setInput('s', 0); sim.settle();
    expect(sim.outputValues()).toEqual({ Q: '1', QN: '0' });
    sim.setInput('r', 1); sim.settle();
    expect(sim.outputValues()).toEqual({ Q: '0', QN: '1' });
    sim.setInput('r', 0); sim.settle();
    expect(sim.outputValues()).toEqual({ Q: '0', QN: '1' });
    sim.setInput('s', 1); sim.setInput('r', 1); sim.settle();
    expect(sim.outputValues()).toEqual({ Q: '0', QN: '0' });
  });

  it('powers on with S = R = 0 at Q = 0, Q\' = 1 (the first gate listed powers on low)', () => {
    const sim = new Simulator(compileBoard(norSrLatch().board()));
    const r = sim.settle();
    expect(r).toMatchObject({ settled: true, powerOn: ['Q'] });
    expect(sim.outputValues()).toEqual({ Q: '0', QN: '1' });
    // and then holds, sets and resets as usual
    sim.setInput('s', 1); sim.settle(); sim.setInput('s', 0); sim.settle();
    expect(sim.outputValues()).toEqual({ Q: '1', QN: '0' });
  });

  it('reports the release race as oscillation and names both nets', () => {
    const sim = new Simulator(compileBoard(norSrLatch().board()), { eventBudget: 1000 });
    sim.setInput('s', 1); sim.setInput('r', 1); sim.settle();
    sim.setInput('s', 0); sim.setInput('r', 0);
    const r = sim.settle();
    expect(r.settled).toBe(false);
    expect(r.oscillating.sort()).toEqual(['Q', 'QN']);
  });

  it('releasing one input first is no race', () => {
    const sim = new Simulator(compileBoard(norSrLatch().board()));
    sim.setInput('s', 1); sim.setInput('r', 1); sim.settle();
    sim.setInput('r', 0);
    expect(sim.settle().settled).toBe(true);
    sim.setInput('s', 0);
    expect(sim.settle().settled).toBe(true);
    expect(sim.outputValues()).toEqual({ Q: '1', QN: '0' });
  });
});

// Built-in parts: CONTRACTS §1 (power-on at init or 0); SR as the NOR latch above (textbook classic);
// D latch transparent while enabled and rising-edge D flip-flop (common practice, no source).
describe('built-in storage parts', () => {
  function storage(kind: 'srlatch' | 'dlatch' | 'dff', init?: 0 | 1) {
    const [a, b] = kind === 'srlatch' ? ['s', 'r'] : kind === 'dlatch' ? ['d', 'en'] : ['d', 'clk'];
    const bb = new BoardBuilder().switch('a', 'A').switch('b', 'B').part({ id: 'm', kind, ...(init === undefined ? {} : { init }) })
      .wire('a.out', `m.${a}`).wire('b.out', `m.${b}`).lamp('q', 'Q', 'm.q').lamp('qn', 'QN', 'm.qn');
    return new Simulator(compileBoard(bb.board()));
  }

  it('power on at init (or 0)', () => {
    for (const kind of ['srlatch', 'dlatch', 'dff'] as const) {
      const s0 = storage(kind); s0.settle();
      expect(s0.outputValues(), kind).toEqual({ Q: '0', QN: '1' });
      const s1 = storage(kind, 1); s1.settle();
      expect(s1.outputValues(), kind).toEqual({ Q: '1', QN: '0' });
    }
  });

  it('srlatch: set, reset, both, and the release race reported', () => {
    const sim = storage('srlatch');
    sim.setInput('a', 1); sim.settle();
    expect(sim.outputValues().Q).toBe('1');
    sim.setInput('a', 0); sim.setInput('b', 1); sim.settle();
    expect(sim.outputValues().Q).toBe('0');
    sim.setInput('a', 1); sim.settle();
    expect(sim.outputValues()).toEqual({ Q: '0', QN: '0' });
    sim.setInput('a', 0); sim.setInput('b', 0);
    const r = sim.settle();
    expect(r.races).toEqual(['m']);
    expect(sim.outputValues()).toEqual({ Q: 'X', QN: 'X' });
  });

  it('dlatch is transparent while EN = 1 and holds while EN = 0', () => {
    const sim = storage('dlatch');
    sim.setInput('b', 1); sim.setInput('a', 1); sim.settle();
    expect(sim.outputValues().Q).toBe('1');
    sim.setInput('b', 0); sim.settle();
    sim.setInput('a', 0); sim.settle();
    expect(sim.outputValues().Q).toBe('1');
  });

  it('dff loads on the rising edge only, and reports D changing on the edge as a race', () => {
    const sim = storage('dff');
    sim.setInput('a', 1); sim.settle();
    expect(sim.outputValues().Q).toBe('0');
    sim.setInput('b', 1); sim.settle();
    expect(sim.outputValues().Q).toBe('1');
    sim.setInput('a', 0); sim.settle();
    sim.setInput('b', 0); sim.settle();
    expect(sim.outputValues().Q).toBe('1');
    sim.setInput('b', 1); sim.setInput('a', 1);
    expect(sim.settle().races).toEqual(['m']);
  });

  it('dff is X-aware: an X→1 clock edge with D ≠ Q, or X data on an edge, give X (IEEE Std 1364 posedge)', () => {
    // clock from an open (undriven) net through a mux whose select is a switch: X, then 1
    const bb = new BoardBuilder().switch('d', 'D', true).switch('sel', 'SEL').const1()
      .part({ id: 'm', kind: 'mux2' }).wire('sel.out', 'm.sel').wire('one.out', 'm.d1')
      .part({ id: 'f', kind: 'dff' }).wire('d.out', 'f.d').wire('m.out', 'f.clk').lamp('q', 'Q', 'f.q');
    const sim = new Simulator(compileBoard(bb.board()));
    sim.settle(); // clk = X (m.d0 open), Q = 0
    sim.setInput('sel', 1); sim.settle(); // X → 1 with D = 1 ≠ Q
    expect(sim.outputValues().Q).toBe('X');
    const bx = new BoardBuilder().switch('c', 'C').part({ id: 'f', kind: 'dff' }).wire('c.out', 'f.clk').lamp('q', 'Q', 'f.q');
    const s2 = new Simulator(compileBoard(bx.board())); // D open → X
    s2.settle();
    s2.setInput('c', 1); s2.settle();
    expect(s2.outputValues().Q).toBe('X');
  });
});
