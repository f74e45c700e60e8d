import { CoverMatrix } from './cover-matrix';

/** What the depth-first cover search found. */
export interface SearchResult {
  covers: number[][];
  /** false when phase 1 ran out of work: `covers` holds the best found, not proven minimal */
  complete: boolean;
  /** true when phase 2 stopped (cover limit or its own work budget) before listing every minimal cover */
  truncated: boolean;
}

/** Work budgets of the two phases, and how many minimal covers to list. */
export interface SearchOptions {
  /** word operations of phase 1 (prove one minimal cover) before giving up with the best found */
  work: number;
  /** word operations of phase 2 (list the other covers of that cost); running out only truncates the list */
  listWork?: number;
  maxCovers: number;
  /** `upper` is already proven minimal (by the covering solver): skip phase 1, only list the ties */
  upperIsMinimal?: boolean;
}

/**
 * Depth-first branch and bound over Petrick's function (the product over rows of the sums of their
 * primes), for cores too big to multiply out, in two phases with separate budgets:
 *
 * 1. **Prove** one minimal cover: a node is pruned as soon as its cost plus a lower bound reaches the
 *    best cover known (ties are not explored), and column dominance may drop a prime whose rows another
 *    prime of equal or lower cost also covers (at least one minimal cover survives).
 * 2. **List** the covers of exactly that cost: only reductions that keep every minimal cover (strict
 *    column dominance), pruning above the proven cost. If this phase runs out, the result is still
 *    proven minimal, only the list is `truncated`.
 *
 * Cost is one number: terms × 2^16 + literals (fewest terms, then fewest literals). Branching is on the
 * row with the fewest primes; branch i takes prime i and strikes primes 1..i-1, so no cover is reached
 * twice. The bound is the larger of a set of rows sharing no prime (each needs its own prime) and the
 * share bound (each row pays at least the cheapest cost-per-row of its primes).
 */
export function searchCovers(clauses: number[][], lits: number[], upper: number[], opts: SearchOptions): SearchResult {
  const m = new CoverMatrix(clauses, lits);
  const rootRows = m.allRows();
  const rootPrimes = m.allPrimes();
  let best = m.costOf(upper);
  let bestCover = upper.map((g) => m.local(g));
  let start = 0;
  let budget = opts.work;
  let out = false;
  let listing = false;
  const found: number[][] = [];
  let truncated = false;
  const taken: number[] = [];

  const dfs = (rows: Uint32Array, primes: Uint32Array, cost0: number): void => {
    if (m.steps - start > budget) { out = true; return; }
    const depth = taken.length;
    const cost = m.reduce(rows, primes, cost0, taken, !listing);
    const done = () => { taken.length = depth; };
    // a proof must finish within the budget: work spent on this node counts before its verdict
    if (m.steps - start > budget) { out = true; return done(); }
    if (cost < 0) return done();
    if (listing ? cost > best : cost >= best) return done();
    const pick = m.branchRow(rows, primes);
    if (pick < 0) {
      // every row covered
      if (listing) {
        if (found.length < opts.maxCovers) found.push(m.globalSorted(taken));
        else truncated = true;
      } else {
        best = cost;
        bestCover = [...taken];
      }
      return done();
    }
    // what the bound must reach to prune: ties are pruned while proving, kept while listing
    const lb = m.lowerBound(rows, primes, listing ? best - cost + 1 : best - cost);
    if (listing ? cost + lb > best : cost + lb >= best) return done();
    const options = m.branchOrder(pick, rows, primes);
    const here = taken.length; // after this node's forced primes
    const struck = primes.slice();
    for (const p of options) {
      struck[p >>> 5] &= ~(1 << (p & 31));
      const nextRows = rows.slice();
      m.cover(nextRows, p);
      taken.push(p);
      dfs(nextRows, struck.slice(), cost + m.weight[p]);
      taken.length = here;
      if (out) return;
    }
    done();
  };

  if (!opts.upperIsMinimal) dfs(rootRows.slice(), rootPrimes.slice(), 0);
  if (out) return { covers: [m.globalSorted(bestCover)], complete: false, truncated: false };
  // phase 2: the alternatives of exactly the proven cost, with a budget of their own
  listing = true;
  start = m.steps;
  budget = opts.listWork ?? opts.work;
  taken.length = 0;
  dfs(rootRows.slice(), rootPrimes.slice(), 0);
  if (out) truncated = true;
  const first = m.globalSorted(bestCover);
  const key = first.join(',');
  const rest = found.filter((c) => c.join(',') !== key);
  const covers = [first, ...rest].slice(0, opts.maxCovers);
  if (rest.length + 1 > opts.maxCovers) truncated = true;
  return { covers, complete: true, truncated };
}
