/**
 * Cubes (product terms) over n inputs. Input i (0 = the first input, the most significant) is bit
 * n-1-i of a row index, so a row index is the binary number the inputs spell in input order.
 */
export interface Cube {
  /** 1 where the input appears as a literal */
  care: number;
  /** the value of each present input (bits outside `care` are 0) */
  bits: number;
}

/** Number of set bits of a 32-bit number. */
export function popcount(x: number): number {
  let v = x >>> 0;
  v = v - ((v >>> 1) & 0x55555555);
  v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
  return (((v + (v >>> 4)) & 0x0f0f0f0f) * 0x01010101) >>> 24;
}

/** Literal count of a cube. */
export function literals(c: Cube): number {
  return popcount(c.care);
}

/** Does the cube contain row `m`? */
export function coversRow(c: Cube, m: number): boolean {
  return ((m & c.care) >>> 0) === c.bits;
}

/** Every row of a cube, ascending (2^(n - literals) of them). */
export function cubeRows(c: Cube, n: number): number[] {
  const free: number[] = [];
  for (let b = 0; b < n; b++) if (!(c.care & (1 << b))) free.push(1 << b);
  const out: number[] = [];
  const count = 1 << free.length;
  for (let k = 0; k < count; k++) {
    let m = c.bits;
    for (let j = 0; j < free.length; j++) if (k & (1 << j)) m |= free[j];
    out.push(m);
  }
  return out.sort((a, b) => a - b);
}

/**
 * Deterministic order of terms: compare inputs in input order; a plain literal sorts before a
 * complemented one, and both before an absent input (so `A & ~B | ~A & B`, `A & B | A & C | B & C`).
 */
export function compareCubes(a: Cube, b: Cube, n: number): number {
  for (let i = 0; i < n; i++) {
    const bit = 1 << (n - 1 - i);
    const ra = a.care & bit ? (a.bits & bit ? 0 : 1) : 2;
    const rb = b.care & bit ? (b.bits & bit ? 0 : 1) : 2;
    if (ra !== rb) return ra - rb;
  }
  return 0;
}

/** The literals of a cube in input order: input index and whether it is complemented. */
export function cubeLiterals(c: Cube, n: number): { input: number; negated: boolean }[] {
  const out: { input: number; negated: boolean }[] = [];
  for (let i = 0; i < n; i++) {
    const bit = 1 << (n - 1 - i);
    if (c.care & bit) out.push({ input: i, negated: !(c.bits & bit) });
  }
  return out;
}
