/**
 * Rising-edge D flip-flop. State: st[o] = q, st[o + 1] = qn, st[o + 2] = last clock level (NONE before
 * the first evaluation, so power-on is not an edge).
 * Edges as IEEE Std 1364 `posedge`: 0→1 loads D (X data gives X); 0→X and X→1 are uncertain edges,
 * which keep Q only when D equals Q, else Q becomes X.
 */
import { L0, L1, LX, NONE, not4 } from '../codes';

/** Evaluates a dff (inputs d, clk); returns true when the clock edge came with an uncertain clock. */
export function evalDff(inp: Uint8Array, st: Uint8Array, o: number): boolean {
  const d = inp[0] === L0 || inp[0] === L1 ? inp[0] : LX;
  const clk = inp[1] === L0 || inp[1] === L1 ? inp[1] : LX;
  const prev = st[o + 2];
  st[o + 2] = clk;
  if (prev === NONE || prev === clk) return false;
  let q = st[o];
  let uncertain = false;
  if (prev === L0 && clk === L1) q = d;
  else if ((prev === L0 && clk === LX) || (prev === LX && clk === L1)) {
    q = d === q ? q : LX;
    uncertain = true;
  } else return false;
  st[o] = q; st[o + 1] = not4(q);
  return uncertain;
}

/** True when evalDff's last call saw a rising (or uncertain rising) edge: prev 0 → 1/X or X → 1. */
export function isRisingEdge(prev: number, clk: number): boolean {
  return (prev === L0 && (clk === L1 || clk === LX)) || (prev === LX && clk === L1);
}
