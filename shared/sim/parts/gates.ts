/**
 * Combinational gates: buffer, NOT, AND, OR, NAND, NOR, XOR, XNOR with 2–8 inputs.
 * Four-valued rules (common practice, as in IEEE Std 1364 gate primitives): a controlling value wins
 * (AND with a 0 → 0, OR with a 1 → 1, even beside X or Z); otherwise any X or Z input gives X.
 * XOR/XNOR of N inputs is odd/even parity.
 */
import type { GateKind } from '../../board';
import { L0, L1, LX, not4 } from '../codes';

/** AND of in[0..n): 0 if any input is 0, else X if any is X/Z, else 1. */
export function and4(inp: Uint8Array, n: number): number {
  let unknown = false;
  for (let i = 0; i < n; i++) {
    const v = inp[i];
    if (v === L0) return L0;
    if (v !== L1) unknown = true;
  }
  return unknown ? LX : L1;
}

/** OR of in[0..n): 1 if any input is 1, else X if any is X/Z, else 0. */
export function or4(inp: Uint8Array, n: number): number {
  let unknown = false;
  for (let i = 0; i < n; i++) {
    const v = inp[i];
    if (v === L1) return L1;
    if (v !== L0) unknown = true;
  }
  return unknown ? LX : L0;
}

/** Parity of in[0..n): X if any input is X/Z. */
export function xor4(inp: Uint8Array, n: number): number {
  let p = 0;
  for (let i = 0; i < n; i++) {
    const v = inp[i];
    if (v !== L0 && v !== L1) return LX;
    p ^= v;
  }
  return p;
}

/** Output of a gate kind over in[0..n). */
export function evalGate(kind: GateKind, inp: Uint8Array, n: number): number {
  switch (kind) {
    case 'and': return and4(inp, n);
    case 'nand': return not4(and4(inp, n));
    case 'or': return or4(inp, n);
    case 'nor': return not4(or4(inp, n));
    case 'xor': return xor4(inp, n);
    case 'xnor': return not4(xor4(inp, n));
    default: {
      const never: never = kind;
      throw new Error(`not a gate: ${String(never)}`);
    }
  }
}

/** Buffer: passes 0 and 1, X and Z give X. */
export function evalBuffer(a: number): number {
  return a === L0 || a === L1 ? a : LX;
}

/** Inverter. */
export function evalNot(a: number): number {
  return not4(a);
}
