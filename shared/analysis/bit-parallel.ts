/**
 * Bit-parallel evaluation of a compiled program (`bit-program.ts`): 32 truth-table rows per 32-bit word,
 * rows in blocks of W words, every op a tight loop over the block (`bit-kernel.ts`).
 * - Two-valued (no X or Z can arise): one plane per value, plain AND / XOR / multiplexer.
 * - Four-valued: two planes per value — T (surely 1) and F (surely 0); X is neither. Z exists only on
 *   undriven nets, whose readers see the family's floating value; a net with two drivers reads X. The
 *   rules are those of the event simulator (a controlling value wins over X; any X or Z otherwise gives X).
 * Each block writes every slot it reads (constants, inputs, then the ops in order), so the value array
 * holds nothing between blocks and one scratch array serves every evaluator of the thread.
 */
import { run2, run4 } from './bit-kernel';
import type { BitProgram } from './bit-program';

const LITTLE_ENDIAN = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;
/** Word patterns of the five lowest bits of the row number: row r of a word is bit r. */
const LOW_PATTERNS = Int32Array.of(0xaaaaaaaa | 0, 0xcccccccc | 0, 0xf0f0f0f0 | 0, 0xff00ff00 | 0, 0xffff0000 | 0);
/** Bits 0–3 of an index spread to the low bit of bytes 0–3 (four row codes 0/1 in one little-endian word). */
const SPREAD = Int32Array.from({ length: 16 }, (_, x) => (x & 1) | ((x & 2) << 7) | ((x & 4) << 14) | ((x & 8) << 21));

/** Scratch value array shared by the evaluators of this thread (a block never leaves state behind). */
let scratch = new Int32Array(0);
/** The scratch array is kept between tables up to this many words; a bigger one is used once. */
const KEEP_WORDS = 1 << 20;

/** Runs a compiled program and writes the row codes of its outputs. */
export class BitParallelEvaluator {
  constructor(private readonly prog: BitProgram) {}

  /**
   * Evaluates words [w0, w0 + count) — rows 32·w0 … — and writes output i's codes (0, 1, 2 = X, 3 = Z)
   * into `values[i]` (a whole table, row-indexed), at most `rowCount` rows.
   */
  evaluate(w0: number, count: number, values: Uint8Array[], rowCount: number): void {
    const { W, ops, twoValued, size } = this.prog;
    let V = scratch;
    if (V.length < size) {
      V = new Int32Array(size);
      if (size <= KEEP_WORDS) scratch = V;
    }
    const words = LITTLE_ENDIAN && rowCount % 32 === 0 ? values.map((out) => (out.byteOffset % 4 === 0 ? new Int32Array(out.buffer, out.byteOffset, out.length >> 2) : undefined)) : [];
    for (let b = 0; b < count; b += W) {
      const n = Math.min(W, count - b);
      // the kernel runs whole groups of 4 words (W is at least 4); the words past n are not stored
      const n4 = (n + 3) & ~3;
      this.load(V, w0 + b, n4);
      if (twoValued) run2(ops, V, n4);
      else run4(ops, V, n4, W);
      this.store(V, w0 + b, n, values, words, rowCount);
    }
  }

  /** Constants and the enumerated inputs' words for words w0 … w0 + n − 1. */
  private load(V: Int32Array, w0: number, n: number): void {
    const { fixed, inputs, W, twoValued } = this.prog;
    for (let i = 0; i < fixed.length; i += 2) V.fill(fixed[i + 1], fixed[i], fixed[i] + n);
    for (let i = 0; i < inputs.length; i += 2) {
      const at = inputs[i];
      const shift = inputs[i + 1];
      if (shift < 5) V.fill(LOW_PATTERNS[shift], at, at + n);
      else inputWords(V, at, w0, n, shift - 5);
      if (!twoValued) for (let j = 0; j < n; j++) V[at + W + j] = ~V[at + j];
    }
  }

  private store(V: Int32Array, w0: number, n: number, values: Uint8Array[], words: (Int32Array | undefined)[], rowCount: number): void {
    const outs = this.prog.outputs;
    const four = !this.prog.twoValued;
    for (let i = 0; i < values.length; i++) {
      const at = outs[2 * i];
      const aux = outs[2 * i + 1];
      const out = values[i];
      if (at < 0) { out.fill(3, w0 * 32, Math.min(rowCount, (w0 + n) * 32)); continue; }
      const q = words[i];
      if (q) {
        if (four) storeWords4(V, at, aux, q, w0 * 8, n);
        else storeWords2(V, at, aux, q, w0 * 8, n);
      } else storeRows(V, at, aux, four, out, w0, n, rowCount);
    }
  }
}

/** Words of the input whose bit of the word index is `bit`: all ones or all zeros. */
function inputWords(V: Int32Array, at: number, w0: number, n: number, bit: number): void {
  for (let j = 0; j < n; j++) V[at + j] = -(((w0 + j) >>> bit) & 1);
}

/** Codes of n two-valued words (mask m: the literal is inverted), four rows (bytes) per written word. */
function storeWords2(V: Int32Array, at: number, m: number, q: Int32Array, base: number, n: number): void {
  for (let j = 0; j < n; j++) {
    const t = V[at + j] ^ m;
    const b = base + 8 * j;
    for (let k = 0; k < 8; k++) q[b + k] = SPREAD[(t >>> (4 * k)) & 15];
  }
}

/** Codes of n four-valued words: 1 where T, 2 (X) where neither T nor F, else 0. */
function storeWords4(V: Int32Array, at: number, af: number, q: Int32Array, base: number, n: number): void {
  for (let j = 0; j < n; j++) {
    const t = V[at + j];
    const x = ~(t | V[af + j]);
    const b = base + 8 * j;
    for (let k = 0; k < 8; k++) q[b + k] = SPREAD[(t >>> (4 * k)) & 15] | (SPREAD[(x >>> (4 * k)) & 15] << 1);
  }
}

/** Codes row by row (tables of fewer than 32 rows, or a big-endian machine). */
function storeRows(V: Int32Array, at: number, aux: number, four: boolean, out: Uint8Array, w0: number, n: number, rowCount: number): void {
  const end = Math.min(rowCount, (w0 + n) * 32);
  for (let r = w0 * 32; r < end; r++) {
    const j = (r >> 5) - w0;
    const bit = r & 31;
    if (!four) out[r] = ((V[at + j] ^ aux) >>> bit) & 1;
    else out[r] = (V[at + j] >>> bit) & 1 ? 1 : (V[aux + j] >>> bit) & 1 ? 0 : 2;
  }
}
