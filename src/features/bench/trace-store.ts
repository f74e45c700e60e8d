import { emptyTrace, pushChange, type Trace } from '../timing';
import { codeLevel, type LiveUpdate } from '../../../shared/sim';

type StateMsg = Extract<LiveUpdate, { type: 'state' }>;

/**
 * New rows for the strip: a signal that was already recorded keeps its history, a new one starts empty.
 * With nothing kept, the recording starts at `at`.
 */
function regroup(trace: Trace, signals: string[], at: number): Trace {
  const old = new Map(trace.signals.map((s) => [s.name, s.changes]));
  const next = emptyTrace(signals, at);
  let kept = false;
  next.signals.forEach((s) => {
    const changes = old.get(s.name);
    if (changes?.length) {
      s.changes = changes;
      kept = true;
    }
  });
  if (kept) {
    next.start = trace.start;
    next.edges = trace.edges;
    next.end = trace.end;
  }
  return next;
}

/**
 * Folds one state message's recording into the page's trace: a reset regroups the rows, then each
 * [signal, time, code] triple becomes a compressed change and rising edges are appended.
 * Returns the trace to keep (the same object unless the recording restarted) and whether it changed.
 */
export function applyTrace(trace: Trace, msg: Pick<StateMsg, 'trace' | 'edges' | 'traceReset' | 'time'>): { trace: Trace; changed: boolean } {
  let changed = false;
  if (msg.traceReset) {
    const { signals, at, fresh } = msg.traceReset;
    trace = fresh ? emptyTrace(signals, at) : regroup(trace, signals, at);
    changed = true;
  }
  const { trace: flat } = msg;
  for (let i = 0; i + 2 < flat.length; i += 3) {
    const signal = trace.signals[flat[i]];
    const t = flat[i + 1];
    if (!signal) continue;
    const last = signal.changes[signal.changes.length - 1];
    if (last && t < last.t) continue; // a late change cannot rewrite drawn history
    changed = pushChange(signal.changes, t, codeLevel(flat[i + 2])) || changed;
  }
  for (const t of msg.edges) {
    trace.edges.push(t);
    changed = true;
  }
  if (trace.signals.length && msg.time > trace.end) {
    trace.end = msg.time;
    changed = true;
  }
  return { trace, changed };
}
