/**
 * The compiled program (`bit-program.ts`) as a WebAssembly module emitted per table: one loop over the
 * rows, 128 rows (one 128-bit SIMD vector, four 32-bit words) per turn, with the whole program written
 * out straight-line in the loop's body — every value a v128 in linear memory at its slot. The module
 * also turns each output's bits into row codes (one byte per row) in memory, so the caller only copies
 * bytes. Why: the JS kernel first runs in the interpreter, and in a fresh worker or command-line process
 * that warm-up costs more than the table; a WebAssembly module is compiled by the baseline compiler in
 * well under a millisecond and runs at machine speed from its first call (decision 007).
 *
 * The same layouts as the JS kernel (`bit-kernel.ts`), read from the op list: an offset o in words is
 * value slot × planes + plane in units of W, so its byte address is o / W × 16. Opcodes are those of the
 * WebAssembly Core Specification 2.0 (W3C), §5.4 (instructions, SIMD prefix 0xfd) — section number from
 * memory; the bytes are checked by every table the tests compile and compare with the JS kernel.
 */
import { OP } from './bit-kernel';
import type { BitProgram } from './bit-program';
/** Turns of 128 rows per call of `run` (8,192 rows: one table chunk). */
const TURNS = 64;
const ROW_BYTES = TURNS * 128;
/** Addresses are written as 3-byte LEB128 (padding is valid), so the memory stays below 2 MiB. */
const MAX_BYTES = 1 << 21;

// locals: 0 first word, 1 turns (params); 2 turn, 3 output byte offset (i32); 4 … v128
const L_TURN = 2, L_OUT = 3, L_WORDS = 4, L_A = 5, L_B = 6, L_T = 7, L_F = 8;
const L_ONE8 = 9, L_BITS = 10, L_LANES = 11, L_ONE32 = 12, L_SWIZZLE = 13;
const V128_LOCALS = L_SWIZZLE + 8 - L_WORDS;

// plain opcodes
const I32_CONST = 0x41, LOCAL_GET = 0x20, LOCAL_SET = 0x21, LOCAL_TEE = 0x22;
// SIMD opcodes (after the 0xfd prefix)
const LOAD = 0x00, STORE = 0x0b, CONST = 0x0c, SWIZZLE = 0x0e, I32X4_SPLAT = 0x11;
const NOT = 0x4d, AND = 0x4e, ANDNOT = 0x4f, OR = 0x50, XOR = 0x51, BITSELECT = 0x52;
const I8X16_SHL = 0x6b, I8X16_MIN_U = 0x77, I32X4_NEG = 0xa1, I32X4_SHR_U = 0xad, I32X4_ADD = 0xae;

/** Word patterns of the five lowest bits of the row number (row r of a word is bit r). */
const LOW_PATTERNS = [0xaaaaaaaa | 0, 0xcccccccc | 0, 0xf0f0f0f0 | 0, 0xff00ff00 | 0, 0xffff0000 | 0];

// The module is written into one buffer sized from the op list, by a few small functions on module
// state: in a fresh process this runs in the interpreter, where every call and bounds check counts.
let buf = new Uint8Array(0);
let p = 0;
/** log2 of W: an op-list offset o (words) is at byte address (o >> shift) << 4 */
let shift = 0;

function b2(a: number, b: number): void {
  buf[p++] = a;
  buf[p++] = b;
}

/** A SIMD instruction (opcodes from 0x80 take two LEB128 bytes). */
function simd(op: number): void {
  buf[p++] = 0xfd;
  if (op < 0x80) buf[p++] = op;
  else { buf[p++] = op | 0x80; buf[p++] = op >> 7; }
}

/** A memory offset as a 3-byte LEB128. */
function addr3(a: number): void {
  buf[p++] = (a & 0x7f) | 0x80;
  buf[p++] = ((a >> 7) & 0x7f) | 0x80;
  buf[p++] = a >> 14;
}

/** v128.load of an op-list offset (base 0, the address as the memarg offset). */
function ld(o: number): void {
  buf[p++] = I32_CONST; buf[p++] = 0; buf[p++] = 0xfd; buf[p++] = LOAD; buf[p++] = 4;
  addr3((o >> shift) << 4);
}

/** v128.load of a literal: inverted where its mask (0 or −1) says so. */
function ldm(o: number, mask: number): void {
  ld(o);
  if (mask !== 0) { buf[p++] = 0xfd; buf[p++] = NOT; }
}

/** v128.store at a byte address of the vector on the stack (the base, i32 0, was pushed before it). */
function stAt(a: number): void {
  buf[p++] = 0xfd; buf[p++] = STORE; buf[p++] = 4;
  addr3(a);
}

/** A v128 constant with four equal 32-bit lanes, stored at a byte address. */
function fillAt(a: number, x: number): void {
  b2(I32_CONST, 0);
  const4(x, x, x, x);
  stAt(a);
}

function const4(a: number, b: number, c: number, d: number): void {
  buf[p++] = 0xfd; buf[p++] = CONST;
  lane(a); lane(b); lane(c); lane(d);
}

function lane(x: number): void {
  buf[p++] = x & 255; buf[p++] = (x >>> 8) & 255; buf[p++] = (x >>> 16) & 255; buf[p++] = x >>> 24;
}

/** The locals L_T and L_F stored at a four-valued value's planes (both computed before either is written). */
function storeTF(o: number): void {
  const a = (o >> shift) << 4;
  b2(I32_CONST, 0); b2(LOCAL_GET, L_T); stAt(a);
  b2(I32_CONST, 0); b2(LOCAL_GET, L_F); stAt(a + 16);
}

/** A 5-byte LEB128 (for sizes written after their content). */
function leb5(at: number, x: number): void {
  for (let i = 0; i < 4; i++) buf[at + i] = ((x >>> (7 * i)) & 0x7f) | 0x80;
  buf[at + 4] = x >>> 28;
}

/** The module: one function `run(firstWord, turns)` and its memory, both exported; undefined if too big. */
function emitModule(prog: BitProgram): { bytes: Uint8Array<ArrayBuffer>; outBase: number; memBytes: number } | undefined {
  const { W, ops, fixed, inputs, outputs, size } = prog;
  const nOut = outputs.length >> 1;
  const outBase = (size / W) * 16;
  const memBytes = outBase + nOut * ROW_BYTES;
  if (memBytes > MAX_BYTES) return undefined;
  shift = 31 - Math.clz32(W);
  buf = new Uint8Array(1024 + 20 * ops.length + 40 * (inputs.length + fixed.length) + 420 * nOut);
  p = 0;
  // header; type (i32, i32) → (); imports the thread's memory as env.mem (at least `pages`); one
  // function; exports "run"
  const pages = Math.max(1, Math.ceil(memBytes / 65536));
  const head = [0, 0x61, 0x73, 0x6d, 1, 0, 0, 0, 1, 6, 1, 0x60, 2, 0x7f, 0x7f, 0,
    2, 14, 1, 3, 0x65, 0x6e, 0x76, 3, 0x6d, 0x65, 0x6d, 2, 0];
  for (let i = 0; i < head.length; i++) buf[p++] = head[i];
  addr3(pages); // the import's minimum, a 3-byte page count
  const tail = [3, 2, 1, 0, 7, 7, 1, 3, 0x72, 0x75, 0x6e, 0, 0, 10];
  for (let i = 0; i < tail.length; i++) buf[p++] = tail[i];
  const codeSize = p;
  p += 5;
  buf[p++] = 1;
  const bodySize = p;
  p += 5;
  emitBody(prog, outBase);
  // typed-array writes past the end are dropped silently: a module that outgrew its estimate is refused
  if (p > buf.length) throw new Error('module larger than its estimate');
  leb5(codeSize, p - codeSize - 5);
  leb5(bodySize, p - bodySize - 5);
  const bytes = buf.slice(0, p);
  buf = new Uint8Array(0);
  return { bytes, outBase, memBytes };
}

function emitBody(prog: BitProgram, outBase: number): void {
  const { ops, fixed, inputs, outputs, twoValued } = prog;
  const nOut = outputs.length >> 1;
  buf[p++] = 2;
  b2(2, 0x7f);
  b2(V128_LOCALS, 0x7b);
  // constant vectors
  const4(0x01010101, 0x01010101, 0x01010101, 0x01010101); b2(LOCAL_SET, L_ONE8);
  const4(0x08040201, 0x80402010, 0x08040201, 0x80402010); b2(LOCAL_SET, L_BITS);
  const4(0, 1, 2, 3); b2(LOCAL_SET, L_LANES);
  const4(1, 1, 1, 1); b2(LOCAL_SET, L_ONE32);
  for (let k = 0; k < 8; k++) {
    const lo = (2 * k) * 0x01010101, hi = (2 * k + 1) * 0x01010101;
    const4(lo, lo, hi, hi); b2(LOCAL_SET, L_SWIZZLE + k);
  }
  // constants and the inputs that repeat in every word: their slots are never reused, so once per call
  for (let i = 0; i < fixed.length; i += 2) fillAt((fixed[i] >> shift) << 4, fixed[i + 1]);
  for (let i = 0; i < inputs.length; i += 2) {
    const s = inputs[i + 1];
    if (s >= 5) continue;
    const a = (inputs[i] >> shift) << 4;
    fillAt(a, LOW_PATTERNS[s]);
    if (!twoValued) fillAt(a + 16, ~LOW_PATTERNS[s]);
  }

  b2(0x02, 0x40); // block
  b2(0x03, 0x40); // loop
  b2(LOCAL_GET, L_TURN); b2(LOCAL_GET, 1); buf[p++] = 0x4f; b2(0x0d, 1); // turn >= turns: leave
  // word numbers of the four lanes, and where this turn's codes go
  b2(LOCAL_GET, 0); b2(LOCAL_GET, L_TURN); b2(I32_CONST, 2); b2(0x74, 0x6a); simd(I32X4_SPLAT); b2(LOCAL_GET, L_LANES); simd(I32X4_ADD); b2(LOCAL_SET, L_WORDS);
  b2(LOCAL_GET, L_TURN); b2(I32_CONST, 7); buf[p++] = 0x74; b2(LOCAL_SET, L_OUT);
  for (let i = 0; i < inputs.length; i += 2) {
    const s = inputs[i + 1];
    if (s < 5) continue;
    const a = (inputs[i] >> shift) << 4;
    // all ones where bit (s − 5) of the word number is set (s − 5 < 27: one LEB byte)
    b2(I32_CONST, 0); b2(LOCAL_GET, L_WORDS); b2(I32_CONST, s - 5); simd(I32X4_SHR_U); b2(LOCAL_GET, L_ONE32); simd(AND); simd(I32X4_NEG);
    if (twoValued) { stAt(a); continue; }
    b2(LOCAL_TEE, L_A); stAt(a);
    b2(I32_CONST, 0); b2(LOCAL_GET, L_A); simd(NOT); stAt(a + 16);
  }
  if (twoValued) emitOps2(ops); else emitOps4(ops);
  for (let i = 0; i < nOut; i++) {
    const at = outputs[2 * i];
    if (at < 0) continue; // undriven: the caller writes Z
    const aux = outputs[2 * i + 1];
    if (twoValued) { ldm(at, aux); b2(LOCAL_SET, L_A); } else {
      ld(at); b2(LOCAL_TEE, L_A);
      ld(aux); simd(OR); simd(NOT); b2(LOCAL_SET, L_B);
    }
    const base = outBase + i * ROW_BYTES;
    for (let k = 0; k < 8; k++) {
      // bytes 2k and 2k + 1 of the vector (rows 16k … 16k + 15) spread to one byte per row
      b2(LOCAL_GET, L_OUT);
      b2(LOCAL_GET, L_A); b2(LOCAL_GET, L_SWIZZLE + k); simd(SWIZZLE); b2(LOCAL_GET, L_BITS); simd(AND); b2(LOCAL_GET, L_ONE8); simd(I8X16_MIN_U);
      if (!twoValued) {
        // X (neither plane) is code 2
        b2(LOCAL_GET, L_B); b2(LOCAL_GET, L_SWIZZLE + k); simd(SWIZZLE); b2(LOCAL_GET, L_BITS); simd(AND); b2(LOCAL_GET, L_ONE8); simd(I8X16_MIN_U);
        b2(I32_CONST, 1); simd(I8X16_SHL); simd(OR);
      }
      stAt(base + 16 * k);
    }
  }
  b2(LOCAL_GET, L_TURN); b2(I32_CONST, 1); buf[p++] = 0x6a; b2(LOCAL_SET, L_TURN);
  b2(0x0c, 0); // br to the loop
  buf[p++] = 0x0b; // end loop
  buf[p++] = 0x0b; // end block
  buf[p++] = 0x0b; // end function
}

/**
 * Two-valued ops (layouts in `bit-kernel.ts`), each computed on the stack and stored at its slot. The
 * bytes are written inline on locals (no helper calls): this loop runs once per op in the interpreter.
 */
function emitOps2(ops: Int32Array): void {
  const b = buf;
  const sh = shift;
  const len = ops.length;
  let q = p;
  let pc = 0;
  while (pc < len) {
    const code = ops[pc];
    const out = (ops[pc + 1] >> sh) << 4;
    b[q++] = I32_CONST; b[q++] = 0; // the store's base
    let k: number;
    let at: number; // first input
    let step: number; // entries per input: 2 with masks, 1 without
    let join: number; // the SIMD op combining the inputs
    if (code === OP.and2 || code === OP.and3 || code === OP.andk) {
      k = code === OP.and2 ? 2 : code === OP.and3 ? 3 : ops[pc + 2]; at = code === OP.andk ? pc + 3 : pc + 2; step = 2; join = AND;
    } else if (code === OP.xor2 || code === OP.xor3 || code === OP.xork) {
      k = code === OP.xor2 ? 2 : code === OP.xor3 ? 3 : ops[pc + 2]; at = code === OP.xork ? pc + 3 : pc + 2; step = 1; join = XOR;
    } else {
      // multiplexers: rare enough for the helpers
      p = q;
      if (code === OP.mux2) {
        // bitselect(d1, d0, s) = s ? d1 : d0
        ldm(ops[pc + 5], ops[pc + 6]); ldm(ops[pc + 3], ops[pc + 4]); ld(ops[pc + 2]); simd(BITSELECT);
        pc += 7;
      } else if (code === OP.mux4) {
        const s0 = ops[pc + 2];
        ldm(ops[pc + 10], ops[pc + 11]); ldm(ops[pc + 8], ops[pc + 9]); ld(s0); simd(BITSELECT);
        ldm(ops[pc + 6], ops[pc + 7]); ldm(ops[pc + 4], ops[pc + 5]); ld(s0); simd(BITSELECT);
        ld(ops[pc + 3]); simd(BITSELECT);
        pc += 12;
      } else throw new Error(`unknown op ${code}`);
      stAt(out);
      q = p;
      continue;
    }
    // AND: the plain literals ANDed, then AND NOT the OR of the inverted ones (one pass each);
    // XOR: no masks (an inverted input flipped the result's polarity when compiled)
    let plain = 0;
    let inverted = 0;
    for (let pass = 0; pass < (step === 2 ? 2 : 1); pass++) {
      for (let i = 0; i < k; i++) {
        const e = at + step * i;
        if (step === 2 && (ops[e + 1] !== 0) !== (pass === 1)) continue;
        const a = (ops[e] >> sh) << 4;
        b[q] = I32_CONST; b[q + 1] = 0; b[q + 2] = 0xfd; b[q + 3] = LOAD; b[q + 4] = 4;
        b[q + 5] = (a & 0x7f) | 0x80; b[q + 6] = ((a >> 7) & 0x7f) | 0x80; b[q + 7] = a >> 14;
        q += 8;
        if (pass === 0 ? plain++ > 0 : inverted++ > 0) { b[q++] = 0xfd; b[q++] = pass === 0 ? join : OR; }
      }
    }
    if (inverted > 0) { b[q++] = 0xfd; b[q++] = plain > 0 ? ANDNOT : NOT; }
    pc = at + step * k;
    b[q] = 0xfd; b[q + 1] = STORE; b[q + 2] = 4;
    b[q + 3] = (out & 0x7f) | 0x80; b[q + 4] = ((out >> 7) & 0x7f) | 0x80; b[q + 5] = out >> 14;
    q += 6;
  }
  p = q;
}

/** Four-valued ops: T and F planes into locals, then stored (an op may reuse an input's slot). */
function emitOps4(ops: Int32Array): void {
  const len = ops.length;
  let pc = 0;
  while (pc < len) {
    const code = ops[pc];
    const o = ops[pc + 1];
    if (code === OP.and4) {
      const k = ops[pc + 2];
      for (let i = 0; i < k; i++) { ld(ops[pc + 3 + 2 * i]); if (i > 0) simd(AND); }
      b2(LOCAL_SET, L_T);
      for (let i = 0; i < k; i++) { ld(ops[pc + 4 + 2 * i]); if (i > 0) simd(OR); }
      b2(LOCAL_SET, L_F);
      pc += 3 + 2 * k;
    } else if (code === OP.xor4) {
      const k = ops[pc + 2];
      // known where every input is known (T or F); then the parity of the T planes
      for (let i = 0; i < k; i++) { ld(ops[pc + 3 + 2 * i]); ld(ops[pc + 4 + 2 * i]); simd(OR); if (i > 0) simd(AND); }
      b2(LOCAL_SET, L_B);
      for (let i = 0; i < k; i++) { ld(ops[pc + 3 + 2 * i]); if (i > 0) simd(XOR); }
      b2(LOCAL_SET, L_A);
      b2(LOCAL_GET, L_B); b2(LOCAL_GET, L_A); simd(AND); b2(LOCAL_SET, L_T);
      b2(LOCAL_GET, L_B); b2(LOCAL_GET, L_A); simd(ANDNOT); b2(LOCAL_SET, L_F);
      pc += 3 + 2 * k;
    } else if (code === OP.mux2f) {
      // a data input counts unless the select surely rules it out (s = 1 rules out d0, s = 0 rules out d1)
      for (let plane = 0; plane < 2; plane++) {
        ld(ops[pc + 2]); ld(ops[pc + 4 + plane]); simd(OR);
        ld(ops[pc + 3]); ld(ops[pc + 6 + plane]); simd(OR);
        simd(AND); b2(LOCAL_SET, plane === 0 ? L_T : L_F);
      }
      pc += 8;
    } else if (code === OP.mux4f) {
      for (let plane = 0; plane < 2; plane++) {
        for (let d = 0; d < 4; d++) {
          // data input d is ruled out where a select surely differs from its bit of d
          ld(ops[pc + (d & 1 ? 3 : 2)]); ld(ops[pc + (d & 2 ? 5 : 4)]); simd(OR);
          ld(ops[pc + 6 + 2 * d + plane]); simd(OR);
          if (d > 0) simd(AND);
        }
        b2(LOCAL_SET, plane === 0 ? L_T : L_F);
      }
      pc += 14;
    } else throw new Error(`unknown op ${code}`);
    storeTF(o);
  }
}

/** false once a module failed to compile here (no WebAssembly, no SIMD, or a policy forbids it). */
let usable = typeof WebAssembly === 'object' && typeof WebAssembly.Module === 'function';

/** Whether this thread can run the WebAssembly kernel (as far as is known: the first compile decides). */
export function wasmKernelUsable(): boolean {
  return usable;
}

/**
 * One memory for every module of this thread, grown as a table needs (at most 2 MiB): a memory of its
 * own per table would reserve address space (and its guard region) each time, and the engine then
 * collects garbage to give it back — several milliseconds, now and then, in a warm process. Modules
 * may share it because every call writes each value before reading it (constants and inputs first)
 * and its codes are copied out before the call returns.
 */
let memory: WebAssembly.Memory | undefined;
let view = new Uint8Array(0);

/** The shared memory with at least `bytes` bytes, and a view of it (growing replaces the buffer). */
function memoryOf(bytes: number): WebAssembly.Memory {
  const pages = Math.ceil(bytes / 65536);
  if (!memory) memory = new WebAssembly.Memory({ initial: Math.max(pages, 4) });
  else if (memory.buffer.byteLength < pages * 65536) memory.grow(pages - memory.buffer.byteLength / 65536);
  return memory;
}

/** Runs a compiled program in a WebAssembly module and writes the row codes of its outputs. */
export class WasmEvaluator {
  private readonly run: (firstWord: number, turns: number) => void;
  private readonly outBase: number;

  private constructor(private readonly prog: BitProgram, run: (firstWord: number, turns: number) => void, outBase: number) {
    this.run = run;
    this.outBase = outBase;
  }

  /** The evaluator, or undefined where WebAssembly (with SIMD) cannot be compiled here. */
  static create(prog: BitProgram): WasmEvaluator | undefined {
    if (!usable) return undefined;
    let module: { bytes: Uint8Array<ArrayBuffer>; outBase: number; memBytes: number } | undefined;
    try {
      module = emitModule(prog);
    } catch {
      module = undefined; // an op this emitter does not know: the JS kernel runs it
    }
    if (!module) return undefined;
    const { bytes, outBase, memBytes } = module;
    try {
      // synchronous compile: allowed in workers and in Node (the main thread of a page limits its size)
      const instance = new WebAssembly.Instance(new WebAssembly.Module(bytes), { env: { mem: memoryOf(memBytes) } });
      return new WasmEvaluator(prog, (instance.exports as { run: (w: number, t: number) => void }).run, outBase);
    } catch {
      usable = false;
      return undefined;
    }
  }

  /** As `BitParallelEvaluator.evaluate`: words [w0, w0 + count) into the row-indexed `values`, at most `rowCount` rows. */
  evaluate(w0: number, count: number, values: Uint8Array[], rowCount: number): void {
    const outs = this.prog.outputs;
    if (view.buffer !== memory!.buffer) view = new Uint8Array(memory!.buffer);
    const mem = view;
    for (let b = 0; b < count; b += TURNS * 4) {
      const n = Math.min(TURNS * 4, count - b);
      this.run(w0 + b, (n + 3) >> 2);
      const start = (w0 + b) * 32;
      const end = Math.min(rowCount, (w0 + b + n) * 32);
      for (let i = 0; i < values.length; i++) {
        if (outs[2 * i] < 0) { values[i].fill(3, start, end); continue; }
        const from = this.outBase + i * ROW_BYTES;
        values[i].set(mem.subarray(from, from + end - start), start);
      }
    }
  }
}
