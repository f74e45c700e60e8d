/**
 * Board → netlist: nets as unions of joined pins (union-find), their drivers and readers, and the driver
 * analysis (undriven nets, conflicting drivers).
 */
import { flattenBoard, isInputKind, isOutputKind, pinsOfPart, signalName, splitPinRef, type BoardFile, type FamilyId, type Part } from '../board';
import { familyDelays } from './families';
import type { CompiledPart, NetInfo, NetProblem, Netlist, PinRef } from './types';

/** Options of compileBoard. */
export interface CompileOptions {
  /** family for the delays (default: the board's family) */
  family?: FamilyId;
}

function find(parent: Int32Array, i: number): number {
  let r = i;
  while (parent[r] !== r) r = parent[r];
  // path compression keeps later finds short on long wire chains
  while (parent[i] !== r) {
    const next = parent[i];
    parent[i] = r;
    i = next;
  }
  return r;
}

/** Pins of a part as the simulator sees them. */
export function partPins(part: Part): { inputs: string[]; outputs: string[] } {
  return pinsOfPart(part);
}

/**
 * Compiles a board into a netlist. Wires to unknown parts or pins are skipped here (parseBoardFile
 * reports them); every pin belongs to exactly one net, an unconnected pin to a net of its own.
 * A board with modules is flattened first (flattenBoard): the netlist's parts and `board` are the flat
 * ones, with path ids such as `u3/g2`.
 */
export function compileBoard(hierarchical: BoardFile, opts: CompileOptions = {}): Netlist {
  const board = flattenBoard(hierarchical);
  const family = opts.family ?? board.family ?? 'ideal';
  const delays = familyDelays(family);
  // Slot per pin: part p's pins are slots base[p] … base[p] + count − 1 (inputs first).
  const partIndex = new Map<string, number>();
  const base = new Int32Array(board.parts.length + 1);
  const pins = board.parts.map((part, p) => {
    if (!partIndex.has(part.id)) partIndex.set(part.id, p);
    const pp = partPins(part);
    base[p + 1] = base[p] + pp.inputs.length + pp.outputs.length;
    return pp;
  });
  const nSlots = base[board.parts.length];
  const slotPart = new Int32Array(nSlots);
  for (let p = 0; p < board.parts.length; p++) slotPart.fill(p, base[p], base[p + 1]);
  const slotPinName = (s: number) => {
    const p = slotPart[s];
    const k = s - base[p];
    const pp = pins[p];
    return k < pp.inputs.length ? pp.inputs[k] : pp.outputs[k - pp.inputs.length];
  };
  const isOutputSlot = (s: number) => s - base[slotPart[s]] >= pins[slotPart[s]].inputs.length;
  const slotOfPin = (partId: string, pin: string): number | undefined => {
    const p = partIndex.get(partId);
    if (p === undefined) return undefined;
    const i = pins[p].inputs.indexOf(pin);
    if (i >= 0) return base[p] + i;
    const o = pins[p].outputs.indexOf(pin);
    return o >= 0 ? base[p] + pins[p].inputs.length + o : undefined;
  };
  const slotOfRef = (ref: string): number | undefined => {
    const split = splitPinRef(ref);
    return split ? slotOfPin(split.part, split.pin) : undefined;
  };
  const parent = new Int32Array(nSlots);
  for (let i = 0; i < parent.length; i++) parent[i] = i;
  for (const wire of board.wires) {
    const a = slotOfRef(wire.from);
    const b = slotOfRef(wire.to);
    if (a === undefined || b === undefined) continue;
    const ra = find(parent, a);
    const rb = find(parent, b);
    // the smaller root wins so that net ids follow file order
    if (ra !== rb) { if (ra < rb) parent[rb] = ra; else parent[ra] = rb; }
  }
  const netOfSlot = new Int32Array(nSlots);
  const rootNet = new Map<number, number>();
  const nets: NetInfo[] = [];
  for (let s = 0; s < nSlots; s++) {
    const r = find(parent, s);
    let n = rootNet.get(r);
    if (n === undefined) {
      n = nets.length;
      rootNet.set(r, n);
      nets.push({ id: n, name: '', drivers: [], readers: [] });
    }
    netOfSlot[s] = n;
    const ref: PinRef = { part: board.parts[slotPart[s]].id, pin: slotPinName(s) };
    (isOutputSlot(s) ? nets[n].drivers : nets[n].readers).push(ref);
  }
  nameNets(board, nets, (partId, pin) => netOfSlot[slotOfPin(partId, pin)!]);

  const parts: CompiledPart[] = board.parts.map((part, index) => {
    const pp = pins[index];
    const source = isInputKind(part.kind);
    return {
      index, id: part.id, kind: part.kind, name: signalName(part),
      inputPins: pp.inputs, inputs: pp.inputs.map((_, k) => netOfSlot[base[index] + k]),
      outputPins: pp.outputs, outputs: pp.outputs.map((_, k) => netOfSlot[base[index] + pp.inputs.length + k]),
      rise: source ? 0 : delays.rise, fall: source ? 0 : delays.fall,
      part,
    };
  });
  const byId = new Map(parts.map((p) => [p.id, p]));
  const undriven = nets.filter((n) => n.drivers.length === 0).map((n) => n.id);
  const conflicts = nets.filter((n) => n.drivers.length > 1).map((n) => n.id);
  const problems: NetProblem[] = [
    ...undriven.map((id): NetProblem => ({ kind: 'undriven', net: id, name: nets[id].name,
      message: `net ${nets[id].name} has no driver (read by ${nets[id].readers.map((r) => `${r.part}.${r.pin}`).join(', ')})` })),
    ...conflicts.map((id): NetProblem => ({ kind: 'conflict', net: id, name: nets[id].name,
      message: `net ${nets[id].name} has ${nets[id].drivers.length} drivers (${nets[id].drivers.map((r) => `${r.part}.${r.pin}`).join(', ')})` })),
  ];
  return {
    board, family, nets, parts,
    inputs: parts.filter((p) => isInputKind(p.kind)),
    outputs: parts.filter((p) => isOutputKind(p.kind)),
    undriven, conflicts, problems,
    netOf(partId, pin) {
      const s = slotOfPin(partId, pin);
      if (s === undefined) throw new Error(`no pin ${partId}.${pin}`);
      return netOfSlot[s];
    },
    partById: (id) => byId.get(id),
  };
}

/** Net names: an input/output label on it, else `<partId>_<pin>` of its driver, else of its first pin; unique. */
function nameNets(board: BoardFile, nets: NetInfo[], netOf: (partId: string, pin: string) => number): void {
  const labelled = new Map<number, string>();
  for (const part of board.parts) {
    if (!(isInputKind(part.kind) || isOutputKind(part.kind)) || !part.label) continue;
    const pin = isInputKind(part.kind) ? 'out' : 'in';
    const n = netOf(part.id, pin);
    if (!labelled.has(n)) labelled.set(n, signalName(part));
  }
  // labels are unique already; reserve them so that no generated name takes one
  const used = new Set<string>(labelled.values());
  for (const net of nets) {
    const label = labelled.get(net.id);
    if (label !== undefined) { net.name = label; continue; }
    const first = net.drivers[0] ?? net.readers[0];
    let name = `${first.part}_${first.pin}`;
    if (used.has(name)) name = `${name}_n${net.id}`;
    used.add(name);
    net.name = name;
  }
}
