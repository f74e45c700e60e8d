/**
 * Make a module from a selection, as a pure function on one level of a board (the top level or a
 * module's inside): the selected parts move into a new module, every net that crosses the selection's
 * edge becomes one port, and the selection is replaced by an instance wired where the parts were.
 * The named edit `makeModule` and the tests both use it.
 */
import { isInputKind, isOutputKind } from './kinds';
import { LABEL_RE, isNamedKind } from './labels';
import { pinSide, pinRef, splitPinRef, type ModulePins } from './pins';
import type { Module, Part, Wire } from './schema';

/** One level of a board: its parts and wires. */
export interface BoardLevel {
  parts: Part[];
  wires: Wire[];
}

export interface ExtractOptions {
  moduleId: string;
  instanceId: string;
  title: string;
  /** pins of the board's existing modules (for instances inside the selection) */
  modulePins?: ModulePins;
  /**
   * port names asked of the user, keyed by a pin of the crossing net inside the selection (`g2.in0`);
   * otherwise a port is named from a label on its net, else `in1`, `out1`, …
   */
  names?: Record<string, string>;
}

export interface Extracted {
  module: Module;
  level: BoardLevel;
  /** the parts that stayed outside although selected (inputs and outputs: a module takes them through ports) */
  keptOutside: string[];
}

/** Kinds that never move into a module (inputs and outputs of the board stay where they are). */
function staysOutside(part: Part): boolean {
  return isInputKind(part.kind) && part.kind !== 'const' ? true : isOutputKind(part.kind) || part.kind === 'port' || part.kind === 'note';
}

function uniqueId(base: string, taken: Set<string>): string {
  let id = base;
  for (let k = 2; taken.has(id); k++) id = `${base}_${k}`;
  taken.add(id);
  return id;
}

/** Turns `ids` of `level` into a module (see the file comment). Throws when nothing can move. */
export function extractModule(level: BoardLevel, ids: readonly string[], opts: ExtractOptions): Extracted {
  const chosen = new Set(ids);
  const keptOutside = level.parts.filter((p) => chosen.has(p.id) && staysOutside(p)).map((p) => p.id);
  const inside = new Set(level.parts.filter((p) => chosen.has(p.id) && !staysOutside(p)).map((p) => p.id));
  if (!inside.size) throw new Error('nothing to put in a module: select gates, storage parts, multiplexers or instances');
  const byId = new Map(level.parts.map((p) => [p.id, p]));
  const isIn = (ref: string) => inside.has(splitPinRef(ref)?.part ?? '');

  // nets of this level (union of wire ends), to give each crossing net one port
  const parent = new Map<string, string>();
  const find = (k: string): string => {
    if (!parent.has(k)) parent.set(k, k);
    let r = k;
    while (parent.get(r) !== r) r = parent.get(r)!;
    return r;
  };
  for (const w of level.wires) {
    const a = find(w.from);
    const b = find(w.to);
    if (a !== b) parent.set(b, a);
  }
  const members = new Map<string, string[]>();
  for (const k of parent.keys()) {
    const r = find(k);
    const list = members.get(r) ?? [];
    list.push(k);
    members.set(r, list);
  }
  const crossing = level.wires.filter((w) => isIn(w.from) !== isIn(w.to));
  const side = (ref: string) => {
    const s = splitPinRef(ref);
    const part = s && byId.get(s.part);
    return part && s ? pinSide(part, s.pin, opts.modulePins) : null;
  };

  // one port per crossing net: `out` when something inside drives it, else `in`
  const portOfNet = new Map<string, { id: string; label: string; dir: 'in' | 'out' }>();
  const labels = new Set<string>();
  const partIds = new Set<string>(inside);
  let nIn = 0;
  let nOut = 0;
  const order = [...new Set(crossing.map((w) => find(w.from)))];
  for (const net of order) {
    const pins = members.get(net) ?? [];
    const dir = pins.some((r) => isIn(r) && side(r) === 'out') ? 'out' : 'in';
    const asked = pins.map((r) => (isIn(r) ? opts.names?.[r] : undefined)).find((n) => n && LABEL_RE.test(n));
    const labelled = pins.map((r) => byId.get(splitPinRef(r)?.part ?? '')).find((p) => p && isNamedKind(p.kind) && p.label && LABEL_RE.test(p.label))?.label;
    let label = asked ?? labelled ?? (dir === 'in' ? `in${++nIn}` : `out${++nOut}`);
    for (let k = 2; labels.has(label); k++) label = `${asked ?? labelled ?? label}_${k}`;
    labels.add(label);
    portOfNet.set(net, { id: uniqueId(`port_${label}`, partIds), label, dir });
  }

  // the module: the inside parts shifted to start near the origin, ports at the edges
  const moved = level.parts.filter((p) => inside.has(p.id));
  const minX = Math.min(...moved.map((p) => p.x));
  const minY = Math.min(...moved.map((p) => p.y));
  const maxX = Math.max(...moved.map((p) => p.x));
  const innerParts: Part[] = moved.map((p) => ({ ...p, x: p.x - minX + 160, y: p.y - minY + 40 }));
  let yi = 40;
  let yo = 40;
  const ports = [...portOfNet.values()];
  for (const port of ports) {
    const x = port.dir === 'in' ? 0 : maxX - minX + 320;
    const y = port.dir === 'in' ? (yi += 60) - 60 : (yo += 60) - 60;
    innerParts.push({ id: port.id, kind: 'port', dir: port.dir, label: port.label, x, y });
  }
  const wireIds = new Set(level.wires.map((w) => w.id));
  const innerWires: Wire[] = level.wires.filter((w) => isIn(w.from) && isIn(w.to));
  const outerWires: Wire[] = level.wires.filter((w) => !isIn(w.from) && !isIn(w.to));
  const seenInner = new Set<string>();
  const seenOuter = new Set<string>();
  for (const w of crossing) {
    const [inner, outer] = isIn(w.from) ? [w.from, w.to] : [w.to, w.from];
    const port = portOfNet.get(find(w.from))!;
    const portPin = pinRef(port.id, port.dir === 'in' ? 'out' : 'in');
    if (!seenInner.has(`${portPin}|${inner}`)) {
      seenInner.add(`${portPin}|${inner}`);
      innerWires.push(port.dir === 'in' ? { id: uniqueId(`${w.id}_i`, wireIds), from: portPin, to: inner } : { id: uniqueId(`${w.id}_i`, wireIds), from: inner, to: portPin });
    }
    const instPin = pinRef(opts.instanceId, port.label);
    if (!seenOuter.has(`${instPin}|${outer}`)) {
      seenOuter.add(`${instPin}|${outer}`);
      outerWires.push(port.dir === 'in' ? { id: w.id, from: outer, to: instPin } : { id: w.id, from: instPin, to: outer });
    }
  }
  const module: Module = { id: opts.moduleId, title: opts.title, parts: innerParts, wires: innerWires };
  const firstIndex = level.parts.findIndex((p) => inside.has(p.id));
  const instance: Part = { id: opts.instanceId, kind: 'module', module: opts.moduleId, x: minX, y: minY };
  const outerParts = level.parts.filter((p) => !inside.has(p.id));
  outerParts.splice(Math.min(firstIndex, outerParts.length), 0, instance);
  return { module, level: { parts: outerParts, wires: outerWires }, keptOutside };
}
