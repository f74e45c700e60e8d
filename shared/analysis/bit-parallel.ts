/**
 * Bit-parallel evaluation of a compiled program (`bit-program.ts`): 32 truth-table rows per 32-bit word,
 * rows in blocks of W words, every op a tight loop over the block.
 * - Two-valued (no X or Z can arise): one plane per net, plain AND / OR / XOR / NOT.
 * - Four-valued: two planes per net — T (surely 1) and F (surely 0); X is neither. Z exists only on
 *   undriven nets, whose readers see the family's floating value; a net with two drivers reads X. The
 *   rules are those of the event simulator (a controlling value wins over X; any X or Z otherwise gives X).
 */
import { OP, type BitProgram } from './bit-program';

const LITTLE_ENDIAN = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

/** Bits 0–3 of x spread to the low bit of bytes 0–3 (the shifted copies do not overlap, so the product is their OR). */
function spread4(x: number): number {
  return Math.imul(x & 15, 0x204081) & 0x01010101;
}

/** Word w of the row-number pattern of the input with bit s. */
function inputWord(s: number, w: number): number {
  if (s < 5) return [0xaaaaaaaa, 0xcccccccc, 0xf0f0f0f0, 0xff00ff00, 0xffff0000][s] | 0;
  return (w >>> (s - 5)) & 1 ? -1 : 0;
}

/** Runs a compiled program and writes the row codes of its outputs. */
export class BitParallelEvaluator {
  private readonly T: Int32Array;
  private readonly F: Int32Array;

  constructor(private readonly prog: BitProgram) {
    const size = Math.max(1, prog.slots * prog.W);
    this.T = new Int32Array(size);
    this.F = new Int32Array(prog.twoValued ? 0 : size);
    for (const fx of prog.fixed) {
      this.T.fill(fx.t, fx.at, fx.at + prog.W);
      if (!prog.twoValued) this.F.fill(fx.f, fx.at, fx.at + prog.W);
    }
  }

  /**
   * Evaluates words [w0, w0 + count) — rows 32·w0 … — and writes output i's codes (0, 1, 2 = X, 3 = Z)
   * into `values[i]` (a whole table, row-indexed), at most `rowCount` rows.
   */
  evaluate(w0: number, count: number, values: Uint8Array[], rowCount: number): void {
    const { W } = this.prog;
    for (let b = 0; b < count; b += W) {
      const n = Math.min(W, count - b);
      this.loadInputs(w0 + b, n);
      if (this.prog.twoValued) run2(this.prog.ops, this.T, n);
      else run4(this.prog.ops, this.T, this.F, n);
      this.store(w0 + b, n, values, rowCount);
    }
  }

  private loadInputs(w0: number, n: number): void {
    const { T, F } = this;
    const four = !this.prog.twoValued;
    for (const s of this.prog.inputs) {
      for (let j = 0; j < n; j++) {
        const word = s.invert ? ~inputWord(s.shift, w0 + j) : inputWord(s.shift, w0 + j);
        T[s.at + j] = word;
        if (four) F[s.at + j] = ~word;
      }
    }
  }

  private store(w0: number, n: number, values: Uint8Array[], rowCount: number): void {
    const outs = this.prog.outputs;
    for (let i = 0; i < outs.length; i++) {
      const at = outs[i];
      const out = values[i];
      if (at < 0) { out.fill(3, w0 * 32, Math.min(rowCount, (w0 + n) * 32)); continue; }
      if (LITTLE_ENDIAN && rowCount % 32 === 0 && out.byteOffset % 4 === 0) {
        const q = new Int32Array(out.buffer, out.byteOffset + w0 * 32, n * 8);
        if (this.prog.twoValued) storeWords2(this.T, at, q, n);
        else storeWords4(this.T, this.F, at, q, n);
      } else storeRows(this.T, this.prog.twoValued ? undefined : this.F, at, out, w0, n, rowCount);
    }
  }
}

/** Codes of n two-valued words, four rows (bytes, little-endian) per written word. */
function storeWords2(T: Int32Array, at: number, q: Int32Array, n: number): void {
  for (let j = 0; j < n; j++) {
    const t = T[at + j];
    const base = j * 8;
    for (let k = 0; k < 8; k++) q[base + k] = spread4(t >>> (4 * k));
  }
}

/** Codes of n four-valued words, four rows per written word. */
function storeWords4(T: Int32Array, F: Int32Array, at: number, q: Int32Array, n: number): void {
  for (let j = 0; j < n; j++) {
    const t = T[at + j];
    const f = F[at + j];
    const base = j * 8;
    // code 1 where T, 2 (X) where neither T nor F, else 0
    const x = ~(t | f);
    for (let k = 0; k < 8; k++) q[base + k] = spread4(t >>> (4 * k)) | (spread4(x >>> (4 * k)) << 1);
  }
}

/** Codes row by row (tables of fewer than 32 rows). */
function storeRows(T: Int32Array, F: Int32Array | undefined, at: number, out: Uint8Array, w0: number, n: number, rowCount: number): void {
  const end = Math.min(rowCount, (w0 + n) * 32);
  for (let r = w0 * 32; r < end; r++) {
    const j = (r >> 5) - w0;
    const bit = r & 31;
    out[r] = (T[at + j] >>> bit) & 1 ? 1 : !F || (F[at + j] >>> bit) & 1 ? 0 : 2;
  }
}

/** The two-valued program over one block of n words. */
function run2(ops: Int32Array, V: Int32Array, n: number): void {
  for (let pc = 0; pc < ops.length;) {
    const code = ops[pc];
    const o = ops[pc + 1];
    const k = ops[pc + 2];
    const a = pc + 3;
    pc = a + k;
    const x = ops[a];
    const y = ops[a + 1];
    switch (code) {
      case OP.buffer: for (let j = 0; j < n; j++) V[o + j] = V[x + j]; break;
      case OP.not: for (let j = 0; j < n; j++) V[o + j] = ~V[x + j]; break;
      case OP.and: case OP.nand: {
        const inv = code === OP.nand ? -1 : 0;
        if (k === 2) { for (let j = 0; j < n; j++) V[o + j] = (V[x + j] & V[y + j]) ^ inv; break; }
        for (let j = 0; j < n; j++) { let v = V[x + j]; for (let i = 1; i < k; i++) v &= V[ops[a + i] + j]; V[o + j] = v ^ inv; }
        break;
      }
      case OP.or: case OP.nor: {
        const inv = code === OP.nor ? -1 : 0;
        if (k === 2) { for (let j = 0; j < n; j++) V[o + j] = (V[x + j] | V[y + j]) ^ inv; break; }
        for (let j = 0; j < n; j++) { let v = V[x + j]; for (let i = 1; i < k; i++) v |= V[ops[a + i] + j]; V[o + j] = v ^ inv; }
        break;
      }
      case OP.xor: case OP.xnor: {
        const inv = code === OP.xnor ? -1 : 0;
        if (k === 2) { for (let j = 0; j < n; j++) V[o + j] = V[x + j] ^ V[y + j] ^ inv; break; }
        for (let j = 0; j < n; j++) { let v = V[x + j]; for (let i = 1; i < k; i++) v ^= V[ops[a + i] + j]; V[o + j] = v ^ inv; }
        break;
      }
      case OP.mux2: {
        const d1 = ops[a + 2];
        for (let j = 0; j < n; j++) { const s = V[x + j]; V[o + j] = (V[y + j] & ~s) | (V[d1 + j] & s); }
        break;
      }
      case OP.mux4: {
        const d0 = ops[a + 2], d1 = ops[a + 3], d2 = ops[a + 4], d3 = ops[a + 5];
        for (let j = 0; j < n; j++) {
          const s0 = V[x + j];
          const s1 = V[y + j];
          V[o + j] = (~s1 & ((V[d0 + j] & ~s0) | (V[d1 + j] & s0))) | (s1 & ((V[d2 + j] & ~s0) | (V[d3 + j] & s0)));
        }
        break;
      }
      default: throw new Error(`unknown op ${code}`);
    }
  }
}

/** The four-valued program over one block of n words (T and F planes). */
function run4(ops: Int32Array, T: Int32Array, F: Int32Array, n: number): void {
  for (let pc = 0; pc < ops.length;) {
    const code = ops[pc];
    const o = ops[pc + 1];
    const k = ops[pc + 2];
    const a = pc + 3;
    pc = a + k;
    const x = ops[a];
    switch (code) {
      case OP.buffer: for (let j = 0; j < n; j++) { T[o + j] = T[x + j]; F[o + j] = F[x + j]; } break;
      case OP.not: for (let j = 0; j < n; j++) { const t = T[x + j]; T[o + j] = F[x + j]; F[o + j] = t; } break;
      case OP.and: case OP.nand: case OP.or: case OP.nor: {
        // AND: T = ∧T, F = ∨F; OR is the dual; the inverted kinds swap the planes
        const isAnd = code === OP.and || code === OP.nand;
        const swap = code === OP.nand || code === OP.nor;
        const A = isAnd ? T : F;
        const B = isAnd ? F : T;
        const toA = isAnd !== swap ? T : F;
        const toB = isAnd !== swap ? F : T;
        for (let j = 0; j < n; j++) {
          let p = A[x + j];
          let q = B[x + j];
          for (let i = 1; i < k; i++) { p &= A[ops[a + i] + j]; q |= B[ops[a + i] + j]; }
          toA[o + j] = p;
          toB[o + j] = q;
        }
        break;
      }
      case OP.xor: case OP.xnor: {
        const inv = code === OP.xnor ? -1 : 0;
        for (let j = 0; j < n; j++) {
          let known = -1;
          let v = inv;
          for (let i = 0; i < k; i++) { const s = ops[a + i] + j; known &= T[s] | F[s]; v ^= T[s]; }
          T[o + j] = known & v;
          F[o + j] = known & ~v;
        }
        break;
      }
      case OP.mux2: case OP.mux4: {
        // a data input counts when the select does not rule it out; all counted must agree
        const sels = code === OP.mux2 ? 1 : 2;
        for (let j = 0; j < n; j++) {
          let t = -1;
          let f = -1;
          for (let d = 0; d < 1 << sels; d++) {
            let ruledOut = 0;
            for (let b = 0; b < sels; b++) ruledOut |= d & (1 << b) ? F[ops[a + b] + j] : T[ops[a + b] + j];
            t &= ruledOut | T[ops[a + sels + d] + j];
            f &= ruledOut | F[ops[a + sels + d] + j];
          }
          T[o + j] = t;
          F[o + j] = f;
        }
        break;
      }
      default: throw new Error(`unknown op ${code}`);
    }
  }
}
