import { describe, expect, it } from 'vitest';
import { BoardFileSchema, type BoardFile } from '../../board';
import { compileBoard } from '../compile';
import { decodeLevels, encodeLevels, type Level } from '../levels';
import { Simulator } from '../simulator';
import type { Timers } from './clock-driver';
import { debouncedDffBoard } from './fixtures/debounced-dff';
import { romModuleBoard } from './fixtures/rom-module';
import { LiveEngine, packLevels } from './live-engine';
import type { LiveUpdate } from './messages';

type Compiled = Extract<LiveUpdate, { type: 'compiled' }>;
type State = Extract<LiveUpdate, { type: 'state' }>;

/** Timers that never fire: for tests that do not run the clock. */
const stillTimers: Timers = { now: () => 0, setTimeout: () => undefined, clearTimeout: () => undefined };

function harness(timers: Timers = stillTimers) {
  const sent: LiveUpdate[] = [];
  const engine = new LiveEngine((m) => sent.push(m), timers);
  const compiled = () => sent.filter((m): m is Compiled => m.type === 'compiled');
  const last = () => [...sent].reverse().find((m): m is State => m.type === 'state')!;
  const levels = () => decodeLevels(compiled().at(-1)!.keys, last().levels);
  const errors = () => sent.filter((m) => m.type === 'error');
  return { engine, sent, compiled, last, levels, errors };
}

function halfAdder(on: { a?: boolean; b?: boolean } = {}): BoardFile {
  return BoardFileSchema.parse({
    format: 'gatefold-board', version: 1, title: 'Half adder', family: 'ideal',
    parts: [
      { id: 'a', kind: 'switch', label: 'A', on: on.a ?? false }, { id: 'b', kind: 'switch', label: 'B', on: on.b ?? false },
      { id: 'g1', kind: 'xor', inputs: 2 }, { id: 'g2', kind: 'and', inputs: 2 },
      { id: 's', kind: 'lamp', label: 'S' }, { id: 'c', kind: 'lamp', label: 'C' },
    ],
    wires: [
      { id: 'w1', from: 'a.out', to: 'g1.in0' }, { id: 'w2', from: 'b.out', to: 'g1.in1' },
      { id: 'w3', from: 'a.out', to: 'g2.in0' }, { id: 'w4', from: 'b.out', to: 'g2.in1' },
      { id: 'w5', from: 'g1.out', to: 's.in' }, { id: 'w6', from: 'g2.out', to: 'c.in' },
    ],
  });
}

describe('LiveEngine', () => {
  it('simulates a half adder and follows the truth table (any digital-logic textbook: S = A xor B, C = A and B)', () => {
    const h = harness();
    for (const [a, b] of [[false, false], [false, true], [true, false], [true, true]]) {
      h.engine.handle({ type: 'load', board: halfAdder({ a, b }), tryOut: [] });
      const v = h.last().values;
      expect([v.s, v.c]).toEqual([a !== b ? '1' : '0', a && b ? '1' : '0']);
      expect(h.levels().get('s.in')).toBe(v.s);
    }
    // flipping switches is not a change of the circuit: compiled once
    expect(h.compiled()).toHaveLength(1);
    expect(h.compiled()[0].inputs.map((p) => p.label)).toEqual(['A', 'B']);
    expect(h.compiled()[0].outputs.map((p) => p.net)).toEqual(['S', 'C']);
  });

  it('keeps a private try-out on top of the document values until it is cleared', () => {
    const h = harness();
    h.engine.handle({ type: 'load', board: halfAdder(), tryOut: [] });
    h.engine.handle({ type: 'set-input', partId: 'a', value: true });
    expect(h.last().values.s).toBe('1');
    h.engine.handle({ type: 'load', board: halfAdder({ b: true }), tryOut: [['a', true]] });
    expect([h.last().values.s, h.last().values.c]).toEqual(['0', '1']);
    h.engine.handle({ type: 'clear-try-out' });
    expect([h.last().values.s, h.last().values.c]).toEqual(['1', '0']);
  });

  // Six-gate edge-triggered D flip-flop of NANDs, the structure of the 7474 logic diagram (source: NJIT
  // Digital Commons "dld-animations" 84, Fig. 6.18, 2023): Q takes D on the rising clock edge, and changing
  // D while the clock is high or low does not change Q. Debouncer: a stability-window filter (common practice, no source).
  it('clocks the debounced gate flip-flop from the bouncy button: one press, one edge, Q takes D', () => {
    const h = harness();
    const board = debouncedDffBoard();
    const press = (pressed: boolean, d = true) =>
      h.engine.handle({ type: 'load', board: { ...board, parts: board.parts.map((p) => (p.id === 'btn' ? { ...p, pressed } : p.id === 'sw_d' ? { ...p, on: d } : p)) }, tryOut: [] });
    h.engine.handle({ type: 'load', board, tryOut: [] });
    expect(h.errors()).toEqual([]);
    expect(h.last().report.settled).toBe(true);
    h.engine.handle({ type: 'subscribe', signals: ['STEP', 'CLK', 'Q'] });
    expect(h.last().traceReset?.signals).toEqual(['STEP', 'CLK', 'Q']);
    expect(h.last().values.probe_clk).toBe('0');

    const rises: Record<number, number> = {};
    const collect = () => {
      const t = h.last().trace;
      for (let i = 0; i < t.length; i += 3) if (t[i + 2] === 1) rises[t[i]] = (rises[t[i]] ?? 0) + 1;
    };
    press(true);
    collect();
    expect(h.last().values.lamp_q).toBe('1');
    press(false, false); // release, and D low: the flip-flop holds Q
    collect();
    expect(h.last().values.lamp_q).toBe('1');
    expect(h.last().values.lamp_chg).toBe('1');
    expect(rises[0]).toBeGreaterThan(1); // the raw button bounced…
    expect(rises[1]).toBe(1); // …the debounced clock rose once
    press(true, false);
    expect(h.last().values.lamp_q).toBe('0');
    expect(h.compiled()).toHaveLength(1); // stored state survived every input edit
  });

  it('steps, runs and pauses the clock of a board with a clock part; reset restores power-on state', () => {
    let now = 0;
    const queue: { at: number; fn: () => void }[] = [];
    const timers: Timers = { now: () => now, setTimeout: (fn, ms) => queue.push({ at: now + ms, fn }), clearTimeout: () => queue.splice(0) };
    const h = harness(timers);
    const board = BoardFileSchema.parse({
      format: 'gatefold-board', version: 1, title: 'Divider', family: 'ideal',
      parts: [{ id: 'clk', kind: 'clock', label: 'CK', period: 20 }, { id: 'ff', kind: 'dff' }, { id: 'q', kind: 'lamp', label: 'Q' }],
      wires: [{ id: 'w1', from: 'clk.out', to: 'ff.clk' }, { id: 'w2', from: 'ff.qn', to: 'ff.d' }, { id: 'w3', from: 'ff.q', to: 'q.in' }],
    });
    h.engine.handle({ type: 'load', board, tryOut: [] });
    h.engine.handle({ type: 'subscribe', signals: ['CK'] });
    h.engine.handle({ type: 'clock', action: 'step' });
    // a ring of one toggle flip-flop: Q after k rising edges is k mod 2 (common practice, no source)
    expect(h.last().clock.cycles).toBe(1);
    expect(h.last().values.q).toBe('1');
    expect(h.last().values.clk).toBe('0');
    expect(h.last().edges).toHaveLength(1);
    h.engine.handle({ type: 'rate', hz: 10 });
    h.engine.handle({ type: 'clock', action: 'run' });
    expect(h.last().clock.running).toBe(true);
    for (let i = 0; i < 20; i++) {
      now += 50;
      queue.splice(0).forEach((e) => e.fn());
    }
    // one second at 10 Hz: ten more cycles
    expect(h.last().clock.cycles).toBe(11);
    expect(h.last().values.q).toBe('1');
    h.engine.handle({ type: 'clock', action: 'pause' });
    expect(h.last().clock.running).toBe(false);
    h.engine.handle({ type: 'reset-state' });
    expect(h.last().values.q).toBe('0');
  });

  it('reports conflicts, undriven inputs and oscillation, with badges and pulsing pins', () => {
    const h = harness();
    const board = (run: boolean) => BoardFileSchema.parse({
      format: 'gatefold-board', version: 1, title: 'Trouble', family: 'ttl-74ls',
      parts: [
        { id: 'a', kind: 'switch', label: 'A' }, { id: 'b', kind: 'switch', label: 'B', on: true },
        { id: 'n1', kind: 'not' }, { id: 'g', kind: 'and', inputs: 2 },
        { id: 'en', kind: 'switch', label: 'EN', on: run },
        { id: 'r1', kind: 'nand', inputs: 2 }, { id: 'r2', kind: 'not' }, { id: 'r3', kind: 'not' },
      ],
      wires: [
        { id: 'w1', from: 'a.out', to: 'n1.in0' }, { id: 'w2', from: 'b.out', to: 'n1.in0' },
        { id: 'w3', from: 'en.out', to: 'r1.in0' }, { id: 'w4', from: 'r3.out', to: 'r1.in1' },
        { id: 'w5', from: 'r1.out', to: 'r2.in0' }, { id: 'w6', from: 'r2.out', to: 'r3.in0' },
      ],
    });
    h.engine.handle({ type: 'load', board: board(false), tryOut: [] });
    expect(h.last().report.settled).toBe(true);
    // an enabled ring of three inversions never settles (Rabaey et al., Digital Integrated Circuits, 2nd ed. — from memory)
    h.engine.handle({ type: 'load', board: board(true), tryOut: [] });
    const s = h.last();
    expect(s.report.settled).toBe(false);
    expect(s.report.oscillating.length).toBeGreaterThan(0);
    expect(s.report.conflicts).toEqual(['A']);
    expect(s.report.undrivenInputs).toEqual(expect.arrayContaining(['g.in0', 'g.in1']));
    const badges = new Map(s.badges.map(([id, tone, text]) => [id, { tone, text }]));
    expect(badges.get('a')).toEqual({ tone: 'conflict', text: 'Two outputs drive this net (a.out, b.out): it reads X.' });
    expect(badges.get('g')?.text).toContain('reads 1'); // an open TTL input reads high (from memory)
    expect(badges.get('r2')?.tone).toBe('oscillating');
    expect(s.pulsing).toEqual(expect.arrayContaining(['r2.out', 'r3.in0']));
    const lv: Level | undefined = h.levels().get('n1.in0');
    expect(lv).toBe('X');
  });

  it('reports a race when an SR latch is released from S = R = 1 at once (CHECKS: SR latch, releasing both is a race)', () => {
    const h = harness();
    const board = (on: boolean) => BoardFileSchema.parse({
      format: 'gatefold-board', version: 1, title: 'Latch', family: 'ideal',
      parts: [{ id: 's', kind: 'switch', label: 'S', on }, { id: 'r', kind: 'switch', label: 'R', on }, { id: 'l', kind: 'srlatch' }, { id: 'q', kind: 'lamp', label: 'Q' }],
      wires: [{ id: 'w1', from: 's.out', to: 'l.s' }, { id: 'w2', from: 'r.out', to: 'l.r' }, { id: 'w3', from: 'l.q', to: 'q.in' }],
    });
    h.engine.handle({ type: 'load', board: board(true), tryOut: [] });
    expect(h.last().report.races).toEqual([]);
    h.engine.handle({ type: 'load', board: board(false), tryOut: [] });
    expect(h.last().report.races).toEqual(['l']);
  });

  it('keeps recording across a recompile, after the old time, and names new rows on a new subscription', () => {
    const h = harness();
    h.engine.handle({ type: 'load', board: halfAdder(), tryOut: [] });
    h.engine.handle({ type: 'subscribe', signals: ['A', 'S'] });
    h.engine.handle({ type: 'load', board: halfAdder({ a: true }), tryOut: [] });
    const before = h.last().time;
    expect(before).toBeGreaterThan(0);
    const grown = halfAdder({ a: true });
    grown.parts.push({ id: 'extra', kind: 'lamp', label: 'E', x: 0, y: 0 });
    grown.wires.push({ id: 'w7', from: 'a.out', to: 'extra.in' });
    h.engine.handle({ type: 'load', board: grown, tryOut: [] });
    expect(h.compiled()).toHaveLength(2);
    const after = h.last();
    expect(after.traceReset).toBeUndefined();
    expect(after.time).toBeGreaterThan(before);
    const times = after.trace.filter((_, k) => k % 3 === 1);
    expect(times.length).toBe(2);
    times.forEach((t) => expect(t).toBeGreaterThan(before));
    h.engine.handle({ type: 'subscribe', signals: ['S', 'C'] });
    expect(h.last().traceReset).toEqual({ signals: ['S', 'C'], at: h.last().time });
    h.engine.handle({ type: 'clear-trace' });
    expect(h.last().traceReset).toEqual({ signals: ['S', 'C'], at: h.last().time, fresh: true });
    expect(h.last().trace).toEqual([0, h.last().time, 1, 1, h.last().time, 0]); // S = 1, C = 0 now
  });

  it('packs pin levels exactly as the Simulator reports them pin by pin', () => {
    const boards = [halfAdder({ a: true }), debouncedDffBoard(), BoardFileSchema.parse({
      format: 'gatefold-board', version: 1, title: 'Open inputs', family: 'ttl-74ls',
      parts: [{ id: 'g', kind: 'nand', inputs: 3 }, { id: 'l', kind: 'lamp', label: 'L' }, { id: 'p', kind: 'probe', label: 'P' }],
      wires: [{ id: 'w1', from: 'g.out', to: 'l.in' }],
    })];
    for (const board of boards) {
      const netlist = compileBoard(board);
      const sim = new Simulator(netlist);
      sim.settle();
      const keys = netlist.parts.flatMap((p) => [...p.inputPins, ...p.outputPins].map((pin) => `${p.id}.${pin}`));
      expect(Array.from(packLevels(netlist, sim))).toEqual(Array.from(encodeLevels(keys, sim.levels())));
    }
  });

  it('answers a bad message with a clear error and keeps working', () => {
    const h = harness();
    h.engine.handle({ type: 'load', board: halfAdder(), tryOut: [] });
    h.engine.handle({ type: 'rate', hz: Number.NaN });
    expect(h.errors()).toEqual([{ type: 'error', message: 'clock rate must be a number of Hz, got NaN' }]);
    h.engine.handle({ type: 'load', board: halfAdder({ a: true }), tryOut: [] });
    expect(h.last().values.s).toBe('1');
  });

  it('keeps stored state when a lamp is relabelled, and names the signals by the new label', () => {
    // 4-bit ripple counter of rising-edge D flip-flops: after k cycles Q3..Q0 = k mod 16 (common practice, no source)
    const counter = (lamp0: string) => BoardFileSchema.parse({
      format: 'gatefold-board', version: 1, title: 'Counter', family: 'ideal',
      parts: [
        { id: 'clk', kind: 'clock', label: 'CLK' },
        ...[0, 1, 2, 3].map((i) => ({ id: `ff${i}`, kind: 'dff' })),
        ...[0, 1, 2, 3].map((i) => ({ id: `q${i}`, kind: 'lamp', label: i === 0 ? lamp0 : `Q${i}` })),
      ],
      wires: [
        { id: 'wc', from: 'clk.out', to: 'ff0.clk' },
        ...[0, 1, 2, 3].flatMap((i) => [
          { id: `wd${i}`, from: `ff${i}.qn`, to: `ff${i}.d` }, { id: `wq${i}`, from: `ff${i}.q`, to: `q${i}.in` },
          ...(i < 3 ? [{ id: `wn${i}`, from: `ff${i}.qn`, to: `ff${i + 1}.clk` }] : []),
        ]),
      ],
    });
    const h = harness();
    h.engine.handle({ type: 'load', board: counter('Q0'), tryOut: [] });
    for (let k = 0; k < 6; k++) h.engine.handle({ type: 'clock', action: 'step' });
    const count = () => { const v = h.last().values; return Number.parseInt(`${v.q3}${v.q2}${v.q1}${v.q0}`, 2); };
    expect(count()).toBe(6);
    h.engine.handle({ type: 'load', board: counter('BIT0'), tryOut: [] });
    expect(count()).toBe(6);
    expect(h.compiled().at(-1)!.outputs.map((p) => p.label)).toEqual(['BIT0', 'Q1', 'Q2', 'Q3']);
    expect(h.compiled().at(-1)!.nets).toContain('BIT0');
    h.engine.handle({ type: 'clock', action: 'step' });
    expect(count()).toBe(7);
    expect(h.errors()).toEqual([]);
  });

  it('lists the board’s own inputs and outputs, never a constant inside a module instance (decision 004)', () => {
    const h = harness();
    const board = romModuleBoard();
    h.engine.handle({ type: 'load', board, tryOut: [] });
    const c = h.compiled().at(-1)!;
    // the netlist itself holds the inner constants (they drive the circuit)…
    expect(h.engine.live.netlist!.inputs.map((p) => p.id)).toEqual(['s', 'clk', 'btn', 'one', 'w/r0/c0', 'w/r0/c1', 'w/c1']);
    // …but the bench's list is the top level: switch, clock, button and the board's own constant, in file order
    expect(c.inputs.map((p) => [p.partId, p.kind, p.net])).toEqual([['s', 'switch', 'S'], ['clk', 'clock', 'CLK'], ['btn', 'button', 'BTN'], ['one', 'const', 'ONE']]);
    expect(c.outputs.map((p) => p.partId)).toEqual(['y', 'p', 'z', 'q']);
    // the inner constants still drive their nets, which stay in the net list (the timing strip can pick them)
    const v = h.last().values;
    expect([v.y, v.p, v.z, v.q]).toEqual(['1', '1', '0', '0']);
    expect(c.nets).toEqual(expect.arrayContaining(['w/r0/c0_out', 'w/r0/c1_out']));
    // a relabel (same circuit, names sent again) keeps the list to the top level
    h.engine.handle({ type: 'load', board: { ...board, parts: board.parts.map((p) => (p.id === 's' ? { ...p, label: 'SEL' } : p)) }, tryOut: [] });
    expect(h.compiled().at(-1)!.inputs.map((p) => p.label)).toEqual(['SEL', 'CLK', 'BTN', 'ONE']);
    // top level means one of the loaded board's own parts
    expect(h.engine.live.isTopLevel('w/r0/c0')).toBe(false);
    expect(h.engine.live.isTopLevel('one')).toBe(true);
  });
});
