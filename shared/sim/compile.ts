/**
 * Board → netlist: nets as unions of joined pins (union-find), their drivers and readers, and the driver
 * analysis (undriven nets, conflicting drivers).
 */
import { flattenBoard, isInputKind, isOutputKind, pinsOfPart, signalName, type BoardFile, type FamilyId, type Part } from '../board';
import { familyDelays } from './families';
import { flatLayout, moduleLayout, type PinLayout } from './compile-levels';
import type { CompiledPart, NetInfo, NetProblem, Netlist, PinRef } from './types';

/** Options of compileBoard. */
export interface CompileOptions {
  /** family for the delays (default: the board's family) */
  family?: FamilyId;
}

/** Pins of a part as the simulator sees them. */
export function partPins(part: Part): { inputs: string[]; outputs: string[] } {
  return pinsOfPart(part);
}

/**
 * Compiles a board into a netlist. Wires to unknown parts or pins are skipped here (parseBoardFile
 * reports them); every pin belongs to exactly one net, an unconnected pin to a net of its own.
 * A board with modules is compiled as its flat board (flattenBoard): the netlist's parts and `board` are
 * the flat ones, with path ids such as `u3/g2`. Each module's inside is laid out once and copied per
 * instance (compile-levels.ts), so the flat board itself is only built when someone reads `board`.
 */
export function compileBoard(hierarchical: BoardFile, opts: CompileOptions = {}): Netlist {
  const hasModules = !!hierarchical.modules?.length || hierarchical.parts.some((p) => p.kind === 'module');
  const fast = hasModules ? moduleLayout(hierarchical) : null;
  let flat: BoardFile | undefined = hasModules ? undefined : hierarchical;
  if (hasModules && !fast) flat = flattenBoard(hierarchical);
  const lay = fast ?? flatLayout(flat!);
  const boardOf = () => (flat ??= flattenBoard(hierarchical));
  return buildNetlist(lay, boardOf, opts.family ?? hierarchical.family ?? 'ideal');
}

/**
 * The netlist over a layout. The parts are made at once; the nets (drivers, readers, names) and the
 * problems only when first read — the simulator works from the parts alone, so compile and settle of a
 * board never build a string per net.
 */
function buildNetlist(lay: PinLayout, boardOf: () => BoardFile, family: FamilyId): Netlist {
  const delays = familyDelays(family);
  const { parts: flatParts, pins, slotBase, slotNet } = lay;
  const n = flatParts.length;
  const parts: CompiledPart[] = new Array<CompiledPart>(n);
  const inputs: CompiledPart[] = [];
  const outputs: CompiledPart[] = [];
  for (let index = 0; index < n; index++) {
    const part = flatParts[index];
    const pp = pins[index];
    const id = part.id;
    const b = slotBase[index];
    const nIn = pp.inputs.length;
    const ins: number[] = new Array<number>(nIn);
    for (let k = 0; k < nIn; k++) ins[k] = slotNet[b + k];
    const nOut = pp.outputs.length;
    const outs: number[] = new Array<number>(nOut);
    for (let k = 0; k < nOut; k++) outs[k] = slotNet[b + nIn + k];
    const source = isInputKind(part.kind);
    const compiled: CompiledPart = {
      index, id, kind: part.kind, name: part.label === undefined ? id : signalName(part),
      inputPins: pp.inputs, inputs: ins, outputPins: pp.outputs, outputs: outs,
      rise: source ? 0 : delays.rise, fall: source ? 0 : delays.fall,
      part,
    };
    parts[index] = compiled;
    if (source) inputs.push(compiled);
    else if (isOutputKind(part.kind)) outputs.push(compiled);
  }
  const slotOfPinAt = (p: number, pin: string): number | undefined => {
    const i = pins[p].inputs.indexOf(pin);
    if (i >= 0) return slotBase[p] + i;
    const o = pins[p].outputs.indexOf(pin);
    return o >= 0 ? slotBase[p] + pins[p].inputs.length + o : undefined;
  };
  /** slot of a pin, by the first part with that id (as the flat board's wires resolve) */
  const slotOfPin = (partId: string, pin: string): number | undefined => {
    const p = lay.index().get(partId);
    return p === undefined ? undefined : slotOfPinAt(p, pin);
  };
  // by id the last part with it (ids repeat only on a flat board, which parseBoardFile refuses)
  let lastById: Map<string, CompiledPart> | undefined;
  const partById = (id: string): CompiledPart | undefined => {
    if (lay.repeats) return (lastById ??= new Map(parts.map((p) => [p.id, p]))).get(id);
    const p = lay.index().get(id);
    return p === undefined ? undefined : parts[p];
  };
  let nets: NetDescription | undefined;
  const described = () => (nets ??= describeNets(lay, (p, pin) => {
    // a pin of the first part with that id, as lookups by id resolve (ids repeat only on a flat board)
    const s = lay.repeats ? slotOfPin(flatParts[p].id, pin) : slotOfPinAt(p, pin);
    return s === undefined ? undefined : slotNet[s];
  }));
  let board: BoardFile | undefined;
  return {
    get board() { return (board ??= boardOf()); },
    family,
    get nets() { return described().nets; },
    parts, inputs, outputs,
    get undriven() { return described().undriven; },
    get conflicts() { return described().conflicts; },
    get problems() { return described().problems; },
    netOf(partId, pin) {
      const s = slotOfPin(partId, pin);
      if (s === undefined) throw new Error(`no pin ${partId}.${pin}`);
      return slotNet[s];
    },
    partById,
  };
}

interface NetDescription {
  nets: NetInfo[];
  undriven: number[];
  conflicts: number[];
  problems: NetProblem[];
}

/** The nets of a layout: drivers and readers (each list made at its size), names, and the driver analysis. */
function describeNets(lay: PinLayout, netOfPin: (p: number, pin: string) => number | undefined): NetDescription {
  const { parts, pins, slotBase, slotNet, nNets } = lay;
  const n = parts.length;
  const nRead = new Int32Array(nNets);
  const nDrive = new Int32Array(nNets);
  for (let p = 0; p < n; p++) {
    const b = slotBase[p];
    const nIn = pins[p].inputs.length;
    for (let s = b; s < b + nIn; s++) nRead[slotNet[s]]++;
    for (let s = b + nIn; s < slotBase[p + 1]; s++) nDrive[slotNet[s]]++;
  }
  const nets: NetInfo[] = new Array<NetInfo>(nNets);
  for (let i = 0; i < nNets; i++) nets[i] = { id: i, name: '', drivers: new Array<PinRef>(nDrive[i]), readers: new Array<PinRef>(nRead[i]) };
  nRead.fill(0);
  nDrive.fill(0);
  for (let p = 0; p < n; p++) {
    const id = parts[p].id;
    const pp = pins[p];
    const b = slotBase[p];
    const nIn = pp.inputs.length;
    for (let k = 0; k < nIn; k++) { const net = slotNet[b + k]; nets[net].readers[nRead[net]++] = { part: id, pin: pp.inputs[k] }; }
    for (let k = 0; k < pp.outputs.length; k++) { const net = slotNet[b + nIn + k]; nets[net].drivers[nDrive[net]++] = { part: id, pin: pp.outputs[k] }; }
  }
  nameNets(parts, nets, netOfPin);
  const undriven: number[] = [];
  const conflicts: number[] = [];
  for (const net of nets) {
    if (net.drivers.length === 0) undriven.push(net.id);
    else if (net.drivers.length > 1) conflicts.push(net.id);
  }
  const problems: NetProblem[] = [
    ...undriven.map((id): NetProblem => ({ kind: 'undriven', net: id, name: nets[id].name,
      message: `net ${nets[id].name} has no driver (read by ${nets[id].readers.map((r) => `${r.part}.${r.pin}`).join(', ')})` })),
    ...conflicts.map((id): NetProblem => ({ kind: 'conflict', net: id, name: nets[id].name,
      message: `net ${nets[id].name} has ${nets[id].drivers.length} drivers (${nets[id].drivers.map((r) => `${r.part}.${r.pin}`).join(', ')})` })),
  ];
  return { nets, undriven, conflicts, problems };
}

/** Net names: an input/output label on it, else `<partId>_<pin>` of its driver, else of its first pin; unique. */
function nameNets(parts: readonly Part[], nets: NetInfo[], netOf: (p: number, pin: string) => number | undefined): void {
  const labelled = new Map<number | undefined, string>();
  for (let p = 0; p < parts.length; p++) {
    const part = parts[p];
    if (!part.label || !(isInputKind(part.kind) || isOutputKind(part.kind))) continue;
    const n = netOf(p, isInputKind(part.kind) ? 'out' : 'in');
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
