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
import { isInputKind, type Part } from '../board';
import type { CompiledPart, Level, Netlist } from '../sim';
import type { Levelised } from './levelise';
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
/** How a combinational kind is compiled: group, output inverted, inputs inverted (OR = AND of inverses). */
const KINDS: Record<string, readonly [number, number, number] | undefined> = {
  buffer: [KIND_ALIAS, 0, 0], not: [KIND_ALIAS, 1, 0],
  and: [KIND_AND, 0, 0], nand: [KIND_AND, 1, 0], or: [KIND_AND, 1, 1], nor: [KIND_AND, 0, 1],
  xor: [KIND_XOR, 0, 0], xnor: [KIND_XOR, 1, 0], mux2: [KIND_MUX, 0, 0], mux4: [KIND_MUX, 0, 0],
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
 * path for tests and the benchmark).
 */
export function compileBitProgram(
  netlist: Netlist, lev: Levelised, inputs: CompiledPart[], nets: number[], floating: Level, totalWords: number, fourValued = false,
): BitProgram {
  const nNets = netlist.nets.length;
  const parts = netlist.parts;
  // the part (and pin) driving each net that has exactly one driver
  const driver = new Int32Array(nNets).fill(-1);
  const driverPin = new Int32Array(nNets);
  const driverCount = new Int32Array(nNets);
  for (let net = 0; net < nNets; net++) driverCount[net] = netlist.nets[net].drivers.length;
  for (const p of parts) {
    const outs = p.outputs;
    for (let pin = 0; pin < outs.length; pin++) if (driverCount[outs[pin]] === 1) { driver[outs[pin]] = p.index; driverPin[outs[pin]] = pin; }
  }
  const inOrder = new Uint8Array(parts.length);
  for (const p of lev.order) inOrder[p.index] = 1;
  const shiftOf = new Int32Array(parts.length).fill(-1);
  for (let i = 0; i < inputs.length; i++) shiftOf[inputs[i].index] = inputs.length - 1 - i;

  // the fan-in cone of the requested nets through the ordered parts; the other nets reached are sources
  const needed = new Uint8Array(parts.length);
  const seen = new Uint8Array(nNets);
  const source = new Uint8Array(nNets);
  const stack: number[] = nets.slice();
  let twoValued = !fourValued;
  while (stack.length) {
    const net = stack.pop()!;
    if (seen[net]) continue;
    seen[net] = 1;
    const d = driver[net];
    if (d >= 0 && inOrder[d]) {
      if (needed[d]) continue;
      needed[d] = 1;
      const ins = parts[d].inputs;
      for (let i = 0; i < ins.length; i++) stack.push(ins[i]);
      continue;
    }
    let src: number;
    if (driverCount[net] === 0) src = floating === '0' ? SRC_ZERO : floating === '1' ? SRC_ONE : SRC_FLOAT;
    else if (d < 0) src = SRC_X; // two or more drivers
    else if (shiftOf[d] >= 0) src = SRC_INPUT;
    else if (isInputKind(parts[d].kind)) src = (sourceBit(parts[d].part) === '1') !== (driverPin[net] !== 0) ? SRC_ONE : SRC_ZERO;
    else src = SRC_X; // not expected: stateful nets are not in a combinational cone
    source[net] = src;
    if (src === SRC_X || src === SRC_FLOAT) twoValued = false;
  }

  const b = new ProgramBuilder(twoValued, nNets);
  const four = !twoValued;
  // literals of the sources, made when first read: value × 2 + polarity (four-valued: planes swapped)
  const litOf = (net: number): number => {
    const l = b.netLit[net];
    if (l >= 0) return l;
    let lit: number;
    switch (source[net]) {
      case SRC_INPUT: lit = b.input(shiftOf[driver[net]]) * 2 + (driverPin[net] !== 0 ? 1 : 0); break;
      case SRC_ONE: lit = b.constant(0) * 2 + 1; break;
      case SRC_ZERO: lit = b.constant(0) * 2; break;
      default: lit = b.constant(1) * 2; // X (two-valued never gets here)
    }
    b.netLit[net] = lit;
    return lit;
  };

  const lits: number[] = [];
  for (const p of lev.order) {
    if (!needed[p.index]) continue;
    const how = KINDS[p.kind];
    if (!how) throw new Error('not combinational');
    const [group, outInv, inInv] = how;
    lits.length = 0;
    for (const net of p.inputs) lits.push(litOf(net) ^ inInv);
    let out: number;
    if (group === KIND_ALIAS || lits.length === 1) out = lits[0] ^ outInv;
    else if (group === KIND_AND) out = b.and(lits) ^ outInv;
    else if (group === KIND_XOR) out = b.xor(lits) ^ outInv;
    else out = b.mux(lits);
    b.netLit[p.outputs[0]] = out;
  }
  const outLits = nets.map((net) => (driverCount[net] === 0 ? -1 : litOf(net)));
  for (const l of outLits) if (l >= 0) b.keep(l >> 1);

  const slots = b.allocate();
  const planes = four ? 2 : 1;
  const span = Math.max(1, Math.floor(BLOCK_BUDGET_WORDS / Math.max(1, slots) / planes));
  let W = 4; // at least 4: the kernel's loops run in groups of 4 words
  while (W * 2 <= Math.min(span, MAX_W, totalWords)) W *= 2;
  const ops = b.finish(W);
  const at = (lit: number, plane: 0 | 1) => b.slotOf[lit >> 1] * planes * W + (four && (lit & 1) !== plane ? W : 0);
  const outputs = new Int32Array(nets.length * 2);
  outLits.forEach((l, i) => {
    outputs[2 * i] = l < 0 ? -1 : at(l, 0);
    outputs[2 * i + 1] = l < 0 ? 0 : four ? at(l, 1) : -(l & 1);
  });
  const fixed: number[] = [];
  for (const [v, kind] of b.constants) {
    const o = b.slotOf[v] * planes * W;
    // two-valued: only the zero word; four-valued: 0 is T = 0, F = 1; X is neither
    fixed.push(o, 0);
    if (four) fixed.push(o + W, kind === 0 ? -1 : 0);
  }
  const inputWords: number[] = [];
  for (const [v, shift] of b.inputs) inputWords.push(b.slotOf[v] * planes * W, shift);
  return { twoValued, W, size: Math.max(1, slots * planes * W), slots, ops, fixed: Int32Array.from(fixed), inputs: Int32Array.from(inputWords), outputs };
}

/**
 * Builds the op list on values (not yet slots), then gives each value a slot by liveness and writes
 * the offsets. A reference to a value in the op list is recorded with its position and plane.
 */
class ProgramBuilder {
  readonly netLit: Int32Array;
  /** constant values: [value, 0 = zero, 1 = X] */
  readonly constants: [number, number][] = [];
  /** input values: [value, bit of the row number] */
  readonly inputs: [number, number][] = [];
  slotOf = new Int32Array(0);
  private readonly code: number[] = [];
  /** per reference: its position in `code`; value × 4 + kind (0 output, 1 T plane or word, 2 F plane) */
  private readonly refPos: number[] = [];
  private readonly refVal: number[] = [];
  /** first reference of each op */
  private readonly opRef: number[] = [];
  private lastUse: number[] = [];
  private readonly permanent: number[] = [];
  private values = 0;
  private zero = -1;
  private unknown = -1;

  constructor(private readonly two: boolean, nNets: number) {
    this.netLit = new Int32Array(nNets).fill(-1);
  }

  private value(permanent: boolean): number {
    const v = this.values++;
    this.lastUse.push(-1);
    if (permanent) this.permanent.push(v);
    return v;
  }

  input(shift: number): number {
    const v = this.value(true);
    this.inputs.push([v, shift]);
    return v;
  }

  /** The zero value (kind 0) or the X value (kind 1, four-valued only). */
  constant(kind: 0 | 1): number {
    if (kind === 0 && this.zero >= 0) return this.zero;
    if (kind === 1 && this.unknown >= 0) return this.unknown;
    const v = this.value(true);
    this.constants.push([v, kind]);
    if (kind === 0) this.zero = v; else this.unknown = v;
    return v;
  }

  /** Keeps a value to the end (an output reads it). */
  keep(v: number): void {
    this.lastUse[v] = 0x7fffffff;
  }

  private begin(code: number): number {
    this.opRef.push(this.refPos.length);
    this.code.push(code, 0);
    const out = this.value(false);
    this.ref(this.code.length - 1, out, 0);
    return out;
  }

  private ref(pos: number, v: number, kind: number): void {
    this.refPos.push(pos);
    this.refVal.push(v * 4 + kind);
    if (kind !== 0) this.lastUse[v] = this.opRef.length - 1;
  }

  /** A word (two-valued) or the T plane of a literal (four-valued). */
  private word(lit: number): void {
    this.code.push(0);
    this.ref(this.code.length - 1, lit >> 1, this.two || (lit & 1) === 0 ? 1 : 2);
  }

  /** The F plane of a four-valued literal. */
  private fword(lit: number): void {
    this.code.push(0);
    this.ref(this.code.length - 1, lit >> 1, (lit & 1) === 0 ? 2 : 1);
  }

  /** AND of literals; returns the result's literal. */
  and(lits: number[]): number {
    const k = lits.length;
    if (!this.two) {
      const out = this.begin(OP.and4);
      this.code.push(k);
      for (const l of lits) { this.word(l); this.fword(l); }
      return out * 2;
    }
    const out = this.begin(k === 2 ? OP.and2 : k === 3 ? OP.and3 : OP.andk);
    if (k > 3) this.code.push(k);
    for (const l of lits) { this.word(l); this.code.push(-(l & 1)); }
    return out * 2;
  }

  /** XOR of literals; returns the result's literal. */
  xor(lits: number[]): number {
    const k = lits.length;
    if (!this.two) {
      const out = this.begin(OP.xor4);
      this.code.push(k);
      for (const l of lits) { this.word(l); this.fword(l); }
      return out * 2;
    }
    const out = this.begin(k === 2 ? OP.xor2 : k === 3 ? OP.xor3 : OP.xork);
    if (k > 3) this.code.push(k);
    let pol = 0;
    for (const l of lits) { this.word(l); pol ^= l & 1; }
    return out * 2 + pol;
  }

  /** A multiplexer: select literals (sel0 first), then data literals; returns the result's literal. */
  mux(lits: number[]): number {
    const sels = lits.length === 3 ? 1 : 2;
    if (!this.two) {
      const out = this.begin(sels === 1 ? OP.mux2f : OP.mux4f);
      for (const l of lits) { this.word(l); this.fword(l); }
      return out * 2;
    }
    // an inverted select swaps the data inputs it chooses between
    const data = lits.slice(sels);
    for (let s = 0; s < sels; s++) {
      if ((lits[s] & 1) === 0) continue;
      for (let d = 0; d < data.length; d++) if ((d & (1 << s)) === 0) [data[d], data[d | (1 << s)]] = [data[d | (1 << s)], data[d]];
    }
    const out = this.begin(sels === 1 ? OP.mux2 : OP.mux4);
    for (let s = 0; s < sels; s++) this.word(lits[s] & ~1);
    for (const l of data) { this.word(l); this.code.push(-(l & 1)); }
    return out * 2;
  }

  /** Gives every value a slot (permanent values first, then by liveness); returns the number of slots. */
  allocate(): number {
    const slotOf = new Int32Array(this.values).fill(-1);
    let slots = 0;
    for (const v of this.permanent) slotOf[v] = slots++;
    const permanent = slots;
    const free: number[] = [];
    const { refVal, opRef, lastUse } = this;
    const nOps = opRef.length;
    for (let i = 0; i < nOps; i++) {
      const r0 = opRef[i];
      const r1 = i + 1 < nOps ? opRef[i + 1] : refVal.length;
      // inputs read at word j before the output is written at word j: the output may take a freed input's slot
      for (let r = r0 + 1; r < r1; r++) {
        const v = refVal[r] >> 2;
        if (lastUse[v] === i && slotOf[v] >= permanent) { free.push(slotOf[v]); lastUse[v] = -2; }
      }
      const out = refVal[r0] >> 2;
      slotOf[out] = free.length ? free.pop()! : slots++;
      if (lastUse[out] === -1) free.push(slotOf[out]); // read by nothing
    }
    this.slotOf = slotOf;
    return slots;
  }

  /** The op list with offsets in words for W words per plane. */
  finish(W: number): Int32Array {
    const ops = Int32Array.from(this.code);
    const planes = this.two ? 1 : 2;
    const { refPos, refVal, slotOf } = this;
    for (let r = 0; r < refPos.length; r++) {
      const kind = refVal[r] & 3;
      ops[refPos[r]] = slotOf[refVal[r] >> 2] * planes * W + (kind === 2 ? W : 0);
    }
    return ops;
  }
}
