import type { Level } from '../../../shared/sim';

/** One value change of a signal: at simulated time `t` the signal takes level `v`. */
export interface Change {
  t: number;
  v: Level;
}

/** A recorded signal: its name and its value changes in time order (the first one holds the start value). */
export interface TraceSignal {
  name: string;
  changes: Change[];
}

/** What the timing strip draws: chosen signals, the clock's rising-edge times and the recorded span. */
export interface Trace {
  signals: TraceSignal[];
  /** simulated times of the clock's rising edges, in order (cycle k starts at edges[k-1]) */
  edges: number[];
  start: number;
  end: number;
}

/** Longest change list kept per signal; older changes are dropped so a long run stays cheap to draw. */
export const MAX_CHANGES = 20_000;

export function emptyTrace(names: readonly string[] = [], at = 0): Trace {
  return { signals: names.map((name) => ({ name, changes: [] })), edges: [], start: at, end: at };
}

/**
 * Appends a change, keeping the list compressed: a repeat of the current level is dropped and a second
 * change at the same time replaces the first (a zero-width glitch has nothing to draw).
 * Returns whether the list changed.
 */
export function pushChange(list: Change[], t: number, v: Level, limit = MAX_CHANGES): boolean {
  const last = list[list.length - 1];
  if (last && t < last.t) throw new Error(`change at ${t} is earlier than the last one at ${last.t}`);
  if (last && last.v === v) return false;
  if (last && last.t === t) {
    list.pop();
    const before = list[list.length - 1];
    if (before && before.v === v) return true;
  }
  list.push({ t, v });
  if (list.length > limit) list.splice(0, list.length - limit);
  return true;
}

/** Index of the last change at or before `t`, or -1 when `t` is before the first change. */
export function changeIndexAt(list: readonly Change[], t: number): number {
  let lo = 0;
  let hi = list.length - 1;
  let found = -1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    if (list[mid].t <= t) {
      found = mid;
      lo = mid + 1;
    } else hi = mid - 1;
  }
  return found;
}

/** The level of a signal at time `t`; before its first recorded change it is unknown (X). */
export function levelAt(list: readonly Change[], t: number): Level {
  const i = changeIndexAt(list, t);
  return i < 0 ? 'X' : list[i].v;
}

/** Cursor readout: every signal's level at time `t`, in the strip's order. */
export function readout(trace: Trace, t: number): { name: string; level: Level }[] {
  return trace.signals.map((s) => ({ name: s.name, level: levelAt(s.changes, t) }));
}

/** Clock cycle number at time `t`: 0 before the first rising edge, k from the k-th rising edge on. */
export function cycleAt(edges: readonly number[], t: number): number {
  let lo = 0;
  let hi = edges.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (edges[mid] <= t) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** A stretch of waveform to draw: a steady level, or `busy` where changes are closer than one pixel. */
export interface Segment {
  from: number;
  to: number;
  v: Level | 'busy';
}

/**
 * The segments of a signal between `t0` and `t1` for drawing at `unitsPerPx` simulated units per pixel.
 * Runs of changes narrower than a pixel collapse into one `busy` segment, so an oscillating net costs
 * one rectangle per pixel at most, however many events it had.
 */
export function segmentsIn(list: readonly Change[], t0: number, t1: number, unitsPerPx: number): Segment[] {
  if (t1 <= t0) return [];
  const out: Segment[] = [];
  let i = Math.max(0, changeIndexAt(list, t0));
  if (list.length === 0 || list[0].t > t1) return [{ from: t0, to: t1, v: levelAt(list, t0) }];
  if (list[0].t > t0) out.push({ from: t0, to: list[0].t, v: 'X' });
  for (; i < list.length && list[i].t <= t1; i++) {
    const from = Math.max(t0, list[i].t);
    const to = Math.min(t1, i + 1 < list.length ? list[i + 1].t : t1);
    if (to <= from) continue;
    const v = list[i].v;
    const prev = out[out.length - 1];
    const narrow = to - from < unitsPerPx;
    if (narrow && prev && (prev.v === 'busy' || prev.to - prev.from < unitsPerPx) && prev.to >= from) {
      prev.to = Math.max(prev.to, to);
      prev.v = prev.v === v ? v : 'busy';
    } else if (prev && prev.v === v && prev.to >= from) {
      prev.to = to;
    } else out.push({ from, to, v });
  }
  return out.length ? out : [{ from: t0, to: t1, v: levelAt(list, t0) }];
}

/** Rising edges (a change to 1 from 0) in a change list — the count a builder checks on a clock line. */
export function risingEdges(list: readonly Change[]): number {
  let n = 0;
  for (let i = 1; i < list.length; i++) if (list[i].v === '1' && list[i - 1].v === '0') n++;
  return n;
}
