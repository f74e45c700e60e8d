import type { Cube } from './cube';

/** Calls `fn` for every row of the cube (the free inputs run through all their subsets). */
function everyRow(c: Cube, n: number, test: (row: number) => boolean): boolean {
  const free = (((1 << n) - 1) & ~c.care) >>> 0;
  let sub = free;
  for (;;) {
    if (!test((c.bits | sub) >>> 0)) return false;
    if (sub === 0) return true;
    sub = (sub - 1) & free;
  }
}

/**
 * A cover for tables too large for the exact method: each uncovered 1-row is grown into a prime by
 * dropping inputs one at a time while the cube stays inside the 1 and don't-care rows, then cubes whose
 * 1-rows are all covered by others are dropped. Not proven minimal.
 * @param fn per row: 0 off, 1 on, 2 don't-care
 */
export function expandCover(n: number, fn: Uint8Array): Cube[] {
  const size = 1 << n;
  const full = (size - 1) >>> 0;
  const count = new Uint16Array(size);
  const cubes: Cube[] = [];
  for (let m = 0; m < size; m++) {
    if (fn[m] !== 1 || count[m]) continue;
    let cube: Cube = { care: full, bits: m };
    for (let b = n - 1; b >= 0; b--) {
      const bit = 1 << b;
      // the half the cube would gain: its rows with this input flipped
      const mirror: Cube = { care: cube.care, bits: (cube.bits ^ bit) >>> 0 };
      if (everyRow(mirror, n, (r) => fn[r] !== 0)) cube = { care: (cube.care & ~bit) >>> 0, bits: (cube.bits & ~bit) >>> 0 };
    }
    cubes.push(cube);
    everyRow(cube, n, (r) => { if (count[r] < 65535) count[r]++; return true; });
  }
  const out: Cube[] = [];
  for (let i = cubes.length - 1; i >= 0; i--) {
    const redundant = everyRow(cubes[i], n, (r) => fn[r] !== 1 || count[r] > 1);
    if (redundant) everyRow(cubes[i], n, (r) => { count[r]--; return true; });
    else out.push(cubes[i]);
  }
  return out;
}
