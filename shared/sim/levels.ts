/**
 * The four signal levels and their one-byte codes — the one table of them in Gatefold. The simulator
 * keeps levels as these codes in typed arrays, the bench sends them as bytes, truth tables index it.
 */

/** The levels in code order: low, high, unknown, undriven (high impedance); a level's code is its index. */
export const LEVELS = ['0', '1', 'X', 'Z'] as const;

/** The four signal values: low, high, unknown, undriven (high impedance). */
export type Level = (typeof LEVELS)[number];

/** Level, boolean or 0/1 → its code (0, 1, X, Z → 0…3); anything else reads as unknown. */
export function levelCode(v: Level | boolean | 0 | 1): number {
  if (v === true || v === 1 || v === '1') return 1;
  if (v === false || v === 0 || v === '0') return 0;
  return v === 'Z' ? 3 : 2;
}

/** Code → level; anything out of range reads as unknown. */
export function codeLevel(code: number): Level {
  return LEVELS[code] ?? 'X';
}

/**
 * Packs pin levels into one byte per pin in the order of `keys`, so a state message is a small
 * transferable array rather than a map of strings. Pins missing from `levels` read as Z (undriven).
 */
export function encodeLevels(keys: readonly string[], levels: ReadonlyMap<string, Level>): Uint8Array {
  const out = new Uint8Array(keys.length);
  for (let i = 0; i < keys.length; i++) out[i] = levelCode(levels.get(keys[i]) ?? 'Z');
  return out;
}

/** Unpacks `encodeLevels` output back into a `"partId.pin" → Level` map. */
export function decodeLevels(keys: readonly string[], codes: Uint8Array): Map<string, Level> {
  const out = new Map<string, Level>();
  const n = Math.min(keys.length, codes.length);
  for (let i = 0; i < n; i++) out.set(keys[i], codeLevel(codes[i]));
  return out;
}
