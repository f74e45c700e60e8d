/**
 * 2:1 and 4:1 multiplexers: Y = S'D0 + S·D1 and Y = S1'S0'D0 + S1'S0D1 + S1S0'D2 + S1S0D3 (textbook
 * standard). An X select chooses among the candidates: equal candidates give that value, else X.
 */
import { L0, L1, LX } from '../codes';

function data(v: number): number {
  return v === L0 || v === L1 ? v : LX;
}

/** inputs: sel, d0, d1 */
export function evalMux2(inp: Uint8Array): number {
  const s = inp[0];
  if (s === L0) return data(inp[1]);
  if (s === L1) return data(inp[2]);
  const a = data(inp[1]);
  return a === data(inp[2]) ? a : LX;
}

/** inputs: sel0 (least significant), sel1, d0 … d3 */
export function evalMux4(inp: Uint8Array): number {
  const s0 = inp[0];
  const s1 = inp[1];
  let result = -1;
  for (let hi = 0; hi < 2; hi++) {
    if ((s1 === L0 && hi === 1) || (s1 === L1 && hi === 0)) continue;
    for (let lo = 0; lo < 2; lo++) {
      if ((s0 === L0 && lo === 1) || (s0 === L1 && lo === 0)) continue;
      const v = data(inp[2 + hi * 2 + lo]);
      if (result === -1) result = v;
      else if (result !== v) return LX;
    }
  }
  return result;
}
