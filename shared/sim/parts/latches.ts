/**
 * Built-in SR and D latches (level-sensitive). State: st[o] = q, st[o + 1] = qn.
 * SR (active-high, as the NOR latch): 00 hold, 01 → Q = 0, 10 → Q = 1, 11 → Q = Q' = 0 (not allowed);
 * releasing 11 to 00 leaves the state unknown (X) and is reported as a race.
 * X inputs: every 0/1 reading of the X inputs is tried and outputs that disagree become X.
 */
import { L0, L1, LX, not4 } from '../codes';

function srKnown(s: number, r: number, q: number, qn: number, out: Uint8Array): boolean {
  if (s === L1 && r === L1) { out[0] = L0; out[1] = L0; return false; }
  if (s === L1) { out[0] = L1; out[1] = L0; return false; }
  if (r === L1) { out[0] = L0; out[1] = L1; return false; }
  if (q === L0 && qn === L0) { out[0] = LX; out[1] = LX; return true; }
  out[0] = q; out[1] = qn;
  return false;
}

const tmp = new Uint8Array(2);

/** Next state of an SR latch (inputs s, r); writes q, qn to st. Returns true on a release race. */
export function evalSrLatch(inp: Uint8Array, st: Uint8Array, o: number): boolean {
  const s = inp[0] === L0 || inp[0] === L1 ? inp[0] : LX;
  const r = inp[1] === L0 || inp[1] === L1 ? inp[1] : LX;
  const q = st[o];
  const qn = st[o + 1];
  if (s !== LX && r !== LX) {
    const race = srKnown(s, r, q, qn, tmp);
    st[o] = tmp[0]; st[o + 1] = tmp[1];
    return race;
  }
  let rq = -1;
  let rqn = -1;
  for (let sv = 0; sv < 2; sv++) {
    if (s !== LX && s !== sv) continue;
    for (let rv = 0; rv < 2; rv++) {
      if (r !== LX && r !== rv) continue;
      srKnown(sv, rv, q, qn, tmp);
      rq = rq === -1 || rq === tmp[0] ? tmp[0] : LX;
      rqn = rqn === -1 || rqn === tmp[1] ? tmp[1] : LX;
    }
  }
  st[o] = rq; st[o + 1] = rqn;
  return false;
}

/** D latch (inputs d, en): transparent while en = 1, holds while en = 0; X enable keeps Q only if D = Q. */
export function evalDLatch(inp: Uint8Array, st: Uint8Array, o: number): boolean {
  const d = inp[0] === L0 || inp[0] === L1 ? inp[0] : LX;
  const en = inp[1];
  let q = st[o];
  if (en === L1) q = d;
  else if (en !== L0) q = d === q ? q : LX;
  st[o] = q; st[o + 1] = not4(q);
  return false;
}
