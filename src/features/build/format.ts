/** Numbers for the build sheet: volts, milliamps, seconds and rates with their units. */

export const volts = (v: number) => `${v >= 0 ? '+' : '−'}${Math.abs(v).toFixed(Math.abs(v) < 10 ? 3 : 2)} V`;
export const milliamps = (ma: number) => (Math.abs(ma) < 1 ? `${(ma * 1000).toFixed(1)} µA` : ma < 1000 ? `${ma.toFixed(2)} mA` : `${(ma / 1000).toFixed(3)} A`);
export const watts = (w: number) => (w < 1 ? `${(w * 1000).toFixed(1)} mW` : `${w.toFixed(2)} W`);

/** A delay in ns as ns, µs, ms or s. */
export function duration(ns: number): string {
  if (ns < 1e3) return `${Number(ns.toPrecision(4))} ns`;
  if (ns < 1e6) return `${Number((ns / 1e3).toPrecision(4))} µs`;
  if (ns < 1e9) return `${Number((ns / 1e6).toPrecision(4))} ms`;
  return `${Number((ns / 1e9).toPrecision(4))} s`;
}

/** A rate in Hz, kHz or MHz. */
export function rate(hz: number): string {
  if (hz >= 1e6) return `${Number((hz / 1e6).toPrecision(3))} MHz`;
  if (hz >= 1e3) return `${Number((hz / 1e3).toPrecision(3))} kHz`;
  return `${Number(hz.toPrecision(3))} Hz`;
}
