/**
 * Lagrangian lower bound on the number of terms of a unate cover (every row needs one of its primes,
 * each prime costs 1): for multipliers λ ≥ 0 on the rows, L(λ) = Σ λ_r + Σ_p min(0, 1 − Σ_{r ∋ p} λ_r)
 * bounds every cover from below. Subgradient steps from a feasible dual start raise it towards the
 * covering LP's optimum (common practice, no source: the textbook Lagrangian relaxation of set cover).
 * @param rowPrimes per open row, its allowed primes (local indices)
 * @param start a feasible dual (Σ_{r ∋ p} start_r ≤ 1 for every prime), e.g. from dual ascent
 * @param enough stop as soon as the bound reaches this
 * @returns the best bound found and the work spent (entries visited)
 */
export function lagrangianTerms(rowPrimes: number[][], start: number[], enough: number, iterations = 40): { bound: number; steps: number } {
  const rows = rowPrimes.length;
  const lambda = Float64Array.from(start);
  const byPrime = new Map<number, number[]>();
  rowPrimes.forEach((list, r) => list.forEach((p) => { const l = byPrime.get(p); if (l) l.push(r); else byPrime.set(p, [r]); }));
  const primes = [...byPrime.values()];
  let best = start.reduce((s, y) => s + y, 0);
  let steps = 0;
  let mu = 1.5;
  let stale = 0;
  const g = new Float64Array(rows);
  for (let it = 0; it < iterations && best < enough; it++) {
    let value = 0;
    for (let r = 0; r < rows; r++) { value += lambda[r]; g[r] = 1; }
    for (const mine of primes) {
      let s = 0;
      for (const r of mine) s += lambda[r];
      steps += mine.length;
      if (s > 1) { value += 1 - s; for (const r of mine) g[r] -= 1; }
    }
    if (value > best + 1e-9) { best = value; stale = 0; } else if (++stale >= 4) { mu /= 2; stale = 0; }
    let norm = 0;
    for (let r = 0; r < rows; r++) if (g[r] !== 0 && !(g[r] < 0 && lambda[r] === 0)) norm += g[r] * g[r];
    if (norm === 0) break; // λ is optimal for the LP
    const target = Math.max(best * 1.03, best + 0.5);
    const t = (mu * (target - value)) / norm;
    for (let r = 0; r < rows; r++) lambda[r] = Math.max(0, lambda[r] + t * g[r]);
  }
  return { bound: best, steps };
}
