/**
 * Named edits of a board document. Each is ONE `doc.transact(fn, origin)`; `origin` is the caller's
 * local origin object (the canvas tracks its own with `Y.UndoManager`, so each user undoes only their edits).
 * The same functions serve the canvas, the tests, import and snapshot restore.
 */
import * as Y from 'yjs';
import { newPartId, newWireId } from './ids';
import { dedupeLabel } from './edits-bulk';
import { isNamedKind, labelProblem, namedLabels } from './labels';
import { allPins, pinSide, splitPinRef } from './pins';
import { PartSchema, type BoardFile, type FamilyId, type Fragment, type Part } from './schema';
import {
  PART_FIELDS, docModulePins, metaMap, nextOrder, partToYMap, partsMap, readPart, readWire, wireToYMap,
  wiresMap, type YRecord,
} from './ydoc';

/** Thrown by edits given values the board file does not allow. */
export class EditError extends Error {
  constructor(public code: 'invalid_part' | 'invalid_field' | 'missing_part' | 'invalid_label', message: string) {
    super(message);
    this.name = 'EditError';
  }
}

function checkedPart(raw: unknown): Part {
  const parsed = PartSchema.safeParse(raw);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new EditError('invalid_part', `${issue.path.join('.') || 'part'}: ${issue.message}`);
  }
  return parsed.data;
}

/** Labels of the document's inputs and outputs (label → part id), except the part `exceptId`. */
function docLabels(doc: Y.Doc, exceptId?: string): Map<string, string> {
  const parts = [...partsMap(doc).entries()].map(([id, p]) => ({ id, kind: String(p.get('kind')), label: p.get('label') }));
  return namedLabels(parts, exceptId);
}

/**
 * Adds a part (validated against PartSchema); a fresh id is chosen if `part.id` is empty or taken, and an
 * input or output label already in use gets a `_2`, `_3`… suffix (labels name the board's signals).
 */
export function addPart(doc: Y.Doc, part: Part, origin: unknown): string {
  const parts = partsMap(doc);
  const id = part.id && !parts.has(part.id) ? part.id : newPartId(doc, part.kind);
  const taken = docLabels(doc);
  const label = part.label && isNamedKind(part.kind) ? dedupeLabel(part.label, new Set(taken.keys())) : part.label;
  const problem = label && isNamedKind(part.kind) ? labelProblem(label, taken) : null;
  if (problem) throw new EditError('invalid_label', `${id}: ${problem}`);
  const checked = checkedPart(label === undefined ? { ...part, id } : { ...part, id, label });
  doc.transact(() => parts.set(id, partToYMap(checked, nextOrder(parts))), origin);
  return id;
}

/** Moves parts to new positions (unknown ids are skipped: another user may have deleted them). */
export function movePart(doc: Y.Doc, moves: { id: string; x: number; y: number }[], origin: unknown): void {
  const parts = partsMap(doc);
  doc.transact(() => {
    for (const m of moves) {
      const p = parts.get(m.id);
      if (!p || !Number.isFinite(m.x) || !Number.isFinite(m.y)) continue;
      if (p.get('x') !== m.x) p.set('x', m.x);
      if (p.get('y') !== m.y) p.set('y', m.y);
    }
  }, origin);
}

/** Turns parts a quarter turn clockwise (0 → 90 → 180 → 270 → 0). */
export function rotateParts(doc: Y.Doc, ids: string[], origin: unknown): void {
  const parts = partsMap(doc);
  doc.transact(() => {
    for (const id of ids) {
      const p = parts.get(id);
      if (!p) continue;
      const r = typeof p.get('rotation') === 'number' ? (p.get('rotation') as number) : 0;
      p.set('rotation', (r + 90) % 360);
    }
  }, origin);
}

/**
 * Sets a part's label ('' removes it). Throws EditError `invalid_label` when an input or output would get
 * a label that is not an identifier or is already used by another input or output.
 */
export function relabelPart(doc: Y.Doc, id: string, label: string, origin: unknown): void {
  const p = partsMap(doc).get(id);
  if (!p) throw new EditError('missing_part', `no part "${id}"`);
  const kind = String(p.get('kind'));
  const problem = label === '' || !isNamedKind(kind) ? null : labelProblem(label, docLabels(doc, id));
  if (problem) throw new EditError('invalid_label', `${id}: ${problem}`);
  setPartField(doc, id, 'label', label === '' ? undefined : label, origin);
}

/**
 * Sets one field of a part, checked against PartSchema (throws EditError on a bad value; `undefined`
 * removes an optional field). Lowering a gate's `inputs` also removes the wires of the pins it loses.
 */
export function setPartField(doc: Y.Doc, id: string, field: string, value: unknown, origin: unknown): void {
  const p = partsMap(doc).get(id);
  if (!p) throw new EditError('missing_part', `no part "${id}"`);
  if (field === 'id' || field === 'kind' || !(PART_FIELDS as readonly string[]).includes(field)) {
    throw new EditError('invalid_field', `${id}: field "${field}" cannot be set`);
  }
  const next = { ...readPart(p), [field]: value } as Record<string, unknown>;
  if (value === undefined) delete next[field];
  checkedPart(next);
  doc.transact(() => {
    if (value === undefined) p.delete(field);
    else p.set(field, value);
    if (field === 'inputs') removeWiresToMissingPins(doc, id);
  }, origin);
}

function removeWiresToMissingPins(doc: Y.Doc, partId: string): void {
  const part = readPart(partsMap(doc).get(partId)!);
  const all = allPins(part);
  const wires = wiresMap(doc);
  for (const [wid, w] of [...wires.entries()]) {
    for (const end of ['from', 'to'] as const) {
      const ref = splitPinRef(String(w.get(end)));
      if (ref && ref.part === partId && !all.includes(ref.pin)) {
        wires.delete(wid);
        break;
      }
    }
  }
}

export type ConnectResult = { ok: true; id: string; warning?: string } | { ok: false; reason: string };

/** What a pin is: 'in' (read by its part), 'out' (driven by its part), or null if it does not exist. */
export function pinRole(doc: Y.Doc, ref: string): 'in' | 'out' | null {
  const split = splitPinRef(ref);
  const p = split && partsMap(doc).get(split.part);
  if (!split || !p) return null;
  return pinSide(readPart(p), split.pin, docModulePins(doc));
}

/** Every pin on the same net as `ref` (joined through wires), `ref` included. */
export function netOf(doc: Y.Doc, ref: string): Set<string> {
  const adj = new Map<string, string[]>();
  for (const w of wiresMap(doc).values()) {
    const { from, to } = readWire(w);
    adj.set(from, [...(adj.get(from) ?? []), to]);
    adj.set(to, [...(adj.get(to) ?? []), from]);
  }
  const seen = new Set([ref]);
  const queue = [ref];
  while (queue.length) {
    for (const next of adj.get(queue.pop()!) ?? []) {
      if (seen.has(next)) continue;
      seen.add(next);
      queue.push(next);
    }
  }
  return seen;
}

/**
 * Draws a wire between two pins, with the wiring rules: both pins exist, not the same pin, no duplicate
 * wire, an input pin has at most one wire. A wire that joins two driven nets is made but warned about.
 * When exactly one end is an output it becomes `from`, so wires read driver → reader.
 */
export function connect(doc: Y.Doc, from: string, to: string, origin: unknown): ConnectResult {
  const rf = pinRole(doc, from);
  const rt = pinRole(doc, to);
  if (!rf) return { ok: false, reason: `no pin "${from}"` };
  if (!rt) return { ok: false, reason: `no pin "${to}"` };
  if (from === to) return { ok: false, reason: 'a wire needs two different pins' };
  if (rf === 'in' && rt === 'out') [from, to] = [to, from];
  const wires = [...wiresMap(doc).values()].map(readWire);
  if (wires.some((w) => (w.from === from && w.to === to) || (w.from === to && w.to === from))) {
    return { ok: false, reason: `${from} and ${to} are already wired` };
  }
  for (const ref of [from, to]) {
    if (pinRole(doc, ref) === 'in' && wires.some((w) => w.from === ref || w.to === ref)) {
      return { ok: false, reason: `input ${ref} already has a wire` };
    }
  }
  const driven = (ref: string) => [...netOf(doc, ref)].some((r) => pinRole(doc, r) === 'out');
  const warning = driven(from) && driven(to) ? 'joins two outputs' : undefined;
  const id = newWireId(doc);
  const map = wiresMap(doc);
  doc.transact(() => map.set(id, wireToYMap({ id, from, to }, nextOrder(map))), origin);
  return warning ? { ok: true, id, warning } : { ok: true, id };
}

/** Removes wires. */
export function disconnect(doc: Y.Doc, wireIds: string[], origin: unknown): void {
  const wires = wiresMap(doc);
  doc.transact(() => wireIds.forEach((id) => wires.delete(id)), origin);
}

/** Deletes parts and wires; wires attached to a deleted part go too. */
export function deleteSelection(doc: Y.Doc, partIds: string[], wireIds: string[], origin: unknown): void {
  const parts = partsMap(doc);
  const wires = wiresMap(doc);
  const gone = new Set(partIds);
  doc.transact(() => {
    for (const id of wireIds) wires.delete(id);
    for (const [wid, w] of [...wires.entries()]) {
      const a = splitPinRef(String(w.get('from')));
      const b = splitPinRef(String(w.get('to')));
      if ((a && gone.has(a.part)) || (b && gone.has(b.part))) wires.delete(wid);
    }
    for (const id of partIds) parts.delete(id);
  }, origin);
}

/** Sets the board's title and/or logic family. */
export function setMeta(doc: Y.Doc, meta: { title?: string; family?: FamilyId }, origin: unknown): void {
  const m = metaMap(doc);
  doc.transact(() => {
    if (meta.title !== undefined && m.get('title') !== meta.title) m.set('title', meta.title);
    if (meta.family !== undefined && m.get('family') !== meta.family) m.set('family', meta.family);
  }, origin);
}

export { newPartId, newWireId };
export { copyFragment, dedupeSignalLabels, pasteFragment, removeDanglingWires, repairBoard, replaceWithBoard } from './edits-bulk';
export type { BoardFile, Fragment, YRecord };
