/** What the depth-first cover search found. */
export interface SearchResult {
  covers: number[][];
  /** false when the work budget ran out: `covers` holds the best found, not proven minimal */
  complete: boolean;
  truncated: boolean;
}

function isSubset(a: number[], b: number[]): boolean {
  // both sorted ascending
  let j = 0;
  for (const x of a) {
    while (j < b.length && b[j] < x) j++;
    if (j === b.length || b[j] !== x) return false;
    j++;
  }
  return true;
}

/**
 * Depth-first branch and bound over Petrick's function (the product over rows of the sums of their
 * primes), for cores too big to multiply out. At every node the reductions that keep every minimal cover
 * (primes a row cannot do without, a row containing another row's primes dropped, a prime whose rows a
 * prime with strictly fewer literals also covers dropped) shrink the problem; then it branches on the
 * row with the fewest primes — branch i takes prime i and strikes primes 1..i-1, so no cover is reached
 * twice. The bound is the cost so far plus one prime per row in a set of rows that share no prime. Finds
 * every cover of minimal cost (fewest terms, then fewest literals), up to `maxCovers`, or gives up after
 * `work` steps with the best found.
 */
export function searchCovers(clauses: number[][], lits: number[], upper: { count: number; lits: number }, opts: { work: number; maxCovers: number }): SearchResult {
  let best = { count: upper.count, lits: upper.lits };
  let found: number[][] = [];
  let truncated = false;
  let work = 0;
  let complete = true;
  const above = (c: number, l: number) => c > best.count || (c === best.count && l > best.lits);

  /** The reduced rows (taken gains the forced primes), or null when a row has no prime left. */
  const reduce = (start: number[][], taken: number[]): number[][] | null => {
    let rows = start;
    for (let changed = true; changed; ) {
      changed = false;
      if (rows.some((c) => c.length === 0)) return null;
      const forced = new Set<number>();
      for (const c of rows) if (c.length === 1) forced.add(c[0]);
      if (forced.size) {
        taken.push(...forced);
        rows = rows.filter((c) => !c.some((p) => forced.has(p)));
        changed = true;
      }
      const keep: number[][] = [];
      for (const c of [...rows].sort((a, b) => a.length - b.length)) {
        work += keep.length;
        if (keep.some((k) => isSubset(k, c))) { changed = true; continue; }
        keep.push(c);
      }
      rows = keep;
      const rowsOf = new Map<number, number[]>();
      rows.forEach((c, i) => c.forEach((p) => { const r = rowsOf.get(p); if (r) r.push(i); else rowsOf.set(p, [i]); }));
      const drop = new Set<number>();
      for (const [p, mine] of rowsOf) {
        for (const q of rows[mine[0]]) {
          work++;
          if (q === p || drop.has(q) || lits[q] >= lits[p]) continue;
          if (isSubset(mine, rowsOf.get(q) ?? [])) { drop.add(p); break; }
        }
      }
      if (drop.size) { rows = rows.map((c) => c.filter((p) => !drop.has(p))); changed = true; }
    }
    return rows;
  };

  const lowerBound = (rows: number[][]) => {
    const used = new Set<number>();
    let count = 0;
    let cheapest = 0;
    for (const c of [...rows].sort((a, b) => a.length - b.length)) {
      work += c.length;
      if (c.some((p) => used.has(p))) continue;
      c.forEach((p) => used.add(p));
      count++;
      cheapest += Math.min(...c.map((p) => lits[p]));
    }
    return { count, lits: cheapest };
  };

  const dfs = (start: number[][], takenBefore: number[]): void => {
    if (work > opts.work) { complete = false; return; }
    const taken = [...takenBefore];
    const rows = reduce(start, taken);
    if (!rows) return;
    const count = taken.length;
    const litSum = taken.reduce((s, p) => s + lits[p], 0);
    if (above(count, litSum)) return;
    if (!rows.length) {
      if (count < best.count || litSum < best.lits) { best = { count, lits: litSum }; found = []; truncated = false; }
      if (found.length < opts.maxCovers) found.push([...taken].sort((a, b) => a - b));
      else truncated = true;
      return;
    }
    const lb = lowerBound(rows);
    if (above(count + lb.count, litSum + lb.lits)) return;
    let pick = rows[0];
    for (const c of rows) if (c.length < pick.length) pick = c;
    const reach = (p: number) => rows.reduce((n, c) => n + (c.includes(p) ? 1 : 0), 0);
    const options = [...pick].sort((a, b) => reach(b) - reach(a) || lits[a] - lits[b]);
    const struck = new Set<number>();
    for (const p of options) {
      const rest = rows.filter((c) => !c.includes(p)).map((c) => (struck.size ? c.filter((q) => !struck.has(q)) : c));
      dfs(rest, [...taken, p]);
      if (!complete) return;
      struck.add(p);
    }
  };
  dfs(clauses.map((c) => [...c].sort((a, b) => a - b)), []);
  return { covers: found, complete, truncated };
}
