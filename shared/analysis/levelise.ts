import { isInputKind, isOutputKind, isStorageKind } from '../board';
import type { CompiledPart, Netlist } from '../sim';

/** The combinational parts in evaluation order, and which nets depend on stored state. */
export interface Levelised {
  /** gates, buffers, inverters and multiplexers outside feedback loops, each after the parts driving it */
  order: CompiledPart[];
  /** per net: 1 when its value can depend on stored state (a storage part or a feedback loop in its fan-in) */
  stateful: Uint8Array;
  /** ids of parts on combinational feedback loops */
  loopParts: string[];
}

/** True for the parts the bit-parallel evaluator computes. */
export function isCombinational(p: CompiledPart): boolean {
  return !isInputKind(p.kind) && !isOutputKind(p.kind) && !isStorageKind(p.kind) && p.kind !== 'note';
}

/**
 * Levelises a netlist (Kahn's algorithm over the part graph): a part is ready when every part driving
 * one of its inputs is placed. Parts never placed lie on (or after) a feedback loop; they and storage
 * parts make the nets they reach stateful.
 */
export function levelise(netlist: Netlist): Levelised {
  const nNets = netlist.nets.length;
  const driversOf: number[][] = Array.from({ length: nNets }, () => []);
  netlist.parts.forEach((p) => { if (isCombinational(p)) p.outputs.forEach((net) => driversOf[net].push(p.index)); });
  const combo = netlist.parts.filter(isCombinational);
  const waiting = new Int32Array(netlist.parts.length);
  const readers: number[][] = Array.from({ length: nNets }, () => []);
  for (const p of combo) {
    const nets = [...new Set(p.inputs)];
    let count = 0;
    for (const net of nets) { count += driversOf[net].length; readers[net].push(p.index); }
    waiting[p.index] = count;
  }
  const queue = combo.filter((p) => waiting[p.index] === 0).map((p) => p.index);
  const order: CompiledPart[] = [];
  for (let head = 0; head < queue.length; head++) {
    const p = netlist.parts[queue[head]];
    order.push(p);
    for (const net of p.outputs) for (const r of readers[net]) if (--waiting[r] === 0) queue.push(r);
  }
  const placed = new Set(order.map((p) => p.index));
  const unplaced = combo.filter((p) => !placed.has(p.index));
  // stateful nets: outputs of storage parts and unplaced parts, then forward through combinational parts
  const stateful = new Uint8Array(nNets);
  for (const p of netlist.parts) if (isStorageKind(p.kind)) p.outputs.forEach((n) => { stateful[n] = 1; });
  for (const p of unplaced) p.outputs.forEach((n) => { stateful[n] = 1; });
  for (const p of order) if (p.inputs.some((n) => stateful[n])) p.outputs.forEach((n) => { stateful[n] = 1; });
  // parts on a loop (not merely after one): those reachable from themselves
  const loopParts = unplaced.filter((p) => reachesItself(netlist, p)).map((p) => p.id);
  return { order, stateful, loopParts };
}

function reachesItself(netlist: Netlist, start: CompiledPart): boolean {
  const seen = new Set<number>();
  const stack = [...start.outputs];
  const readersOf = (net: number) => netlist.nets[net].readers;
  while (stack.length) {
    const net = stack.pop()!;
    if (seen.has(net)) continue;
    seen.add(net);
    for (const r of readersOf(net)) {
      const p = netlist.partById(r.part);
      if (!p || !isCombinational(p)) continue;
      if (p.index === start.index) return true;
      stack.push(...p.outputs);
    }
  }
  return false;
}

/**
 * The fan-in cone of the given parts: every part whose output can reach them, walking back from their
 * input nets through the parts driving those nets. The start parts are included.
 */
export function fanInCone(netlist: Netlist, partIds: Iterable<string>): Set<string> {
  const out = new Set<string>();
  const seenNets = new Set<number>();
  const stack: number[] = [];
  for (const id of partIds) {
    const p = netlist.partById(id);
    if (!p) continue;
    out.add(p.id);
    stack.push(...p.inputs);
  }
  while (stack.length) {
    const net = stack.pop()!;
    if (seenNets.has(net)) continue;
    seenNets.add(net);
    for (const d of netlist.nets[net].drivers) {
      if (out.has(d.part)) continue;
      out.add(d.part);
      const p = netlist.partById(d.part);
      if (p) stack.push(...p.inputs);
    }
  }
  return out;
}
