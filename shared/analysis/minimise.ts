import { compareCubes, literals, type Cube } from './cube';
import { expandCover } from './heuristic';
import { greedyCover, selectCovers } from './petrick';
import { primeImplicants } from './primes';

/** Largest input count minimised exactly (Quine–McCluskey + Petrick); larger tables get a heuristic cover. */
export const EXACT_INPUT_LIMIT = 12;

/** Row values of a single-output function: 0 off, 1 on, 2 don't-care. */
export type FunctionRows = Uint8Array;

/** A two-level cover: SOP terms are cubes of the 1-rows, POS terms cubes of the 0-rows. */
export interface MinimalCovers {
  /** alternative minimal covers (the first is the one shown); one cover when not exact */
  covers: Cube[][];
  /** true when proven minimal: fewest terms, then fewest literals */
  exact: boolean;
  truncated: boolean;
  note?: string;
  /** when not exact and the covering search ran: the terms (and, with the terms proven fewest, literals) every cover needs at least */
  lowerBound?: { terms: number; literals?: number };
}

/**
 * Work of the proof per form (entry visits of the covering solver): calibrated to stay under about 2 s up
 * to 10 inputs and 10 s for 11–12 inputs on the development machine. Counted in work, not time, so that
 * whether a form is proven does not depend on the machine's load.
 */
export function defaultProofWork(n: number): number {
  return n <= 10 ? 140_000_000 : 500_000_000;
}

/** Limits of the exact method (defaults: 12 inputs, 600 products, `defaultProofWork(n)` + 2,000,000 search word operations, 32 covers). */
export interface MinimiseOptions {
  exactLimit?: number;
  /** products Petrick's expansion may keep before the depth-first search takes over */
  budget?: number;
  /** work of the covering solver proving one cover minimal (entry visits) before it settles for the best found (not proven minimal) */
  work?: number;
  /** word operations of the depth-first search listing the other minimal covers (running out only truncates the list) */
  listWork?: number;
  maxCovers?: number;
}

/** Minimal sum-of-products covers of the rows marked 1 (rows marked 2 may go either way). */
export function minimiseOnes(n: number, fn: FunctionRows, opts: MinimiseOptions = {}): MinimalCovers {
  const limit = opts.exactLimit ?? EXACT_INPUT_LIMIT;
  const order = (cover: Cube[]) => [...cover].sort((a, b) => compareCubes(a, b, n));
  if (!fn.includes(1)) return { covers: [[]], exact: true, truncated: false };
  if (n > limit) {
    return { covers: [order(expandCover(n, fn))], exact: false, truncated: false, note: `more than ${limit} inputs: heuristic cover, not proven minimal` };
  }
  const care: number[] = [];
  const onDc: number[] = [];
  for (let m = 0; m < fn.length; m++) {
    if (fn[m] === 1) care.push(m);
    if (fn[m] !== 0) onDc.push(m);
  }
  const primes = primeImplicants(n, onDc);
  if (primes.length * care.length > 5e7) {
    const clauses = care.map((m) => primes.flatMap((p, i) => (((m & p.care) >>> 0) === p.bits ? [i] : [])));
    const pick = greedyCover(clauses, primes.map(literals));
    return { covers: [order(pick.map((i) => primes[i]))], exact: false, truncated: false, note: 'too many prime implicants: greedy cover, not proven minimal' };
  }
  const sel = selectCovers(primes, care, { budget: opts.budget, work: opts.work ?? defaultProofWork(n), listWork: opts.listWork, maxCovers: opts.maxCovers });
  const covers = sel.covers.map((c) => order(c.map((i) => primes[i])));
  return { covers: dedupeOrder(covers, n), exact: sel.exact, truncated: sel.truncated, note: sel.note, ...(sel.lowerBound ? { lowerBound: sel.lowerBound } : {}) };
}

/** Minimal product-of-sums: minimise the 0-rows; each cube becomes a sum of the complemented literals. */
export function minimiseZeros(n: number, fn: FunctionRows, opts: MinimiseOptions = {}): MinimalCovers {
  const flipped = new Uint8Array(fn.length);
  for (let m = 0; m < fn.length; m++) flipped[m] = fn[m] === 2 ? 2 : fn[m] === 1 ? 0 : 1;
  const res = minimiseOnes(n, flipped, opts);
  // order sum terms by their literals as written (a cube of zeros with A=0 is the sum term with A)
  const shown = (c: Cube): Cube => ({ care: c.care, bits: (~c.bits & c.care) >>> 0 });
  const covers = res.covers.map((cover) => [...cover].sort((a, b) => compareCubes(shown(a), shown(b), n)));
  return { ...res, covers };
}

/** Cost of a cover: [terms, literals]. */
export function coverCost(cover: Cube[]): [number, number] {
  return [cover.length, cover.reduce((s, c) => s + literals(c), 0)];
}

function dedupeOrder(covers: Cube[][], n: number): Cube[][] {
  const key = (c: Cube[]) => c.map((x) => `${x.care}:${x.bits}`).join(' ');
  const seen = new Set<string>();
  const out = covers.filter((c) => { const k = key(c); if (seen.has(k)) return false; seen.add(k); return true; });
  return out.sort((a, b) => {
    for (let i = 0; i < Math.min(a.length, b.length); i++) { const d = compareCubes(a[i], b[i], n); if (d) return d; }
    return a.length - b.length;
  });
}
