/**
 * Edits over many parts at once: copy / paste of a fragment and turning a live document into a board
 * (snapshot restore, import into an open board). Each paste or replace is one transaction.
 */
import * as Y from 'yjs';
import type { BoardFile, Fragment, Part, Wire } from './schema';
import { splitPinRef } from './pins';
import { newPartId, newWireId } from './ids';
import { isInputKind, isOutputKind } from './kinds';
import { repairModules } from './module-repair';
import {
  PART_FIELDS, docModulePins, metaMap, moduleToYMap, modulesMap, nextOrder, partToYMap, partsMap, pinExists, readModules, readPart, readWire,
  sortedEntries, wireToYMap, wiresMap,
} from './ydoc';

/** JSON with object keys sorted, so two equal values compare equal whatever their key order. */
function stableJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) =>
    v && typeof v === 'object' && !Array.isArray(v) ? Object.fromEntries(Object.entries(v).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))) : v);
}

/** The chosen parts and the wires running between two of them, as a clipboard fragment. */
export function copyFragment(doc: Y.Doc, partIds: string[]): Fragment {
  const parts = partsMap(doc);
  const chosen = new Set(partIds.filter((id) => parts.has(id)));
  const wires: Wire[] = [];
  for (const w of wiresMap(doc).values()) {
    const wire = readWire(w);
    const a = splitPinRef(wire.from);
    const b = splitPinRef(wire.to);
    if (a && b && chosen.has(a.part) && chosen.has(b.part)) wires.push(wire);
  }
  return { format: 'gatefold-fragment', parts: [...chosen].map((id) => readPart(parts.get(id)!)), wires };
}

/** `label`, or `label_2`, `label_3`… — the first one not in `used`. */
export function dedupeLabel(label: string, used: Set<string>): string {
  if (!used.has(label)) return label;
  for (let n = 2; ; n++) if (!used.has(`${label}_${n}`)) return `${label}_${n}`;
}

/**
 * Pastes a fragment moved by `offset`: every part and wire gets a fresh id, wires follow their parts,
 * labels already on the board get a `_2`, `_3`… suffix. Wires to parts outside the fragment are dropped.
 */
export function pasteFragment(
  doc: Y.Doc, fragment: Fragment, offset: { x: number; y: number }, origin: unknown,
): { partIds: string[]; wireIds: string[] } {
  const parts = partsMap(doc);
  const wires = wiresMap(doc);
  const used = new Set<string>();
  for (const p of parts.values()) if (typeof p.get('label') === 'string') used.add(p.get('label') as string);
  const idMap = new Map<string, string>();
  const partIds: string[] = [];
  const wireIds: string[] = [];
  doc.transact(() => {
    let order = nextOrder(parts);
    for (const part of fragment.parts) {
      const id = newPartId(doc, part.kind);
      idMap.set(part.id, id);
      const copy: Part = { ...part, id, x: part.x + offset.x, y: part.y + offset.y };
      if (part.label) {
        copy.label = dedupeLabel(part.label, used);
        used.add(copy.label);
      }
      parts.set(id, partToYMap(copy, order++));
      partIds.push(id);
    }
    order = nextOrder(wires);
    for (const wire of fragment.wires) {
      const a = splitPinRef(wire.from);
      const b = splitPinRef(wire.to);
      const pa = a && idMap.get(a.part);
      const pb = b && idMap.get(b.part);
      if (!a || !b || !pa || !pb) continue;
      const id = newWireId(doc);
      wires.set(id, wireToYMap({ id, from: `${pa}.${a.pin}`, to: `${pb}.${b.pin}` }, order++));
      wireIds.push(id);
    }
  }, origin);
  return { partIds, wireIds };
}

function syncFields(ymap: Y.Map<unknown>, record: Record<string, unknown>, fields: readonly string[], order: number): void {
  for (const field of fields) {
    const want = record[field];
    if (want === undefined) {
      if (ymap.has(field)) ymap.delete(field);
    } else if (ymap.get(field) !== want) ymap.set(field, want);
  }
  if (ymap.get('order') !== order) ymap.set('order', order);
}

/**
 * Turns the live document into `board`'s content as one ordinary transaction: parts and wires not in
 * the board are deleted, changed fields updated, new ones added, and the order set to the board's.
 * Connected clients see an ordinary edit (and the caller's UndoManager can undo it).
 */
export function replaceWithBoard(doc: Y.Doc, board: BoardFile, origin: unknown): void {
  const parts = partsMap(doc);
  const wires = wiresMap(doc);
  const meta = metaMap(doc);
  doc.transact(() => {
    if (meta.get('title') !== board.title) meta.set('title', board.title);
    if (meta.get('family') !== board.family) meta.set('family', board.family);
    // Modules: one that differs from the file's is replaced whole; one the file lacks is removed.
    const modules = modulesMap(doc);
    const wanted = board.modules ?? [];
    const current = new Map(readModules(doc).map((m) => [m.id, stableJson(m)]));
    const keepModules = new Set(wanted.map((m) => m.id));
    for (const id of [...modules.keys()]) if (!keepModules.has(id)) modules.delete(id);
    wanted.forEach((module, i) => {
      if (current.get(module.id) !== stableJson(module)) modules.set(module.id, moduleToYMap(module, i + 1));
    });
    const keepParts = new Set(board.parts.map((p) => p.id));
    const keepWires = new Set(board.wires.map((w) => w.id));
    for (const id of [...wires.keys()]) if (!keepWires.has(id)) wires.delete(id);
    for (const id of [...parts.keys()]) if (!keepParts.has(id)) parts.delete(id);
    board.parts.forEach((part, i) => {
      const existing = parts.get(part.id);
      if (existing) syncFields(existing, part as unknown as Record<string, unknown>, PART_FIELDS, i + 1);
      else parts.set(part.id, partToYMap(part, i + 1));
    });
    board.wires.forEach((wire, i) => {
      const existing = wires.get(wire.id);
      if (existing) syncFields(existing, wire as unknown as Record<string, unknown>, ['id', 'from', 'to'], i + 1);
      else wires.set(wire.id, wireToYMap(wire, i + 1));
    });
  }, origin);
}

/**
 * Makes the labels of inputs and outputs unique again after concurrent edits (two users naming two
 * switches `A` at the same moment): the part later in board order keeps its place and gets `A_2`…
 * One transaction; returns the ids that were renamed (none when the labels were already unique).
 * The server runs it after merging, so every replica receives the same fix as an ordinary edit.
 */
export function dedupeSignalLabels(doc: Y.Doc, origin: unknown): string[] {
  const used = new Set<string>();
  const renames: [Y.Map<unknown>, string, string][] = [];
  for (const [id, p] of sortedEntries(partsMap(doc))) {
    if (!(p instanceof Y.Map)) continue; // not a part (see quarantineDoc)
    const label = p.get('label');
    const kind = String(p.get('kind'));
    if (typeof label !== 'string' || !(isInputKind(kind) || isOutputKind(kind))) continue;
    if (used.has(label)) renames.push([p, id, label]);
    else used.add(label);
  }
  if (!renames.length) return [];
  doc.transact(() => {
    for (const [p, , label] of renames) {
      const next = dedupeLabel(label, used);
      used.add(next);
      p.set('label', next);
    }
  }, origin);
  return renames.map(([, id]) => id);
}

/**
 * Deletes wires whose part or pin is gone (one user deleted a part, or lowered a gate's input count,
 * while another wired to it). One transaction; returns the deleted wire ids.
 */
export function removeDanglingWires(doc: Y.Doc, origin: unknown): string[] {
  // Entries that are not maps are not parts or wires at all (quarantineDoc removes them); skip, never throw.
  const parts = new Map([...partsMap(doc).values()].filter((p) => p instanceof Y.Map).map((p) => [String(p.get('id')), readPart(p)]));
  const wires = wiresMap(doc);
  const modules = docModulePins(doc); // an instance's pins are its module's port labels
  const gone = [...wires.entries()]
    .filter(([, w]) => w instanceof Y.Map && (!pinExists(parts, String(w.get('from')), modules) || !pinExists(parts, String(w.get('to')), modules)))
    .map(([id]) => id);
  if (gone.length) doc.transact(() => gone.forEach((id) => wires.delete(id)), origin);
  return gone;
}

/**
 * The server's repair after merging concurrent edits: the modules' hierarchy first (`repairModules`:
 * instances of a module that is gone or closing a nesting cycle removed, port and signal labels unique
 * inside each module, wires inside modules to what is gone removed), then the top level's dangling wires
 * and signal labels. Inside a module an id is named `<module>/<id>`.
 */
export function repairBoard(doc: Y.Doc, origin: unknown): { wires: string[]; relabelled: string[]; parts: string[] } {
  let result = { wires: [] as string[], relabelled: [] as string[], parts: [] as string[] };
  doc.transact(() => {
    const inside = repairModules(doc, origin);
    result = {
      wires: [...inside.wires, ...removeDanglingWires(doc, origin)],
      relabelled: [...inside.relabelled, ...dedupeSignalLabels(doc, origin)],
      parts: inside.parts,
    };
  }, origin);
  return result;
}
