/**
 * Gate truth tables for every gate kind and 2–8 inputs, and the four-valued rules.
 * Reference: the Boolean definitions of the gates (any digital-logic textbook; common practice, no
 * source), computed independently here with JavaScript's own integer operators; XOR/XNOR of N > 2 inputs
 * are odd/even parity. Four-valued rules as IEEE Std 1364 gate primitives (controlling value wins).
 */
import { describe, expect, it } from 'vitest';
import { compileBoard, Simulator } from '../../shared/sim';
import { BoardBuilder } from './board-builder';

const KINDS = ['and', 'or', 'nand', 'nor', 'xor', 'xnor'] as const;

function reference(kind: (typeof KINDS)[number], bits: number[]): number {
  const all = bits.every((b) => b === 1);
  const any = bits.some((b) => b === 1);
  const parity = bits.reduce((a, b) => a ^ b, 0);
  switch (kind) {
    case 'and': return all ? 1 : 0;
    case 'or': return any ? 1 : 0;
    case 'nand': return all ? 0 : 1;
    case 'nor': return any ? 0 : 1;
    case 'xor': return parity;
    case 'xnor': return 1 - parity;
  }
}

function gateBoard(kind: string, n: number) {
  const b = new BoardBuilder();
  const ins = Array.from({ length: n }, (_, i) => `s${i}`);
  ins.forEach((id) => b.switch(id));
  b.gate('g', kind, ins.map((id) => `${id}.out`)).lamp('y', 'Y', 'g.out');
  return b.board();
}

describe('gate truth tables', () => {
  for (const kind of KINDS) {
    for (let n = 2; n <= 8; n++) {
      it(`${kind} with ${n} inputs matches its Boolean definition on all ${2 ** n} rows`, () => {
        const sim = new Simulator(compileBoard(gateBoard(kind, n)));
        for (let row = 0; row < 2 ** n; row++) {
          const bits = Array.from({ length: n }, (_, i) => (row >> (n - 1 - i)) & 1);
          bits.forEach((bit, i) => sim.setInput(`s${i}`, bit as 0 | 1));
          expect(sim.settle().settled).toBe(true);
          expect(sim.outputValues().Y).toBe(String(reference(kind, bits)));
        }
      });
    }
  }

  it('buffer and NOT follow their input', () => {
    const b = new BoardBuilder().switch('a').gate('bf', 'buffer', ['a.out']).gate('nt', 'not', ['a.out'])
      .lamp('y1', 'B', 'bf.out').lamp('y2', 'N', 'nt.out');
    const sim = new Simulator(compileBoard(b.board()));
    for (const v of [0, 1] as const) {
      sim.setInput('a', v);
      sim.settle();
      expect(sim.outputValues()).toEqual({ B: String(v), N: String(1 - v) });
    }
  });
});

describe('four-valued rules (IEEE Std 1364 gate primitive tables)', () => {
  // An unconnected gate input is an undriven net: in the ideal family it reads X.
  function withOpen(kind: string, other: 0 | 1): string {
    // in1 left open
    const b = new BoardBuilder().switch('a').part({ id: 'g', kind, inputs: 2 }).wire('a.out', 'g.in0').lamp('y', 'Y', 'g.out');
    const sim = new Simulator(compileBoard(b.board()));
    sim.setInput('a', other);
    sim.settle();
    return sim.outputValues().Y;
  }

  it('a controlling input wins over X: AND with 0 → 0, OR with 1 → 1, NAND with 0 → 1, NOR with 1 → 0', () => {
    expect(withOpen('and', 0)).toBe('0');
    expect(withOpen('or', 1)).toBe('1');
    expect(withOpen('nand', 0)).toBe('1');
    expect(withOpen('nor', 1)).toBe('0');
  });

  it('a non-controlling input beside X gives X; XOR/XNOR with any X give X', () => {
    expect(withOpen('and', 1)).toBe('X');
    expect(withOpen('or', 0)).toBe('X');
    expect(withOpen('xor', 0)).toBe('X');
    expect(withOpen('xnor', 1)).toBe('X');
  });

  it('an undriven net reads as the family floating value: TTL high, CMOS low, ideal X', () => {
    // open TTL input reads high (from memory); CMOS with pull-down low (TI SCBA004: inputs must not float)
    for (const [family, expected] of [['ttl-74ls', '0'], ['cmos-74hc', '1'], ['ideal', 'X'], ['tube-drl-nor', '1']] as const) {
      const b = new BoardBuilder(family).part({ id: 'g', kind: 'not' }).lamp('y', 'Y', 'g.out');
      const sim = new Simulator(compileBoard(b.board()));
      const r = sim.settle();
      expect(sim.outputValues().Y, family).toBe(expected);
      expect(r.undrivenInputs).toEqual(['g.in0']);
    }
  });

  it('a lamp on an undriven net shows Z', () => {
    const b = new BoardBuilder().part({ id: 'l', kind: 'lamp', label: 'L' });
    const sim = new Simulator(compileBoard(b.board()));
    sim.settle();
    expect(sim.outputValues().L).toBe('Z');
  });

  it('two outputs on one net give X and a reported conflict', () => {
    const b = new BoardBuilder().switch('a', 'A', true).switch('b', 'B', true).lamp('y', 'Y', 'a.out').wire('b.out', 'y.in')
      .gate('n', 'not', ['y.in']).lamp('z', 'Z', 'n.out');
    const netlist = compileBoard(b.board());
    expect(netlist.conflicts).toHaveLength(1);
    expect(netlist.problems[0]).toMatchObject({ kind: 'conflict' });
    const sim = new Simulator(netlist);
    const r = sim.settle();
    expect(r.conflicts).toEqual(['A']);
    expect(sim.outputValues()).toEqual({ Y: 'X', Z: 'X' });
  });
});

describe('multiplexers (textbook standard: Y = S\'D0 + S·D1; 4:1 Y = S1\'S0\'D0 + S1\'S0D1 + S1S0\'D2 + S1S0D3)', () => {
  it('mux4 selects d[2·sel1 + sel0] on every row', () => {
    const b = new BoardBuilder();
    ['s0', 's1', 'd0', 'd1', 'd2', 'd3'].forEach((id) => b.switch(id));
    b.part({ id: 'm', kind: 'mux4' });
    b.wire('s0.out', 'm.sel0').wire('s1.out', 'm.sel1');
    [0, 1, 2, 3].forEach((i) => b.wire(`d${i}.out`, `m.d${i}`));
    b.lamp('y', 'Y', 'm.out');
    const sim = new Simulator(compileBoard(b.board()));
    for (let row = 0; row < 64; row++) {
      const bit = (i: number) => ((row >> i) & 1) as 0 | 1;
      ['s0', 's1', 'd0', 'd1', 'd2', 'd3'].forEach((id, i) => sim.setInput(id, bit(i)));
      sim.settle();
      expect(sim.outputValues().Y).toBe(String(bit(2 + bit(0) + 2 * bit(1))));
    }
  });

  it('an X select with equal data gives the data, with different data X', () => {
    const b = new BoardBuilder().switch('d0').switch('d1').part({ id: 'm', kind: 'mux2' })
      .wire('d0.out', 'm.d0').wire('d1.out', 'm.d1').lamp('y', 'Y', 'm.out'); // sel open → X (ideal)
    const sim = new Simulator(compileBoard(b.board()));
    sim.setInput('d0', 1); sim.setInput('d1', 1); sim.settle();
    expect(sim.outputValues().Y).toBe('1');
    sim.setInput('d1', 0); sim.settle();
    expect(sim.outputValues().Y).toBe('X');
  });
});
