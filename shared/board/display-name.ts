/**
 * Readable names of parts and signals for the screens (bench, status lines): a part's label, else its
 * kind and number on the board ("NAND 3", the third NAND in file order). Ids stay internal; screens
 * show them in tooltips only.
 */
import { pinsOfPart } from './pins';
import type { BoardFile, Part } from './schema';
import type { PartKind } from './kinds';

/** Short kind names for a numbered part: trade names for gates, plain words for the rest. */
const SHORT: Record<PartKind, string> = {
  switch: 'Switch', button: 'Button', clock: 'Clock', const: 'Constant', lamp: 'Lamp', probe: 'Probe',
  buffer: 'Buffer', not: 'NOT', and: 'AND', or: 'OR', nand: 'NAND', nor: 'NOR', xor: 'XOR', xnor: 'XNOR',
  srlatch: 'SR latch', dlatch: 'D latch', dff: 'D flip-flop', mux2: 'Mux2', mux4: 'Mux4', note: 'Note', port: 'Port', module: 'Module',
};

/** Every part's readable name, by id: its label, or its kind and number ("NAND 3"). */
export function displayNames(board: BoardFile): Map<string, string> {
  const count = new Map<string, number>();
  const names = new Map<string, string>();
  for (const part of board.parts) {
    const n = (count.get(part.kind) ?? 0) + 1;
    count.set(part.kind, n);
    names.set(part.id, part.label ? part.label : `${SHORT[part.kind]} ${n}`);
  }
  return names;
}

/** One part's readable name (see displayNames; for many parts call that once). */
export function displayName(part: Part, board: BoardFile): string {
  return displayNames(board).get(part.id) ?? part.id;
}

/**
 * A readable form of a name from a simulation report: a part id ("NAND 3"), a pin reference `id.pin`
 * ("NAND 3 in0") or a net named after its driver `id_pin` or `id_pin_n7` ("NAND 3 out"). A label, or
 * anything else, comes back as it is.
 */
export function describeSignal(name: string, board: BoardFile, names: Map<string, string> = displayNames(board)): string {
  const own = names.get(name);
  if (own !== undefined) return own;
  const dot = name.lastIndexOf('.');
  if (dot > 0 && names.has(name.slice(0, dot))) return `${names.get(name.slice(0, dot))} ${name.slice(dot + 1)}`;
  for (const part of board.parts) {
    if (!name.startsWith(`${part.id}_`)) continue;
    const rest = name.slice(part.id.length + 1);
    const pins = pinsOfPart(part);
    const pin = [...pins.inputs, ...pins.outputs].find((p) => rest === p || rest.startsWith(`${p}_n`));
    if (pin) return `${names.get(part.id)} ${pin}`;
  }
  return name;
}
