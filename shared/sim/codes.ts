/**
 * Level codes as named constants for the simulator's inner loops (typed arrays, no strings per event).
 * The table itself (code ⇄ level) lives in levels.ts.
 */
import { levelCode } from './levels';

export const L0 = levelCode('0');
export const L1 = levelCode('1');
export const LX = levelCode('X');
export const LZ = levelCode('Z');
/** no pending value (in the simulator's pending arrays) */
export const NONE = 255;

/** Four-valued NOT (Z reads as X inside a gate). */
export function not4(a: number): number {
  return a === L0 ? L1 : a === L1 ? L0 : LX;
}
