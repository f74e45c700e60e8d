/**
 * The inner loops of the bit-parallel evaluator: one compiled program (`bit-program.ts`) run over one
 * block of n words per slot, 32 truth-table rows per word. Each op is one call of a small function whose
 * body is a single tight loop over the block, so per-op dispatch is paid once per block, and each loop
 * is small enough to be optimised early in a fresh process.
 *
 * Layouts (offsets in words; m… are XOR masks, 0 or −1, for an inverted literal):
 * - two-valued: and2 `[c, o, a, ma, b, mb]`, and3 `[c, o, a, ma, b, mb, c, mc]`, andk `[c, o, k, (a, m)×k]`,
 *   xor2 `[c, o, a, b]`, xor3 `[c, o, a, b, c]`, xork `[c, o, k, a×k]`, mux2 `[c, o, s, d0, m0, d1, m1]`,
 *   mux4 `[c, o, s0, s1, (d, m)×4]` (the selects are plain words: an inverted select was compiled as
 *   swapped data);
 * - four-valued (T plane at o, F plane at o + W): and4 `[c, o, k, (t, f)×k]` (T = ∧T, F = ∨F),
 *   xor4 `[c, o, k, (t, f)×k]`, mux2f `[c, o, (t, f) of sel, (t, f)×2]`, mux4f `[c, o, (t, f)×2 sels, (t, f)×4]`.
 * Every loop reads all its inputs at word j before writing word j, so an op may write into a slot one of
 * its own inputs last used.
 */

export const OP = {
  and2: 0, and3: 1, andk: 2, xor2: 3, xor3: 4, xork: 5, mux2: 6, mux4: 7, and4: 8, xor4: 9, mux2f: 10, mux4f: 11,
} as const;

/** The two-valued program over one block of n words (a multiple of 4, at most the slot's W). */
export function run2(ops: Int32Array, V: Int32Array, n: number): void {
  const len = ops.length;
  let pc = 0;
  while (pc < len) {
    const o = ops[pc + 1];
    switch (ops[pc]) {
      case 0: and2(V, o, ops[pc + 2], ops[pc + 3], ops[pc + 4], ops[pc + 5], n); pc += 6; break;
      case 1: and3(V, o, ops[pc + 2], ops[pc + 3], ops[pc + 4], ops[pc + 5], ops[pc + 6], ops[pc + 7], n); pc += 8; break;
      case 2: andk(V, ops, pc + 3, o, ops[pc + 2], n); pc += 3 + 2 * ops[pc + 2]; break;
      case 3: xor2(V, o, ops[pc + 2], ops[pc + 3], n); pc += 4; break;
      case 4: xor3(V, o, ops[pc + 2], ops[pc + 3], ops[pc + 4], n); pc += 5; break;
      case 5: xork(V, ops, pc + 3, o, ops[pc + 2], n); pc += 3 + ops[pc + 2]; break;
      case 6: mux2(V, o, ops[pc + 2], ops[pc + 3], ops[pc + 4], ops[pc + 5], ops[pc + 6], n); pc += 7; break;
      case 7: mux4(V, ops, pc + 2, o, n); pc += 12; break;
      default: throw new Error(`unknown op ${ops[pc]}`);
    }
  }
}

/** The four-valued program over one block of n words (a multiple of 4); W is the offset of a slot's F plane. */
export function run4(ops: Int32Array, V: Int32Array, n: number, W: number): void {
  const len = ops.length;
  let pc = 0;
  while (pc < len) {
    const o = ops[pc + 1];
    switch (ops[pc]) {
      case 8: {
        const k = ops[pc + 2];
        if (k === 2) and4x2(V, o, o + W, ops[pc + 3], ops[pc + 4], ops[pc + 5], ops[pc + 6], n);
        else and4(V, ops, pc + 3, o, o + W, k, n);
        pc += 3 + 2 * k;
        break;
      }
      case 9: xor4(V, ops, pc + 3, o, o + W, ops[pc + 2], n); pc += 3 + 2 * ops[pc + 2]; break;
      case 10: mux2f(V, ops, pc + 2, o, o + W, n); pc += 8; break;
      case 11: mux4f(V, ops, pc + 2, o, o + W, n); pc += 14; break;
      default: throw new Error(`unknown op ${ops[pc]}`);
    }
  }
}

// The common ops' loops are unrolled four times (n is a multiple of 4): a quarter of the loop overhead.

function and2(V: Int32Array, o: number, a: number, ma: number, b: number, mb: number, n: number): void {
  for (let j = 0; j < n; j += 4) {
    V[o + j] = (V[a + j] ^ ma) & (V[b + j] ^ mb);
    V[o + j + 1] = (V[a + j + 1] ^ ma) & (V[b + j + 1] ^ mb);
    V[o + j + 2] = (V[a + j + 2] ^ ma) & (V[b + j + 2] ^ mb);
    V[o + j + 3] = (V[a + j + 3] ^ ma) & (V[b + j + 3] ^ mb);
  }
}

function and3(V: Int32Array, o: number, a: number, ma: number, b: number, mb: number, c: number, mc: number, n: number): void {
  for (let j = 0; j < n; j += 4) {
    V[o + j] = (V[a + j] ^ ma) & (V[b + j] ^ mb) & (V[c + j] ^ mc);
    V[o + j + 1] = (V[a + j + 1] ^ ma) & (V[b + j + 1] ^ mb) & (V[c + j + 1] ^ mc);
    V[o + j + 2] = (V[a + j + 2] ^ ma) & (V[b + j + 2] ^ mb) & (V[c + j + 2] ^ mc);
    V[o + j + 3] = (V[a + j + 3] ^ ma) & (V[b + j + 3] ^ mb) & (V[c + j + 3] ^ mc);
  }
}

function andk(V: Int32Array, ops: Int32Array, p: number, o: number, k: number, n: number): void {
  for (let j = 0; j < n; j++) {
    let v = -1;
    for (let i = 0; i < k; i++) v &= V[ops[p + 2 * i] + j] ^ ops[p + 2 * i + 1];
    V[o + j] = v;
  }
}

function xor2(V: Int32Array, o: number, a: number, b: number, n: number): void {
  for (let j = 0; j < n; j += 4) {
    V[o + j] = V[a + j] ^ V[b + j];
    V[o + j + 1] = V[a + j + 1] ^ V[b + j + 1];
    V[o + j + 2] = V[a + j + 2] ^ V[b + j + 2];
    V[o + j + 3] = V[a + j + 3] ^ V[b + j + 3];
  }
}

function xor3(V: Int32Array, o: number, a: number, b: number, c: number, n: number): void {
  for (let j = 0; j < n; j += 4) {
    V[o + j] = V[a + j] ^ V[b + j] ^ V[c + j];
    V[o + j + 1] = V[a + j + 1] ^ V[b + j + 1] ^ V[c + j + 1];
    V[o + j + 2] = V[a + j + 2] ^ V[b + j + 2] ^ V[c + j + 2];
    V[o + j + 3] = V[a + j + 3] ^ V[b + j + 3] ^ V[c + j + 3];
  }
}

function xork(V: Int32Array, ops: Int32Array, p: number, o: number, k: number, n: number): void {
  for (let j = 0; j < n; j++) {
    let v = 0;
    for (let i = 0; i < k; i++) v ^= V[ops[p + i] + j];
    V[o + j] = v;
  }
}

/** sel ? d1 : d0, as d0 ^ ((d0 ^ d1) & sel). */
function mux2(V: Int32Array, o: number, s: number, d0: number, m0: number, d1: number, m1: number, n: number): void {
  for (let j = 0; j < n; j++) {
    const x = V[d0 + j] ^ m0;
    V[o + j] = x ^ ((x ^ V[d1 + j] ^ m1) & V[s + j]);
  }
}

function mux4(V: Int32Array, ops: Int32Array, p: number, o: number, n: number): void {
  const s0 = ops[p], s1 = ops[p + 1];
  const d0 = ops[p + 2], m0 = ops[p + 3], d1 = ops[p + 4], m1 = ops[p + 5];
  const d2 = ops[p + 6], m2 = ops[p + 7], d3 = ops[p + 8], m3 = ops[p + 9];
  for (let j = 0; j < n; j++) {
    const a = V[s0 + j];
    const x = V[d0 + j] ^ m0;
    const y = V[d2 + j] ^ m2;
    const lo = x ^ ((x ^ V[d1 + j] ^ m1) & a);
    const hi = y ^ ((y ^ V[d3 + j] ^ m3) & a);
    V[o + j] = lo ^ ((lo ^ hi) & V[s1 + j]);
  }
}

function and4x2(V: Int32Array, ot: number, of: number, at: number, af: number, bt: number, bf: number, n: number): void {
  for (let j = 0; j < n; j += 2) {
    const t0 = V[at + j] & V[bt + j];
    const f0 = V[af + j] | V[bf + j];
    const t1 = V[at + j + 1] & V[bt + j + 1];
    const f1 = V[af + j + 1] | V[bf + j + 1];
    V[ot + j] = t0;
    V[of + j] = f0;
    V[ot + j + 1] = t1;
    V[of + j + 1] = f1;
  }
}

function and4(V: Int32Array, ops: Int32Array, p: number, ot: number, of: number, k: number, n: number): void {
  for (let j = 0; j < n; j++) {
    let t = -1;
    let f = 0;
    for (let i = 0; i < k; i++) { t &= V[ops[p + 2 * i] + j]; f |= V[ops[p + 2 * i + 1] + j]; }
    V[ot + j] = t;
    V[of + j] = f;
  }
}

/** Known where every input is known; then the parity of the T planes. */
function xor4(V: Int32Array, ops: Int32Array, p: number, ot: number, of: number, k: number, n: number): void {
  for (let j = 0; j < n; j++) {
    let known = -1;
    let v = 0;
    for (let i = 0; i < k; i++) {
      const t = V[ops[p + 2 * i] + j];
      known &= t | V[ops[p + 2 * i + 1] + j];
      v ^= t;
    }
    V[ot + j] = known & v;
    V[of + j] = known & ~v;
  }
}

/** A data input counts unless the select surely rules it out; the result is what every counted input agrees on. */
function mux2f(V: Int32Array, ops: Int32Array, p: number, ot: number, of: number, n: number): void {
  const st = ops[p], sf = ops[p + 1];
  const d0t = ops[p + 2], d0f = ops[p + 3], d1t = ops[p + 4], d1f = ops[p + 5];
  for (let j = 0; j < n; j++) {
    const s1 = V[st + j]; // rules out d0
    const s0 = V[sf + j]; // rules out d1
    const t = (s1 | V[d0t + j]) & (s0 | V[d1t + j]);
    const f = (s1 | V[d0f + j]) & (s0 | V[d1f + j]);
    V[ot + j] = t;
    V[of + j] = f;
  }
}

function mux4f(V: Int32Array, ops: Int32Array, p: number, ot: number, of: number, n: number): void {
  const at = ops[p], af = ops[p + 1], bt = ops[p + 2], bf = ops[p + 3];
  for (let j = 0; j < n; j++) {
    const a1 = V[at + j], a0 = V[af + j], b1 = V[bt + j], b0 = V[bf + j];
    let t = -1;
    let f = -1;
    for (let d = 0; d < 4; d++) {
      // data input d is ruled out where a select surely differs from its bit of d
      const out = (d & 1 ? a0 : a1) | (d & 2 ? b0 : b1);
      t &= out | V[ops[p + 4 + 2 * d] + j];
      f &= out | V[ops[p + 5 + 2 * d] + j];
    }
    V[ot + j] = t;
    V[of + j] = f;
  }
}
