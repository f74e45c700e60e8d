/**
 * Board → netlist: nets as unions of joined pins (union-find), their drivers and readers, and the driver
 * analysis (undriven nets, conflicting drivers).
 */
import { isInputKind, isOutputKind, pinsOf, signalName, type BoardFile, type FamilyId, type Part } from '../board';
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
  return pinsOf(part.kind, 'inputs' in part ? part.inputs : 2);
}

/**
 * Compiles a board into a netlist. Wires to unknown parts or pins are skipped here (parseBoardFile
 * reports them); every pin belongs to exactly one net, an unconnected pin to a net of its own.
 */
export function compileBoard(board: BoardFile, opts: CompileOptions = {}): Netlist {
  const family = opts.family ?? board.family ?? 'ideal';
  const delays = familyDelays(family);
  // Slot per pin: part p's pins are slots base[p] … base[p] + count − 1 (inputs first).
  const slotOf = new Map<string, number>();
  const slotPin: { part: number; pin: string; output: boolean }[] = [];
  const pins = board.parts.map((part, p) => {
    const pp = partPins(part);
    for (const pin of pp.inputs) { slotOf.set(`${part.id}.${pin}`, slotPin.length); slotPin.push({ part: p, pin, output: false }); }
    for (const pin of pp.outputs) { slotOf.set(`${part.id}.${pin}`, slotPin.length); slotPin.push({ part: p, pin, output: true }); }
    return pp;
  });
  const parent = new Int32Array(slotPin.length);
  for (let i = 0; i < parent.length; i++) parent[i] = i;
  for (const wire of board.wires) {
    const a = slotOf.get(wire.from);
    const b = slotOf.get(wire.to);
    if (a === undefined || b === undefined) continue;
    const ra = find(parent, a);
    const rb = find(parent, b);
    // the smaller root wins so that net ids follow file order
    if (ra !== rb) { if (ra < rb) parent[rb] = ra; else parent[ra] = rb; }
  }
  const netOfSlot = new Int32Array(slotPin.length);
  const rootNet = new Map<number, number>();
  const nets: NetInfo[] = [];
  for (let s = 0; s < slotPin.length; s++) {
    const r = find(parent, s);
    let n = rootNet.get(r);
    if (n === undefined) {
      n = nets.length;
      rootNet.set(r, n);
      nets.push({ id: n, name: '', drivers: [], readers: [] });
    }
    netOfSlot[s] = n;
    const sp = slotPin[s];
    const ref: PinRef = { part: board.parts[sp.part].id, pin: sp.pin };
    (sp.output ? nets[n].drivers : nets[n].readers).push(ref);
  }
  nameNets(board, nets, slotOf, netOfSlot);

  const parts: CompiledPart[] = board.parts.map((part, index) => {
    const pp = pins[index];
    const source = isInputKind(part.kind);
    return {
      index, id: part.id, kind: part.kind, name: signalName(part),
      inputPins: pp.inputs, inputs: pp.inputs.map((pin) => netOfSlot[slotOf.get(`${part.id}.${pin}`)!]),
      outputPins: pp.outputs, outputs: pp.outputs.map((pin) => netOfSlot[slotOf.get(`${part.id}.${pin}`)!]),
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
      const s = slotOf.get(`${partId}.${pin}`);
      if (s === undefined) throw new Error(`no pin ${partId}.${pin}`);
      return netOfSlot[s];
    },
    partById: (id) => byId.get(id),
  };
}

/** Net names: an input/output label on it, else `<partId>_<pin>` of its driver, else of its first pin; unique. */
function nameNets(board: BoardFile, nets: NetInfo[], slotOf: Map<string, number>, netOfSlot: Int32Array): void {
  const labelled = new Map<number, string>();
  for (const part of board.parts) {
    if (!(isInputKind(part.kind) || isOutputKind(part.kind)) || !part.label) continue;
    const pin = isInputKind(part.kind) ? 'out' : 'in';
    const n = netOfSlot[slotOf.get(`${part.id}.${pin}`)!];
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
