/**
 * The board as a Yjs document (CONTRACTS §4) and the pure conversion between a document and a board file.
 *
 * Layout: `parts` (id → Y.Map of the part's §1 fields, plain values), `wires` (id → Y.Map {id, from, to}),
 * `meta` ({title, family}). Every part and wire map also keeps an `order` number, set when it is added,
 * so that a file's order of parts and wires survives import → export; `order` is never exported.
 * `modules` (id → Y.Map {id, title, order, parts, wires, origin?}) holds the board's modules, each with
 * part and wire maps laid out like the top level's (docs/decisions/004-modules.md).
 */
import * as Y from 'yjs';
import type { BoardFile, FamilyId, Module, ModuleOrigin, Part, Wire } from './schema';
import { pinSide, splitPinRef, type ModulePins } from './pins';
import { PART_KINDS } from './kinds';
import { modulePinTable } from './modules';

/** The part fields of CONTRACTS §1, in the order an exported file lists them. */
export const PART_FIELDS = [
  'id', 'kind', 'label', 'inputs', 'x', 'y', 'rotation',
  'on', 'pressed', 'bounce', 'period', 'value', 'init', 'text',
  'dir', 'module',
] as const;
export type PartField = (typeof PART_FIELDS)[number];

/** A part or wire inside the document. */
export type YRecord = Y.Map<unknown>;

export const DEFAULT_TITLE = 'Untitled board';
export const DEFAULT_FAMILY: FamilyId = 'ideal';

/** The map of parts (id → Y.Map). */
export function partsMap(doc: Y.Doc): Y.Map<YRecord> {
  return doc.getMap<YRecord>('parts');
}
/** The map of wires (id → Y.Map). */
export function wiresMap(doc: Y.Doc): Y.Map<YRecord> {
  return doc.getMap<YRecord>('wires');
}
/** The board's title and logic family. */
export function metaMap(doc: Y.Doc): Y.Map<unknown> {
  return doc.getMap<unknown>('meta');
}

/** The map of modules (id → Y.Map {id, title, order, parts, wires, origin?}). */
export function modulesMap(doc: Y.Doc): Y.Map<YRecord> {
  return doc.getMap<YRecord>('modules');
}

/** The part and wire maps of one module in the document, or null when it is missing or malformed. */
export function moduleMaps(doc: Y.Doc, moduleId: string): { parts: Y.Map<YRecord>; wires: Y.Map<YRecord> } | null {
  const m = modulesMap(doc).get(moduleId);
  if (!(m instanceof Y.Map)) return null;
  const parts = m.get('parts');
  const wires = m.get('wires');
  return parts instanceof Y.Map && wires instanceof Y.Map ? { parts: parts as Y.Map<YRecord>, wires: wires as Y.Map<YRecord> } : null;
}

/** Builds the Y.Map of a module with its parts and wires. Not yet attached to a document. */
export function moduleToYMap(module: Module, order: number): YRecord {
  const ymap = new Y.Map<unknown>();
  ymap.set('id', module.id);
  ymap.set('title', module.title);
  ymap.set('order', order);
  const parts = new Y.Map<YRecord>();
  module.parts.forEach((part, i) => parts.set(part.id, partToYMap(part, i + 1)));
  const wires = new Y.Map<YRecord>();
  module.wires.forEach((wire, i) => wires.set(wire.id, wireToYMap(wire, i + 1)));
  ymap.set('parts', parts);
  ymap.set('wires', wires);
  if (module.origin) ymap.set('origin', { library: module.origin.library, version: module.origin.version });
  return ymap;
}

/** Reads one part's fields from its map, in file order, leaving out absent fields. */
export function readPart(ymap: YRecord): Part {
  const out: Record<string, unknown> = {};
  for (const field of PART_FIELDS) {
    const value = ymap.get(field);
    if (value !== undefined) out[field] = value;
  }
  return out as Part;
}

/** Reads one wire from its map. */
export function readWire(ymap: YRecord): Wire {
  return { id: String(ymap.get('id')), from: String(ymap.get('from')), to: String(ymap.get('to')) };
}

function orderOf(ymap: YRecord): number {
  const o = ymap instanceof Y.Map ? ymap.get('order') : undefined;
  return typeof o === 'number' ? o : Number.MAX_SAFE_INTEGER;
}

/** Entries of a parts or wires map sorted by `order`, then id (ties can come from concurrent adds). */
export function sortedEntries(map: Y.Map<YRecord>): [string, YRecord][] {
  return [...map.entries()].sort(([ia, a], [ib, b]) => orderOf(a) - orderOf(b) || (ia < ib ? -1 : ia > ib ? 1 : 0));
}

/** The next `order` number for a map (one more than the largest in use). */
export function nextOrder(map: Y.Map<YRecord>): number {
  let max = 0;
  for (const item of map.values()) {
    const o = item.get('order');
    if (typeof o === 'number' && o > max) max = o;
  }
  return max + 1;
}

/** Builds the Y.Map of a part (fields of §1 plus `order`). Not yet attached to a document. */
export function partToYMap(part: Part, order: number): YRecord {
  const ymap = new Y.Map<unknown>();
  const record = part as unknown as Record<string, unknown>;
  for (const field of PART_FIELDS) {
    if (record[field] !== undefined) ymap.set(field, record[field]);
  }
  ymap.set('order', order);
  return ymap;
}

/** Builds the Y.Map of a wire. Not yet attached to a document. */
export function wireToYMap(wire: Wire, order: number): YRecord {
  const ymap = new Y.Map<unknown>();
  ymap.set('id', wire.id);
  ymap.set('from', wire.from);
  ymap.set('to', wire.to);
  ymap.set('order', order);
  return ymap;
}

/**
 * Fills an empty document with a board, in one transaction (`origin` is passed to `doc.transact`).
 * Parts and wires keep the file's order.
 */
export function boardToDoc(board: BoardFile, doc: Y.Doc, origin?: unknown): void {
  doc.transact(() => {
    const meta = metaMap(doc);
    meta.set('title', board.title);
    meta.set('family', board.family);
    const parts = partsMap(doc);
    const wires = wiresMap(doc);
    let order = nextOrder(parts);
    for (const part of board.parts) parts.set(part.id, partToYMap(part, order++));
    order = nextOrder(wires);
    for (const wire of board.wires) wires.set(wire.id, wireToYMap(wire, order++));
    if (board.modules?.length) {
      const modules = modulesMap(doc);
      order = nextOrder(modules);
      for (const m of board.modules) modules.set(m.id, moduleToYMap(m, order++));
    }
  }, origin);
}

/** True when `ref` (`part.pin`) names a pin that exists on a part of the document. */
export function pinExists(parts: Map<string, Part>, ref: string, modules?: ModulePins): boolean {
  const split = splitPinRef(ref);
  if (!split) return false;
  const part = parts.get(split.part);
  // a part of an unknown kind has no pins (and must not make the check throw)
  if (!part || !(PART_KINDS as readonly string[]).includes(part.kind)) return false;
  return pinSide(part, split.pin, modules) !== null;
}

/** One level (the top or a module's inside) read from its part and wire maps, wires to missing pins left out. */
function readLevel(parts: Y.Map<YRecord>, wires: Y.Map<YRecord>, modules: ModulePins): { parts: Part[]; wires: Wire[] } {
  const list = sortedEntries(parts).map(([, ymap]) => readPart(ymap));
  const byId = new Map(list.map((p) => [p.id, p]));
  const wireList = sortedEntries(wires)
    .map(([, ymap]) => readWire(ymap))
    .filter((w) => pinExists(byId, w.from, modules) && pinExists(byId, w.to, modules));
  return { parts: list, wires: wireList };
}

/** The pins of each module's instances in a document (read from the modules' ports only). */
export function docModulePins(doc: Y.Doc): ModulePins {
  if (!doc.share.has('modules')) return new Map();
  const list: { id: string; parts: Part[] }[] = [];
  for (const [id] of modulesMap(doc).entries()) {
    const maps = moduleMaps(doc, id);
    if (!maps) continue;
    const ports = sortedEntries(maps.parts).filter(([, y]) => y instanceof Y.Map && y.get('kind') === 'port').map(([, y]) => readPart(y));
    list.push({ id, parts: ports });
  }
  return modulePinTable(list);
}

/** The modules a document holds, in `order` (malformed entries are left out; doc-check reports them). */
export function readModules(doc: Y.Doc): Module[] {
  const raw: { id: string; title: string; parts: Y.Map<YRecord>; wires: Y.Map<YRecord>; origin?: ModuleOrigin }[] = [];
  for (const [id, ymap] of sortedEntries(modulesMap(doc))) {
    if (!(ymap instanceof Y.Map)) continue;
    const maps = moduleMaps(doc, id);
    if (!maps) continue;
    const title = ymap.get('title');
    const origin = ymap.get('origin') as ModuleOrigin | undefined;
    raw.push({ id, title: typeof title === 'string' ? title : '', ...maps, ...(origin && typeof origin === 'object' ? { origin: { library: origin.library, version: origin.version } } : {}) });
  }
  const pins = modulePinTable(raw.map((m) => ({ id: m.id, parts: sortedEntries(m.parts).map(([, y]) => readPart(y)) })));
  return raw.map((m) => ({ id: m.id, title: m.title, ...readLevel(m.parts, m.wires, pins), ...(m.origin ? { origin: m.origin } : {}) }));
}

/**
 * The board file a document holds; `JSON.stringify` of it is the export. Pure: reads only.
 * Wires whose ends no longer exist (one user deleted a part while another wired to it, concurrently)
 * are left out, so the result always passes `parseBoardFile` as far as wiring goes.
 */
export function docToBoard(doc: Y.Doc): BoardFile {
  const meta = metaMap(doc);
  const title = meta.get('title');
  const family = meta.get('family');
  const modules = doc.share.has('modules') ? readModules(doc) : [];
  const { parts, wires } = readLevel(partsMap(doc), wiresMap(doc), modulePinTable(modules));
  return {
    format: 'gatefold-board',
    version: 1,
    title: typeof title === 'string' ? title : DEFAULT_TITLE,
    family: (typeof family === 'string' ? family : DEFAULT_FAMILY) as FamilyId,
    parts,
    wires,
    ...(modules.length ? { modules } : {}),
  };
}

/** Puts a board's parts in the canonical key order of an export (what `docToBoard` would give). */
export function canonicalBoard(board: BoardFile): BoardFile {
  const doc = new Y.Doc();
  boardToDoc(board, doc);
  const out = docToBoard(doc);
  doc.destroy();
  return out;
}
