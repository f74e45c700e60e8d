/**
 * The simulator's public API as the bench, the analysers and the CLI use it: netlist shape, net names,
 * free-running clocks, reset, pin levels, family delays.
 */
import { describe, expect, it } from 'vitest';
import { compileBoard, familyDelays, Simulator, toVerilog } from '../../shared/sim';
import { BoardBuilder } from './board-builder';
import { rippleCounter } from './circuits';
import { runIverilog } from './iverilog';

describe('compileBoard', () => {
  const board = new BoardBuilder().switch('a', 'A').switch('b', 'B')
    .gate('g', 'and', ['a.out', 'b.out']).gate('h', 'not', ['g.out']).lamp('y', 'Y', 'g.out')
    .part({ id: 'k', kind: 'or', inputs: 2 }).wire('h.out', 'k.in0') // k.in1 open, k.out unread
    .part({ id: 'n', kind: 'note', text: 'hello' }).board();
  const nl = compileBoard(board);

  it('joins pins into nets with their drivers and readers', () => {
    const net = nl.nets[nl.netOf('g', 'out')];
    expect(net.drivers).toEqual([{ part: 'g', pin: 'out' }]);
    expect(net.readers).toEqual([{ part: 'h', pin: 'in0' }, { part: 'y', pin: 'in' }]);
    expect(nl.netOf('a', 'out')).toBe(nl.netOf('g', 'in0'));
    expect(() => nl.netOf('g', 'nope')).toThrow();
  });

  it('names nets by label, else by the driver pin, else by the first pin', () => {
    expect(nl.nets[nl.netOf('g', 'out')].name).toBe('Y');
    expect(nl.nets[nl.netOf('a', 'out')].name).toBe('A');
    expect(nl.nets[nl.netOf('h', 'out')].name).toBe('h_out');
    expect(nl.nets[nl.netOf('k', 'in1')].name).toBe('k_in1');
    expect(new Set(nl.nets.map((n) => n.name)).size).toBe(nl.nets.length);
  });

  it('lists inputs and outputs in file order, and the undriven nets as problems', () => {
    expect(nl.inputs.map((p) => p.name)).toEqual(['A', 'B']);
    expect(nl.outputs.map((p) => p.name)).toEqual(['Y']);
    expect(nl.undriven.map((id) => nl.nets[id].name)).toEqual(['k_in1']);
    expect(nl.problems).toEqual([expect.objectContaining({ kind: 'undriven', name: 'k_in1' })]);
    expect(nl.partById('n')?.kind).toBe('note');
  });

  it('gives gates the family delays in time units and input parts none', () => {
    const ttl = compileBoard(board, { family: 'ttl-74ls' });
    const d = familyDelays('ttl-74ls');
    expect(ttl.partById('g')).toMatchObject({ rise: d.rise, fall: d.fall });
    expect(ttl.partById('a')).toMatchObject({ rise: 0, fall: 0 });
    expect(compileBoard(board).partById('g')).toMatchObject({ rise: 1, fall: 1 });
  });
});

describe('Simulator', () => {
  it('runs clocks free in runFor: a ripple counter counts one per period', () => {
    // 4-bit ripple counter reads k mod 16 after k cycles (common practice, no source)
    const b = rippleCounter();
    const board = b.board();
    (board.parts[0] as { period?: number }).period = 20;
    const sim = new Simulator(compileBoard(board));
    sim.settle();
    sim.runFor(20 * 7 + 5);
    const v = sim.outputValues();
    expect(['Q3', 'Q2', 'Q1', 'Q0'].map((q) => v[q]).join('')).toBe('0111');
    expect(sim.time).toBe(145);
    // without clocks, time passes and nothing changes
    sim.runFor(100, { clocks: false });
    expect(sim.outputValues()).toEqual(v);
  });

  it('resetState brings storage back to init, keeps the inputs', () => {
    const board = new BoardBuilder().switch('d', 'D', true).switch('c', 'C')
      .part({ id: 'f', kind: 'dff', init: 1 }).wire('d.out', 'f.d').wire('c.out', 'f.clk').lamp('q', 'Q', 'f.q').board();
    const sim = new Simulator(compileBoard(board));
    sim.settle();
    expect(sim.outputValues().Q).toBe('1');
    sim.setInput('d', 0); sim.setInput('c', 1); sim.settle();
    expect(sim.outputValues().Q).toBe('0');
    sim.resetState(); sim.settle();
    expect(sim.outputValues().Q).toBe('1');
    expect(sim.inputValues()).toEqual({ D: '0', C: '1' });
  });

  it('reports pin levels: an input pin reads the floating value, the net itself is Z', () => {
    // an open TTL input reads high (from memory)
    const board = new BoardBuilder('ttl-74ls').part({ id: 'g', kind: 'not' }).lamp('y', 'Y', 'g.out').board();
    const sim = new Simulator(compileBoard(board));
    sim.settle();
    expect(sim.pinLevel('g', 'in0')).toBe('1');
    expect(sim.level(sim.netlist.netOf('g', 'in0'))).toBe('Z');
    expect(Object.fromEntries(sim.levels())).toEqual({ 'g.in0': '1', 'g.out': '0', 'y.in': '0' });
  });

  it('unsubscribes change listeners', () => {
    const sim = new Simulator(compileBoard(new BoardBuilder().switch('a').gate('n', 'not', ['a.out']).board()));
    let calls = 0;
    const off = sim.onChange(() => { calls++; });
    sim.settle();
    const seen = calls;
    off();
    sim.setInput('a', 1); sim.settle();
    expect(seen).toBeGreaterThan(0);
    expect(calls).toBe(seen);
  });

  it('a family option overrides the floating value and delays', () => {
    // CMOS inputs must never float (TI application report SCBA004): a pull-down is assumed, reads low
    const board = new BoardBuilder().part({ id: 'g', kind: 'not' }).lamp('y', 'Y', 'g.out').board();
    const sim = new Simulator(compileBoard(board), { family: 'cmos-74hc' });
    const r = sim.settle();
    expect(sim.outputValues().Y).toBe('1');
    expect(r.time).toBe(familyDelays('cmos-74hc').rise);
  });
});

describe('toVerilog', () => {
  it('exports every part kind; Icarus Verilog compiles and runs it; a clock is a port, a constant an assign', () => {
    const b = new BoardBuilder('ttl-74ls', '4-bit demo: all kinds').switch('s', 'S').part({ id: 'bt', kind: 'button', label: 'BT' })
      .part({ id: 'ck', kind: 'clock', label: 'CK' }).part({ id: 'k', kind: 'const', value: 1 })
      .gate('g1', 'buffer', ['s.out']).gate('g2', 'not', ['s.outn']).gate('g3', 'nand', ['g1.out', 'k.out', 'bt.out'])
      .gate('g4', 'xnor', ['g2.out', 'g3.out', 's.out', 'bt.out', 'ck.out'])
      .part({ id: 'm2', kind: 'mux2' }).wire('s.out', 'm2.sel').wire('g3.out', 'm2.d0').wire('g4.out', 'm2.d1')
      .part({ id: 'm4', kind: 'mux4' }).wire('s.out', 'm4.sel0').wire('bt.out', 'm4.sel1')
      .wire('k.out', 'm4.d0').wire('g4.out', 'm4.d1').wire('m2.out', 'm4.d2') // m4.d3 open: reads 1 in TTL
      .part({ id: 'sr', kind: 'srlatch' }).wire('bt.out', 'sr.s').wire('s.out', 'sr.r')
      .part({ id: 'dl', kind: 'dlatch' }).wire('m4.out', 'dl.d').wire('ck.out', 'dl.en')
      .part({ id: 'ff', kind: 'dff', init: 1 }).wire('dl.q', 'ff.d').wire('ck.out', 'ff.clk')
      .lamp('l1', 'OUT', 'm4.out').part({ id: 'p1', kind: 'probe', label: 'FQ' }).wire('ff.q', 'p1.in')
      .lamp('l2', 'SRQ', 'sr.qn').part({ id: 'nt', kind: 'note', text: 'n' });
    const board = b.board();
    const netlist = compileBoard(board);
    const v = toVerilog(board, netlist);
    expect(v).toMatch(/^module m_4_bit_demo__all_kinds \(S, BT, CK, OUT, FQ, SRQ\);$/m);
    expect(v).toContain("1'b1;");
    expect(v).toContain('always @(posedge CK)');
    expect(v).toMatch(/assign \w+ = 1'b1; \/\/ open input/);
    // rows: S, BT, CK — the clock pulses through the storage; Gatefold and Icarus agree on each row
    const rows = [[0, 0, 0], [1, 0, 0], [1, 1, 0], [1, 1, 1], [0, 1, 1], [0, 0, 0], [1, 0, 1], [0, 0, 0]];
    const sim = new Simulator(netlist);
    sim.settle();
    const ours = rows.map((row) => {
      ['s', 'bt', 'ck'].forEach((id, k) => sim.setInput(id, row[k] as 0 | 1));
      sim.settle();
      const o = sim.outputValues();
      return `${o.OUT}${o.FQ}${o.SRQ}`;
    });
    expect(runIverilog(v, ['S', 'BT', 'CK'], ['OUT', 'FQ', 'SRQ'], rows)).toEqual(ours);
  });
});
