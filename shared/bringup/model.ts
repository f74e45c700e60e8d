/**
 * The board as fault simulation sees it: its gates in evaluation order on net indices, the inputs the
 * builder sets by hand (switches, buttons, clocks: first input first), the lamps and probes read, and the
 * nets held at a fixed level (constants, and undriven nets at the family's floating level).
 */
import { isInputKind, isOutputKind, isStorageKind, type BoardFile } from '../board';
import { compileBoard, familyOf, type Netlist } from '../sim';
import { levelise } from '../analysis';
import { BringupError } from './types';

/** Gate operations of the evaluators (two-valued words and three-valued PODEM values). */
export const OP = { buffer: 0, not: 1, and: 2, nand: 3, or: 4, nor: 5, xor: 6, xnor: 7, mux2: 8, mux4: 9 } as const;

export interface ModelGate {
  part: string;
  op: number;
  /** output net */
  out: number;
  /** input nets, in pin order */
  ins: Int32Array;
  pins: string[];
}

/** An input the builder sets: the nets of its pins and whether each carries the complement. */
export interface ModelInput {
  part: string;
  label: string;
  nets: { net: number; invert: boolean }[];
}

export interface ModelOutput {
  part: string;
  label: string;
  net: number;
}

export interface Model {
  netlist: Netlist;
  nNets: number;
  /** combinational gates, each after the gates driving it */
  gates: ModelGate[];
  inputs: ModelInput[];
  outputs: ModelOutput[];
  fixed: { net: number; value: 0 | 1 }[];
  /** gate index driving each net, −1 for none */
  driverGate: Int32Array;
  /** input index driving each net (−1 none), and whether it is the complement pin */
  driverInput: Int32Array;
  driverInvert: Uint8Array;
  /** true when the board holds storage (built-in or a gate loop): vectors become sequences */
  sequential: boolean;
}

/** The inputs a builder sets by hand, in file order. */
export function handInputs(netlist: Netlist): ModelInput[] {
  return netlist.inputs
    .filter((p) => p.kind === 'switch' || p.kind === 'button' || p.kind === 'clock')
    .map((p) => ({ part: p.id, label: p.name, nets: p.outputs.map((net, k) => ({ net, invert: p.outputPins[k] === 'outn' })) }));
}

/** The lamps and probes read, in file order, or the ones named (by label). */
export function readOutputs(netlist: Netlist, names?: string[]): ModelOutput[] {
  const all = netlist.outputs.map((p) => ({ part: p.id, label: p.name, net: p.inputs[0] }));
  if (!names) return all;
  return names.map((n) => {
    const o = all.find((x) => x.label === n);
    if (!o) throw new BringupError(`no lamp or probe labelled "${n}" (lamps: ${all.map((x) => x.label).join(', ') || 'none'})`, 'outputs');
    return o;
  });
}

/** True when the board holds storage: a storage part or a loop of gates. */
export function isSequentialBoard(netlist: Netlist): boolean {
  return netlist.parts.some((p) => isStorageKind(p.kind)) || levelise(netlist).loopParts.length > 0;
}

/** Builds the combinational model (the board must hold no storage; see isSequentialBoard). */
export function buildModel(board: BoardFile, outputNames?: string[]): Model {
  const netlist = compileBoard(board);
  if (netlist.conflicts.length) throw new BringupError(`${netlist.problems.find((p) => p.kind === 'conflict')!.message}: fix the fighting outputs before bring-up`, netlist.nets[netlist.conflicts[0]].name);
  const inputs = handInputs(netlist);
  const outputs = readOutputs(netlist, outputNames);
  if (!outputs.length) throw new BringupError('the board has no lamp or probe to read', 'outputs');
  const sequential = isSequentialBoard(netlist);
  const nNets = netlist.nets.length;
  const driverInput = new Int32Array(nNets).fill(-1);
  const driverInvert = new Uint8Array(nNets);
  inputs.forEach((inp, i) => inp.nets.forEach(({ net, invert }) => { driverInput[net] = i; driverInvert[net] = invert ? 1 : 0; }));
  const fixed: { net: number; value: 0 | 1 }[] = [];
  const floating = familyOf(netlist.family).floating;
  for (const p of netlist.parts) {
    if (p.kind !== 'const') continue;
    const v = p.part.kind === 'const' && p.part.value === 1 ? 1 : 0;
    fixed.push({ net: p.outputs[0], value: v });
  }
  for (const net of netlist.undriven) {
    if (!netlist.nets[net].readers.length) continue;
    if (floating !== '0' && floating !== '1') {
      const r = netlist.nets[net].readers[0];
      throw new BringupError(`pin ${r.part}.${r.pin} is not connected and the ${netlist.family} family gives it no level: wire it (or tie it to a constant) before bring-up`, r.part);
    }
    fixed.push({ net, value: floating === '1' ? 1 : 0 });
  }
  const gates: ModelGate[] = [];
  const driverGate = new Int32Array(nNets).fill(-1);
  if (!sequential) {
    for (const p of levelise(netlist).order) {
      const op = OP[p.kind as keyof typeof OP];
      if (op === undefined) continue;
      driverGate[p.outputs[0]] = gates.length;
      gates.push({ part: p.id, op, out: p.outputs[0], ins: Int32Array.from(p.inputs), pins: p.inputPins });
    }
  }
  return { netlist, nNets, gates, inputs, outputs, fixed, driverGate, driverInput, driverInvert, sequential };
}

/** Nets from which some output can be reached (through gates, or any part for a sequential board). */
export function observableNets(netlist: Netlist, outputNets: number[]): Uint8Array {
  const seen = new Uint8Array(netlist.nets.length);
  const driversOf = new Map<number, number[]>();
  for (const p of netlist.parts) for (const n of p.outputs) { const l = driversOf.get(n) ?? []; l.push(p.index); driversOf.set(n, l); }
  const stack = [...outputNets];
  while (stack.length) {
    const n = stack.pop()!;
    if (seen[n]) continue;
    seen[n] = 1;
    for (const d of driversOf.get(n) ?? []) {
      const p = netlist.parts[d];
      if (isInputKind(p.kind) || isOutputKind(p.kind)) continue;
      for (const i of p.inputs) stack.push(i);
    }
  }
  return seen;
}
