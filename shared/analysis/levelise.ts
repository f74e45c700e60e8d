import { isInputKind, isOutputKind, isStorageKind } from '../board';
import type { CompiledPart, Netlist } from '../sim';
import { nodesOnCycles, type CsrGraph } from './scc';

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
 * parts make the nets they reach stateful. Which of them lie on a loop is one strongly-connected-components
 * pass (`scc.ts`). Everything is indexed by part index and net id, so the cost is linear in the board.
 */
export function levelise(netlist: Netlist): Levelised {
  const nNets = netlist.nets.length;
  const parts = netlist.parts;
  const nParts = parts.length;
  const combo = new Uint8Array(nParts);
  for (const p of parts) if (isCombinational(p)) combo[p.index] = 1;
  // combinational drivers per net, and the combinational readers of each net (each reader once per net)
  const drivers = new Int32Array(nNets);
  for (const p of parts) if (combo[p.index]) for (const net of p.outputs) drivers[net]++;
  const readStart = new Int32Array(nNets + 1);
  const lastReader = new Int32Array(nNets).fill(-1);
  const eachRead = (visit: (net: number, part: number) => void) => {
    lastReader.fill(-1);
    for (const p of parts) {
      if (!combo[p.index]) continue;
      for (const net of p.inputs) if (lastReader[net] !== p.index) { lastReader[net] = p.index; visit(net, p.index); }
    }
  };
  eachRead((net) => { readStart[net + 1]++; });
  for (let n = 0; n < nNets; n++) readStart[n + 1] += readStart[n];
  const readPart = new Int32Array(readStart[nNets]);
  const fill = readStart.slice(0, nNets);
  const waiting = new Int32Array(nParts);
  eachRead((net, part) => { readPart[fill[net]++] = part; waiting[part] += drivers[net]; });

  const queue = new Int32Array(nParts);
  let tail = 0;
  for (const p of parts) if (combo[p.index] && waiting[p.index] === 0) queue[tail++] = p.index;
  const placed = new Uint8Array(nParts);
  for (let head = 0; head < tail; head++) {
    const p = parts[queue[head]];
    placed[p.index] = 1;
    for (const net of p.outputs) for (let k = readStart[net]; k < readStart[net + 1]; k++) if (--waiting[readPart[k]] === 0) queue[tail++] = readPart[k];
  }
  const order: CompiledPart[] = Array.from(queue.subarray(0, tail), (i) => parts[i]);
  const unplaced = parts.filter((p) => combo[p.index] && !placed[p.index]);
  // stateful nets: outputs of storage parts and unplaced parts, then forward through combinational parts
  const stateful = new Uint8Array(nNets);
  for (const p of parts) if (isStorageKind(p.kind)) for (const n of p.outputs) stateful[n] = 1;
  for (const p of unplaced) for (const n of p.outputs) stateful[n] = 1;
  for (const p of order) if (p.inputs.some((n) => stateful[n])) for (const n of p.outputs) stateful[n] = 1;
  // parts on a loop (not merely after one): the cyclic components of the unplaced parts' graph
  const cyclic = unplaced.length ? nodesOnCycles(partGraph(parts, combo, placed, readStart, readPart)) : new Uint8Array(0);
  const loopParts = unplaced.filter((p) => cyclic[p.index]).map((p) => p.id);
  return { order, stateful, loopParts };
}

/** part → part edges (a part to each unplaced combinational part reading a net it drives), CSR by part index. */
function partGraph(parts: CompiledPart[], combo: Uint8Array, placed: Uint8Array, readStart: Int32Array, readPart: Int32Array): CsrGraph {
  const start = new Int32Array(parts.length + 1);
  const live = (i: number) => combo[i] === 1 && placed[i] === 0;
  for (const p of parts) {
    if (!live(p.index)) continue;
    for (const net of p.outputs) for (let k = readStart[net]; k < readStart[net + 1]; k++) if (live(readPart[k])) start[p.index + 1]++;
  }
  for (let i = 0; i < parts.length; i++) start[i + 1] += start[i];
  const to = new Int32Array(start[parts.length]);
  const at = start.slice(0, parts.length);
  for (const p of parts) {
    if (!live(p.index)) continue;
    for (const net of p.outputs) for (let k = readStart[net]; k < readStart[net + 1]; k++) if (live(readPart[k])) to[at[p.index]++] = readPart[k];
  }
  return { start, to };
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
