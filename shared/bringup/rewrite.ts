/**
 * Faults as board edits, for the event simulator: a pin stuck at a level is taken off its net (the rest
 * of the net stays joined) and tied to a constant; two swapped pins trade nets. The result is an ordinary
 * board file, so the simulator of `shared/sim` runs it unchanged (storage, gate loops and all).
 */
import { pinRef, type BoardFile, type Wire } from '../board';
import type { Netlist } from '../sim';

function otherPins(netlist: Netlist, part: string, pin: string, except: string[]): string[] {
  const net = netlist.nets[netlist.netOf(part, pin)];
  return [...net.drivers, ...net.readers].map((r) => pinRef(r.part, r.pin)).filter((ref) => !except.includes(ref));
}

function freshId(board: BoardFile, base: string): string {
  const ids = new Set(board.parts.map((p) => p.id));
  let id = base;
  for (let k = 1; ids.has(id); k++) id = `${base}${k}`;
  return id;
}

/** Joins pins in a chain of new wires (pins already on one net stay so; new wires are harmless). */
function chain(pins: string[], prefix: string, into: Wire[]): void {
  for (let k = 1; k < pins.length; k++) into.push({ id: `${prefix}${into.length}`, from: pins[0], to: pins[k] });
}

/** The board with `part.pin` stuck at `value` (taken off its net and tied to a constant). */
export function withStuckPin(board: BoardFile, netlist: Netlist, part: string, pin: string, value: 0 | 1): BoardFile {
  const ref = pinRef(part, pin);
  const rest = otherPins(netlist, part, pin, [ref]);
  const wires = board.wires.filter((w) => w.from !== ref && w.to !== ref);
  chain(rest, '__fault_w', wires);
  const cid = freshId(board, '__stuck');
  const isOutput = netlist.partById(part)!.outputPins.includes(pin);
  if (!isOutput) wires.push({ id: '__fault_tie', from: pinRef(cid, 'out'), to: ref });
  else if (rest.length) wires.push({ id: '__fault_tie', from: pinRef(cid, 'out'), to: rest[0] });
  return { ...board, parts: [...board.parts, { id: cid, kind: 'const', value, x: 0, y: 0 }], wires };
}

/** The board with two pins of one part trading their nets. */
export function withSwappedPins(board: BoardFile, netlist: Netlist, part: string, a: string, b: string): BoardFile {
  const ra = pinRef(part, a);
  const rb = pinRef(part, b);
  const onA = otherPins(netlist, part, a, [ra, rb]);
  const onB = otherPins(netlist, part, b, [ra, rb]);
  const wires = board.wires.filter((w) => w.from !== ra && w.to !== ra && w.from !== rb && w.to !== rb);
  chain(onA, '__swap_a', wires);
  chain(onB, '__swap_b', wires);
  if (onA.length) wires.push({ id: '__swap_ta', from: rb, to: onA[0] });
  if (onB.length) wires.push({ id: '__swap_tb', from: ra, to: onB[0] });
  return { ...board, wires };
}
