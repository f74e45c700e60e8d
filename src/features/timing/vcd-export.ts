import { timescaleFor, toVcd, type VcdSample } from '../../../shared/sim';
import type { Trace } from './trace';

/**
 * The recorded trace as an IEEE Std 1364 value change dump: one 1-bit wire per signal, times in the
 * family's time unit (its `$timescale`), starting where the recording started.
 */
export function traceToVcd(trace: Trace, timeUnitNs: number, date = new Date().toISOString()): string {
  const samples: VcdSample[] = [];
  trace.signals.forEach((s, signal) => {
    for (const c of s.changes) samples.push({ time: c.t, signal, level: c.v });
  });
  return toVcd(samples, trace.signals.map((s) => ({ name: s.name })), {
    timescale: timescaleFor(timeUnitNs),
    start: trace.start,
    date,
    version: 'Gatefold timing strip',
  });
}
