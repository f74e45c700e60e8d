/**
 * Repair of what a board's modules may hold that no board file allows (docs/decisions/004-modules.md),
 * the module half of `quarantineDoc` and `repairBoard`:
 * - `quarantineModules` (a stored board only, shape problems): a module entry that is not a module, or
 *   whose parts or wires are not maps, is removed; a bad field of a module (unknown, wrong id, title,
 *   order, origin) is removed or reset; a part or wire entry inside a module that fails the entry checks
 *   is removed.
 * - `repairModules` (after merging concurrent edits, and on a stored board): instances of a module that is
 *   gone and instances that close a nesting cycle are removed, as are switches, buttons and clocks inside
 *   a module, ports on the top level and part ids with a `/`; two ports (or two inputs or outputs) of one
 *   module with one label are told apart (`A_2`), a port without a usable label gets one; wires inside a
 *   module to a part or pin that is gone are removed.
 * Each runs one transaction with the caller's origin, and only when there is something to change.
 * Entries are named `<module>/<key>` in what they return.
 */
import * as Y from 'yjs';
import { isNamedKind, LABEL_RE } from './labels';
import { KINDS_OUTSIDE_MODULES, moduleCycle, modulePinTable } from './modules';
import type { EntryChecks } from './module-doc-check';
import { ModuleOriginSchema, ModuleSchema, type Part } from './schema';
import { moduleMaps, modulesMap, partsMap, pinExists, readPart, sortedEntries, wiresMap, type YRecord } from './ydoc';

const MODULE_KEYS = new Set(['id', 'title', 'order', 'parts', 'wires', 'origin']);

/** A short JSON text of a removed value, for the server's report. */
export function preview(value: unknown): string {
  let text: string;
  try {
    text = value instanceof Y.AbstractType ? JSON.stringify(value.toJSON()) : JSON.stringify(value) ?? String(value);
  } catch {
    text = String(value);
  }
  return text.length > 200 ? text.slice(0, 200) + '…' : text;
}

/** One entry under `modules` that `quarantineModules` removed or reset. */
export interface ModuleRemoval {
  /** `module`: the module itself, or a field of it (`field`); `parts`/`wires`: an entry inside it */
  where: 'module' | 'parts' | 'wires';
  module: string;
  /** the part or wire id, or the module's field */
  key: string;
  preview: string;
  message: string;
}

/** Removes (or, for a module's own fields, resets) every entry under `modules` with a shape problem. */
export function quarantineModules(doc: Y.Doc, origin: unknown, checks: EntryChecks): ModuleRemoval[] {
  if (!doc.share.has('modules')) return [];
  const root = modulesMap(doc) as Y.Map<unknown>;
  const found: { removal: ModuleRemoval; apply(): void }[] = [];
  const at = (key: string) => `module ${JSON.stringify(key.length > 60 ? key.slice(0, 60) + '…' : key)}`;
  for (const [key, value] of root.entries()) {
    const whole = (message: string) => found.push({ removal: { where: 'module', module: key, key, preview: preview(value), message: `${at(key)}: ${message}` }, apply: () => root.delete(key) });
    if (!(value instanceof Y.Map)) { whole('is not a module'); continue; }
    const parts = value.get('parts');
    const wires = value.get('wires');
    if (!(parts instanceof Y.Map) || !(wires instanceof Y.Map)) { whole('parts and wires must be maps'); continue; }
    const field = (name: string, message: string, apply: () => void) =>
      found.push({ removal: { where: 'module', module: key, key: name, preview: preview(value.get(name)), message: `${at(key)}: ${message}` }, apply });
    for (const name of value.keys()) if (!MODULE_KEYS.has(name)) field(name, `unknown field ${JSON.stringify(name)}`, () => value.delete(name));
    if (value.get('id') !== key) field('id', 'its id is not its key', () => value.set('id', key));
    if (!ModuleSchema.shape.title.safeParse(value.get('title')).success) field('title', 'title must be text of at most 200 characters', () => value.set('title', key.slice(0, 200)));
    const order = value.get('order');
    if (order !== undefined && (typeof order !== 'number' || !Number.isFinite(order))) field('order', 'order is not a number', () => value.delete('order'));
    const libraryOrigin = value.get('origin');
    if (libraryOrigin !== undefined && !ModuleOriginSchema.safeParse(libraryOrigin).success) field('origin', 'origin must be {library, version}', () => value.delete('origin'));
    for (const [where, map, check] of [['parts', parts, checks.part], ['wires', wires, checks.wire]] as const) {
      for (const [k, v] of map.entries()) {
        const problems = check(k, v);
        if (problems.length) found.push({ removal: { where, module: key, key: k, preview: preview(v), message: `${at(key)}: ${problems[0].message}` }, apply: () => map.delete(k) });
      }
    }
  }
  if (found.length) doc.transact(() => found.forEach((f) => f.apply()), origin);
  return found.map((f) => f.removal);
}

/** What `repairModules` changed, each named `<module>/<id>` (`<id>` alone on the top level). */
export interface ModuleRepair {
  parts: string[];
  wires: string[];
  relabelled: string[];
}

interface Level {
  module: string | null;
  parts: Y.Map<YRecord>;
  wires: Y.Map<YRecord>;
}

const named = (level: Level, key: string) => (level.module === null ? key : `${level.module}/${key}`);

/** A label not in `used`: `base_2`, `base_3`… (or `base` itself when free). */
function freeLabel(base: string, used: ReadonlySet<string>): string {
  if (!used.has(base)) return base;
  for (let k = 2; ; k++) if (!used.has(`${base}_${k}`)) return `${base}_${k}`;
}

/** Makes a board's modules and instances a valid hierarchy again (see the file comment). */
export function repairModules(doc: Y.Doc, origin: unknown): ModuleRepair {
  const out: ModuleRepair = { parts: [], wires: [], relabelled: [] };
  const hasModules = doc.share.has('modules') && modulesMap(doc).size > 0;
  const levels: Level[] = [{ module: null, parts: partsMap(doc), wires: wiresMap(doc) }];
  if (hasModules) {
    for (const [id] of sortedEntries(modulesMap(doc))) {
      const maps = moduleMaps(doc, id);
      if (maps) levels.push({ module: id, ...maps });
    }
  } else if (![...partsMap(doc).values()].some((p) => p instanceof Y.Map && (p.get('kind') === 'port' || p.get('kind') === 'module'))) {
    return out; // a flat board: nothing of this concerns it
  }
  const moduleIds = new Set(levels.flatMap((l) => (l.module === null ? [] : [l.module])));
  // every part of every level, as read now (entries that are not maps are quarantineDoc's)
  const read = (level: Level) => sortedEntries(level.parts).filter(([, y]) => y instanceof Y.Map).map(([id, y]) => [id, readPart(y)] as [string, Part]);
  const gone = new Map<Level, Set<string>>(levels.map((l) => [l, new Set()]));
  const drop = (level: Level, id: string) => { gone.get(level)!.add(id); out.parts.push(named(level, id)); };

  for (const level of levels) {
    for (const [id, p] of read(level)) {
      const inside = level.module !== null;
      if (p.kind === 'module' && !moduleIds.has(p.module)) drop(level, id); // its module is gone
      else if (!inside && p.kind === 'port') drop(level, id); // a port belongs inside a module
      else if (inside && (KINDS_OUTSIDE_MODULES as readonly string[]).includes(p.kind)) drop(level, id); // a module's inputs are its ports
      else if ((inside || hasModules) && id.includes('/')) drop(level, id); // `/` separates the path of a part inside an instance
    }
  }
  // nesting cycles: the instance that closes one goes, until none is left
  const uses = () => levels.filter((l) => l.module !== null).map((l) => ({ id: l.module!, parts: read(l).filter(([id]) => !gone.get(l)!.has(id)).map(([, p]) => p) }));
  for (let cycle = moduleCycle(uses()); cycle; cycle = moduleCycle(uses())) {
    const [inner, used] = cycle.slice(-2);
    const level = levels.find((l) => l.module === inner)!;
    for (const [id, p] of read(level)) if (p.kind === 'module' && p.module === used && !gone.get(level)!.has(id)) drop(level, id);
  }

  // labels inside each module: ports unique and usable (they are the instance's pins), inputs and outputs unique
  const relabel: [YRecord, string][] = [];
  const pinsAfter = new Map<string, Part[]>();
  for (const level of levels) {
    if (level.module === null) continue;
    const ports = new Set<string>();
    const signals = new Set<string>();
    const kept: Part[] = [];
    for (const [id, p] of read(level)) {
      if (gone.get(level)!.has(id)) continue;
      let label = p.label;
      if (p.kind === 'port') {
        const usable = typeof label === 'string' && LABEL_RE.test(label);
        const next = usable ? freeLabel(label!, ports) : freeLabel(p.dir === 'out' ? 'out1' : 'in1', ports);
        if (next !== label) { relabel.push([level.parts.get(id)!, next]); out.relabelled.push(named(level, id)); label = next; }
        ports.add(label!);
      } else if (isNamedKind(p.kind) && typeof label === 'string' && label !== '') {
        const next = freeLabel(label, signals);
        if (next !== label) { relabel.push([level.parts.get(id)!, next]); out.relabelled.push(named(level, id)); label = next; }
        signals.add(label);
      }
      kept.push(label === p.label ? p : ({ ...p, label } as Part));
    }
    pinsAfter.set(level.module, kept);
  }

  // wires inside modules to a part or pin that is gone (the top level's are repairBoard's own)
  const pins = modulePinTable([...pinsAfter].map(([id, parts]) => ({ id, parts })));
  const wireDrops: [Level, string][] = [];
  for (const level of levels) {
    if (level.module === null) continue;
    const parts = new Map(pinsAfter.get(level.module)!.map((p) => [p.id, p]));
    for (const [id, w] of level.wires.entries()) {
      if (!(w instanceof Y.Map)) continue;
      if (!pinExists(parts, String(w.get('from')), pins) || !pinExists(parts, String(w.get('to')), pins)) {
        wireDrops.push([level, id]);
        out.wires.push(named(level, id));
      }
    }
  }

  if (out.parts.length || out.relabelled.length || wireDrops.length) {
    doc.transact(() => {
      for (const [level, ids] of gone) for (const id of ids) level.parts.delete(id);
      for (const [ymap, label] of relabel) ymap.set('label', label);
      for (const [level, id] of wireDrops) level.wires.delete(id);
    }, origin);
  }
  return out;
}
