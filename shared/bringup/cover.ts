/**
 * Choosing the fewest vectors: a set cover of the faults (rows) by the vectors (columns) that detect
 * them. Rows that are the same, or that contain another row, are dropped first (a vector detecting the
 * smaller row detects the larger). Greedy choice, then vectors that became unnecessary are removed;
 * small problems are then solved exactly by branch and bound.
 */

export interface CoverResult {
  columns: number[];
  /** true when branch and bound finished: no smaller cover exists among the columns */
  optimal: boolean;
  /** a lower bound: rows no two of which share a column */
  lowerBound: number;
}

/** Rows are sorted column lists; returns the reduced rows (no duplicates, no row containing another). */
export function reduceRows(rows: number[][]): number[][] {
  const uniq = new Map<string, number[]>();
  for (const r of rows) uniq.set(r.join(','), r);
  const list = [...uniq.values()].sort((a, b) => a.length - b.length);
  let width = 1;
  for (const r of list) for (const c of r) width = Math.max(width, (c >> 5) + 1);
  const bits = list.map((r) => { const b = new Uint32Array(width); for (const c of r) b[c >> 5] |= 1 << (c & 31); return b; });
  const kept: number[] = [];
  for (let i = 0; i < list.length; i++) {
    const bi = bits[i];
    // a kept (shorter or equal) row inside this one makes it redundant
    const contains = kept.some((k) => { const bk = bits[k]; for (let w = 0; w < width; w++) if ((bk[w] & ~bi[w]) !== 0) return false; return true; });
    if (!contains) kept.push(i);
  }
  return kept.map((i) => list[i]);
}

/** Greedy cover, unnecessary columns removed, then exact branch and bound within `nodeBudget` nodes. */
export function minimumCover(rows: number[][], nodeBudget = 200_000): CoverResult {
  const nRows = rows.length;
  if (!nRows) return { columns: [], optimal: true, lowerBound: 0 };
  const colRows = new Map<number, number[]>();
  rows.forEach((r, i) => r.forEach((c) => { const l = colRows.get(c) ?? []; l.push(i); colRows.set(c, l); }));
  // greedy
  const covered = new Uint8Array(nRows);
  let left = nRows;
  const chosen: number[] = [];
  while (left > 0) {
    let best = -1; let bestGain = 0;
    for (const [c, rs] of colRows) {
      let gain = 0;
      for (const r of rs) if (!covered[r]) gain++;
      if (gain > bestGain || (gain === bestGain && c < best)) { best = c; bestGain = gain; }
    }
    chosen.push(best);
    for (const r of colRows.get(best)!) if (!covered[r]) { covered[r] = 1; left--; }
  }
  // remove columns no longer needed, latest chosen first
  const count = new Int32Array(nRows);
  for (const c of chosen) for (const r of colRows.get(c)!) count[r]++;
  let cover = chosen.slice();
  for (let k = cover.length - 1; k >= 0; k--) {
    const c = cover[k];
    if (colRows.get(c)!.every((r) => count[r] > 1)) {
      for (const r of colRows.get(c)!) count[r]--;
      cover = cover.filter((x) => x !== c);
    }
  }
  const lowerBound = disjointRows(rows, [...Array(nRows).keys()], new Uint8Array(nRows));
  if (cover.length <= lowerBound) return { columns: cover.sort((a, b) => a - b), optimal: true, lowerBound };
  // branch and bound
  let best = cover.slice();
  let nodes = 0;
  let aborted = false;
  const cov = new Int32Array(nRows);
  const pick: number[] = [];
  const search = () => {
    if (aborted) return;
    if (++nodes > nodeBudget) { aborted = true; return; }
    let row = -1; let fewest = Infinity;
    const open: number[] = [];
    for (let r = 0; r < nRows; r++) if (!cov[r]) { open.push(r); if (rows[r].length < fewest) { fewest = rows[r].length; row = r; } }
    if (row < 0) { if (pick.length < best.length) best = pick.slice(); return; }
    if (pick.length + 1 >= best.length) return;
    if (pick.length + disjointRows(rows, open, cov) >= best.length) return;
    const cols = rows[row].slice().sort((a, b) => colRows.get(b)!.length - colRows.get(a)!.length);
    for (const c of cols) {
      pick.push(c);
      for (const r of colRows.get(c)!) cov[r]++;
      search();
      for (const r of colRows.get(c)!) cov[r]--;
      pick.pop();
    }
  };
  search();
  return { columns: best.sort((a, b) => a - b), optimal: !aborted, lowerBound };
}

/** Greedy count of open rows no two of which share a column (each needs its own vector). */
function disjointRows(rows: number[][], open: number[], covered: ArrayLike<number>): number {
  const used = new Set<number>();
  let n = 0;
  const sorted = open.filter((r) => !covered[r]).sort((a, b) => rows[a].length - rows[b].length);
  for (const r of sorted) {
    if (rows[r].some((c) => used.has(c))) continue;
    for (const c of rows[r]) used.add(c);
    n++;
  }
  return n;
}
