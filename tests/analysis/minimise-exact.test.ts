import { describe, expect, it } from 'vitest';
import { coversRow, minimiseOnes, minimiseZeros, type Cube } from '../../shared/analysis';

/** Seeded generator (mulberry32, common practice, no source): the same functions on every run. */
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

/** The cover evaluated on every row: 1 where a cube contains the row. */
const evaluate = (cover: Cube[], rows: number) => Array.from({ length: rows }, (_, m) => (cover.some((c) => coversRow(c, m)) ? 1 : 0));

describe('exact minimisation of dense random 8-input functions', () => {
  // Minimality is the search's own proof (exact: true); correctness is checked independently by
  // evaluating every cover on all 256 rows against the truth table (exhaustive evaluation, common
  // practice, no source). The exhaustive check of minimality for ≤ 4 inputs is in minimise-random.test.ts.
  const functions = Array.from({ length: 20 }, (_, k) => {
    const rnd = seeded(8_000 + k);
    const density = 0.3 + 0.4 * (k / 19);
    return { density, fn: Uint8Array.from({ length: 256 }, () => (rnd() < density ? 1 : 0)) };
  });

  // SOP: the on-set density runs 0.3–0.7. (The POS minimises the 0-rows, whose density runs 0.7–0.3; one
  // of those, 0-row density 0.62, needs more than the default budget to prove — noted in the README.)
  it('proves every SOP minimal and each listed SOP and POS cover equals the truth table', () => {
    for (const { density, fn } of functions) {
      const sop = minimiseOnes(8, fn);
      const pos = minimiseZeros(8, fn);
      expect(sop.exact, `SOP at density ${density.toFixed(2)}: ${sop.note ?? ''}`).toBe(true);
      for (const cover of sop.covers) expect(evaluate(cover, 256)).toEqual([...fn]);
      // a POS cover is a cover of the 0-rows
      for (const cover of pos.covers) expect(evaluate(cover, 256)).toEqual([...fn].map((v) => 1 - v));
      // every listed alternative has the same cost as the first
      const cost = (c: Cube[]) => [c.length, c.reduce((s, q) => s + q.care.toString(2).replaceAll('0', '').length, 0)];
      for (const cover of sop.covers) expect(cost(cover)).toEqual(cost(sop.covers[0]));
      for (const cover of pos.covers) expect(cost(cover)).toEqual(cost(pos.covers[0]));
    }
  }, 120_000);

  it('finds the same minimal cost whether or not alternatives are listed, and with a tiny budget is honest', () => {
    for (const { fn } of functions.slice(0, 5)) {
      const full = minimiseOnes(8, fn);
      const proofOnly = minimiseOnes(8, fn, { listWork: 0 });
      expect(proofOnly.exact).toBe(true);
      // no room to list ties: the list is marked incomplete, the proven cost is the same
      expect(proofOnly.truncated).toBe(true);
      expect(proofOnly.covers[0].length).toBe(full.covers[0].length);
      const starved = minimiseOnes(8, fn, { budget: 1, work: 1 });
      expect(starved.exact).toBe(false);
      expect(starved.note).toMatch(/not proven minimal/);
      expect(evaluate(starved.covers[0], 256)).toEqual([...fn]);
      expect(starved.covers[0].length).toBeGreaterThanOrEqual(full.covers[0].length);
    }
  }, 120_000);
});
