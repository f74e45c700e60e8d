import { coversRow, literals, type Cube } from './cube';
import { searchCovers } from './cover-search';
import { solveCover } from './cover-solver';

/** Which minimal covers were found, and whether they are proven minimal. */
export interface CoverSelection {
  /** each cover as indices into the prime list; all of equal, minimal cost when `exact` */
  covers: number[][];
  exact: boolean;
  /** true when more minimal covers exist than were listed */
  truncated: boolean;
  note?: string;
  /** work spent by the covering solver (entry visits), when it ran */
  work?: number;
  /**
   * When not proven: what the search did prove about every cover — at least `terms` terms, and when the
   * fewest terms were proven (`terms` is then the cover's count), at least `literals` literals.
   */
  lowerBound?: { terms: number; literals?: number };
}

export interface CoverOptions {
  /** products kept while multiplying Petrick's function out before switching to the depth-first search */
  budget?: number;
  /** work of the covering solver (entry visits) proving one cover minimal before giving up with the best found (not proven minimal) */
  work?: number;
  /** word operations for listing the other minimal covers once one is proven; running out only truncates the list */
  listWork?: number;
  /** at most this many alternative minimal covers are listed */
  maxCovers?: number;
}

/** Default work of the proof (entry visits of the covering solver). */
const DEFAULT_WORK = 400_000_000;

interface Problem {
  clauses: number[][]; // per uncovered care row: the primes covering it (sorted)
  lits: number[];
  chosen: Set<number>;
}

/**
 * Chooses prime implicants covering every care row: essential primes, then the reductions that keep
 * every minimal cover (a row whose primes include another row's primes is dropped; a prime whose rows
 * are all covered by a prime with strictly fewer literals is dropped), then Petrick's method on what is
 * left — the product over rows of the sums of their primes, multiplied out, products costlier than a
 * greedy cover pruned. Minimal = fewest terms, then fewest literals.
 */
export function selectCovers(primes: Cube[], careRows: number[], opts: CoverOptions = {}): CoverSelection {
  const budget = opts.budget ?? 600;
  const maxCovers = opts.maxCovers ?? 32;
  const lits = primes.map(literals);
  const clauses = coverLists(primes, careRows);
  const prob: Problem = { clauses, lits, chosen: new Set() };
  reduce(prob);
  const base = [...prob.chosen];
  if (!prob.clauses.length) return { covers: [sorted(base)], exact: true, truncated: false };
  const greedy = greedyCover(prob.clauses, lits);
  const upper = { count: greedy.length, lits: greedy.reduce((s, p) => s + lits[p], 0) };
  const expanded = petrick(prob.clauses, lits, upper, budget);
  if (expanded) {
    const covers = expanded.slice(0, maxCovers).map((extra) => sorted([...base, ...extra]));
    return { covers, exact: true, truncated: expanded.length > maxCovers };
  }
  const solved = solveCover(prob.clauses, (p) => lits[p], greedy, opts.work ?? DEFAULT_WORK);
  if (!solved.proven) {
    const cover = sorted([...base, ...solved.cover]);
    const terms = base.length + solved.termBound;
    const literals = solved.literalBound === undefined ? undefined : base.reduce((s, p) => s + lits[p], 0) + solved.literalBound;
    const coverLits = cover.reduce((s, p) => s + lits[p], 0);
    const proof = literals === undefined
      ? `${cover.length} terms; every cover has at least ${terms}`
      : `its ${cover.length} terms are proven fewest; ${coverLits} literals, every cover of ${cover.length} terms has at least ${literals}`;
    return {
      covers: [cover], exact: false, truncated: false, work: solved.steps, lowerBound: { terms, literals },
      note: `the exact cover search passed its work budget; best cover found, not proven minimal (${proof})`,
    };
  }
  const found = searchCovers(prob.clauses, lits, solved.cover, { work: 0, listWork: opts.listWork ?? 2_000_000, maxCovers, upperIsMinimal: true });
  const covers = found.covers.map((extra) => sorted([...base, ...extra]));
  if (!found.complete) {
    return { covers: covers.slice(0, 1), exact: false, truncated: false, note: 'the exact cover search passed its work budget; best cover found, not proven minimal' };
  }
  return { covers, exact: true, truncated: found.truncated, work: solved.steps };
}

/**
 * Per care row, the primes covering it (ascending). Each prime's rows are enumerated (the subsets of its
 * absent inputs) when that is fewer steps than testing every prime against every row: dense 12-input
 * functions have about 3,500 rows × 7,900 primes but only about 160,000 incidences.
 */
function coverLists(primes: Cube[], careRows: number[]): number[][] {
  const clauses: number[][] = careRows.map(() => []);
  let top = 0;
  for (const m of careRows) top = Math.max(top, m);
  const n = 32 - Math.clz32(top);
  const full = n >= 32 ? 0xffffffff : (1 << n) - 1;
  let enumerated = 0;
  for (const p of primes) enumerated += 2 ** popcount(~p.care & full);
  if (n > 24 || enumerated > primes.length * careRows.length) {
    careRows.forEach((m, i) => { for (let p = 0; p < primes.length; p++) if (coversRow(primes[p], m)) clauses[i].push(p); });
    return clauses;
  }
  // no care row lies above 2^n, so inputs from n up need not be enumerated
  const rowOf = new Int32Array(2 ** n).fill(-1);
  careRows.forEach((m, i) => { rowOf[m] = i; });
  primes.forEach((c, p) => {
    // a cube asking for a 1 outside its care mask or above input n − 1 holds no care row
    if ((c.bits & ~c.care) || (c.bits & ~full)) return;
    const free = ~c.care & full;
    const bits = c.bits;
    // every subset of the absent inputs, in turn
    for (let sub = free; ; sub = (sub - 1) & free) {
      const i = rowOf[(bits | sub) >>> 0];
      if (i >= 0) clauses[i].push(p);
      if (sub === 0) break;
    }
  });
  return clauses;
}

function popcount(x: number): number {
  let c = 0;
  for (let v = x >>> 0; v; v &= v - 1) c++;
  return c;
}

function sorted(a: number[]): number[] {
  return [...a].sort((x, y) => x - y);
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

/** Essential primes, row dominance and strict column dominance, repeated until nothing changes. */
function reduce(prob: Problem): void {
  for (let changed = true; changed; ) {
    changed = false;
    // essential (or secondary essential) primes
    for (const c of prob.clauses) if (c.length === 1 && !prob.chosen.has(c[0])) { prob.chosen.add(c[0]); changed = true; }
    prob.clauses = prob.clauses.filter((c) => !c.some((p) => prob.chosen.has(p)));
    // row dominance: a clause containing another clause is implied by it
    const byLen = [...prob.clauses].sort((a, b) => a.length - b.length);
    const keep: number[][] = [];
    const seen = new Set<string>();
    const byPrime = new Map<number, number[][]>();
    for (const c of byLen) {
      const key = c.join(',');
      if (seen.has(key)) { changed = true; continue; }
      // a kept clause inside c starts with one of c's primes
      const implied = c.some((p) => (byPrime.get(p) ?? []).some((small) => isSubset(small, c)));
      if (implied) { changed = true; continue; }
      seen.add(key);
      keep.push(c);
      const list = byPrime.get(c[0]) ?? [];
      list.push(c);
      byPrime.set(c[0], list);
    }
    prob.clauses = keep;
    // strict column dominance
    const rowsOf = new Map<number, number[]>();
    prob.clauses.forEach((c, i) => c.forEach((p) => { const r = rowsOf.get(p) ?? []; r.push(i); rowsOf.set(p, r); }));
    const drop = new Set<number>();
    for (const [p, rows] of rowsOf) {
      for (const q of prob.clauses[rows[0]]) {
        if (q === p || drop.has(q) || prob.lits[q] >= prob.lits[p]) continue;
        if (isSubset(rows, rowsOf.get(q) ?? [])) { drop.add(p); break; }
      }
    }
    if (drop.size) {
      changed = true;
      prob.clauses = prob.clauses.map((c) => c.filter((p) => !drop.has(p)));
    }
  }
}

/** A cover by repeatedly taking the prime that covers most open rows (fewer literals on a tie), made irredundant. */
export function greedyCover(clauses: number[][], lits: number[]): number[] {
  const open = new Set(clauses.map((_, i) => i));
  const rowsOf = new Map<number, number[]>();
  clauses.forEach((c, i) => c.forEach((p) => { const r = rowsOf.get(p) ?? []; r.push(i); rowsOf.set(p, r); }));
  const pick: number[] = [];
  while (open.size) {
    let best = -1;
    let bestGain = 0;
    for (const [p, rows] of rowsOf) {
      const gain = rows.reduce((s, r) => s + (open.has(r) ? 1 : 0), 0);
      if (gain > bestGain || (gain === bestGain && gain > 0 && lits[p] < lits[best])) { best = p; bestGain = gain; }
    }
    pick.push(best);
    for (const r of rowsOf.get(best) ?? []) open.delete(r);
  }
  const count = clauses.map((c) => c.filter((p) => pick.includes(p)).length);
  const final: number[] = [];
  for (const p of [...pick].reverse()) {
    const rows = rowsOf.get(p) ?? [];
    if (rows.every((r) => count[r] > 1)) rows.forEach((r) => count[r]--);
    else final.push(p);
  }
  return final;
}

interface Product { set: bigint; count: number; lits: number }

function costAbove(a: { count: number; lits: number }, b: { count: number; lits: number }): boolean {
  return a.count > b.count || (a.count === b.count && a.lits > b.lits);
}

/** Petrick's method: multiply the sums out, keeping products no costlier than `bound`. Null past the budget. */
function petrick(clauses: number[][], lits: number[], bound: { count: number; lits: number }, budget: number): number[][] | null {
  const ordered = [...clauses].sort((a, b) => a.length - b.length);
  const masks = ordered.map((c) => c.reduce((m, p) => m | (1n << BigInt(p)), 0n));
  let products: Product[] = [{ set: 0n, count: 0, lits: 0 }];
  for (let i = 0; i < ordered.length; i++) {
    const next = new Map<bigint, Product>();
    for (const t of products) {
      if (t.set & masks[i]) { next.set(t.set, t); continue; }
      for (const p of ordered[i]) {
        const u: Product = { set: t.set | (1n << BigInt(p)), count: t.count + 1, lits: t.lits + lits[p] };
        if (costAbove(u, bound) || next.has(u.set)) continue;
        next.set(u.set, u);
      }
    }
    if (next.size > budget) return null;
    products = [...next.values()];
  }
  let best = products[0];
  for (const t of products) if (costAbove(best, t)) best = t;
  const minimal = products.filter((t) => !costAbove(t, best) && !costAbove(best, t));
  return minimal
    .map((t) => bitsOf(t.set))
    .sort((a, b) => { for (let i = 0; i < Math.min(a.length, b.length); i++) if (a[i] !== b[i]) return a[i] - b[i]; return a.length - b.length; });
}

function bitsOf(set: bigint): number[] {
  const out: number[] = [];
  let s = set;
  for (let i = 0; s; i++, s >>= 1n) if (s & 1n) out.push(i);
  return out;
}
