/**
 * The strict check of a board DOCUMENT (not a file): what `parseBoardFile` would say about the board
 * the document holds, reported per part, wire or meta key instead of thrown or coerced — `docToBoard`
 * reads a part map stored as a string, a number in `wires` or an unknown kind without complaint, and
 * the repair pass would throw on them. Problems come in two kinds:
 * - `shape`: no single honest edit makes it (a part that is not a map, an unknown kind, `x: "left"`,
 *   `inputs: 1000`, a 100,000-character title). The server refuses an update that makes one, and
 *   quarantines (removes) the entry when a stored board already has one.
 * - `merge`: two valid concurrent edits can make it (two inputs labelled `A`, a wire to a part someone
 *   deleted). The server repairs it with an ordinary edit (`repairBoard`).
 */
/* eslint-disable @typescript-eslint/no-explicit-any -- Yjs types are generic over their event type */
import * as Y from 'yjs';
import { PART_KINDS } from './kinds';
import { isNamedKind, LABEL_RE } from './labels';
import { splitPinRef } from './pins';
import { BoardFileSchema, FamilySchema, PartSchema, WireSchema, type Part } from './schema';
import { PART_FIELDS, docModulePins, metaMap, partsMap, pinExists, readPart, wiresMap } from './ydoc';
import { repairBoard } from './edits-bulk';
import { SIMLOG_ROOT, checkSimLog } from './sim-log';
import { MODULES_ROOT, checkModulesRoot } from './module-doc-check';
import { preview, quarantineModules } from './module-repair';

/** The room's simulation record (sim-log.ts), a root of its own with its own check. */
function simLogProblems(doc: Y.Doc): DocProblem[] {
  return checkSimLog(doc).map((message) => ({ kind: 'shape' as const, where: 'root' as const, key: SIMLOG_ROOT, message }));
}

/** The board's modules (module-doc-check.ts), a root of its own checked with the same entry checks. */
function modulesProblems(doc: Y.Doc): DocProblem[] {
  return checkModulesRoot(doc, { part: checkPartEntry, wire: checkWireEntry })
    .map((message) => ({ kind: 'shape' as const, where: 'root' as const, key: MODULES_ROOT, message }));
}

/** One problem of a document; `key` is the part or wire id (the map key), or the meta key. */
export interface DocProblem {
  kind: 'shape' | 'merge';
  where: 'parts' | 'wires' | 'meta' | 'root';
  key: string;
  message: string;
}

/** What one or more transactions changed, by top-level place. */
export interface DocTouched {
  parts: Set<string>;
  wires: Set<string>;
  meta: Set<string>;
  /** content outside `parts`/`wires`/`meta`, or list content in one of them: never part of a board */
  strays: Set<string>;
}

export function emptyTouched(): DocTouched {
  return { parts: new Set(), wires: new Set(), meta: new Set(), strays: new Set() };
}

const PART_KEYS = new Set<string>([...PART_FIELDS, 'order']);
const WIRE_KEYS = new Set(['id', 'from', 'to', 'order']);
const ROOTS = ['parts', 'wires', 'meta'] as const;
const MAX_SHOWN = 60;

function describe(value: unknown): string {
  if (value instanceof Y.AbstractType) return `a shared ${value.constructor.name}`;
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'a list';
  if (value instanceof Uint8Array) return 'binary data';
  if (typeof value === 'string') return `the text "${value.length > 20 ? value.slice(0, 20) + '…' : value}"`;
  return `the ${typeof value} ${typeof value === 'object' ? '' : String(value)}`.trim();
}

/** `key` as shown in a message (long or odd keys are cut). */
export function shownKey(key: string): string {
  return JSON.stringify(key.length > MAX_SHOWN ? key.slice(0, MAX_SHOWN) + '…' : key);
}

/** Shape problems of one entry of `parts` (its map key and value). */
export function checkPartEntry(key: string, value: unknown): DocProblem[] {
  const bad = (message: string): DocProblem[] => [{ kind: 'shape', where: 'parts', key, message: `part ${shownKey(key)}: ${message}` }];
  if (!(value instanceof Y.Map)) return bad(`is ${describe(value)}, not a part`);
  for (const field of value.keys()) if (!PART_KEYS.has(field)) return bad(`unknown field ${shownKey(field)}`);
  const order = value.get('order');
  if (order !== undefined && (typeof order !== 'number' || !Number.isFinite(order))) return bad('order is not a number');
  const raw = readPart(value as Y.Map<unknown>) as unknown as Record<string, unknown>;
  if (raw.id !== key) return bad(`its id ${describe(raw.id)} is not its key`);
  if (raw.kind === undefined) return bad('has no kind');
  if (typeof raw.kind !== 'string' || !(PART_KINDS as readonly string[]).includes(raw.kind)) return bad(`unknown kind ${typeof raw.kind === 'string' ? shownKey(raw.kind) : describe(raw.kind)}`);
  const parsed = PartSchema.safeParse(raw);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    return bad(`${issue.path.join('.') || 'part'}: ${issue.message}`);
  }
  const part: Part = parsed.data;
  if (isNamedKind(part.kind) && part.label !== undefined && part.label !== '' && !LABEL_RE.test(part.label)) {
    return bad(`label ${shownKey(part.label)} must be a letter or _ followed by letters, digits or _`);
  }
  return [];
}

/** Shape problems of one entry of `wires`. A wire to a missing part or pin is a merge problem (see `checkDoc`). */
export function checkWireEntry(key: string, value: unknown): DocProblem[] {
  const bad = (message: string): DocProblem[] => [{ kind: 'shape', where: 'wires', key, message: `wire ${shownKey(key)}: ${message}` }];
  if (!(value instanceof Y.Map)) return bad(`is ${describe(value)}, not a wire`);
  for (const field of value.keys()) if (!WIRE_KEYS.has(field)) return bad(`unknown field ${shownKey(field)}`);
  const order = value.get('order');
  if (order !== undefined && (typeof order !== 'number' || !Number.isFinite(order))) return bad('order is not a number');
  const raw = { id: value.get('id'), from: value.get('from'), to: value.get('to') };
  if (raw.id !== key) return bad(`its id ${describe(raw.id)} is not its key`);
  const parsed = WireSchema.safeParse(raw);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    return bad(`${issue.path.join('.')}: ${issue.message}`);
  }
  for (const end of ['from', 'to'] as const) {
    if (!splitPinRef(parsed.data[end])) return bad(`${end} ${shownKey(parsed.data[end])} is not of the form part.pin`);
  }
  return [];
}

/** Shape problems of one meta key (title and family are checked; other keys are not part of a board). */
export function checkMetaEntry(key: string, value: unknown): DocProblem[] {
  if (value === undefined || (key !== 'title' && key !== 'family')) return [];
  const schema = key === 'title' ? BoardFileSchema.shape.title : FamilySchema;
  const parsed = schema.safeParse(value);
  if (parsed.success) return [];
  const message = typeof value === 'string' ? parsed.error.issues[0].message : `is ${describe(value)}`;
  return [{ kind: 'shape', where: 'meta', key, message: `${key}: ${message}` }];
}

function rootNameOf(doc: Y.Doc, type: Y.AbstractType<any>): string {
  for (const [name, t] of doc.share) if (t === type) return name;
  return '?';
}

/**
 * Adds what transaction `tr` changed to `into`: the part, wire and meta keys (a change deep inside a
 * part map counts for that part) and stray content anywhere else. Read it from `afterTransaction`.
 * Open the document's `parts`, `wires` and `meta` (partsMap…) before its first transaction: a root
 * first made by an update is a plain AbstractType that Yjs replaces when it is opened as a map.
 */
export function touchedBy(tr: Y.Transaction, into: DocTouched = emptyTouched()): DocTouched {
  const doc = tr.doc;
  const roots = new Map<unknown, (typeof ROOTS)[number]>([[partsMap(doc), 'parts'], [wiresMap(doc), 'wires'], [metaMap(doc), 'meta']]);
  for (const [type, keys] of tr.changed) {
    let t = type as Y.AbstractType<any>;
    let top: string | null | undefined;
    while (t._item) {
      top = t._item.parentSub;
      t = t._item.parent as Y.AbstractType<any>;
    }
    const root = roots.get(t);
    if (!root) {
      into.strays.add(rootNameOf(doc, t));
      continue;
    }
    const found = top === undefined ? [...keys] : [top];
    for (const key of found) {
      if (key === null) into.strays.add(root);
      else into[root].add(key);
    }
  }
  return into;
}

/**
 * Shape problems of what `touched` names, as the document holds it now: the check of an incoming
 * update (merge problems are left to the repair). Costs O(touched), not O(board).
 */
export function checkDocChanges(doc: Y.Doc, touched: DocTouched): DocProblem[] {
  const problems: DocProblem[] = [];
  for (const name of touched.strays) {
    if (name === SIMLOG_ROOT) {
      problems.push(...simLogProblems(doc));
      continue;
    }
    if (name === MODULES_ROOT) {
      problems.push(...modulesProblems(doc));
      continue;
    }
    problems.push({ kind: 'shape', where: 'root', key: name, message: `content outside the board's parts, wires and meta (${shownKey(name)})` });
  }
  const parts = partsMap(doc);
  const wires = wiresMap(doc);
  const meta = metaMap(doc);
  for (const key of touched.parts) if (parts.has(key)) problems.push(...checkPartEntry(key, parts.get(key)));
  for (const key of touched.wires) if (wires.has(key)) problems.push(...checkWireEntry(key, wires.get(key)));
  for (const key of touched.meta) problems.push(...checkMetaEntry(key, meta.get(key)));
  return problems;
}

function hasContent(type: Y.AbstractType<any>): boolean {
  return type._start !== null || type._map.size > 0;
}

/**
 * Every problem of the document: shape problems of every part, wire and meta key and of stray
 * content, then merge problems (repeated input/output labels, wires to missing parts or pins) among
 * the well-shaped entries. Never throws.
 */
export function checkDoc(doc: Y.Doc): DocProblem[] {
  const problems: DocProblem[] = [];
  for (const [name, type] of doc.share) {
    if (name === SIMLOG_ROOT) {
      problems.push(...simLogProblems(doc));
      continue;
    }
    if (name === MODULES_ROOT) {
      problems.push(...modulesProblems(doc));
      continue;
    }
    const root = ROOTS.includes(name as (typeof ROOTS)[number]);
    if ((!root && hasContent(type)) || (root && type._start !== null)) {
      problems.push({ kind: 'shape', where: 'root', key: name, message: `content outside the board's parts, wires and meta (${shownKey(name)})` });
    }
  }
  const good = new Map<string, Part>();
  for (const [key, value] of partsMap(doc).entries()) {
    const found = checkPartEntry(key, value);
    if (found.length) problems.push(...found);
    else good.set(key, readPart(value));
  }
  const labels = new Map<string, string>();
  for (const [id, part] of good) {
    if (!isNamedKind(part.kind) || !part.label) continue;
    const other = labels.get(part.label);
    if (other !== undefined) problems.push({ kind: 'merge', where: 'parts', key: id, message: `part ${shownKey(id)}: label "${part.label}" is already on ${other}` });
    else labels.set(part.label, id);
  }
  const modulePins = docModulePins(doc); // an instance's pins are its module's port labels
  for (const [key, value] of wiresMap(doc).entries()) {
    const found = checkWireEntry(key, value);
    if (found.length) {
      problems.push(...found);
      continue;
    }
    for (const end of ['from', 'to'] as const) {
      const ref = String(value.get(end));
      if (!pinExists(good, ref, modulePins)) problems.push({ kind: 'merge', where: 'wires', key, message: `wire ${shownKey(key)}: ${end} ${shownKey(ref)} is not a pin on the board` });
    }
  }
  const meta = metaMap(doc);
  for (const key of ['title', 'family']) problems.push(...checkMetaEntry(key, meta.get(key)));
  return problems;
}

/** What `quarantineDoc` removed and why. */
export interface Quarantine {
  problems: DocProblem[];
  /**
   * entries removed, with a short JSON preview of what they held (for the report); inside a module
   * `where` is `modules` and `key` is `<module>/<part or wire id>` (or the module, or `<module>/<field>`)
   */
  removed: { where: DocProblem['where'] | 'modules'; key: string; preview: string }[];
  /** what the merge repair changed (`repairBoard`); inside a module named `<module>/<id>` */
  repaired: { wires: string[]; relabelled: string[]; parts: string[] };
}

/**
 * Makes the document a valid board: removes every part, wire and meta value with a shape problem
 * (one transaction with `origin`) and every entry under `modules` with one (`quarantineModules`), then
 * repairs the merge problems, inside modules too (`repairBoard`). Content outside parts/wires/meta/modules
 * is reported, not removed (the board never reads it). Never throws.
 */
export function quarantineDoc(doc: Y.Doc, origin: unknown): Quarantine {
  const problems = checkDoc(doc);
  const shape = problems.filter((p) => p.kind === 'shape' && p.where !== 'root');
  const removed: Quarantine['removed'] = [];
  if (shape.length) {
    const maps = { parts: partsMap(doc), wires: wiresMap(doc), meta: metaMap(doc) } as const;
    doc.transact(() => {
      for (const p of shape) {
        const map = maps[p.where as keyof typeof maps];
        if (!map.has(p.key)) continue;
        removed.push({ where: p.where, key: p.key, preview: preview(map.get(p.key)) });
        map.delete(p.key);
      }
    }, origin);
  }
  for (const r of quarantineModules(doc, origin, { part: checkPartEntry, wire: checkWireEntry })) {
    removed.push({ where: 'modules', key: r.where === 'module' && r.key === r.module ? r.module : `${r.module}/${r.key}`, preview: r.preview });
  }
  const repaired = repairBoard(doc, origin);
  return { problems, removed, repaired };
}
