/**
 * The combinational fan-in of a table's outputs compiled once into a straight-line program on typed
 * arrays (`bit-kernel.ts` runs it, `bit-parallel.ts` drives it block by block).
 *
 * - Every net is a literal: a value and a polarity. Buffers and inverters emit no op: a buffer's output
 *   is its input's literal, an inverter's the same value with the polarity flipped. A NAND is an AND
 *   whose result is read inverted, an OR is an AND of inverted inputs read inverted (De Morgan); an
 *   inverted input of an AND is a mask XORed into the word, of an XOR a flip of the result's polarity.
 * - Two-valued (no X or Z can reach the outputs): one plane per value. Four-valued: two planes per value,
 *   T (surely 1) and F (surely 0), X being neither; there an inverted literal is the same value with its
 *   planes swapped, and AND is T = ∧T, F = ∨F.
 * - Values get slots by liveness: a slot is reused once the last op reading its value has run, so the
 *   working set of a block is the largest number of values live at once, not the number of nets.
 * - Ops are flat in one Int32Array, offsets already in words: `[code, out, …]` (layouts in `bit-kernel.ts`).
 */
import type { Part } from '../board';
import type { CompiledPart, Level, Netlist } from '../sim';
import type { Cone } from './cone';
import { OP } from './bit-kernel';

export { OP } from './bit-kernel';

export interface BitProgram {
  /** true: one plane, no X or Z can arise; false: T and F planes */
  twoValued: boolean;
  /** words per plane of a slot (rows per block / 32) */
  W: number;
  /** words of the value array (slots × planes × W) */
  size: number;
  /** live slots at most */
  slots: number;
  ops: Int32Array;
  /** words filled with a constant before each block: `[offset, word]` pairs (each fills W words) */
  fixed: Int32Array;
  /** enumerated inputs: `[offset, bit of the row number]` pairs (four-valued: F plane at offset + W) */
  inputs: Int32Array;
  /**
   * per requested net `[at, aux]`: at = offset of its word (four-valued: of its T plane), −1 for an
   * undriven net (it reads Z); aux = XOR mask (two-valued) or offset of the F plane (four-valued)
   */
  outputs: Int32Array;
}

/** Rows per block are chosen so that one block of every live slot stays near this many words. */
const BLOCK_BUDGET_WORDS = 48 * 1024;
/** Most words per block (8,192 rows): beyond this the per-op dispatch is already amortised. */
const MAX_W = 256;

/** The board value of an input part (a clock rests low). */
function sourceBit(part: Part): Level {
  switch (part.kind) {
    case 'switch': return part.on ? '1' : '0';
    case 'button': return part.pressed ? '1' : '0';
    case 'const': return part.value === 1 ? '1' : '0';
    default: return '0';
  }
}

const KIND_AND = 1;
const KIND_XOR = 2;
const KIND_MUX = 3;
const KIND_ALIAS = 4;
/** How a combinational kind is compiled: group | output inverted << 3 | inputs inverted << 4 (OR = AND of inverses). */
const KIND_CODE: Record<string, number | undefined> = {
  buffer: KIND_ALIAS, not: KIND_ALIAS | 8,
  and: KIND_AND, nand: KIND_AND | 8, or: KIND_AND | 8 | 16, nor: KIND_AND | 16,
  xor: KIND_XOR, xnor: KIND_XOR | 8, mux2: KIND_MUX, mux4: KIND_MUX,
};

/** Where a source net's level comes from. */
const SRC_FLOAT = 1;
const SRC_X = 2;
const SRC_INPUT = 3;
const SRC_ZERO = 4;
const SRC_ONE = 5;

/**
 * Compiles the program that computes `nets` (the nets the outputs read, none of them stateful) with the
 * given inputs enumerated (first = most significant bit of the row number). `floating` is what a reader
 * of an undriven net sees; `fourValued` keeps the two planes even where one would do (the reference
 * path for tests and the benchmark). Plain loops over typed arrays: in a fresh process this runs
 * before it is optimised, so its cost is the number of operations per part.
 */
export function compileBitProgram(
  netlist: Netlist, cone: Cone, inputs: CompiledPart[], nets: number[], floating: Level, totalWords: number, fourValued = false,
): BitProgram {
  const parts = netlist.parts;
  const { driver, driverPin, driverCount, order, kindClass, nNets } = cone;
  const inOrder = new Uint8Array(parts.length);
  for (let i = 0; i < order.length; i++) inOrder[order[i]] = 1;
  const shiftOf = new Int32Array(parts.length).fill(-1);
  for (let i = 0; i < inputs.length; i++) shiftOf[inputs[i].index] = inputs.length - 1 - i;

  // the fan-in cone of the requested nets through the ordered parts; the other nets reached are sources
  const needed = new Uint8Array(parts.length);
  const seen = new Uint8Array(nNets);
  const source = new Uint8Array(nNets);
  // a net is pushed once (marked seen when pushed), so the stack never holds more than every net
  const stack = new Int32Array(nNets);
  let sp = 0;
  for (let i = 0; i < nets.length; i++) if (!seen[nets[i]]) { seen[nets[i]] = 1; stack[sp++] = nets[i]; }
  let twoValued = !fourValued;
  let nNeeded = 0;
  let codeBound = 0;
  let maxIn = 1;
  while (sp > 0) {
    const net = stack[--sp];
    const d = driver[net];
    if (d >= 0 && inOrder[d]) {
      if (needed[d]) continue;
      needed[d] = 1;
      const ins = parts[d].inputs;
      nNeeded++;
      codeBound += 4 + 2 * ins.length;
      if (ins.length > maxIn) maxIn = ins.length;
      for (let i = 0; i < ins.length; i++) if (!seen[ins[i]]) { seen[ins[i]] = 1; stack[sp++] = ins[i]; }
      continue;
    }
    let src: number;
    if (driverCount[net] === 0) src = floating === '0' ? SRC_ZERO : floating === '1' ? SRC_ONE : SRC_FLOAT;
    else if (d < 0) src = SRC_X; // two or more drivers
    else if (shiftOf[d] >= 0) src = SRC_INPUT;
    else if (kindClass[d] === 2) src = (sourceBit(parts[d].part) === '1') !== (driverPin[net] !== 0) ? SRC_ONE : SRC_ZERO;
    else src = SRC_X; // not expected: stateful nets are not in a combinational cone
    source[net] = src;
    if (src === SRC_X || src === SRC_FLOAT) twoValued = false;
  }

  const e = new Emitter(twoValued, nNets, codeBound, nNeeded + inputs.length * 2 + 2);
  const lits = new Int32Array(maxIn);
  for (let i = 0; i < order.length; i++) {
    if (!needed[order[i]]) continue;
    const p = parts[order[i]];
    const how = KIND_CODE[p.kind];
    if (how === undefined) throw new Error('not combinational');
    const group = how & 7;
    const inInv = (how >> 4) & 1;
    const ins = p.inputs;
    const k = ins.length;
    for (let j = 0; j < k; j++) lits[j] = e.litOf(ins[j], source, shiftOf, driver, driverPin) ^ inInv;
    let out: number;
    if (group === KIND_ALIAS || k === 1) out = lits[0];
    else if (group === KIND_AND) out = e.and(lits, k);
    else if (group === KIND_XOR) out = e.xor(lits, k);
    else out = e.mux(lits, k);
    e.netLit[p.outputs[0]] = out ^ ((how >> 3) & 1);
  }
  const outLits = new Int32Array(nets.length);
  for (let i = 0; i < nets.length; i++) {
    outLits[i] = driverCount[nets[i]] === 0 ? -1 : e.litOf(nets[i], source, shiftOf, driver, driverPin);
    if (outLits[i] >= 0) e.keep(outLits[i] >> 1);
  }

  const slots = e.allocate();
  const four = !twoValued;
  const planes = four ? 2 : 1;
  const span = Math.max(1, Math.floor(BLOCK_BUDGET_WORDS / Math.max(1, slots) / planes));
  let W = 4; // at least 4: the kernel's loops run in groups of 4 words
  while (W * 2 <= Math.min(span, MAX_W, totalWords)) W *= 2;
  const ops = e.finish(W);
  const slotOf = e.slotOf;
  const stride = planes * W;
  const outputs = new Int32Array(nets.length * 2);
  for (let i = 0; i < nets.length; i++) {
    const l = outLits[i];
    if (l < 0) { outputs[2 * i] = -1; continue; }
    const o = slotOf[l >> 1] * stride;
    // four-valued: a literal read inverted has its planes swapped
    outputs[2 * i] = four && (l & 1) ? o + W : o;
    outputs[2 * i + 1] = four ? ((l & 1) ? o : o + W) : -(l & 1);
  }
  const fixed = new Int32Array(e.nConst * planes * 2);
  for (let i = 0, f = 0; i < e.nConst; i++) {
    const o = slotOf[e.constVal[i]] * stride;
    // two-valued: only the zero word; four-valued: 0 is T = 0, F = 1; X is neither
    fixed[f++] = o;
    fixed[f++] = 0;
    if (four) { fixed[f++] = o + W; fixed[f++] = e.constKind[i] === 0 ? -1 : 0; }
  }
  const inputWords = new Int32Array(e.nInputs * 2);
  for (let i = 0; i < e.nInputs; i++) { inputWords[2 * i] = slotOf[e.inputVal[i]] * stride; inputWords[2 * i + 1] = e.inputShift[i]; }
  return { twoValued, W, size: Math.max(1, slots * stride), slots, ops, fixed, inputs: inputWords, outputs };
}

/**
 * Builds the op list on values (not yet slots), then gives each value a slot by liveness and writes
 * the offsets. Every reference to a value in the op list is recorded with its position and plane.
 */
class Emitter {
  readonly netLit: Int32Array;
  /** constant values (the zero word; four-valued also X) and their kinds (0 zero, 1 X) */
  readonly constVal = new Int32Array(2);
  readonly constKind = new Int32Array(2);
  nConst = 0;
  /** enumerated inputs' values and their bits of the row number */
  readonly inputVal: Int32Array;
  readonly inputShift: Int32Array;
  nInputs = 0;
  slotOf = new Int32Array(0);
  private readonly code: Int32Array;
  private len = 0;
  /** per reference: its position in `code`, and value × 4 + kind (0 output, 1 T plane or word, 2 F plane) */
  private readonly refPos: Int32Array;
  private readonly refVal: Int32Array;
  private nRefs = 0;
  /** first reference of each op */
  private readonly opRef: Int32Array;
  private nOps = 0;
  private readonly lastUse: Int32Array;
  private readonly permanent: Uint8Array;
  private values = 0;
  private zero = -1;
  private unknown = -1;

  constructor(private readonly two: boolean, nNets: number, codeBound: number, valueBound: number) {
    this.netLit = new Int32Array(nNets).fill(-1);
    this.code = new Int32Array(codeBound);
    this.refPos = new Int32Array(codeBound);
    this.refVal = new Int32Array(codeBound);
    this.opRef = new Int32Array(valueBound + 1);
    this.lastUse = new Int32Array(valueBound).fill(-1);
    this.permanent = new Uint8Array(valueBound);
    this.inputVal = new Int32Array(valueBound);
    this.inputShift = new Int32Array(valueBound);
  }

  /** A net's literal (value × 2 + inverted); a source's value is made when it is first read. */
  litOf(net: number, source: Uint8Array, shiftOf: Int32Array, driver: Int32Array, driverPin: Int32Array): number {
    const l = this.netLit[net];
    if (l >= 0) return l;
    let lit: number;
    switch (source[net]) {
      case SRC_INPUT: {
        const v = this.values++;
        this.permanent[v] = 1;
        this.inputVal[this.nInputs] = v;
        this.inputShift[this.nInputs++] = shiftOf[driver[net]];
        lit = v * 2 + (driverPin[net] !== 0 ? 1 : 0);
        break;
      }
      case SRC_ONE: lit = this.constant(0) * 2 + 1; break;
      case SRC_ZERO: lit = this.constant(0) * 2; break;
      default: lit = this.constant(1) * 2; // X (two-valued never gets here)
    }
    this.netLit[net] = lit;
    return lit;
  }

  /** The zero value (kind 0) or the X value (kind 1, four-valued only). */
  private constant(kind: 0 | 1): number {
    if (kind === 0 && this.zero >= 0) return this.zero;
    if (kind === 1 && this.unknown >= 0) return this.unknown;
    const v = this.values++;
    this.permanent[v] = 1;
    this.constVal[this.nConst] = v;
    this.constKind[this.nConst++] = kind;
    if (kind === 0) this.zero = v; else this.unknown = v;
    return v;
  }

  /** Keeps a value to the end (an output reads it). */
  keep(v: number): void {
    this.lastUse[v] = 0x7fffffff;
  }

  private begin(code: number): number {
    this.opRef[this.nOps++] = this.nRefs;
    this.code[this.len++] = code;
    const out = this.values++;
    this.ref(out, 0);
    return out;
  }

  /** Appends a reference to value v (kind: 0 output, 1 T plane or word, 2 F plane). */
  private ref(v: number, kind: number): void {
    this.refPos[this.nRefs] = this.len++;
    this.refVal[this.nRefs++] = v * 4 + kind;
    if (kind !== 0) this.lastUse[v] = this.nOps - 1;
  }

  /** A word (two-valued) or the T plane of a literal (four-valued). */
  private word(lit: number): void {
    this.ref(lit >> 1, this.two || (lit & 1) === 0 ? 1 : 2);
  }

  /** The F plane of a four-valued literal. */
  private fword(lit: number): void {
    this.ref(lit >> 1, (lit & 1) === 0 ? 2 : 1);
  }

  private push(x: number): void {
    this.code[this.len++] = x;
  }

  /** AND of k literals; returns the result's literal. */
  and(lits: Int32Array, k: number): number {
    if (!this.two) {
      const out = this.begin(OP.and4);
      this.push(k);
      for (let i = 0; i < k; i++) { this.word(lits[i]); this.fword(lits[i]); }
      return out * 2;
    }
    const out = this.begin(k === 2 ? OP.and2 : k === 3 ? OP.and3 : OP.andk);
    if (k > 3) this.push(k);
    for (let i = 0; i < k; i++) { this.word(lits[i]); this.push(-(lits[i] & 1)); }
    return out * 2;
  }

  /** XOR of k literals; returns the result's literal. */
  xor(lits: Int32Array, k: number): number {
    if (!this.two) {
      const out = this.begin(OP.xor4);
      this.push(k);
      for (let i = 0; i < k; i++) { this.word(lits[i]); this.fword(lits[i]); }
      return out * 2;
    }
    const out = this.begin(k === 2 ? OP.xor2 : k === 3 ? OP.xor3 : OP.xork);
    if (k > 3) this.push(k);
    let pol = 0;
    for (let i = 0; i < k; i++) { this.word(lits[i]); pol ^= lits[i] & 1; }
    return out * 2 + pol;
  }

  /** A multiplexer: select literals (sel0 first), then data literals; returns the result's literal. */
  mux(lits: Int32Array, k: number): number {
    const sels = k === 3 ? 1 : 2;
    if (!this.two) {
      const out = this.begin(sels === 1 ? OP.mux2f : OP.mux4f);
      for (let i = 0; i < k; i++) { this.word(lits[i]); this.fword(lits[i]); }
      return out * 2;
    }
    // an inverted select swaps the data inputs it chooses between (lits is scratch: swapped in place)
    for (let s = 0; s < sels; s++) {
      if ((lits[s] & 1) === 0) continue;
      for (let d = 0; d < k - sels; d++) {
        if ((d & (1 << s)) !== 0) continue;
        const x = lits[sels + d];
        lits[sels + d] = lits[sels + (d | (1 << s))];
        lits[sels + (d | (1 << s))] = x;
      }
    }
    const out = this.begin(sels === 1 ? OP.mux2 : OP.mux4);
    for (let s = 0; s < sels; s++) this.word(lits[s] & ~1);
    for (let i = sels; i < k; i++) { this.word(lits[i]); this.push(-(lits[i] & 1)); }
    return out * 2;
  }

  /** Gives every value a slot (permanent values first, then by liveness); returns the number of slots. */
  allocate(): number {
    const slotOf = new Int32Array(this.values).fill(-1);
    let slots = 0;
    for (let v = 0; v < this.values; v++) if (this.permanent[v]) slotOf[v] = slots++;
    const permanent = slots;
    const free = new Int32Array(this.values + 1);
    let nFree = 0;
    const { refVal, opRef, lastUse, nOps, nRefs } = this;
    for (let i = 0; i < nOps; i++) {
      const r0 = opRef[i];
      const r1 = i + 1 < nOps ? opRef[i + 1] : nRefs;
      // inputs are read at word j before the output is written at word j: the output may take a freed input's slot
      for (let r = r0 + 1; r < r1; r++) {
        const v = refVal[r] >> 2;
        if (lastUse[v] === i && slotOf[v] >= permanent) { free[nFree++] = slotOf[v]; lastUse[v] = -2; }
      }
      const out = refVal[r0] >> 2;
      slotOf[out] = nFree > 0 ? free[--nFree] : slots++;
      if (lastUse[out] === -1) free[nFree++] = slotOf[out]; // read by nothing
    }
    this.slotOf = slotOf;
    return slots;
  }

  /** The op list with offsets in words for W words per plane. */
  finish(W: number): Int32Array {
    const ops = this.code.slice(0, this.len);
    const stride = this.two ? W : 2 * W;
    const { refPos, refVal, slotOf, nRefs } = this;
    for (let r = 0; r < nRefs; r++) ops[refPos[r]] = slotOf[refVal[r] >> 2] * stride + ((refVal[r] & 3) === 2 ? W : 0);
    return ops;
  }
}
