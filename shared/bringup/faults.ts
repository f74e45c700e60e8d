/**
 * The single stuck-at fault list: sa0 and sa1 on every pin of every gate, block, storage part, switch,
 * button, clock, constant, lamp and probe — except output pins wired to nothing (no line in the build,
 * so nothing to be stuck). Uncollapsed; `collapseCount` gives the structurally collapsed count.
 */
import { isInputKind, isOutputKind, isStorageKind } from '../board';
import type { Netlist } from '../sim';
import type { Fault } from './types';

/** `"g2.out sa0"` */
export function faultName(part: string, pin: string, value: 0 | 1): string {
  return `${part}.${pin} sa${value}`;
}

/** Every fault of the board, in file order of the parts, pins in pin order, sa0 before sa1. */
export function faultList(netlist: Netlist): Fault[] {
  const faults: Fault[] = [];
  for (const p of netlist.parts) {
    if (p.kind === 'note') continue;
    const pins: string[] = [...p.inputPins];
    p.outputPins.forEach((pin, k) => {
      const net = netlist.nets[p.outputs[k]];
      if (net.readers.length > 0 || net.drivers.length > 1) pins.push(pin);
    });
    for (const pin of pins) for (const value of [0, 1] as const) faults.push({ index: faults.length, part: p.id, pin, value, name: faultName(p.id, pin, value) });
  }
  return faults;
}

/** Index of each fault by name. */
export function faultIndex(faults: Fault[]): Map<string, number> {
  return new Map(faults.map((f) => [f.name, f.index]));
}

/**
 * Structural equivalence classes (a union-find over the fault list): a wire with one driver and one
 * reader is one line (the two pins' faults are the same); a controlling value stuck on an AND/NAND/OR/NOR
 * input equals the output stuck at the value it forces; an inverter's and a buffer's input faults equal
 * output faults. Returns the class representative (lowest index) of each fault.
 */
export function collapseClasses(netlist: Netlist, faults: Fault[]): Int32Array {
  const idx = faultIndex(faults);
  const parent = Int32Array.from(faults, (_, i) => i);
  const find = (i: number): number => { while (parent[i] !== i) { parent[i] = parent[parent[i]]; i = parent[i]; } return i; };
  const join = (a: string, b: string) => {
    const x = idx.get(a); const y = idx.get(b);
    if (x === undefined || y === undefined) return;
    const rx = find(x); const ry = find(y);
    if (rx !== ry) { if (rx < ry) parent[ry] = rx; else parent[rx] = ry; }
  };
  for (const net of netlist.nets) {
    if (net.drivers.length !== 1 || net.readers.length !== 1) continue;
    const d = net.drivers[0]; const r = net.readers[0];
    for (const v of [0, 1] as const) join(faultName(d.part, d.pin, v), faultName(r.part, r.pin, v));
  }
  const controlling: Record<string, [0 | 1, 0 | 1]> = { and: [0, 0], nand: [0, 1], or: [1, 1], nor: [1, 0] };
  for (const p of netlist.parts) {
    if (p.kind in controlling) {
      const [c, o] = controlling[p.kind];
      for (const pin of p.inputPins) join(faultName(p.id, pin, c), faultName(p.id, 'out', o));
    } else if (p.kind === 'not' || p.kind === 'buffer') {
      for (const v of [0, 1] as const) join(faultName(p.id, 'in0', v), faultName(p.id, 'out', (p.kind === 'not' ? 1 - v : v) as 0 | 1));
    }
  }
  return Int32Array.from(faults, (_, i) => find(i));
}

/** Number of structural equivalence classes. */
export function collapseCount(netlist: Netlist, faults: Fault[]): number {
  const rep = collapseClasses(netlist, faults);
  let n = 0;
  rep.forEach((r, i) => { if (r === i) n++; });
  return n;
}

/** True for parts whose pins are evaluated by the combinational model. */
export function isLogicPart(kind: string): boolean {
  return !isInputKind(kind) && !isOutputKind(kind) && !isStorageKind(kind) && kind !== 'note';
}
