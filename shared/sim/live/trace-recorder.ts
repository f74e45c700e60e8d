import { levelCode, type Level } from '../levels';
import type { Netlist } from '../types';

/** Recorded numbers kept between two state messages (3 per change); beyond this a burst is cut short. */
const TRACE_BUDGET = 3 * 60_000;

/** What the page gets of the recording with each state message. */
export interface TraceBatch {
  trace: number[];
  edges: number[];
  /** new rows; with `fresh` the page drops everything it recorded */
  traceReset?: { signals: string[]; at: number; fresh?: boolean };
}

/**
 * The worker's side of the timing strip: records changes of the subscribed nets as flat
 * [row, time, level code] triples until the next state message takes them. Times are continuous over
 * recompiles and replays: each new Simulator starts at 0 and a replay runs a Simulator's time on, so the
 * engine sets `base` to keep the strip's time going on from where it was.
 */
export class TraceRecorder {
  private signals: string[] = [];
  /** names the page's rows stand for, in row order */
  private rows: string[] = [];
  private netRows = new Map<number, number[]>();
  private trace: number[] = [];
  private edges: number[] = [];
  private reset: TraceBatch['traceReset'];
  /** simulated time of the Simulators before the current one */
  base = 0;
  /** while true nothing is recorded: the engine is recomputing what the strip already shows (a replay) */
  muted = false;

  /** A new choice of signals, recorded from the next `attach` on. */
  subscribe(signals: string[]): void {
    this.signals = signals;
  }

  /**
   * Points the recording at the nets of `netlist` (after a subscription or a recompile) and records each
   * signal's level now. When the rows change (another choice of signals, or a signal gone from the
   * board) the page is told the new rows; it keeps the history of rows that stay.
   */
  attach(netlist: Netlist, time: number, level: (net: number) => Level): void {
    const byName = new Map(netlist.nets.map((n) => [n.name, n.id]));
    const names = this.signals.filter((s) => byName.has(s));
    const now = this.base + time;
    if (names.length !== this.rows.length || names.some((n, i) => n !== this.rows[i]) || !this.rows.length) {
      this.trace = []; // row numbers change: what was not sent yet is recorded again below as the level now
      this.reset = { signals: names, at: now };
      this.rows = names;
    }
    this.netRows.clear();
    names.forEach((name, i) => {
      const net = byName.get(name)!;
      this.netRows.set(net, [...(this.netRows.get(net) ?? []), i]);
      this.trace.push(i, now, levelCode(level(net)));
    });
  }

  /** Starts the recording over at `time` with the current rows and their levels now. */
  clear(netlist: Netlist, time: number, level: (net: number) => Level): void {
    this.rows = [];
    this.edges = [];
    this.attach(netlist, time, level);
    this.reset = { ...this.reset!, fresh: true };
  }

  /** A net changed (the Simulator's change listener). */
  record(time: number, net: number, level: Level): void {
    const rows = this.netRows.get(net);
    if (!rows || this.muted || this.trace.length >= TRACE_BUDGET) return;
    for (const i of rows) this.trace.push(i, this.base + time, levelCode(level));
  }

  /** A rising clock edge at simulator time `time`. */
  edge(time: number): void {
    if (!this.muted) this.edges.push(this.base + time);
  }

  /** Everything recorded since the last call. */
  take(): TraceBatch {
    const batch: TraceBatch = { trace: this.trace, edges: this.edges, traceReset: this.reset };
    this.trace = [];
    this.edges = [];
    this.reset = undefined;
    return batch;
  }
}
