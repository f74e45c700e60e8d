/**
 * Exact minimisation of seeded random functions (heavy rows of `npm run bench analysis`): how many SOP
 * and POS forms the search proves minimal, and the time per form. The proof's budget per form is counted
 * in work (`defaultProofWork(n)`: entry visits of the covering solver), so "proven" does not depend on the
 * machine's load; the times do.
 */
import type { BenchRow } from './run';
import { minimiseOnes, minimiseZeros, type FunctionRows } from '../shared/analysis';
import { mulberry32 } from '../shared/sim';

/** n-input functions: each row 1 with probability `ones`, else don't-care with probability `dc`, else 0. */
function randomFunctions(n: number, count: number, ones: number, dc = 0): FunctionRows[] {
  return Array.from({ length: count }, (_, k) => {
    const rnd = mulberry32(1000 * n + k);
    return Uint8Array.from({ length: 1 << n }, () => { const x = rnd(); return x < ones ? 1 : x < ones + dc ? 2 : 0; });
  });
}

function minimiseAll(n: number, fns: FunctionRows[]): { proven: number; forms: number; times: number[]; open: string[] } {
  let proven = 0;
  const times: number[] = [];
  const open: string[] = [];
  fns.forEach((fn, k) => {
    for (const [form, run] of [['SOP', minimiseOnes], ['POS', minimiseZeros]] as const) {
      const t0 = performance.now();
      const r = run(n, fn);
      times.push(performance.now() - t0);
      if (r.exact) { proven++; continue; }
      // what the search did prove about a form it could not prove minimal: the gap left
      const terms = r.covers[0].length;
      const lb = r.lowerBound;
      open.push(!lb ? `${k} ${form}` : lb.literals === undefined ? `${k} ${form} ${terms} terms ≥ ${lb.terms}`
        : `${k} ${form} ${terms} terms proven, literals ${r.covers[0].reduce((s, c) => s + literalCount(c.care), 0)} ≥ ${lb.literals}`);
    }
  });
  return { proven, forms: 2 * fns.length, times, open };
}

function literalCount(care: number): number {
  let c = 0;
  for (let v = care >>> 0; v; v &= v - 1) c++;
  return c;
}

export function minimisationRows(): BenchRow[] {
  const rows: BenchRow[] = [];
  const cases = [
    { n: 8, count: 50, ones: 0.5, dc: 0, proveGoal: 100, formMs: 2000, what: 'density 0.5' },
    { n: 10, count: 20, ones: 0.5, dc: 0, proveGoal: 38, formMs: 2000, what: 'density 0.5' },
    // a sparse on-set with some don't-cares, as textbook exercises have (our choice of density)
    { n: 12, count: 5, ones: 0.1, dc: 0.05, proveGoal: 10, formMs: 10_000, what: '10 % ones, 5 % don\'t-cares' },
  ];
  for (const c of cases) {
    const r = minimiseAll(c.n, randomFunctions(c.n, c.count, c.ones, c.dc));
    const worst = Math.max(...r.times);
    const mean = r.times.reduce((a, b) => a + b, 0) / r.times.length;
    rows.push({ name: `${c.count} random ${c.n}-input functions: forms proven minimal`, value: r.proven, unit: `of ${r.forms}`, goal: { min: c.proveGoal },
      note: `SOP and POS each; ${c.what}; seeded${r.open.length ? `; not proven (function, form, cover ≥ proven bound): ${r.open.join(', ')}` : ''}` });
    rows.push({ name: `${c.count} random ${c.n}-input functions: slowest form`, value: worst, unit: 'ms', goal: { max: c.formMs },
      note: `mean ${mean.toFixed(0)} ms per form; total ${(r.times.reduce((a, b) => a + b, 0) / 1000).toFixed(1)} s` });
  }
  return rows;
}
