import { lagrangianTerms } from './cover-bound';

/** Number of set bits of a 32-bit word. */
export function pop(x: number): number {
  let v = x >>> 0;
  v = v - ((v >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return (((v + (v >>> 4)) & 0x0f0f0f0f) * 0x01010101) >>> 24;
}

/** Cost weight of one term: a cover's cost is terms × TERM + literals, so fewer terms always wins. */
export const TERM = 1 << 16;

/**
 * Petrick's covering problem as bitsets: per prime the rows it covers, per row the primes covering it
 * (local prime indices 0..P-1). Node state is a pair of bitsets — the rows still open and the primes
 * still allowed — so the reductions and bounds of the cover search are word operations.
 */
export class CoverMatrix {
  readonly rowCount: number;
  readonly primeCount: number;
  readonly rw: number;
  readonly pw: number;
  /** cost of each local prime: TERM + its literals */
  readonly weight: number[];
  /** word operations done so far: the search's work measure (independent of machine speed) */
  steps = 0;
  private readonly ids: number[];
  private readonly toLocal = new Map<number, number>();
  private readonly primeRows: Uint32Array;
  private readonly rowPrimes: Uint32Array;

  constructor(clauses: number[][], lits: number[]) {
    this.ids = [...new Set(clauses.flat())].sort((a, b) => a - b);
    this.ids.forEach((g, i) => this.toLocal.set(g, i));
    this.rowCount = clauses.length;
    this.primeCount = this.ids.length;
    this.rw = (this.rowCount + 31) >>> 5;
    this.pw = (this.primeCount + 31) >>> 5;
    this.primeRows = new Uint32Array(this.primeCount * this.rw);
    this.rowPrimes = new Uint32Array(this.rowCount * this.pw);
    clauses.forEach((c, r) => c.forEach((g) => {
      const p = this.local(g);
      this.primeRows[p * this.rw + (r >>> 5)] |= 1 << (r & 31);
      this.rowPrimes[r * this.pw + (p >>> 5)] |= 1 << (p & 31);
    }));
    this.weight = this.ids.map((g) => TERM + lits[g]);
  }

  local(g: number): number { return this.toLocal.get(g) ?? -1; }
  globalSorted(local: number[]): number[] { return local.map((p) => this.ids[p]).sort((a, b) => a - b); }
  costOf(global: number[]): number { return global.reduce((s, g) => s + this.weight[this.local(g)], 0); }
  allRows(): Uint32Array { return full(this.rowCount, this.rw); }
  allPrimes(): Uint32Array { return full(this.primeCount, this.pw); }

  /** Clears the rows prime p covers. */
  cover(rows: Uint32Array, p: number): void {
    const o = p * this.rw;
    for (let w = 0; w < this.rw; w++) rows[w] &= ~this.primeRows[o + w];
  }

  /** Allowed primes of row r that are in `primes`, counted. */
  private rowDegree(r: number, primes: Uint32Array): number {
    let n = 0;
    const o = r * this.pw;
    this.steps += this.pw;
    for (let w = 0; w < this.pw; w++) n += pop(this.rowPrimes[o + w] & primes[w]);
    return n;
  }

  private firstPrime(r: number, primes: Uint32Array): number {
    const o = r * this.pw;
    for (let w = 0; w < this.pw; w++) { const x = this.rowPrimes[o + w] & primes[w]; if (x) return (w << 5) + (31 - Math.clz32(x & -x)); }
    return -1;
  }

  /** Open rows prime p covers. */
  reach(p: number, rows: Uint32Array): number {
    let n = 0;
    const o = p * this.rw;
    this.steps += this.rw;
    for (let w = 0; w < this.rw; w++) n += pop(this.primeRows[o + w] & rows[w]);
    return n;
  }

  /**
   * Essential primes (taken), row dominance (a row whose primes include another row's is dropped) and
   * column dominance (a prime whose open rows another prime also covers at lower cost is dropped — at
   * equal or lower cost when `loose`, which keeps at least one minimal cover rather than all), repeated
   * until nothing changes. Mutates `rows` and `primes`; returns the new cost, or -1 when a row has no prime.
   */
  reduce(rows: Uint32Array, primes: Uint32Array, cost: number, taken: number[], loose: boolean): number {
    const { rw, pw } = this;
    for (let changed = true; changed; ) {
      changed = false;
      const open = listBits(rows, this.rowCount);
      const deg: number[] = [];
      for (const r of open) {
        if (!(rows[r >>> 5] & (1 << (r & 31)))) continue;
        const d = this.rowDegree(r, primes);
        if (d === 0) return -1;
        if (d === 1) {
          const p = this.firstPrime(r, primes);
          taken.push(p);
          cost += this.weight[p];
          this.cover(rows, p);
          primes[p >>> 5] &= ~(1 << (p & 31));
          changed = true;
        } else deg[r] = d;
      }
      if (changed) continue;
      // row dominance, smaller rows first
      open.sort((a, b) => deg[a] - deg[b]);
      const kept: number[] = [];
      for (const i of open) {
        const oi = i * pw;
        let dominated = false;
        for (const j of kept) {
          if (deg[j] > deg[i]) break;
          const oj = j * pw;
          this.steps += pw;
          let sub = true;
          for (let w = 0; w < pw && sub; w++) if (this.rowPrimes[oj + w] & primes[w] & ~this.rowPrimes[oi + w]) sub = false;
          if (sub) { dominated = true; break; }
        }
        if (dominated) { rows[i >>> 5] &= ~(1 << (i & 31)); changed = true; } else kept.push(i);
      }
      // column dominance: a dominating prime covers p's first open row too
      const live = listBits(primes, this.primeCount);
      for (const p of live) {
        const op = p * rw;
        let first = -1;
        for (let w = 0; w < rw && first < 0; w++) { const x = this.primeRows[op + w] & rows[w]; if (x) first = (w << 5) + (31 - Math.clz32(x & -x)); }
        if (first < 0) { primes[p >>> 5] &= ~(1 << (p & 31)); changed = true; continue; }
        const orow = first * pw;
        for (let w = 0; w < pw; w++) {
          let cand = this.rowPrimes[orow + w] & primes[w];
          while (cand) {
            const low = cand & -cand;
            cand ^= low;
            const q = (w << 5) + (31 - Math.clz32(low));
            if (q === p || this.weight[q] > this.weight[p] || (!loose && this.weight[q] === this.weight[p])) continue;
            const oq = q * rw;
            this.steps += rw;
            let sub = true;
            let same = true;
            for (let v = 0; v < rw && sub; v++) {
              const a = this.primeRows[op + v] & rows[v];
              const b = this.primeRows[oq + v] & rows[v];
              if (a & ~b) sub = false;
              if (a !== b) same = false;
            }
            // equal rows and equal cost: drop the later one only
            if (!sub || (same && this.weight[q] === this.weight[p] && q > p)) continue;
            primes[p >>> 5] &= ~(1 << (p & 31));
            changed = true;
            w = pw;
            break;
          }
        }
      }
    }
    return cost;
  }

  /** The open row with the fewest allowed primes, or -1 when every row is covered. */
  branchRow(rows: Uint32Array, primes: Uint32Array): number {
    let pick = -1;
    let fewest = Infinity;
    for (const r of listBits(rows, this.rowCount)) {
      const d = this.rowDegree(r, primes);
      if (d < fewest) { fewest = d; pick = r; if (d <= 2) break; }
    }
    return pick;
  }

  /** The allowed primes of row r, most open rows per unit of cost first. */
  branchOrder(r: number, rows: Uint32Array, primes: Uint32Array): number[] {
    const opts: number[] = [];
    const o = r * this.pw;
    for (let w = 0; w < this.pw; w++) {
      let x = this.rowPrimes[o + w] & primes[w];
      while (x) { const low = x & -x; x ^= low; opts.push((w << 5) + (31 - Math.clz32(low))); }
    }
    const score = new Map(opts.map((p) => [p, this.reach(p, rows) / this.weight[p]]));
    return opts.sort((a, b) => (score.get(b) ?? 0) - (score.get(a) ?? 0) || a - b);
  }

  /**
   * A lower bound on the cost of covering the open rows, terms and literals bounded separately (a cover
   * has at least ⌈T⌉ terms and ⌈L⌉ literals). Each of T and L is the larger of two feasible solutions of
   * the covering LP's dual, which bound every cover from below: (a) dual ascent — rows in order of fewest
   * primes, each raising its value to the least slack left among its primes (rows sharing no prime each
   * pay a whole prime, so this includes the independent-rows bound); (b) the share bound — each row pays
   * the least cost-per-open-row among its primes.
   */
  lowerBound(rows: Uint32Array, primes: Uint32Array, need = Infinity): number {
    const { pw } = this;
    const open = listBits(rows, this.rowCount);
    const deg = new Map(open.map((r) => [r, this.rowDegree(r, primes)]));
    open.sort((a, b) => (deg.get(a) ?? 0) - (deg.get(b) ?? 0));
    const slackT = new Map<number, number>();
    const slackL = new Map<number, number>();
    const reachOf = new Map<number, number>();
    let ascentT = 0;
    let ascentL = 0;
    let shareT = 0;
    let shareL = 0;
    const lists: number[][] = [];
    const ys: number[] = [];
    for (const r of open) {
      const o = r * pw;
      const mine: number[] = [];
      lists.push(mine);
      let yT = Infinity;
      let yL = Infinity;
      let sT = Infinity;
      let sL = Infinity;
      for (let w = 0; w < pw; w++) {
        let x = this.rowPrimes[o + w] & primes[w];
        while (x) {
          const low = x & -x;
          x ^= low;
          const p = (w << 5) + (31 - Math.clz32(low));
          mine.push(p);
          let k = reachOf.get(p);
          if (k === undefined) { k = this.reach(p, rows); reachOf.set(p, k); }
          const l = this.weight[p] - TERM;
          yT = Math.min(yT, slackT.get(p) ?? 1);
          yL = Math.min(yL, slackL.get(p) ?? l);
          sT = Math.min(sT, 1 / k);
          sL = Math.min(sL, l / k);
        }
      }
      this.steps += mine.length;
      for (const p of mine) {
        slackT.set(p, (slackT.get(p) ?? 1) - yT);
        slackL.set(p, (slackL.get(p) ?? this.weight[p] - TERM) - yL);
      }
      ys.push(yT);
      ascentT += yT;
      ascentL += yL;
      shareT += sT;
      shareL += sL;
    }
    const up = (x: number) => Math.ceil(x - 1e-9);
    const litBound = up(Math.max(ascentL, shareL));
    let terms = up(Math.max(ascentT, shareT));
    if (terms * TERM + litBound < need && need < Infinity) {
      // the cheap bounds do not prune this node: raise the term bound towards the LP optimum
      const wanted = Math.ceil((need - litBound) / TERM);
      const lag = lagrangianTerms(lists, ys, wanted - 1 + 1e-6);
      this.steps += lag.steps;
      terms = Math.max(terms, up(lag.bound));
    }
    return terms * TERM + litBound;
  }
}

function full(n: number, words: number): Uint32Array {
  const a = new Uint32Array(words);
  for (let i = 0; i < n; i++) a[i >>> 5] |= 1 << (i & 31);
  return a;
}

function listBits(set: Uint32Array, n: number): number[] {
  const out: number[] = [];
  for (let w = 0; w < set.length; w++) {
    let x = set[w];
    while (x) { const low = x & -x; x ^= low; const i = (w << 5) + (31 - Math.clz32(low)); if (i < n) out.push(i); }
  }
  return out;
}
