/**
 * Levels as small integers inside the simulator (typed arrays, no strings per event).
 * 0 = low, 1 = high, 2 = X (unknown), 3 = Z (undriven).
 */
import type { Level } from './levels';

export const L0 = 0;
export const L1 = 1;
export const LX = 2;
export const LZ = 3;
/** no pending value (in the simulator's pending arrays) */
export const NONE = 255;

const NAMES: readonly Level[] = ['0', '1', 'X', 'Z'];

/** Code → Level. */
export function levelName(code: number): Level {
  return NAMES[code] ?? 'X';
}

/** Level, boolean or 0/1 → code. */
export function levelCode(v: Level | boolean | 0 | 1): number {
  if (v === true || v === 1 || v === '1') return L1;
  if (v === false || v === 0 || v === '0') return L0;
  return v === 'Z' ? LZ : LX;
}

/** Four-valued NOT (Z reads as X inside a gate). */
export function not4(a: number): number {
  return a === L0 ? L1 : a === L1 ? L0 : LX;
}
