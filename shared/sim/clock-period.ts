/**
 * The clock's half period — one rule for the Simulator's own clocks, the live engine (the bench) and the
 * command line's `simulate --clock`.
 */

/** A clock's period defaults to this many of the slowest gate delay. */
export const DEFAULT_CLOCK_PERIOD_GATE_DELAYS = 32;

/**
 * Half a clock period in whole time units (at least 1): half of `period` when the clock part gives one,
 * else half of DEFAULT_CLOCK_PERIOD_GATE_DELAYS times `slowestDelay` (the slowest gate delay, at least 1).
 */
export function clockHalfPeriod(period: number | undefined, slowestDelay: number): number {
  const full = period ?? DEFAULT_CLOCK_PERIOD_GATE_DELAYS * Math.max(1, slowestDelay);
  return Math.max(1, Math.round(full / 2));
}
