/**
 * The order of the bring-up sheet: each next vector is the one that changes the fewest switches from the
 * current settings (starting from all off), as a Gray code does for a full count — so a builder flips as
 * few switches as possible between checks. Sequences of a sequential board keep their own order.
 */

/** Number of positions where two settings differ. */
export function switchChanges(a: string, b: string): number {
  let d = 0;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) d++;
  return d;
}

/** Nearest-neighbour order from all inputs off (ties: the earlier vector). */
export function orderForBench(settings: string[]): string[] {
  const left = settings.slice();
  const out: string[] = [];
  let cur = '0'.repeat(settings[0]?.length ?? 0);
  while (left.length) {
    let best = 0;
    for (let k = 1; k < left.length; k++) if (switchChanges(cur, left[k]) < switchChanges(cur, left[best])) best = k;
    cur = left.splice(best, 1)[0];
    out.push(cur);
  }
  return out;
}

/** Total switch changes to walk the sheet from all off. */
export function totalChanges(settings: string[]): number {
  let cur = '0'.repeat(settings[0]?.length ?? 0);
  let n = 0;
  for (const s of settings) { n += switchChanges(cur, s); cur = s; }
  return n;
}
