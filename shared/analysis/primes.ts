import type { Cube } from './cube';

/**
 * Prime implicants by the Quine–McCluskey merging step: cubes that differ in exactly one present
 * input merge into one with that input dropped; a cube that never merges is prime. Cubes are kept in
 * hash sets per care mask instead of the classic grouping by number of ones — the same merges, found
 * by looking up the partner directly.
 * @param n number of inputs (≤ 20)
 * @param rows rows where the function is 1 or don't-care (the "on ∪ dc" set)
 */
export function primeImplicants(n: number, rows: Iterable<number>): Cube[] {
  const full = n >= 32 ? 0xffffffff : (1 << n) - 1;
  // key = care * 2^n + bits, exact in a double for n ≤ 20
  const scale = 2 ** n;
  let level = new Map<number, Cube>();
  for (const m of rows) level.set(full * scale + m, { care: full, bits: m });
  const primes: Cube[] = [];
  while (level.size) {
    const next = new Map<number, Cube>();
    const merged = new Set<number>();
    for (const [key, c] of level) {
      for (let b = 0; b < n; b++) {
        const bit = 1 << b;
        if (!(c.care & bit) || c.bits & bit) continue;
        const partnerKey = key + bit;
        if (!level.has(partnerKey)) continue;
        merged.add(key);
        merged.add(partnerKey);
        const care = c.care & ~bit;
        const nk = care * scale + c.bits;
        if (!next.has(nk)) next.set(nk, { care, bits: c.bits });
      }
    }
    for (const [key, c] of level) if (!merged.has(key)) primes.push(c);
    level = next;
  }
  return primes;
}
