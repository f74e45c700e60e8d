import { describe, expect, it } from 'vitest';
import { expressionColumn, minimalForms, parseExpression } from '../../shared/analysis';
import { counts, satEquivalentOnCare } from './helpers';

const ABCD = ['A', 'B', 'C', 'D'];
function rows(n: number, ones: number[], dcs: number[] = []): Uint8Array {
  const fn = new Uint8Array(1 << n);
  ones.forEach((m) => { fn[m] = 1; });
  dcs.forEach((m) => { fn[m] = 2; });
  return fn;
}

describe('minimalForms', () => {
  // Source: Wikipedia article "Quine–McCluskey algorithm", worked example:
  // f(A,B,C,D) = Σm(4,8,10,11,12,15) + d(9,14); two minimal sums of 7 literals each,
  // BC'D' + AB' + AC and BC'D' + AD' + AC.
  it('finds a 3-term, 7-literal cover of the worked example with don\'t-cares', () => {
    const ones = [4, 8, 10, 11, 12, 15];
    const { forms } = minimalForms(ABCD, rows(4, ones, [9, 14]));
    expect(forms.exact).toBe(true);
    expect(counts(forms.sop, 'sop')).toEqual({ terms: 3, literals: 7 });
    expect(satEquivalentOnCare(forms.sop, ABCD, ones, [9, 14])).toBe(true);
    expect(['A & ~B | A & C | B & ~C & ~D', 'A & C | A & ~D | B & ~C & ~D']).toContain(forms.sop);
    // both published minimal sums are listed
    expect(new Set(forms.sopAll)).toEqual(new Set(['A & ~B | A & C | B & ~C & ~D', 'A & C | A & ~D | B & ~C & ~D']));
  });

  // Same source: treating 9 and 14 as minterms gives the unique AB' + AC + BC'D'.
  it('gives the unique cover when the don\'t-cares are minterms', () => {
    const { forms } = minimalForms(ABCD, rows(4, [4, 8, 9, 10, 11, 12, 14, 15]));
    expect(forms.sopAll).toEqual(['A & ~B | A & C | B & ~C & ~D']);
  });

  // Cyclic example with two minimal covers (common practice, textbook classic): Σm(0,1,2,5,6,7) of A,B,C
  // → A'B' + BC' + AC or A'C' + B'C + AB.
  it('lists both covers of the cyclic example', () => {
    const { forms } = minimalForms(['A', 'B', 'C'], rows(3, [0, 1, 2, 5, 6, 7]));
    expect(new Set(forms.sopAll)).toEqual(new Set(['A & C | ~A & ~B | B & ~C', 'A & B | ~A & ~C | ~B & C']));
    forms.sopAll.forEach((s) => expect(counts(s, 'sop')).toEqual({ terms: 3, literals: 6 }));
  });

  // CONTRACTS §2 half adder (S = XOR, C = AND); De Morgan/XOR forms are common practice, no source.
  it('writes the contract forms of XOR and AND', () => {
    expect(minimalForms(['A', 'B'], rows(2, [1, 2])).forms).toMatchObject({ sop: 'A & ~B | ~A & B', pos: '(A | B) & (~A | ~B)', function: 'XOR' });
    expect(minimalForms(['A', 'B'], rows(2, [3])).forms).toMatchObject({ sop: 'A & B', pos: 'A & B', function: 'AND' });
  });

  it('writes constants and single literals', () => {
    expect(minimalForms(['A', 'B'], rows(2, [])).forms).toMatchObject({ sop: '0', pos: '0', function: 'FALSE' });
    expect(minimalForms(['A', 'B'], rows(2, [0, 1, 2, 3])).forms).toMatchObject({ sop: '1', pos: '1', function: 'TRUE' });
    expect(minimalForms(['A', 'B'], rows(2, [0, 1])).forms).toMatchObject({ sop: '~A', pos: '~A', function: 'NOT_A' });
    expect(minimalForms(['A', 'B'], rows(2, [0, 1, 3])).forms).toMatchObject({ sop: '~A | B', pos: '~A | B', function: 'NOT_A_OR_B' });
  });

  // Full adder carry: Cout = AB + A·Cin + B·Cin (any digital-logic textbook).
  it('minimises the full-adder carry to the textbook majority form', () => {
    const { forms } = minimalForms(['A', 'B', 'Cin'], rows(3, [3, 5, 6, 7]));
    expect(forms.sop).toBe('A & B | A & Cin | B & Cin');
    expect(forms.pos).toBe('(A | B) & (A | Cin) & (B | Cin)');
  });

  it('minimises a 12-input function exactly', () => {
    // f = majority of the first three inputs, OR the last input — 4 terms; check by evaluating back.
    const names = Array.from({ length: 12 }, (_, i) => `I${i}`);
    const fn = new Uint8Array(1 << 12);
    for (let m = 0; m < fn.length; m++) {
      const b = (i: number) => (m >> (11 - i)) & 1;
      fn[m] = (b(0) + b(1) + b(2) >= 2) || b(11) ? 1 : 0;
    }
    const { forms } = minimalForms(names, fn);
    expect(forms.exact).toBe(true);
    expect(forms.sop).toBe('I0 & I1 | I0 & I2 | I1 & I2 | I11');
    const col = expressionColumn(parseExpression(forms.pos), names);
    col.forEach((v, m) => expect(v ? 1 : 0).toBe(fn[m]));
  });

  it('says so when the exact search runs out of budget, and still gives a correct cover', () => {
    // the cyclic example again (common practice, textbook classic), with no room to search
    const fn = rows(3, [0, 1, 2, 5, 6, 7]);
    const { forms } = minimalForms(['A', 'B', 'C'], fn, { budget: 1, work: 1 });
    expect(forms.exact).toBe(false);
    expect(forms.note).toMatch(/not proven minimal/);
    expect(satEquivalentOnCare(forms.sop, ['A', 'B', 'C'], [0, 1, 2, 5, 6, 7], [])).toBe(true);
  });

  it('labels a heuristic cover of more than 12 inputs as not proven minimal and keeps it correct', () => {
    const names = Array.from({ length: 14 }, (_, i) => `I${i}`);
    const fn = new Uint8Array(1 << 14);
    for (let m = 0; m < fn.length; m++) fn[m] = (m % 7 === 0 || (m & 0x3000) === 0x3000) ? 1 : 0;
    const { forms } = minimalForms(names, fn);
    expect(forms.exact).toBe(false);
    expect(forms.note).toMatch(/not proven minimal/);
    const col = expressionColumn(parseExpression(forms.sop), names);
    col.forEach((v, m) => expect(v ? 1 : 0).toBe(fn[m]));
  });
});
