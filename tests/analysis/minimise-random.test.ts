import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { expressionColumn, minimalForms, parseExpression } from '../../shared/analysis';
import { counts, satEquivalentOnCare } from './helpers';

/** A random function of n inputs: per row 0, 1 or 2 (don't-care, rarer). */
const fnArb = (maxInputs: number) => fc.integer({ min: 1, max: maxInputs }).chain((n) =>
  fc.array(fc.constantFrom(0, 0, 0, 1, 1, 1, 2), { minLength: 1 << n, maxLength: 1 << n }).map((vals) => ({ n, fn: Uint8Array.from(vals) })));
const namesOf = (n: number) => Array.from({ length: n }, (_, i) => String.fromCharCode(65 + i));
const rowsWith = (fn: Uint8Array, v: number) => [...fn.keys()].filter((m) => fn[m] === v);

/** Independent brute force: every cube inside the on ∪ dc rows, its primes, then covers by increasing size. */
function bruteMinimumCost(n: number, fn: Uint8Array): [number, number] {
  const size = 1 << n;
  const onMask = rowsWith(fn, 1).reduce((m, r) => m | (1 << r), 0);
  if (!onMask) return [0, 0];
  const implicants: { rows: number; lits: number }[] = [];
  // a cube is a ternary word: per input 0, 1 or absent
  for (let code = 0; code < 3 ** n; code++) {
    let rows = 0;
    let lits = 0;
    const digits = Array.from({ length: n }, (_, i) => Math.floor(code / 3 ** i) % 3);
    digits.forEach((d) => { if (d < 2) lits++; });
    for (let m = 0; m < size; m++) {
      if (digits.every((d, i) => d === 2 || ((m >> (n - 1 - i)) & 1) === d)) rows |= 1 << m;
    }
    if ([...Array(size).keys()].every((m) => !(rows & (1 << m)) || fn[m] !== 0)) implicants.push({ rows, lits });
  }
  let best: [number, number] | null = null;
  const pick = (start: number, k: number, covered: number, lits: number) => {
    if (k === 0) {
      if ((covered & onMask) === onMask && (!best || lits < best[1])) best = [0, lits];
      return;
    }
    for (let i = start; i < implicants.length; i++) pick(i + 1, k - 1, covered | implicants[i].rows, lits + implicants[i].lits);
  };
  // only cubes that are not inside a bigger implicant (primes) can be in a cheapest cover
  const primes = implicants.filter((c) => !implicants.some((d) => d !== c && (c.rows & d.rows) === c.rows && d.lits < c.lits));
  implicants.length = 0;
  implicants.push(...primes);
  for (let k = 1; k <= primes.length; k++) {
    best = null;
    pick(0, k, 0, 0);
    if (best) return [k, (best as [number, number])[1]];
  }
  throw new Error('no cover');
}

describe('minimalForms on random functions', () => {
  // Independent references: logic-solver (SAT, npm) and exhaustive evaluation of the parsed expression
  // (CHECKS.md "Independent references on npm"); minimality against a brute-force search (common practice, no source).
  it('gives SOP and POS equal to the truth table for up to 8 inputs', () => {
    fc.assert(fc.property(fnArb(8), ({ n, fn }) => {
      const names = namesOf(n);
      const { forms } = minimalForms(names, fn);
      const ones = rowsWith(fn, 1);
      const dcs = rowsWith(fn, 2);
      for (const expr of [...forms.sopAll, ...forms.posAll]) {
        expect(satEquivalentOnCare(expr, names, ones, dcs)).toBe(true);
        const col = expressionColumn(parseExpression(expr), names);
        col.forEach((v, m) => { if (fn[m] !== 2) expect(v ? 1 : 0).toBe(fn[m]); });
      }
    }), { numRuns: 30 });
  }, 180_000);

  it('finds no smaller cover than an exhaustive search for up to 4 inputs', () => {
    fc.assert(fc.property(fnArb(4), ({ n, fn }) => {
      const names = namesOf(n);
      const { forms } = minimalForms(names, fn);
      expect(forms.exact).toBe(true);
      const [terms, lits] = bruteMinimumCost(n, fn);
      for (const s of forms.sopAll) expect(counts(s, 'sop')).toEqual({ terms, literals: lits });
      const flipped = fn.map((v) => (v === 2 ? 2 : 1 - v));
      const [pt, pl] = bruteMinimumCost(n, flipped);
      for (const p of forms.posAll) expect(counts(p, 'pos')).toEqual({ terms: pt, literals: pl });
    }), { numRuns: 150 });
  });

  it('lists the same minimal covers by the depth-first search as by multiplying Petrick\'s product out', () => {
    fc.assert(fc.property(fnArb(5), ({ n, fn }) => {
      const names = namesOf(n);
      const expanded = minimalForms(names, fn).forms;
      // a budget of one product sends every cyclic core to the depth-first search
      const searched = minimalForms(names, fn, { budget: 1 }).forms;
      expect(searched.exact).toBe(expanded.exact);
      if (expanded.note?.includes('more minimal')) return; // over 32 covers: each lists a different 32
      expect(new Set(searched.sopAll)).toEqual(new Set(expanded.sopAll));
      expect(new Set(searched.posAll)).toEqual(new Set(expanded.posAll));
      if (n <= 4) expect(counts(searched.sop, 'sop')).toEqual((([terms, literals]) => ({ terms, literals }))(bruteMinimumCost(n, fn)));
    }), { numRuns: 150 });
  });
});
