/**
 * The fan-in cone of a table's outputs in one depth-first pass: which outputs depend on stored state,
 * and the cone's combinational parts in evaluation order — without levelising the whole board. A loop
 * in the cone (met as a part reached again while it is still being visited) hands over to `levelise`,
 * whose rules then decide; so the result is always the one `levelise` gives, only cheaper when there is
 * no loop. Everything is indexed by part index and net id on typed arrays: linear in the cone, with
 * few operations per part, which matters in a fresh process where this code runs before it is optimised.
 */
import { isInputKind, isOutputKind, isStorageKind } from '../board';
import type { Netlist } from '../sim';
import { levelise } from './levelise';

/** What the truth table needs to know about the fan-in of its outputs. */
export interface Cone {
  /** per requested net: 1 when its value can depend on stored state (a storage part or a loop in its fan-in) */
  stateful: Uint8Array;
  /** combinational parts of the fan-in (indices into `netlist.parts`), each after the parts driving its inputs */
  order: Int32Array;
  /** per net: how many pins drive it */
  driverCount: Int32Array;
  /** per net with exactly one driver: the driving part's index, else −1 */
  driver: Int32Array;
  /** per net with exactly one driver: which output pin of that part */
  driverPin: Int32Array;
  /** per part: 1 combinational, 2 input, 3 storage, 0 other (outputs, notes) */
  kindClass: Uint8Array;
  /** net ids are below this (one past the highest net of any pin) */
  nNets: number;
}

const COMBINATIONAL = 1;
const INPUT = 2;
const STORAGE = 3;
const classCache = new Map<string, number>();

/** The class of a part kind (combinational as in `isCombinational`). */
function classOf(kind: string): number {
  let c = classCache.get(kind);
  if (c === undefined) {
    c = isInputKind(kind) ? INPUT : isStorageKind(kind) ? STORAGE : isOutputKind(kind) || kind === 'note' ? 0 : COMBINATIONAL;
    classCache.set(kind, c);
  }
  return c;
}

/** The cone of `nets` (see the module comment). */
export function tableCone(netlist: Netlist, nets: number[]): Cone {
  const parts = netlist.parts;
  const nParts = parts.length;
  const nNets = netBound(netlist);
  const kindClass = new Uint8Array(nParts);
  const driverCount = new Int32Array(nNets);
  const driver = new Int32Array(nNets).fill(-1);
  const driverPin = new Int32Array(nNets);
  for (let i = 0; i < nParts; i++) {
    const p = parts[i];
    kindClass[i] = classOf(p.kind);
    const outs = p.outputs;
    for (let k = 0; k < outs.length; k++) {
      const net = outs[k];
      if (driverCount[net]++ === 0) { driver[net] = i; driverPin[net] = k; } else driver[net] = -1;
    }
  }
  const base = { driverCount, driver, driverPin, kindClass, nNets };
  return depthFirst(netlist, nets, base) ?? fromLevelised(netlist, nets, base);
}

/**
 * One past the highest net id on any pin. Not `netlist.nets.length`: the netlist describes its nets
 * (drivers, readers, names: an object and strings per net) only when they are first read, which in a
 * fresh process costs more than the whole combinational table; the table needs only the ids.
 */
function netBound(netlist: Netlist): number {
  const parts = netlist.parts;
  let max = -1;
  for (let i = 0; i < parts.length; i++) {
    const ins = parts[i].inputs;
    for (let k = 0; k < ins.length; k++) if (ins[k] > max) max = ins[k];
    const outs = parts[i].outputs;
    for (let k = 0; k < outs.length; k++) if (outs[k] > max) max = outs[k];
  }
  return max + 1;
}

/** 0 not yet known, 2 clean, 3 stateful (nets and parts); 1: a part being visited. */
const ON_PATH = 1;
const CLEAN = 2;
const STATEFUL = 3;

type Base = Omit<Cone, 'stateful' | 'order'>;

function depthFirst(netlist: Netlist, nets: number[], base: Base): Cone | undefined {
  const { driverCount, driver, kindClass } = base;
  const parts = netlist.parts;
  const nParts = parts.length;
  const partState = new Uint8Array(nParts);
  const netState = new Uint8Array(base.nNets);
  const order = new Int32Array(nParts);
  let placed = 0;
  // frames: a part (−1: the requested nets) and the next of its input nets
  const framePart = new Int32Array(nParts + 1);
  const frameInput = new Int32Array(nParts + 1);
  let depth = 0;
  framePart[0] = -1;
  frameInput[0] = 0;
  while (depth >= 0) {
    const p = framePart[depth];
    const ins = p < 0 ? nets : parts[p].inputs;
    let i = frameInput[depth];
    let pushed = false;
    for (; i < ins.length; i++) {
      const net = ins[i];
      if (netState[net] !== 0) continue;
      const count = driverCount[net];
      if (count === 0) { netState[net] = CLEAN; continue; }
      const d = count === 1 ? driver[net] : -1;
      if (d >= 0) {
        const c = kindClass[d];
        if (c !== COMBINATIONAL) { netState[net] = c === STORAGE ? STATEFUL : CLEAN; continue; }
        const s = partState[d];
        if (s === ON_PATH) return undefined; // a loop
        if (s !== 0) { netState[net] = s; continue; }
        partState[d] = ON_PATH;
        frameInput[depth] = i;
        depth++;
        framePart[depth] = d;
        frameInput[depth] = 0;
        pushed = true;
        break;
      }
      // two or more drivers (rare): each must be known before the net is
      const next = unknownDriver(netlist, net, kindClass, partState);
      if (next === -2) return undefined;
      if (next >= 0) {
        partState[next] = ON_PATH;
        frameInput[depth] = i;
        depth++;
        framePart[depth] = next;
        frameInput[depth] = 0;
        pushed = true;
        break;
      }
      netState[net] = multiState(netlist, net, kindClass, partState);
    }
    if (pushed) continue;
    if (p >= 0) {
      let s = CLEAN;
      for (let k = 0; k < ins.length; k++) if (netState[ins[k]] === STATEFUL) s = STATEFUL;
      partState[p] = s;
      order[placed++] = p;
    }
    depth--;
  }
  const stateful = new Uint8Array(nets.length);
  for (let k = 0; k < nets.length; k++) stateful[k] = netState[nets[k]] === STATEFUL ? 1 : 0;
  return { ...base, stateful, order: order.subarray(0, placed) };
}

/** Part indices driving a net, from the netlist's driver list (only for nets with two or more drivers). */
function driversOf(netlist: Netlist, net: number): number[] {
  return netlist.nets[net].drivers.map((r) => netlist.partById(r.part)!.index);
}

/** A combinational driver of the net not yet visited (−1: none; −2: one is being visited — a loop). */
function unknownDriver(netlist: Netlist, net: number, kindClass: Uint8Array, partState: Uint8Array): number {
  for (const d of driversOf(netlist, net)) {
    if (kindClass[d] !== COMBINATIONAL) continue;
    if (partState[d] === ON_PATH) return -2;
    if (partState[d] === 0) return d;
  }
  return -1;
}

/** Stateful when any driver is a storage part or a stateful combinational part. */
function multiState(netlist: Netlist, net: number, kindClass: Uint8Array, partState: Uint8Array): number {
  for (const d of driversOf(netlist, net)) {
    if (kindClass[d] === STORAGE || (kindClass[d] === COMBINATIONAL && partState[d] === STATEFUL)) return STATEFUL;
  }
  return CLEAN;
}

/** With a loop in the cone: the levelised board decides. */
function fromLevelised(netlist: Netlist, nets: number[], base: Base): Cone {
  const lev = levelise(netlist);
  const stateful = Uint8Array.from(nets, (net) => lev.stateful[net]);
  return { ...base, stateful, order: Int32Array.from(lev.order, (p) => p.index) };
}
