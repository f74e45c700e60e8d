/**
 * The combinational fan-in of a table's outputs compiled once into a straight-line program on typed
 * arrays: each net the outputs depend on gets a slot (a run of W words), each gate one op in evaluation
 * order — `[code, out, n, in_1 … in_n]`, offsets already multiplied by W. The program is two-valued when
 * no X or Z can reach the outputs (no net with two drivers, no undriven net reading X or Z), else it
 * carries the four-valued planes (`bit-parallel.ts`).
 */
import { isInputKind, isStorageKind, type Part } from '../board';
import type { CompiledPart, Level, Netlist } from '../sim';
import type { Levelised } from './levelise';

export const OP = { buffer: 0, not: 1, and: 2, nand: 3, or: 4, nor: 5, xor: 6, xnor: 7, mux2: 8, mux4: 9 } as const;

/** A source slot: filled once (a constant, X, or the floating level) — `t`, `f` are the planes (two-valued: `t`). */
export interface FixedSlot { at: number; t: number; f: number }
/** An enumerated input's slot: its bit in the row number, and whether it is the complement pin. */
export interface InputSlot { at: number; shift: number; invert: boolean }

export interface BitProgram {
  /** true: one plane, no X or Z can arise; false: T and F planes */
  twoValued: boolean;
  /** words per slot (rows per block / 32) */
  W: number;
  slots: number;
  ops: Int32Array;
  fixed: FixedSlot[];
  inputs: InputSlot[];
  /** per requested net: its slot offset, or −1 for an undriven net (it reads Z) */
  outputs: Int32Array;
}

/** Rows per block are chosen so that one block of every slot stays near this many words (cache-sized). */
const BLOCK_BUDGET_WORDS = 32_768;

function planes(v: Level): { t: number; f: number } {
  return v === '1' ? { t: -1, f: 0 } : v === '0' ? { t: 0, f: -1 } : { t: 0, f: 0 };
}

/** The board value of an input part (a clock rests low). */
function sourceBit(part: Part): Level {
  switch (part.kind) {
    case 'switch': return part.on ? '1' : '0';
    case 'button': return part.pressed ? '1' : '0';
    case 'const': return part.value === 1 ? '1' : '0';
    default: return '0';
  }
}

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
  const single = (net: number) => netlist.nets[net].drivers.length === 1;
  // the part (and pin) driving each net that has exactly one driver
  const driver = new Int32Array(nNets).fill(-1);
  const driverPin = new Int32Array(nNets);
  for (const p of netlist.parts) p.outputs.forEach((net, pin) => { if (single(net)) { driver[net] = p.index; driverPin[net] = pin; } });
  const inOrder = new Uint8Array(netlist.parts.length);
  for (const p of lev.order) inOrder[p.index] = 1;
  // the fan-in cone of the requested nets through the ordered parts
  const needed = new Uint8Array(netlist.parts.length);
  const seen = new Uint8Array(nNets);
  const stack = [...nets];
  while (stack.length) {
    const net = stack.pop()!;
    if (seen[net]) continue;
    seen[net] = 1;
    const d = driver[net];
    if (d < 0 || !inOrder[d] || needed[d]) continue;
    needed[d] = 1;
    for (const n of netlist.parts[d].inputs) stack.push(n);
  }
  const slotOf = new Int32Array(nNets).fill(-1);
  const order: number[] = [];
  const slot = (net: number) => { if (slotOf[net] < 0) { slotOf[net] = order.length; order.push(net); } return slotOf[net]; };
  const ops = lev.order.filter((p) => needed[p.index]);
  for (const p of ops) { p.inputs.forEach(slot); slot(p.outputs[0]); }
  for (const net of nets) if (netlist.nets[net].drivers.length > 0) slot(net);

  const shiftOf = new Map<number, number>(inputs.map((p, i) => [p.index, inputs.length - 1 - i]));
  const fixed: { net: number; level: Level }[] = [];
  const inputSlots: { net: number; shift: number; invert: boolean }[] = [];
  for (const net of order) {
    const d = driver[net];
    if (netlist.nets[net].drivers.length === 0) fixed.push({ net, level: floating });
    else if (d < 0) fixed.push({ net, level: 'X' }); // two or more drivers
    else if (needed[d]) continue;
    else if (shiftOf.has(d)) inputSlots.push({ net, shift: shiftOf.get(d)!, invert: driverPin[net] !== 0 });
    else if (isInputKind(netlist.parts[d].kind)) {
      const v = sourceBit(netlist.parts[d].part);
      fixed.push({ net, level: driverPin[net] === 0 ? v : v === '1' ? '0' : '1' });
    } else fixed.push({ net, level: 'X' }); // not expected: stateful nets are not in a combinational cone
  }
  const twoValued = !fourValued && fixed.every((f) => f.level === '0' || f.level === '1');
  const span = Math.max(1, Math.floor(BLOCK_BUDGET_WORDS / Math.max(1, order.length) / (twoValued ? 1 : 2)));
  let W = 1;
  while (W * 2 <= Math.min(span, 256, Math.max(1, totalWords))) W *= 2;
  const code: number[] = [];
  for (const p of ops) {
    const o = p.outputs[0];
    if (!single(o)) continue; // a net with two drivers stays X
    code.push(OP[p.kind as keyof typeof OP], slotOf[o] * W, p.inputs.length, ...p.inputs.map((n) => slotOf[n] * W));
  }
  if (ops.some((p) => isStorageKind(p.kind) || !(p.kind in OP))) throw new Error('not combinational');
  return {
    twoValued, W, slots: order.length, ops: Int32Array.from(code),
    fixed: fixed.map((f) => ({ at: slotOf[f.net] * W, ...planes(f.level) })),
    inputs: inputSlots.map((s) => ({ at: slotOf[s.net] * W, shift: s.shift, invert: s.invert })),
    outputs: Int32Array.from(nets, (net) => (netlist.nets[net].drivers.length === 0 ? -1 : slotOf[net] * W)),
  };
}
