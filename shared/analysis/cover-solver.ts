/**
 * Exact weighted unate covering (which primes to take so that every row is covered at least once, at
 * least cost): the proof phase of the minimal-cover search. Costs are integers (terms × TERM + literals),
 * so a lower bound LB with ⌈LB⌉ ≥ the best cover known proves that cover minimal.
 *
 * - **Reduction** at the root on index arrays and bitsets: essential columns, row dominance, column
 *   dominance at equal or lower cost (keeps at least one minimal cover), repeated; then the core is split
 *   into independent components (no shared column), each solved on its own.
 * - **Lower bound**: Lagrangian relaxation of the row constraints, L(λ) = Σ λ_r + Σ_j min(0, c_j − Σ_{r ∈ j} λ_r),
 *   valid for every λ ≥ 0, raised by subgradient optimisation (common practice, no source: the textbook
 *   Lagrangian relaxation of set covering, as in Beasley's set-covering algorithm, from memory); when
 *   that does not prune, the LP relaxation of the node's open part solved by our simplex (`cover-lp.ts`),
 *   whose dual multipliers are then the λ (in the literal stage the term count is an equality — stage 1
 *   proved that no cover has fewer — which lifts the bound well above the subgradient's).
 * - **Reduced-cost fixing**: a column whose reduced cost lifts the bound to the best known is struck; a
 *   column whose removal would do so is taken.
 * - **Incumbents** from the LP solution (columns by LP value, made irredundant; at the root a dive:
 *   columns of high LP value taken and the LP solved again until the rows are covered) and from the reduced
 *   costs: the columns of negative reduced cost, completed greedily, redundant columns dropped,
 *   single-column swaps to cheaper ones.
 * - **Branch and bound** on the free column whose LP value is nearest 1/2 (take it, then strike it);
 *   without an LP solution, on the open row with fewest columns, its columns in order of reduced cost
 *   (branch i takes column i and strikes columns 1..i−1); each child warm-started from its parent's
 *   multipliers.
 *
 * Work is counted in entry visits (one per row–column incidence touched; four simplex tableau updates count
 * as one), not time, so whether a cover is proven does not depend on the machine's load.
 */

/** What the covering solver found. */
export interface CoverSolution {
  /** the columns (as given) of the best cover found */
  cover: number[];
  cost: number;
  /** true when the search proved no cheaper cover exists */
  proven: boolean;
  /** work spent (entry visits) */
  steps: number;
  /**
   * A proven lower bound on the number of columns of any cover (equal to the cover's count when the term
   * stage was proven everywhere): from the root bounds of the components whose search ran out.
   */
  termBound: number;
  /**
   * When the fewest columns are proven (every component's term stage finished): a proven lower bound on
   * the literals of any cover with that many columns (the cover's literals when proven); else undefined.
   */
  literalBound?: number;
}

/** Cost weight of one term: terms × TERM + literals, so fewer terms always wins (as in cover-matrix.ts). */
const TERM = 1 << 16;

/** Margin for floating-point sums in the bound: costs are integers, bounds are compared as ⌈LB − EPS⌉. */
const EPS = 1e-4;
/** Subgradient iterations at the root and at other nodes (warm-started from the parent's multipliers). */
const ROOT_IT = 3000;
const NODE_IT = 60;
/** Non-improving iterations before the step factor is halved. */
const STALE = 30;
/** Root iterations between runs of the covering heuristic. */
const HEUR_EVERY = 100;

/**
 * Minimum-cost cover of the rows.
 * @param clauses per row, the columns covering it (any non-negative integers)
 * @param costOf cost of a column (a positive integer)
 * @param upper a cover known beforehand (columns as in `clauses`), or empty
 * @param work entry visits allowed before giving up with the best cover found (not proven)
 */
export function solveCover(clauses: number[][], lits: (col: number) => number, upper: number[], work: number): CoverSolution {
  const ids = [...new Set(clauses.flat())].sort((a, b) => a - b);
  const local = new Map<number, number>();
  ids.forEach((g, i) => local.set(g, i));
  const rows = clauses.map((c) => c.map((g) => local.get(g) ?? -1));
  const litCost = Float64Array.from(ids, lits);
  const costs = Float64Array.from(litCost, (l) => TERM + l);
  const ones = new Float64Array(ids.length).fill(1);
  const budget = { left: work, steps: 0 };
  const root = reduceRoot(rows, costs, budget);
  if (!root) throw new Error('solveCover: a row has no column');
  if (budget.left < 0) {
    // the budget ran out before the reductions finished: the known cover, not proven
    const cost = upper.reduce((s, g) => s + costs[local.get(g) ?? 0], 0);
    return { cover: [...upper].sort((a, b) => a - b), cost, proven: false, steps: budget.steps, termBound: 0 };
  }
  const taken = [...root.taken];
  let proven = true;
  let termBound = taken.length;
  let literalBound: number | undefined = taken.reduce((s, p) => s + litCost[p], 0);
  for (const comp of components(root.rows)) {
    // the known cover restricted to this component's columns (a cover of its rows unless reduction struck one of them)
    const compCols = new Set(comp.flat());
    const start = upper.map((g) => local.get(g) ?? -1).filter((p) => compCols.has(p));
    // stage 1: fewest terms; stage 2: fewest literals among covers of at most that many terms
    const terms = new BranchAndBound(comp, ones, budget, Infinity, litCost).solve(start);
    let pick = terms.cover;
    let done = terms.proven;
    termBound += terms.bound;
    if (done) {
      const lit = new BranchAndBound(comp, litCost, budget, terms.cover.length, ones).solve(terms.cover);
      pick = lit.cover;
      done = lit.proven;
      if (literalBound !== undefined) literalBound += lit.bound;
    } else literalBound = undefined;
    taken.push(...pick);
    if (!done) proven = false;
  }
  const cover = taken.map((p) => ids[p]).sort((a, b) => a - b);
  const cost = taken.reduce((s, p) => s + costs[p], 0);
  return { cover, cost, proven, steps: budget.steps, termBound, literalBound };
}

interface Budget { left: number; steps: number }

/**
 * Essential columns, row dominance, column dominance (at equal or lower cost; of two equal columns the
 * later goes), until nothing changes. Returns the columns taken and the rows left, or null when a row has
 * no column.
 */
function reduceRoot(rows0: number[][], costs: Float64Array, budget: Budget): { taken: number[]; rows: number[][] } | null {
  const C = costs.length;
  let rows = rows0.map((r) => [...new Set(r)].sort((a, b) => a - b));
  const taken: number[] = [];
  const struck = new Uint8Array(C);
  for (let changed = true; changed; ) {
    changed = false;
    for (const r of rows) budget.steps += r.length;
    // essential columns
    const chosen = new Uint8Array(C);
    for (const r of rows) {
      if (!r.length) return null;
      if (r.length === 1 && !chosen[r[0]]) { chosen[r[0]] = 1; taken.push(r[0]); changed = true; }
    }
    if (changed) rows = rows.filter((r) => !r.some((p) => chosen[p]));
    // row dominance: a row whose columns include another row's columns is implied by it
    const R = rows.length;
    const cw = (C + 31) >>> 5;
    const rowBits = new Uint32Array(R * cw);
    rows.forEach((r, i) => { for (const p of r) rowBits[i * cw + (p >>> 5)] |= 1 << (p & 31); });
    const colRows: number[][] = Array.from({ length: C }, () => []);
    const order = rows.map((_, i) => i).sort((a, b) => rows[a].length - rows[b].length || a - b);
    const keep = new Uint8Array(R);
    for (const i of order) {
      const ri = rows[i];
      // a kept row inside ri shares ri's columns; look through the column of ri with the fewest kept rows
      let pivot = ri[0];
      for (const p of ri) if (colRows[p].length < colRows[pivot].length) pivot = p;
      let dominated = false;
      for (const j of colRows[pivot]) {
        if (rows[j].length > ri.length) continue;
        budget.steps += cw;
        let sub = true;
        for (let w = 0; w < cw && sub; w++) if (rowBits[j * cw + w] & ~rowBits[i * cw + w]) sub = false;
        if (sub) { dominated = true; break; }
      }
      // a dominated row need not be indexed: any row it would dominate is dominated by its dominator too
      if (dominated) { changed = true; continue; }
      keep[i] = 1;
      for (const p of ri) colRows[p].push(i);
    }
    if (changed) rows = rows.filter((_, i) => keep[i]);
    // column dominance on the kept rows: p goes when some q of no greater cost covers every row of p
    const keptIdx = rows.map((_, i) => i);
    const K = rows.length;
    const rw = (K + 31) >>> 5;
    const colBits = new Uint32Array(C * rw);
    const colList: number[][] = Array.from({ length: C }, () => []);
    keptIdx.forEach((i) => { for (const p of rows[i]) { colBits[p * rw + (i >>> 5)] |= 1 << (i & 31); colList[p].push(i); } });
    let dropped = false;
    for (let p = 0; p < C; p++) {
      if (struck[p] || !colList[p].length) continue;
      const first = colList[p][0];
      for (const q of rows[first]) {
        if (q === p || struck[q] || costs[q] > costs[p] || colList[q].length < colList[p].length) continue;
        budget.steps += rw;
        let sub = true;
        for (let w = 0; w < rw && sub; w++) if (colBits[p * rw + w] & ~colBits[q * rw + w]) sub = false;
        if (!sub) continue;
        // equal rows and equal cost: the later column goes, so one of them stays
        if (costs[q] === costs[p] && colList[q].length === colList[p].length && q > p) continue;
        struck[p] = 1;
        dropped = true;
        break;
      }
    }
    if (dropped) {
      changed = true;
      rows = rows.map((r) => r.filter((p) => !struck[p]));
    }
  }
  budget.left -= budget.steps;
  return { taken, rows };
}

/** Rows grouped into components that share no column. */
function components(rows: number[][]): number[][][] {
  const parent = new Map<number, number>();
  const find = (x: number): number => {
    let r = x;
    while (parent.get(r) !== r) r = parent.get(r) ?? r;
    let y = x;
    while (y !== r) { const n = parent.get(y) ?? r; parent.set(y, r); y = n; }
    return r;
  };
  for (const r of rows) for (const p of r) if (!parent.has(p)) parent.set(p, p);
  for (const r of rows) for (let k = 1; k < r.length; k++) { const a = find(r[0]); const b = find(r[k]); if (a !== b) parent.set(a, b); }
  const groups = new Map<number, number[][]>();
  for (const r of rows) {
    const k = find(r[0]);
    const g = groups.get(k);
    if (g) g.push(r); else groups.set(k, [r]);
  }
  return [...groups.values()];
}

import { solveCoverLp, type CoverLp } from './cover-lp';

/**
 * Largest open part (open rows × free columns) given to the simplex: its dense tableau takes 8 bytes an
 * entry (2 million: 16 MB), and larger parts take too many pivots to pay for themselves; they keep the
 * subgradient bound.
 */
const LP_ENTRIES = 2_000_000;
/**
 * The simplex sees each column's cost raised by a fixed pseudo-random amount below this (equal costs make
 * the LP very degenerate: many pivots that gain nothing); the bound is still computed with the true costs.
 */
const PERTURB = 1e-3;

const FREE = 0;
const IN = 1;
const OUT = 2;

/**
 * Branch and bound with a Lagrangian bound on one component: columns of cost w (all 1 to count terms,
 * or literals), at most `cap` columns. The cap is relaxed too, with its own multiplier μ (stored after the
 * row multipliers): L(λ, μ) = Σ λ_r − μ·(cap − taken) + Σ_j min(0, w_j + μ − Σ_{r ∋ j} λ_r).
 */
class BranchAndBound {
  private readonly R: number;
  private readonly C: number;
  /** local column → column of the caller */
  private readonly col: Int32Array;
  private readonly w: Float64Array;
  /** second cost (literals while counting terms): breaks ties of w in the heuristics */
  private readonly tie: Float64Array;
  private readonly colStart: Int32Array;
  private readonly colRow: Int32Array;
  private readonly rowStart: Int32Array;
  private readonly rowCol: Int32Array;
  private readonly capped: boolean;
  /** node state: per column FREE / IN / OUT, per row how many IN columns cover it */
  private readonly state: Uint8Array;
  private readonly covered: Int32Array;
  private readonly trail: number[] = [];
  private cost = 0;
  private taken = 0;
  private best = Infinity;
  private bestSet: number[] = [];
  private out = false;
  /** a proven lower bound on the cost of any cover of the component (within the cap): the root's best */
  private rootBound = 0;
  nodes = 0;
  // scratch
  private readonly rc: Float64Array;
  /** the LP's primal solution at the current node (per column) */
  private readonly x: Float64Array;
  /** the term bound of a capped search: unit costs, its reduced costs, its multipliers per depth */
  private readonly unit: Float64Array;
  private readonly rcU: Float64Array;
  private readonly lambdaU: Float64Array[] = [];
  private readonly g: Float64Array;
  private readonly cnt: Int32Array;

  constructor(rows: number[][], costs: Float64Array, private readonly budget: Budget, private readonly cap: number, tieCosts: Float64Array) {
    const ids = [...new Set(rows.flat())].sort((a, b) => a - b);
    const loc = new Map<number, number>();
    ids.forEach((g, i) => loc.set(g, i));
    this.R = rows.length;
    this.C = ids.length;
    this.capped = Number.isFinite(cap);
    this.col = Int32Array.from(ids);
    this.w = Float64Array.from(ids, (g) => costs[g]);
    this.tie = Float64Array.from(ids, (g) => tieCosts[g]);
    this.rowStart = new Int32Array(this.R + 1);
    rows.forEach((r, i) => { this.rowStart[i + 1] = this.rowStart[i] + r.length; });
    this.rowCol = new Int32Array(this.rowStart[this.R]);
    const deg = new Int32Array(this.C);
    rows.forEach((r, i) => r.forEach((g, k) => { const p = loc.get(g) ?? 0; this.rowCol[this.rowStart[i] + k] = p; deg[p]++; }));
    this.colStart = new Int32Array(this.C + 1);
    for (let p = 0; p < this.C; p++) this.colStart[p + 1] = this.colStart[p] + deg[p];
    this.colRow = new Int32Array(this.colStart[this.C]);
    const fill = this.colStart.slice(0, this.C);
    for (let i = 0; i < this.R; i++) for (let k = this.rowStart[i]; k < this.rowStart[i + 1]; k++) this.colRow[fill[this.rowCol[k]]++] = i;
    this.state = new Uint8Array(this.C);
    this.covered = new Int32Array(this.R);
    this.rc = new Float64Array(this.C);
    this.x = new Float64Array(this.C);
    this.unit = new Float64Array(this.C).fill(1);
    this.rcU = new Float64Array(this.C);
    this.g = new Float64Array(this.R + 1);
    this.cnt = new Int32Array(this.R);
  }

  /** The best cover (columns of the caller) and whether it is proven minimal; `start` is a known cover or not. */
  solve(start: number[]): { cover: number[]; proven: boolean; bound: number } {
    const loc = new Map<number, number>();
    this.col.forEach((g, i) => loc.set(g, i));
    const startLocal = start.map((g) => loc.get(g) ?? -1).filter((p) => p >= 0);
    if (this.isCover(startLocal)) this.offer(startLocal);
    const lambda = new Float64Array(this.R + 1);
    // start: each row pays the cheapest cost per row among its columns
    for (let i = 0; i < this.R; i++) {
      let m = Infinity;
      for (let k = this.rowStart[i]; k < this.rowStart[i + 1]; k++) { const p = this.rowCol[k]; m = Math.min(m, this.w[p] / (this.colStart[p + 1] - this.colStart[p])); }
      lambda[i] = m;
    }
    if (this.capped) {
      const u = new Float64Array(this.R + 1);
      for (let i = 0; i < this.R; i++) {
        let m = Infinity;
        for (let k = this.rowStart[i]; k < this.rowStart[i + 1]; k++) { const p = this.rowCol[k]; m = Math.min(m, 1 / (this.colStart[p + 1] - this.colStart[p])); }
        u[i] = m;
      }
      this.lambdaU[0] = u;
    }
    this.node(lambda, 0);
    if (!this.bestSet.length && this.R) this.greedyFallback();
    let best = 0;
    for (const p of this.bestSet) best += this.w[p];
    // proven: the cover's own cost; else what the root proved (no cover is cheaper than both)
    return { cover: this.bestSet.map((p) => this.col[p]), proven: !this.out, bound: this.out ? Math.min(best, this.rootBound) : best };
  }

  /** A cover by most open rows per unit of cost (only when the budget ran out before any cover was found). */
  private greedyFallback(): void {
    this.undo(0);
    const cnt = new Int32Array(this.R);
    const set: number[] = [];
    for (;;) {
      let pick = -1;
      let score = 0;
      for (let p = 0; p < this.C; p++) {
        let open = 0;
        for (let k = this.colStart[p]; k < this.colStart[p + 1]; k++) if (!cnt[this.colRow[k]]) open++;
        if (open / this.w[p] > score) { score = open / this.w[p]; pick = p; }
      }
      if (pick < 0) break;
      set.push(pick);
      for (let k = this.colStart[pick]; k < this.colStart[pick + 1]; k++) cnt[this.colRow[k]]++;
    }
    this.improve(set, cnt);
    // past the cap only when nothing better is known: the caller's start cover is then kept
    let c = 0;
    for (const p of set) c += this.w[p];
    this.best = c;
    this.bestSet = set;
  }

  /**
   * Records a bound of the root's open part: no cover costs less than min(best, cost + ⌈bound⌉) — the
   * root's fixings (propagation, reduced-cost fixing against the best cover) only strike covers that are
   * not cheaper than the best one. Rounded down by the same margin as `prunes`.
   */
  private noteRoot(bound: number): void {
    if (!Number.isFinite(bound)) return;
    const whole = this.cost + Math.ceil(bound - EPS);
    this.rootBound = Math.max(this.rootBound, Math.min(this.best, whole));
  }

  private spend(n: number): boolean {
    this.budget.steps += n;
    this.budget.left -= n;
    if (this.budget.left < 0) this.out = true;
    return this.out;
  }

  private isCover(set: number[]): boolean {
    const seen = new Uint8Array(this.R);
    for (const p of set) for (let k = this.colStart[p]; k < this.colStart[p + 1]; k++) seen[this.colRow[k]] = 1;
    return seen.every((v) => v === 1);
  }

  private offer(set: number[]): void {
    if (set.length > this.cap) return;
    let c = 0;
    for (const p of set) c += this.w[p];
    if (c < this.best) {
      // a new incumbent of the literal stage, or of a term stage too large for the LP (no LP dive for a
      // first cover): improved by swaps before it is kept (new incumbents are few)
      const better = this.capped || this.R * this.C > LP_ENTRIES ? this.swapSearch(set) : [...set];
      c = 0;
      for (const p of better) c += this.w[p];
      this.best = c;
      this.bestSet = better;
    }
  }

  /**
   * Local search on a cover at equal or fewer columns: repeatedly replaces one column by one, or two by
   * two, of lower total cost (ties broken by the tie cost), keeping every row covered; any column of the
   * component may come in (the result is a cover of the whole component, valid whatever the node's
   * state). Stops at a local optimum or after an eighth of the work left. Work counted as entry visits.
   */
  private swapSearch(start: number[]): number[] {
    const { R, C, colStart, colRow, rowStart, rowCol, w, tie } = this;
    const inSet = new Uint8Array(C);
    const cnt = new Int32Array(R);
    const list = [...start];
    for (const p of list) { inSet[p] = 1; for (let k = colStart[p]; k < colStart[p + 1]; k++) cnt[colRow[k]]++; }
    const cost = (p: number) => w[p] + tie[p] * 1e-6;
    const put = (p: number, d: number) => { inSet[p] = d > 0 ? 1 : 0; for (let k = colStart[p]; k < colStart[p + 1]; k++) cnt[colRow[k]] += d; };
    /** rows of column p with no cover left (cnt 0) */
    const bare = (p: number, out: number[]) => { out.length = 0; for (let k = colStart[p]; k < colStart[p + 1]; k++) if (!cnt[colRow[k]]) out.push(colRow[k]); };
    const covers = (q: number, rowsNeeded: number[]) => {
      for (const r of rowsNeeded) {
        let ok = false;
        for (let k = rowStart[r]; k < rowStart[r + 1]; k++) if (rowCol[k] === q) { ok = true; break; }
        if (!ok) return false;
      }
      return true;
    };
    const redundant = (p: number) => { for (let k = colStart[p]; k < colStart[p + 1]; k++) if (cnt[colRow[k]] < 2) return false; return true; };
    const u1: number[] = [];
    const u2: number[] = [];
    let visits = 0;
    // at most an eighth of the work left per call (a large cover's search could otherwise take it all)
    const limit = this.budget.steps + Math.max(1_000_000, this.budget.left / 8);
    let stopped = false;
    for (let improved = true; improved && !this.out && !stopped; ) {
      improved = false;
      for (let a = 0; a < list.length && !improved; a++) {
        const p1 = list[a];
        put(p1, -1);
        bare(p1, u1);
        visits += colStart[p1 + 1] - colStart[p1];
        if (!u1.length) { list.splice(a, 1); improved = true; break; } // redundant: dropped
        const r0 = u1[0];
        let done = false;
        for (let k = rowStart[r0]; k < rowStart[r0 + 1] && !done; k++) {
          const q1 = rowCol[k];
          visits++;
          if (inSet[q1] || q1 === p1) continue;
          put(q1, 1);
          visits += 2 * (colStart[q1 + 1] - colStart[q1]);
          bare(p1, u2);
          if (!u2.length) {
            if (cost(q1) < cost(p1)) { list[a] = q1; done = true; break; }
            // q1 alone keeps the cover: one more column may now be redundant (2-for-1)
            for (let j = colStart[q1]; j < colStart[q1 + 1] && !done; j++) {
              const r = colRow[j];
              if (cnt[r] !== 2) continue;
              visits += rowStart[r + 1] - rowStart[r];
              for (let h = rowStart[r]; h < rowStart[r + 1]; h++) {
                const p2 = rowCol[h];
                if (!inSet[p2] || p2 === q1) continue;
                visits += colStart[p2 + 1] - colStart[p2];
                if (redundant(p2) && cost(q1) < cost(p1) + cost(p2)) { put(p2, -1); list[a] = q1; list.splice(list.indexOf(p2), 1); done = true; break; }
              }
            }
            if (done) break;
          } else {
            // two for two: q2 covers what is left of p1's rows, and some p2 becomes redundant
            const r1 = u2[0];
            for (let h = rowStart[r1]; h < rowStart[r1 + 1] && !done; h++) {
              const q2 = rowCol[h];
              visits++;
              if (inSet[q2] || q2 === p1) continue;
              for (const r of u2) visits += rowStart[r + 1] - rowStart[r];
              if (!covers(q2, u2)) continue;
              put(q2, 1);
              visits += colStart[q2 + 1] - colStart[q2];
              let pick = -1;
              for (const q of [q1, q2]) {
                for (let j = colStart[q]; j < colStart[q + 1]; j++) {
                  const r = colRow[j];
                  if (cnt[r] < 2) continue;
                  visits += rowStart[r + 1] - rowStart[r];
                  for (let g = rowStart[r]; g < rowStart[r + 1]; g++) {
                    const p2 = rowCol[g];
                    if (!inSet[p2] || p2 === q1 || p2 === q2 || (pick >= 0 && cost(p2) <= cost(pick))) continue;
                    visits += colStart[p2 + 1] - colStart[p2];
                    if (redundant(p2)) pick = p2;
                  }
                }
              }
              if (pick >= 0 && cost(q1) + cost(q2) < cost(p1) + cost(pick)) {
                put(pick, -1);
                list[a] = q1;
                list[list.indexOf(pick)] = q2;
                done = true;
                break;
              }
              put(q2, -1);
            }
          }
          if (done) break;
          put(q1, -1);
        }
        if (done) { improved = true; break; }
        put(p1, 1);
        // large covers: the budget is checked within a pass, not only after it
        if (visits > 100_000) { const out = this.spend(visits); visits = 0; if (out || this.budget.steps > limit) { stopped = true; break; } }
      }
      if (this.spend(visits) || this.budget.steps > limit) break;
      visits = 0;
    }
    this.spend(visits);
    if (!this.isCover(list)) return [...start];
    return list.length <= start.length ? list : [...start];
  }

  private setIn(p: number): void {
    this.state[p] = IN;
    this.trail.push(p);
    this.cost += this.w[p];
    this.taken++;
    for (let k = this.colStart[p]; k < this.colStart[p + 1]; k++) this.covered[this.colRow[k]]++;
  }

  private setOut(p: number): void {
    this.state[p] = OUT;
    this.trail.push(p);
  }

  private undo(mark: number): void {
    while (this.trail.length > mark) {
      const p = this.trail.pop() ?? 0;
      if (this.state[p] === IN) {
        this.cost -= this.w[p];
        this.taken--;
        for (let k = this.colStart[p]; k < this.colStart[p + 1]; k++) this.covered[this.colRow[k]]--;
      }
      this.state[p] = FREE;
    }
  }

  /** Takes the only column of an open row, strikes columns with no open row; false when a row has none or the cap is passed. */
  private propagate(): boolean {
    for (let again = true; again; ) {
      again = false;
      this.spend(this.colRow.length);
      for (let i = 0; i < this.R; i++) {
        if (this.covered[i]) continue;
        let only = -1;
        let n = 0;
        for (let k = this.rowStart[i]; k < this.rowStart[i + 1] && n < 2; k++) { const p = this.rowCol[k]; if (this.state[p] === FREE) { only = p; n++; } }
        if (n === 0) return false;
        if (n === 1) { this.setIn(only); again = true; }
      }
      if (this.taken > this.cap) return false;
      for (let p = 0; p < this.C; p++) {
        if (this.state[p] !== FREE) continue;
        let open = false;
        for (let k = this.colStart[p]; k < this.colStart[p + 1] && !open; k++) if (!this.covered[this.colRow[k]]) open = true;
        if (!open) this.setOut(p);
      }
    }
    return true;
  }

  /**
   * Reduced costs for (λ, μ) into `rc` (free columns; others +∞) and the Lagrangian value of the open
   * part, for column costs `w` (μ only when `withCap`).
   */
  private evaluate(lambda: Float64Array, w: Float64Array, withCap: boolean, rc: Float64Array): number {
    const mu = withCap ? lambda[this.R] : 0;
    let value = withCap ? -mu * (this.cap - this.taken) : 0;
    for (let i = 0; i < this.R; i++) if (!this.covered[i]) value += lambda[i];
    let visits = 0;
    for (let p = 0; p < this.C; p++) {
      if (this.state[p] !== FREE) { rc[p] = Infinity; continue; }
      let s = 0;
      const end = this.colStart[p + 1];
      for (let k = this.colStart[p]; k < end; k++) { const r = this.colRow[k]; if (!this.covered[r]) s += lambda[r]; }
      visits += end - this.colStart[p];
      const c = w[p] + mu - s;
      rc[p] = c;
      if (c < 0) value += c;
    }
    this.spend(visits + this.R);
    return value;
  }

  /**
   * Subgradient optimisation of L(λ, μ) from `lambda` (updated in place to the best multipliers found),
   * for column costs `w`; the bound must exceed need − 1 to prune. Stops when it prunes, when the step
   * has shrunk, or after `iterations`. Leaves `rc` at the best multipliers; returns the best bound.
   */
  private subgradient(lambda: Float64Array, w: Float64Array, withCap: boolean, need0: number, rc: Float64Array, iterations: number, heuristicEvery = 0): number {
    let need = need0;
    const bestLambda = Float64Array.from(lambda);
    let bestValue = -Infinity;
    let f = 1;
    let stale = 0;
    const { g, R } = this;
    for (let it = 0; it < iterations; it++) {
      const value = this.evaluate(lambda, w, withCap, rc);
      if (value > bestValue + 1e-9) { bestValue = value; bestLambda.set(lambda); stale = 0; } else if (++stale >= STALE) { f /= 2; stale = 0; }
      if (prunes(bestValue, need) || this.out || f < 0.002) break;
      if (heuristicEvery && it % heuristicEvery === heuristicEvery - 1) { this.heuristic(); need = this.best - this.cost; }
      // subgradient: 1 − (columns of negative reduced cost covering the row); for μ: those columns − room left
      for (let i = 0; i < R; i++) g[i] = this.covered[i] ? 0 : 1;
      let picked = 0;
      for (let p = 0; p < this.C; p++) {
        if (!(rc[p] < 0)) continue;
        picked++;
        for (let k = this.colStart[p]; k < this.colStart[p + 1]; k++) g[this.colRow[k]] -= 1;
      }
      g[R] = withCap ? picked - (this.cap - this.taken) : 0;
      let norm = 0;
      for (let i = 0; i <= R; i++) {
        if (i < R && this.covered[i]) continue;
        if (i < R && g[i] < 0 && lambda[i] <= 0) g[i] = 0;
        norm += g[i] * g[i];
      }
      if (norm === 0) break; // the relaxed solution is feasible and complementary: the multipliers are optimal
      const target = Number.isFinite(need) ? Math.max(need, value + 1) : value * 1.05 + 1;
      const t = (f * (target - value)) / norm;
      for (let i = 0; i < R; i++) if (g[i] !== 0 && !this.covered[i]) lambda[i] = Math.max(0, lambda[i] + t * g[i]);
      // μ has no sign: stage 1 proved that no cover has fewer columns, so a cover within the cap has exactly cap
      if (withCap) lambda[R] += t * g[R];
    }
    lambda.set(bestLambda);
    return this.evaluate(lambda, w, withCap, rc);
  }

  /**
   * Reduced-cost fixing: with bound `bound` and reduced costs `rc` for a bound that must exceed need − 1,
   * a free column whose taking lifts the bound that far is struck, one whose striking does is taken.
   */
  private fix(bound: number, rc: Float64Array, need: number): boolean {
    let fixed = false;
    for (let p = 0; p < this.C; p++) {
      if (this.state[p] !== FREE) continue;
      const r = rc[p];
      if (r >= 0 && prunes(bound + r, need)) { this.setOut(p); fixed = true; } else if (r < 0 && prunes(bound - r, need)) { this.setIn(p); fixed = true; }
    }
    return fixed;
  }

  /**
   * A cover from the reduced costs: the IN columns, the free columns of negative reduced cost, then for
   * each open row its free column of least reduced cost per open row; redundant columns dropped
   * (costliest first), then columns swapped for cheaper ones covering the rows only they cover.
   */
  private heuristic(): void {
    const { rc, cnt } = this;
    const set: number[] = [];
    cnt.fill(0);
    const add = (p: number) => { set.push(p); for (let k = this.colStart[p]; k < this.colStart[p + 1]; k++) cnt[this.colRow[k]]++; };
    for (let p = 0; p < this.C; p++) if (this.state[p] === IN || (this.state[p] === FREE && rc[p] < 0)) add(p);
    let visits = 0;
    for (let i = 0; i < this.R; i++) {
      if (cnt[i]) continue;
      let pick = -1;
      let score = Infinity;
      for (let k = this.rowStart[i]; k < this.rowStart[i + 1]; k++) {
        const p = this.rowCol[k];
        if (this.state[p] !== FREE) continue;
        let open = 0;
        for (let j = this.colStart[p]; j < this.colStart[p + 1]; j++) if (!cnt[this.colRow[j]]) open++;
        visits += this.colStart[p + 1] - this.colStart[p];
        const s = (Math.max(rc[p], 0) + (this.w[p] + this.tie[p] * 1e-3) * 1e-6) / open;
        if (s < score) { score = s; pick = p; }
      }
      if (pick < 0) return;
      add(pick);
    }
    this.spend(visits);
    this.improve(set, cnt);
    this.offer(set);
  }

  /**
   * LP diving for an incumbent: take the free columns of LP value ≥ 0.9 and the one of largest value
   * below, propagate, solve the LP of what is left, round it, until the rows are covered or the bound
   * shows no better cover down this path; then everything is undone and the node's multipliers,
   * reduced costs and LP solution restored.
   */
  private dive(lambda: Float64Array): void {
    const mark = this.trail.length;
    const x0 = Float64Array.from(this.x);
    const trial = Float64Array.from(lambda);
    for (let step = 0; step < this.C && !this.out; step++) {
      let top = -1;
      let topX = 0;
      let took = false;
      for (let p = 0; p < this.C; p++) {
        if (this.state[p] !== FREE) continue;
        const v = this.x[p];
        if (v >= 0.9) { this.setIn(p); took = true; } else if (v > topX) { topX = v; top = p; }
      }
      if (!took && top >= 0) this.setIn(top);
      else if (!took) break;
      if (!this.propagate()) break;
      if (this.openRows() === 0) { this.offer(this.inSet()); break; }
      if (this.taken >= this.cap || this.cost >= this.best) break;
      if (this.openRows() * this.freeColumns() > LP_ENTRIES) break;
      const b = this.lpBound(trial);
      this.heuristicX();
      if (prunes(b, this.best - this.cost)) break;
    }
    this.undo(mark);
    this.x.set(x0);
    this.evaluate(lambda, this.w, this.capped, this.rc);
  }

  /** A cover by rounding the LP solution: free columns by LP value (highest first) while they cover an open row, then made irredundant. */
  private heuristicX(): void {
    const { cnt } = this;
    cnt.fill(0);
    const set: number[] = [];
    const add = (p: number) => { set.push(p); for (let k = this.colStart[p]; k < this.colStart[p + 1]; k++) cnt[this.colRow[k]]++; };
    const free: number[] = [];
    for (let p = 0; p < this.C; p++) if (this.state[p] === IN) add(p); else if (this.state[p] === FREE) free.push(p);
    free.sort((a, b) => this.x[b] - this.x[a] || this.rc[a] - this.rc[b] || a - b);
    for (const p of free) {
      let open = false;
      for (let k = this.colStart[p]; k < this.colStart[p + 1] && !open; k++) if (!cnt[this.colRow[k]]) open = true;
      if (open) add(p);
    }
    this.spend(this.colRow.length);
    for (let i = 0; i < this.R; i++) if (!cnt[i]) return;
    this.improve(set, cnt);
    this.offer(set);
  }

  /** Drops redundant columns (costliest first) and swaps a column for a cheaper free one covering the rows only it covers. */
  private improve(set: number[], cnt: Int32Array): void {
    const mark = new Uint8Array(this.C);
    for (const p of set) mark[p] = 1;
    const byCost = [...set].sort((a, b) => this.w[b] - this.w[a] || this.tie[b] - this.tie[a] || this.rc[b] - this.rc[a] || b - a);
    for (const p of byCost) {
      if (this.state[p] === IN) continue;
      let needed = false;
      for (let k = this.colStart[p]; k < this.colStart[p + 1] && !needed; k++) if (cnt[this.colRow[k]] < 2) needed = true;
      if (needed) continue;
      mark[p] = 0;
      for (let k = this.colStart[p]; k < this.colStart[p + 1]; k++) cnt[this.colRow[k]]--;
    }
    for (let p = 0; p < this.C; p++) {
      if (!mark[p] || this.state[p] === IN) continue;
      let first = -1;
      for (let k = this.colStart[p]; k < this.colStart[p + 1]; k++) if (cnt[this.colRow[k]] === 1) { first = this.colRow[k]; break; }
      if (first < 0) continue;
      let swap = -1;
      for (let k = this.rowStart[first]; k < this.rowStart[first + 1]; k++) {
        const q = this.rowCol[k];
        if (mark[q] || this.state[q] !== FREE || !this.cheaper(q, p) || (swap >= 0 && !this.cheaper(q, swap))) continue;
        let ok = true;
        for (let j = this.colStart[p]; j < this.colStart[p + 1] && ok; j++) {
          const r = this.colRow[j];
          if (cnt[r] !== 1) continue;
          ok = false;
          for (let h = this.rowStart[r]; h < this.rowStart[r + 1]; h++) if (this.rowCol[h] === q) { ok = true; break; }
        }
        if (ok) swap = q;
      }
      if (swap < 0) continue;
      mark[p] = 0;
      for (let k = this.colStart[p]; k < this.colStart[p + 1]; k++) cnt[this.colRow[k]]--;
      mark[swap] = 1;
      for (let k = this.colStart[swap]; k < this.colStart[swap + 1]; k++) cnt[this.colRow[k]]++;
    }
    set.length = 0;
    for (let p = 0; p < this.C; p++) if (mark[p]) set.push(p);
  }

  /** Is column a cheaper than b (cost, then the tie cost)? */
  private cheaper(a: number, b: number): boolean {
    return this.w[a] < this.w[b] || (this.w[a] === this.w[b] && this.tie[a] < this.tie[b]);
  }

  private node(parentLambda: Float64Array, depth: number): void {
    if (this.out) return;
    this.nodes++;
    const mark = this.trail.length;
    const lambda = Float64Array.from(parentLambda);
    const finish = () => this.undo(mark);
    const lambdaU = this.capped ? Float64Array.from(this.lambdaU[depth] ?? parentLambda) : lambda;
    let bound = 0;
    let haveX = false;
    for (let round = 0; ; round++) {
      if (!this.propagate()) return finish();
      if (this.cost >= this.best) return finish();
      if (this.openRows() === 0) { this.offer(this.inSet()); return finish(); }
      if (this.taken >= this.cap) return finish();
      const its = depth === 0 && round === 0 ? ROOT_IT : round === 0 ? NODE_IT : NODE_IT / 2;
      if (this.capped) {
        // the cap: the open rows need at least the term bound's columns
        const needU = this.cap - this.taken + 1;
        const boundU = this.subgradient(lambdaU, this.unit, false, needU, this.rcU, its);
        if (this.out || prunes(boundU, needU)) return finish();
        if (this.fix(boundU, this.rcU, needU)) {
          if (!this.propagate()) return finish();
          if (this.openRows() === 0) { this.offer(this.inSet()); return finish(); }
          if (this.taken >= this.cap) return finish();
        }
      }
      bound = this.subgradient(lambda, this.w, this.capped, this.best - this.cost, this.rc, its, depth === 0 ? HEUR_EVERY : 0);
      if (depth === 0) this.noteRoot(bound);
      if (this.out) return finish();
      if (!prunes(bound, this.best - this.cost) && round === 0 && this.openRows() * this.freeColumns() <= LP_ENTRIES) {
        const saved = Float64Array.from(lambda);
        const lp = this.lpBound(lambda);
        haveX = true;
        if (lp > bound) bound = lp; else { lambda.set(saved); bound = this.evaluate(lambda, this.w, this.capped, this.rc); }
        if (depth === 0) this.noteRoot(bound);
        this.heuristicX();
        if (depth === 0) this.dive(lambda);
      }
      this.heuristic();
      const need = this.best - this.cost;
      if (prunes(bound, need)) return finish();
      if (!this.fix(bound, this.rc, need) || round >= 4) break;
    }
    if (haveX) {
      // branch on the free column whose LP value is nearest 1/2: take it, then strike it
      let q = -1;
      let qx = 0;
      for (let p = 0; p < this.C; p++) {
        if (this.state[p] !== FREE) continue;
        const v = this.x[p];
        if (v > 1e-6 && v < 1 - 1e-6) {
          const score = 0.5 - Math.abs(v - 0.5);
          if (score > qx) { qx = score; q = p; }
        }
      }
      if (q >= 0) {
        const r = this.rc[q];
        this.lambdaU[depth + 1] = lambdaU;
        if (!prunes(bound + Math.max(r, 0), this.best - this.cost)) {
          const inner = this.trail.length;
          this.setIn(q);
          this.node(lambda, depth + 1);
          this.undo(inner);
        }
        if (!this.out && !prunes(bound - Math.min(r, 0), this.best - this.cost)) {
          this.setOut(q);
          this.node(lambda, depth + 1);
        }
        return finish();
      }
    }
    // branch on the open row with fewest free columns (larger multiplier on a tie)
    let pick = -1;
    let fewest = Infinity;
    for (let i = 0; i < this.R; i++) {
      if (this.covered[i]) continue;
      let n = 0;
      for (let k = this.rowStart[i]; k < this.rowStart[i + 1]; k++) if (this.state[this.rowCol[k]] === FREE) n++;
      if (n < fewest || (n === fewest && lambda[i] > lambda[pick])) { fewest = n; pick = i; }
    }
    const options: number[] = [];
    for (let k = this.rowStart[pick]; k < this.rowStart[pick + 1]; k++) { const p = this.rowCol[k]; if (this.state[p] === FREE) options.push(p); }
    const rcOf = Float64Array.from(options, (p) => this.rc[p]);
    this.lambdaU[depth + 1] = lambdaU;
    const order = options.map((_, i) => i).sort((a, b) => rcOf[a] - rcOf[b] || options[a] - options[b]);
    for (let k = 0; k < order.length; k++) {
      const p = options[order[k]];
      if (this.state[p] !== FREE) continue;
      // the parent's multipliers bound this child: taking p adds its reduced cost when positive
      if (!prunes(bound + Math.max(rcOf[order[k]], 0), this.best - this.cost)) {
        const inner = this.trail.length;
        this.setIn(p);
        this.node(lambda, depth + 1);
        this.undo(inner);
        if (this.out) break;
      }
      this.setOut(p);
    }
    finish();
  }

  /**
   * The LP bound of the open part: the simplex's multipliers, if their Lagrangian value beats the one of
   * `lambda`, are written into `lambda` (rows of this search; μ last) and `rc`; returns their value.
   */
  /**
   * The LP bound of the open part (our simplex on the dual of the open rows and free columns, from
   * scratch: after fixing, a node's open part is much smaller than the root's). The simplex's multipliers
   * are written into `lambda` (rows of this search; μ last) and `rc`, its primal solution into `x`;
   * returns their Lagrangian value (a valid bound whatever the rounding in the tableau).
   */
  private lpBound(lambda: Float64Array): number {
    const rowId = new Int32Array(this.R).fill(-1);
    const cols: number[] = [];
    const lp = this.openLp(this.w, this.capped, rowId, cols);
    const res = solveCoverLp(lp, Math.max(0, this.budget.left) * 4);
    // a tableau entry update costs about a quarter of an entry visit of the Lagrangian (measured)
    this.spend(Math.ceil(res.work / 4));
    this.x.fill(0);
    cols.forEach((p, j) => { this.x[p] = res.x[j]; });
    const trial = new Float64Array(this.R + 1);
    for (let i = 0; i < this.R; i++) trial[i] = rowId[i] >= 0 ? res.y[rowId[i]] : 0;
    if (this.capped) trial[this.R] = res.y[lp.rows];
    const v = this.evaluate(trial, this.w, this.capped, this.rc);
    lambda.set(trial);
    return v;
  }

  /** The open part (free columns, uncovered rows) as an LP. */
  openLp(w: Float64Array, withCap: boolean, rowId = new Int32Array(this.R).fill(-1), cols: number[] = []): CoverLp {
    let R = 0;
    for (let i = 0; i < this.R; i++) if (!this.covered[i]) rowId[i] = R++;
    for (let p = 0; p < this.C; p++) if (this.state[p] === FREE) cols.push(p);
    const colStart = new Int32Array(cols.length + 1);
    const entries: number[] = [];
    const cost = new Float64Array(cols.length);
    cols.forEach((p, j) => {
      for (let k = this.colStart[p]; k < this.colStart[p + 1]; k++) { const r = rowId[this.colRow[k]]; if (r >= 0) entries.push(r); }
      colStart[j + 1] = entries.length;
      cost[j] = w[p] + PERTURB * (((p * 2654435761) >>> 0) / 4294967296);
    });
    return { rows: R, cols: cols.length, colStart, colRow: Int32Array.from(entries), cost, cap: withCap ? this.cap - this.taken : Infinity, exact: withCap };
  }

  private freeColumns(): number {
    let n = 0;
    for (let p = 0; p < this.C; p++) if (this.state[p] === FREE) n++;
    return n;
  }

  private openRows(): number {
    let n = 0;
    for (let i = 0; i < this.R; i++) if (!this.covered[i]) n++;
    return n;
  }

  private inSet(): number[] {
    const s: number[] = [];
    for (let p = 0; p < this.C; p++) if (this.state[p] === IN) s.push(p);
    return s;
  }
}

/** True when no cover of the open part costs less than `need`: ⌈bound⌉ ≥ need (integer costs). */
function prunes(bound: number, need: number): boolean {
  return bound > need - 1 + EPS;
}
