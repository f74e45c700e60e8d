/**
 * The linear-programming bound of a covering problem, by our own simplex method on its dual.
 *
 * Covering LP: min Σ c_j x_j  s.t. every open row has Σ_{j ∋ r} x_j ≥ 1, x ≥ 0, and (optionally) Σ x_j ≤ cap.
 * Its dual is a packing LP: max Σ y_r − cap·μ  s.t. Σ_{r ∈ j} y_r − μ ≤ c_j for every column, y, μ ≥ 0. With
 * c ≥ 0 the all-slack basis is feasible, so the primal simplex runs on the dual from y = 0 (no phase one).
 * Dense exchange tableau (one row per column of the covering problem, one column per dual variable),
 * Dantzig's rule, Bland's rule after a run of degenerate pivots (common practice, no source: the textbook
 * simplex method, from memory).
 *
 * The value returned is never taken from the tableau: any y, μ ≥ 0 give the Lagrangian lower bound
 * Σ y_r − cap·μ + Σ_j min(0, c_j − Σ_{r ∈ j} y_r + μ), which is computed from the multipliers in exact
 * arithmetic on the original costs, so rounding in the tableau can only weaken the bound, never make it
 * wrong.
 */

/** A covering problem in compressed columns: column j covers rows colRow[colStart[j] … colStart[j+1]). */
export interface CoverLp {
  rows: number;
  cols: number;
  colStart: Int32Array;
  colRow: Int32Array;
  cost: Float64Array;
  /** at most this many columns (Infinity: no cap) */
  cap: number;
  /** exactly `cap` columns (every cover is known to need at least that many): μ may then be negative */
  exact?: boolean;
}

export interface LpResult {
  /** the dual multipliers: y per row, then μ (0 without a cap) */
  y: Float64Array;
  /** the primal solution: x per column (the negated objective entries of the constraints' slacks) */
  x: Float64Array;
  /** the lower bound L(y, μ), recomputed from the multipliers */
  bound: number;
  /** false when the pivot limit stopped the simplex early (the bound is still valid, only weaker) */
  optimal: boolean;
  /** the dual is unbounded: no cover of the rows exists within the cap (up to rounding; the caller confirms) */
  unbounded: boolean;
  /** pivots done */
  pivots: number;
  /** tableau entries touched (work) */
  work: number;
}

/** Lagrangian value L(y, μ) of the covering problem (a valid lower bound for every y, μ ≥ 0). */
export function lagrangianValue(p: CoverLp, y: Float64Array): number {
  const capped = Number.isFinite(p.cap);
  const mu = capped ? (p.exact ? y[p.rows] : Math.max(0, y[p.rows])) : 0;
  let v = capped ? -mu * p.cap : 0;
  for (let r = 0; r < p.rows; r++) v += Math.max(0, y[r]);
  for (let j = 0; j < p.cols; j++) {
    let s = 0;
    for (let k = p.colStart[j]; k < p.colStart[j + 1]; k++) s += Math.max(0, y[p.colRow[k]]);
    const rc = p.cost[j] + mu - s;
    if (rc < 0) v += rc;
  }
  return v;
}

/**
 * Solves the dual packing LP. `maxWork` (tableau entries touched) and `maxPivots` bound the work; the
 * multipliers reached are returned either way (a valid, weaker bound when stopped early).
 */
export function solveCoverLp(p: CoverLp, maxWork = Infinity, maxPivots = 50_000): LpResult {
  const capped = Number.isFinite(p.cap);
  const both = capped && !!p.exact;
  // dual variables (tableau columns): y, then μ⁺ (cap ≤), then μ⁻ (cap ≥, when exact)
  const n = p.rows + (capped ? 1 : 0) + (both ? 1 : 0);
  const m = p.cols; // dual constraints (tableau rows)
  const T = new Float64Array(m * n);
  const rhs = new Float64Array(m);
  const d = new Float64Array(n); // objective coefficients of the non-basic variables (maximise)
  // labels: 0 … n−1 the dual variables, n … n+m−1 the slacks of the constraints
  const basic = new Int32Array(m);
  const nonbasic = new Int32Array(n);
  for (let j = 0; j < m; j++) {
    for (let k = p.colStart[j]; k < p.colStart[j + 1]; k++) T[j * n + p.colRow[k]] = 1;
    if (capped) T[j * n + p.rows] = -1;
    if (both) T[j * n + p.rows + 1] = 1;
    rhs[j] = p.cost[j];
    basic[j] = n + j;
  }
  for (let v = 0; v < n; v++) { nonbasic[v] = v; d[v] = v < p.rows ? 1 : v === p.rows ? -p.cap : p.cap; }
  const EPS = 1e-9;
  let pivots = 0;
  let work = 0;
  let degenerate = 0;
  let optimal = false;
  let unbounded = false;
  const rowK = new Float64Array(n);
  const nzIdx = new Int32Array(n);
  while (pivots < maxPivots && work < maxWork) {
    // entering column: largest d (Dantzig), or the lowest label with d > 0 (Bland) while degenerate
    let k = -1;
    if (degenerate < 50) {
      let best = EPS;
      for (let v = 0; v < n; v++) if (d[v] > best) { best = d[v]; k = v; }
    } else {
      let label = Infinity;
      for (let v = 0; v < n; v++) if (d[v] > EPS && nonbasic[v] < label) { label = nonbasic[v]; k = v; }
    }
    if (k < 0) { optimal = true; break; }
    // ratio test (ties: lowest label, as Bland's rule needs)
    let r = -1;
    let ratio = Infinity;
    for (let i = 0; i < m; i++) {
      const a = T[i * n + k];
      if (a <= EPS) continue;
      const q = rhs[i] / a;
      if (q < ratio - 1e-12 || (q <= ratio + 1e-12 && r >= 0 && basic[i] < basic[r])) { ratio = q; r = i; }
    }
    if (r < 0) { unbounded = true; break; } // only with a cap: more columns needed than it allows
    degenerate = ratio <= 1e-12 ? degenerate + 1 : 0;
    pivots++;
    // pivot on (r, k)
    const pv = T[r * n + k];
    const base = r * n;
    for (let j = 0; j < n; j++) T[base + j] /= pv;
    T[base + k] = 1 / pv;
    rhs[r] /= pv;
    rowK.set(T.subarray(base, base + n));
    // the pivot row's non-zero entries (the tableau stays sparse for a long while)
    let nz = 0;
    for (let j = 0; j < n; j++) if (rowK[j] !== 0 && j !== k) nzIdx[nz++] = j;
    for (let i = 0; i < m; i++) {
      if (i === r) continue;
      const off = i * n;
      const f = T[off + k];
      if (f === 0) continue;
      for (let t = 0; t < nz; t++) { const j = nzIdx[t]; T[off + j] -= f * rowK[j]; }
      T[off + k] = -f / pv;
      rhs[i] -= f * rhs[r];
      if (rhs[i] < 0 && rhs[i] > -1e-9) rhs[i] = 0;
      work += nz + 8;
    }
    work += m + 2 * n;
    const dk = d[k];
    for (let t = 0; t < nz; t++) { const j = nzIdx[t]; d[j] -= dk * rowK[j]; }
    d[k] = -dk / pv;
    const t = nonbasic[k];
    nonbasic[k] = basic[r];
    basic[r] = t;
  }
  const y = new Float64Array(p.rows + 1);
  for (let i = 0; i < m; i++) {
    const v = basic[i];
    if (v >= n) continue;
    const val = Math.max(0, rhs[i]);
    if (v < p.rows) y[v] = val;
    else if (v === p.rows) y[p.rows] += val;
    else y[p.rows] -= val;
  }
  const x = new Float64Array(m);
  for (let v = 0; v < n; v++) if (nonbasic[v] >= n) x[nonbasic[v] - n] = Math.max(0, -d[v]);
  return { y, x, bound: lagrangianValue(p, y), optimal, unbounded, pivots, work };
}
