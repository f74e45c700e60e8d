import { describe, expect, it } from 'vitest';
import { lagrangianValue, solveCoverLp, type CoverLp } from '../../shared/analysis/cover-lp';

/** Seeded generator (mulberry32, common practice, no source). */
function seeded(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A covering problem from the columns' row lists. */
function problem(rows: number, cols: number[][], cost: number[], cap = Infinity, exact = false): CoverLp {
  const colStart = new Int32Array(cols.length + 1);
  cols.forEach((c, j) => { colStart[j + 1] = colStart[j] + c.length; });
  return { rows, cols: cols.length, colStart, colRow: Int32Array.from(cols.flat()), cost: Float64Array.from(cost), cap, exact };
}

/** Cheapest cover by trying every subset of columns (small problems only). */
function bruteForce(p: CoverLp): number {
  let best = Infinity;
  for (let s = 0; s < 1 << p.cols; s++) {
    const seen = new Uint8Array(p.rows);
    let cost = 0;
    let count = 0;
    for (let j = 0; j < p.cols; j++) {
      if (!(s & (1 << j))) continue;
      count++;
      cost += p.cost[j];
      for (let k = p.colStart[j]; k < p.colStart[j + 1]; k++) seen[p.colRow[k]] = 1;
    }
    const capOk = p.exact ? count === p.cap : count <= p.cap;
    if (capOk && seen.every((v) => v === 1) && cost < best) best = cost;
  }
  return best;
}

describe('LP bound of covering problems (our simplex on the dual)', () => {
  it('gives 3/2 for three rows pairwise covered by three unit columns (the odd cycle; from memory)', () => {
    const p = problem(3, [[0, 1], [1, 2], [0, 2]], [1, 1, 1]);
    const lp = solveCoverLp(p);
    expect(lp.optimal).toBe(true);
    expect(lp.bound).toBeCloseTo(1.5, 9);
    expect(bruteForce(p)).toBe(2);
  });

  it('is optimal by its own certificate and never above the cheapest cover, with and without a cap', () => {
    const rnd = seeded(4242);
    let checked = 0;
    for (let t = 0; t < 150; t++) {
      const rows = 3 + Math.floor(rnd() * 8);
      const C = 4 + Math.floor(rnd() * 9);
      const cols = Array.from({ length: C }, () => { const c: number[] = []; for (let r = 0; r < rows; r++) if (rnd() < 0.35) c.push(r); return c.length ? c : [Math.floor(rnd() * rows)]; });
      // every row needs a column
      for (let r = 0; r < rows; r++) if (!cols.some((c) => c.includes(r))) cols[Math.floor(rnd() * C)].push(r);
      cols.forEach((c) => c.sort((a, b) => a - b));
      const cost = cols.map(() => 1 + Math.floor(rnd() * 9));
      const free = problem(rows, cols, cost);
      const terms = bruteForce(problem(rows, cols, cols.map(() => 1)));
      for (const p of [free, problem(rows, cols, cost, terms + (t % 2), false), problem(rows, cols, cost, terms, true)]) {
        const lp = solveCoverLp(p);
        expect(lp.optimal).toBe(true);
        // the bound is the Lagrangian value of the returned multipliers (weak duality: a valid bound)
        expect(lp.bound).toBeCloseTo(lagrangianValue(p, lp.y), 9);
        const best = bruteForce(p);
        expect(lp.bound).toBeLessThanOrEqual(best + 1e-9);
        // the primal solution covers every row, keeps the cap, and costs the bound: both are optimal
        let primal = 0;
        let count = 0;
        const cover = new Float64Array(p.rows);
        for (let j = 0; j < p.cols; j++) {
          primal += p.cost[j] * lp.x[j];
          count += lp.x[j];
          for (let k = p.colStart[j]; k < p.colStart[j + 1]; k++) cover[p.colRow[k]] += lp.x[j];
        }
        for (const v of cover) expect(v).toBeGreaterThanOrEqual(1 - 1e-7);
        if (Number.isFinite(p.cap)) expect(count).toBeLessThanOrEqual(p.cap + 1e-7);
        if (p.exact) expect(count).toBeCloseTo(p.cap, 7);
        expect(primal).toBeCloseTo(lp.bound, 6);
        checked++;
      }
    }
    expect(checked).toBe(450);
  });
});
