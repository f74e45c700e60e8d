/**
 * Fan-out of a board: the nets whose loads exceed what one driver of the family may hold, and what a
 * builder does about each. Every load counts: a gate, storage or multiplexer input, an indicator (lamp,
 * probe); an inverter drawn as a NOR with both inputs tied counts twice, as its two diode inputs do.
 */
import type { Netlist } from '../sim';

export interface FanOutWarning {
  net: string;
  /** `part.pin` of the net's one driver */
  driver: string;
  /** the driving part's kind: a gate, storage or multiplexer, or an input (switch, button, clock) */
  kind: string;
  loads: number;
  limit: number;
  /** driver stages that bring every output within the limit: `drivers` buffers in `levels` levels */
  drivers: number;
  levels: number;
  /** what a builder does about it */
  advice: string;
}

/**
 * The buffers of a driver tree from one source to `loads` loads when every output may drive `limit`, by
 * level from the loads' side: a buffer per group of `limit` loads, then a buffer per group of `limit`
 * buffers below, until the source itself drives at most `limit` (common practice, no source).
 */
export function driverLevels(loads: number, limit: number): number[] {
  const per = Math.max(2, limit); // a buffer that drove one load would never reduce it
  const levels: number[] = [];
  for (let n = loads; n > limit;) {
    n = Math.ceil(n / per);
    levels.push(n);
  }
  return levels;
}

// Inputs are counted as gates are (common practice, no source): a switch or push button feeding many
// inputs is one contact and its pull-up or pull-down resistor, and a clock is one generator's output;
// each holds up about as many inputs as a gate of the family, so a builder buffers them the same way.
// A constant is left out: it is a tie to a supply rail, not a driver (TTL ties several inputs to VCC
// through one resistor, the family's unused-input advice).
const COUNTED_INPUTS = new Set(['switch', 'button', 'clock']);

function advice(kind: string, loads: number, limit: number, levels: number[]): string {
  const more = levels.slice(1).map((n, i) => `, ${n} more feed those ${levels[i]}`).join('');
  const total = levels.length > 1 ? ` (${levels.reduce((a, b) => a + b, 0)} in all)` : '';
  const split = `Buffer it: ${levels[0]} buffers (driver stages) each feed at most ${limit} of its ${loads} loads${more}${total}`;
  const source = kind === 'clock' || COUNTED_INPUTS.has(kind) ? `the ${kind}` : 'the gate';
  const tree = `${split}; ${source} then drives ${levels.at(-1)}`;
  // common practice, no source: a clock tree is kept balanced so that every flip-flop sees the edge at once
  if (kind === 'clock') return `${tree}. Give every flip-flop's clock the same number of stages: a branch with more stages clocks later (skew), and a flip-flop clocked late can take its neighbour's new value instead of the old one.`;
  if (COUNTED_INPUTS.has(kind)) return `${tree}.`;
  return `${tree}, or build the gate twice and share the loads between the copies.`;
}

/**
 * Nets whose loads exceed the family's fan-out `limit` (null: no limit), driven by one gate, storage part,
 * multiplexer or changing input (switch, button, clock), with the driver tree that brings them within it.
 */
export function fanOutWarnings(netlist: Netlist, limit: number | null): FanOutWarning[] {
  if (limit === null) return [];
  const out: FanOutWarning[] = [];
  for (const net of netlist.nets) {
    const driver = net.drivers[0];
    if (!driver || net.drivers.length !== 1) continue;
    const dp = netlist.partById(driver.part);
    if (!dp || dp.kind === 'const') continue;
    const loads = net.readers.length;
    if (loads <= limit) continue;
    const levels = driverLevels(loads, limit);
    out.push({
      net: net.name, driver: `${driver.part}.${driver.pin}`, kind: dp.kind, loads, limit,
      drivers: levels.reduce((a, b) => a + b, 0), levels: levels.length, advice: advice(dp.kind, loads, limit, levels),
    });
  }
  return out;
}
