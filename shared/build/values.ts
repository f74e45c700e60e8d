/** Component values as builders write them: `22k`, `4k7`, `4.7k`, `1M`, `470`, `470R`; volts as numbers. */

/** An input the build sheet refuses, naming the offending field. */
export class BuildError extends Error {
  constructor(message: string, readonly fields: Record<string, string> = {}) {
    super(message);
    this.name = 'BuildError';
  }
}

const MULTIPLIER: Record<string, number> = { '': 1, R: 1, r: 1, k: 1e3, K: 1e3, M: 1e6 };

/** Ohms of a resistor written like `22k`, `4k7`, `4.7k`, `1M`, `470R` (NaN when it is not a value). */
export function parseOhms(text: string): number {
  const t = text.trim().replace(/\s*(Ω|ohms?)$/i, '');
  const m = /^(\d+(?:\.\d+)?)([RrkKM]?)(\d*)$/.exec(t);
  if (!m) return NaN;
  const [, whole, unit, frac] = m;
  if (frac && (whole.includes('.') || !unit)) return NaN;
  return Number(frac ? `${whole}.${frac}` : whole) * MULTIPLIER[unit];
}

/** A resistor's value for a parts list: `22 kΩ`, `4.7 kΩ`, `470 Ω`, `1 MΩ`. */
export function formatOhms(ohms: number): string {
  const [scale, unit] = ohms >= 1e6 ? [1e6, 'MΩ'] : ohms >= 1e3 ? [1e3, 'kΩ'] : [1, 'Ω'];
  return `${Number((ohms / scale).toPrecision(3))} ${unit}`;
}

/** Keys of resistors among the level-check values (the rest are volts). */
export const RESISTOR_KEYS = new Set(['R1', 'R2', 'RG', 'RL', 'RSC', 'RS', 'RSH', 'RC', 'RP']);
/** Keys of volts. */
export const VOLT_KEYS = new Set(['VH', 'VL', 'VD', 'VS', 'VN', 'VP', 'VPL', 'VF', 'VDD']);

/**
 * Parses `R1=22k,R2=33k,VN=-12` (or an object of the same) into numbers; an unknown key, a resistor
 * that is not a positive finite value, or volts that are not a number is a BuildError naming it.
 */
export function parseSettings(input: string | Record<string, string | number> | undefined): Record<string, number> {
  if (input === undefined || input === '') return {};
  const entries: [string, string][] = typeof input === 'string'
    ? input.split(',').map((s) => s.trim()).filter(Boolean).map((pair) => {
      const eq = pair.indexOf('=');
      if (eq <= 0) throw new BuildError(`"${pair}" is not KEY=VALUE (e.g. R1=22k)`, { set: pair });
      return [pair.slice(0, eq).trim(), pair.slice(eq + 1).trim()];
    })
    : Object.entries(input).map(([key, value]) => [key, String(value)]);
  const out: Record<string, number> = {};
  for (const [key, raw] of entries) {
    if (RESISTOR_KEYS.has(key)) {
      const ohms = parseOhms(raw);
      if (!Number.isFinite(ohms) || ohms <= 0) throw new BuildError(`impossible resistor value ${key}=${raw} (a resistor is a positive value like 22k, 4k7 or 470)`, { [key]: raw });
      out[key] = ohms;
    } else if (VOLT_KEYS.has(key)) {
      const volts = Number(raw.replace(/\s*V$/i, ''));
      if (!raw || !Number.isFinite(volts)) throw new BuildError(`${key}=${raw} is not a voltage in volts`, { [key]: raw });
      out[key] = volts;
    } else {
      throw new BuildError(`unknown value ${key} (resistors ${[...RESISTOR_KEYS].join(', ')}; volts ${[...VOLT_KEYS].join(', ')})`, { [key]: raw });
    }
  }
  return out;
}
