/** What the depth-first cover search found. */
export interface SearchResult {
  covers: number[][];
  /** false when the work budget ran out: `covers` holds the best found, not proven minimal */
  complete: boolean;
  truncated: boolean;
}

/**
 * Depth-first branch and bound over Petrick's function (the product over rows of the sums of their
 * primes), for cores too big to multiply out. Branches on the row with the fewest remaining primes;
 * branch i takes prime i and forbids primes 1..i-1, so no cover is reached twice. The bound is the cost
 * so far plus one prime per row in a set of rows that share no prime. Finds every cover of minimal cost
 * (fewest terms, then fewest literals), up to `maxCovers`, or gives up after `work` steps.
 */
export function searchCovers(clauses: number[][], lits: number[], upper: { count: number; lits: number }, opts: { work: number; maxCovers: number }): SearchResult {
  const nPrimes = lits.length;
  const rowsOf: number[][] = Array.from({ length: nPrimes }, () => []);
  clauses.forEach((c, i) => c.forEach((p) => rowsOf[p].push(i)));
  const covered = new Int32Array(clauses.length);
  const allowed = Int32Array.from(clauses, (c) => c.length);
  const forbidden = new Uint8Array(nPrimes);
  const taken: number[] = [];
  let best = { count: upper.count, lits: upper.lits };
  let found: number[][] = [];
  let truncated = false;
  let work = 0;
  let complete = true;
  const above = (c: number, l: number) => c > best.count || (c === best.count && l > best.lits);
  const mark = new Uint8Array(nPrimes);
  // rows with few primes first: a packing of disjoint rows found in this order is larger (a tighter bound)
  const packOrder = clauses.map((_, i) => i).sort((a, b) => clauses[a].length - clauses[b].length);

  const lowerBound = (): { count: number; lits: number } => {
    // rows sharing no prime each need a prime of their own
    let count = 0;
    let minLits = 0;
    const used: number[] = [];
    for (const r of packOrder) {
      if (covered[r]) continue;
      work += clauses[r].length;
      let clash = false;
      let cheapest = Infinity;
      for (const p of clauses[r]) {
        if (forbidden[p]) continue;
        if (mark[p]) { clash = true; break; }
        if (lits[p] < cheapest) cheapest = lits[p];
      }
      if (clash) continue;
      for (const p of clauses[r]) if (!forbidden[p]) { mark[p] = 1; used.push(p); }
      count++;
      minLits += cheapest;
    }
    for (const p of used) mark[p] = 0;
    return { count, lits: minLits };
  };

  const take = (p: number, d: number) => { for (const r of rowsOf[p]) covered[r] += d; };
  const forbid = (p: number, d: number) => { forbidden[p] = d > 0 ? 1 : 0; for (const r of rowsOf[p]) allowed[r] -= d; };

  const dfs = (count: number, litSum: number): void => {
    if (work > opts.work) { complete = false; return; }
    let pick = -1;
    for (let r = 0; r < clauses.length; r++) {
      if (covered[r]) continue;
      if (allowed[r] === 0) return;
      if (pick < 0 || allowed[r] < allowed[pick]) pick = r;
    }
    work += clauses.length;
    if (pick < 0) {
      if (above(count, litSum)) return;
      if (count < best.count || litSum < best.lits) { best = { count, lits: litSum }; found = []; truncated = false; }
      if (found.length < opts.maxCovers) found.push([...taken].sort((a, b) => a - b));
      else truncated = true;
      return;
    }
    const lb = lowerBound();
    if (above(count + lb.count, litSum + lb.lits)) return;
    const options = clauses[pick].filter((p) => !forbidden[p])
      .sort((a, b) => rowsOf[b].length - rowsOf[a].length || lits[a] - lits[b]);
    const done: number[] = [];
    for (const p of options) {
      if (!above(count + 1, litSum + lits[p])) {
        taken.push(p);
        take(p, 1);
        dfs(count + 1, litSum + lits[p]);
        take(p, -1);
        taken.pop();
      }
      forbid(p, 1);
      done.push(p);
      if (!complete) break;
    }
    for (const p of done) forbid(p, -1);
  };
  dfs(0, 0);
  return { covers: found, complete, truncated };
}
