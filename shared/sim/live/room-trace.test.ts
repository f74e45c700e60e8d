import { describe, expect, it } from 'vitest';
import { BoardFileSchema, type BoardFile, type SimLogEntry } from '../../board';
import type { Timers } from './clock-driver';
import { debouncedDffBoard } from './fixtures/debounced-dff';
import { LiveEngine } from './live-engine';
import type { LiveUpdate } from './messages';

// The timing strip in the room's run (decision 005): a replay of the room's record (a first record, a
// new circuit after an edit inside a module, entries reordered) recomputes the state; it is not new
// history, so the strip must not show what it replays a second time.

type State = Extract<LiveUpdate, { type: 'state' }>;

const stillTimers: Timers = { now: () => 0, setTimeout: () => undefined, clearTimeout: () => undefined };

/**
 * The page's side of the strip, kept as the bench keeps it (src/features/bench/trace-store.ts): per row a
 * compressed list of changes — a repeat of the level is dropped, a second change at the same time
 * replaces the first — and the rising edges, counted 0 → 1.
 */
function strip() {
  let rows: string[] = [];
  let changes: { t: number; v: number }[][] = [];
  let end = -Infinity;
  const fold = (s: State) => {
    if (s.traceReset) {
      const old = new Map(rows.map((r, i) => [r, changes[i]]));
      rows = s.traceReset.signals;
      changes = rows.map((r) => (s.traceReset!.fresh ? [] : old.get(r) ?? []));
    }
    for (let i = 0; i + 2 < s.trace.length; i += 3) {
      const list = changes[s.trace[i]];
      const t = s.trace[i + 1];
      const v = s.trace[i + 2];
      const last = list.at(-1);
      if (last && t < last.t) throw new Error(`row ${rows[s.trace[i]]}: a change at ${t} before the last one at ${last.t}`);
      if (last && last.v === v) continue;
      if (last && last.t === t) {
        list.pop();
        if (list.at(-1)?.v === v) continue;
      }
      list.push({ t, v });
    }
    if (s.time < end) throw new Error(`the strip's time went back from ${end} to ${s.time}`);
    end = s.time;
  };
  const rises = (row: string) => {
    const list = changes[rows.indexOf(row)] ?? [];
    let n = 0;
    for (let i = 1; i < list.length; i++) if (list[i].v === 1 && list[i - 1].v === 0) n++;
    return n;
  };
  return { fold, rises, end: () => end };
}

function harness() {
  const view = strip();
  const sent: LiveUpdate[] = [];
  const engine = new LiveEngine((m) => {
    sent.push(m);
    if (m.type === 'state') view.fold(m);
  }, stillTimers);
  const last = () => [...sent].reverse().find((m): m is State => m.type === 'state')!;
  const compiles = () => sent.filter((m) => m.type === 'compiled').length;
  return { engine, view, last, compiles };
}

const withInputs = (board: BoardFile, values: Record<string, boolean>): BoardFile => ({
  ...board,
  parts: board.parts.map((p) => (p.kind === 'switch' && p.id in values ? { ...p, on: values[p.id] } : p.kind === 'button' && p.id in values ? { ...p, pressed: values[p.id] } : p)),
});

describe('the timing strip in the room’s run', () => {
  // Debouncer and six-NAND flip-flop: see fixtures/debounced-dff.ts for their sources; one press of the
  // bouncy button is one clean rise of the debounced clock CLK (common practice, no source).
  it('shows one clock rise on a screen that got the press as a document edit before its record entry', () => {
    const h = harness();
    const board = debouncedDffBoard();
    h.engine.handle({ type: 'room', me: 2, following: true });
    h.engine.handle({ type: 'room-log', entries: [] });
    h.engine.handle({ type: 'load', board, tryOut: [] });
    h.engine.handle({ type: 'subscribe', signals: ['STEP', 'CLK', 'Q'] });
    // the owner's press: the part's field reaches this screen first…
    h.engine.handle({ type: 'load', board: withInputs(board, { btn: true }), tryOut: [] });
    expect(h.last().values.probe_clk).toBe('1');
    // …then the record the owner's screen appended (its first entry brings the reset it started from)
    const log: SimLogEntry[] = [
      { id: 'o.1.0', kind: 'reset', inputs: { sw_d: true, btn: false } },
      { id: 'o.1.1', kind: 'input', part: 'btn', value: true, was: false },
    ];
    h.engine.handle({ type: 'room-log', entries: log });
    expect(h.last().values.lamp_q).toBe('1');
    expect(h.view.rises('CLK')).toBe(1);
    // the release, again the document first, then the record
    h.engine.handle({ type: 'load', board: withInputs(board, { btn: false }), tryOut: [] });
    h.engine.handle({ type: 'room-log', entries: [...log, { id: 'o.2.1', kind: 'input', part: 'btn', value: false, was: true }] });
    expect(h.last().values.probe_clk).toBe('0');
    expect(h.last().values.lamp_q).toBe('1');
    expect(h.view.rises('CLK')).toBe(1);
    expect(h.view.rises('Q')).toBe(1);
  });

  it('shows one clock rise on the screen whose record entry came before the document edit, bounce and all', () => {
    const h = harness();
    const board = debouncedDffBoard();
    h.engine.handle({ type: 'room', me: 1, following: true });
    h.engine.handle({ type: 'room-log', entries: [] });
    h.engine.handle({ type: 'load', board, tryOut: [] });
    h.engine.handle({ type: 'subscribe', signals: ['STEP', 'CLK', 'Q'] });
    h.engine.handle({ type: 'room-log', entries: [
      { id: 'o.1.0', kind: 'reset', inputs: { sw_d: true, btn: false } },
      { id: 'o.1.1', kind: 'input', part: 'btn', value: true, was: false },
    ] });
    h.engine.handle({ type: 'load', board: withInputs(board, { btn: true }), tryOut: [] });
    expect(h.last().values.lamp_q).toBe('1');
    expect(h.view.rises('CLK')).toBe(1);
    expect(h.view.rises('STEP')).toBeGreaterThan(1); // the raw contact bounced, and the strip shows it
  });

  /** A switch lighting a lamp through a module that buffers it (one port in, one port out). */
  function moduleBoard(inside: 'buffer' | 'two buffers'): BoardFile {
    const parts = inside === 'buffer'
      ? [{ id: 'b1', kind: 'buffer' }]
      : [{ id: 'b1', kind: 'buffer' }, { id: 'b2', kind: 'buffer' }];
    const wires = inside === 'buffer'
      ? [{ id: 'm1', from: 'pi.out', to: 'b1.in0' }, { id: 'm2', from: 'b1.out', to: 'po.in' }]
      : [{ id: 'm1', from: 'pi.out', to: 'b1.in0' }, { id: 'm2', from: 'b1.out', to: 'b2.in0' }, { id: 'm3', from: 'b2.out', to: 'po.in' }];
    return BoardFileSchema.parse({
      format: 'gatefold-board', version: 1, title: 'Through a module', family: 'ideal',
      parts: [
        { id: 's', kind: 'switch', label: 'S', on: false, x: 0, y: 0 },
        { id: 'u1', kind: 'module', module: 'buf', x: 100, y: 0 },
        { id: 'l', kind: 'lamp', label: 'L', x: 200, y: 0 },
      ],
      wires: [{ id: 'w1', from: 's.out', to: 'u1.I' }, { id: 'w2', from: 'u1.O', to: 'l.in' }],
      modules: [{
        id: 'buf', title: 'Buffer',
        parts: [{ id: 'pi', kind: 'port', dir: 'in', label: 'I', x: 0, y: 0 }, { id: 'po', kind: 'port', dir: 'out', label: 'O', x: 200, y: 0 }, ...parts.map((p, i) => ({ ...p, x: 100, y: i * 60 }))],
        wires,
      }],
    });
  }

  it('records a switch toggled three times once, after an edit inside a module recompiles the board', () => {
    const h = harness();
    let board = moduleBoard('buffer');
    h.engine.handle({ type: 'room', me: 1, following: true });
    h.engine.handle({ type: 'room-log', entries: [] });
    h.engine.handle({ type: 'load', board, tryOut: [] });
    h.engine.handle({ type: 'subscribe', signals: ['S', 'L'] });
    const log: SimLogEntry[] = [{ id: 'a.0', kind: 'reset', inputs: { s: false } }];
    let on = false;
    for (let k = 1; k <= 6; k++) {
      log.push({ id: `a.${k}`, kind: 'input', part: 's', value: !on, was: on });
      on = !on;
      h.engine.handle({ type: 'room-log', entries: [...log] });
      board = withInputs(board, { s: on });
      h.engine.handle({ type: 'load', board, tryOut: [] });
    }
    expect(h.view.rises('S')).toBe(3);
    expect(h.view.rises('L')).toBe(3);
    const before = h.last().time;
    // someone adds a second buffer inside the module: a new circuit, the room's record replayed on it
    h.engine.handle({ type: 'load', board: withInputs(moduleBoard('two buffers'), { s: on }), tryOut: [] });
    expect(h.compiles()).toBe(2);
    expect(h.last().room?.replays).toBeGreaterThan(1);
    expect(h.view.rises('S')).toBe(3);
    expect(h.view.rises('L')).toBe(3);
    // the strip's time goes on from where it was, not from the end of the replayed record
    expect(h.last().time).toBeGreaterThanOrEqual(before);
    expect(h.last().time - before).toBeLessThan(100);
    // and the next toggle is recorded as usual
    log.push({ id: 'a.7', kind: 'input', part: 's', value: true, was: false });
    h.engine.handle({ type: 'room-log', entries: [...log] });
    expect(h.view.rises('S')).toBe(4);
    expect(h.view.rises('L')).toBe(4);
  });

  it('does not record the replay of a viewer coming back from a private clock try-out', () => {
    const h = harness();
    const board = debouncedDffBoard();
    h.engine.handle({ type: 'room', me: 3, following: true });
    const log: SimLogEntry[] = [
      { id: 'o.1.0', kind: 'reset', inputs: { sw_d: true, btn: false } },
      { id: 'o.1.1', kind: 'input', part: 'btn', value: true, was: false },
    ];
    h.engine.handle({ type: 'room-log', entries: log });
    h.engine.handle({ type: 'load', board: withInputs(board, { btn: true }), tryOut: [] });
    h.engine.handle({ type: 'subscribe', signals: ['CLK', 'Q'] });
    expect(h.view.rises('CLK')).toBe(0); // subscribed after the press: the strip starts high
    h.engine.handle({ type: 'room', me: 3, following: false });
    h.engine.handle({ type: 'reset-state' });
    h.engine.handle({ type: 'room', me: 3, following: true });
    expect(h.last().values.lamp_q).toBe('1');
    // the try-out's reset dropped Q; back to live it is the room's again: one rise of Q, no replayed press
    expect(h.view.rises('Q')).toBe(1);
    expect(h.view.rises('CLK')).toBe(0);
  });
});
