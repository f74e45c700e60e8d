/**
 * Rising-edge D flip-flop. State: st[o] = q, st[o + 1] = qn, st[o + 2] = last clock level (NONE before
 * the first evaluation, so power-on is not an edge; WAIT_D while the clock is high after an uncertain
 * edge that found D unknown).
 * Edges as IEEE Std 1364 `posedge`: 0→1 loads D (X data gives X); 0→X and X→1 are uncertain edges,
 * which keep Q when D equals Q, else Q becomes X.
 * An X→1 edge often comes from a gate settling out of its power-on X while the gates feeding D are
 * still settling too (their X only means "not evaluated yet"): such an edge waits, while the clock
 * stays high, for D to become known and then compares D with Q. It resolves with D as it is when the
 * clock leaves high first.
 */
import { L0, L1, LX, NONE, not4 } from '../codes';

/** Last-clock marker: clock high after an X→1 edge, waiting for D to become known. */
const WAIT_D = 254;

function setQ(st: Uint8Array, o: number, q: number): void {
  st[o] = q; st[o + 1] = not4(q);
}

/** The outcome of an uncertain edge: Q stays when D equals it, else X. */
function uncertainEdge(st: Uint8Array, o: number, d: number): void {
  setQ(st, o, d === st[o] ? st[o] : LX);
}

/** Evaluates a dff (inputs d, clk); returns true when the clock edge came with an uncertain clock. */
export function evalDff(inp: Uint8Array, st: Uint8Array, o: number): boolean {
  const d = inp[0] === L0 || inp[0] === L1 ? inp[0] : LX;
  const clk = inp[1] === L0 || inp[1] === L1 ? inp[1] : LX;
  let prev = st[o + 2];
  if (prev === WAIT_D) {
    if (clk === L1 && d === LX) return false;
    uncertainEdge(st, o, d);
    prev = L1;
  }
  st[o + 2] = clk;
  if (prev === NONE || prev === clk) return false;
  if (prev === L0 && clk === L1) { setQ(st, o, d); return false; }
  if (prev === LX && clk === L1 && d === LX) { st[o + 2] = WAIT_D; return true; }
  if ((prev === L0 && clk === LX) || (prev === LX && clk === L1)) { uncertainEdge(st, o, d); return true; }
  return false;
}

/** True when evalDff's last call saw a rising (or uncertain rising) edge: prev 0 → 1/X or X → 1. */
export function isRisingEdge(prev: number, clk: number): boolean {
  return (prev === L0 && (clk === L1 || clk === LX)) || (prev === LX && clk === L1);
}
