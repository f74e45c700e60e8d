/**
 * Named edits of modules (docs/decisions/004-modules.md), each ONE transaction with the caller's origin:
 * make a module from a selection, place an instance, add modules (a library copy), update a module from
 * a newer copy. Editing a module's inside is an ordinary edit through `moduleDoc`, a view of the
 * document whose `parts` and `wires` are the module's: every edit of edits.ts works on it unchanged.
 */
import * as Y from 'yjs';
import { extractModule } from './extract-module';
import { modulePinTable } from './modules';
import type { Module, ModuleOrigin, Part } from './schema';
import {
  moduleMaps, moduleToYMap, modulesMap, nextOrder, partToYMap, partsMap, readModules, readPart, readWire,
  sortedEntries, wireToYMap, wiresMap, type YRecord,
} from './ydoc';
import { newPartId } from './ids';

/** Thrown by module edits given a selection or a module they cannot use. */
export class ModuleEditError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ModuleEditError';
  }
}

const views = new WeakMap<Y.Doc, Map<string, Y.Doc>>();

/**
 * The document as seen from inside module `moduleId`: `getMap('parts')` and `getMap('wires')` are the
 * module's maps, everything else (meta, modules, transactions, the client id) is the document's. Pass it
 * to the edits of edits.ts to edit the module's inside; throws when the module is missing.
 */
export function moduleDoc(doc: Y.Doc, moduleId: string): Y.Doc {
  const maps = moduleMaps(doc, moduleId);
  if (!maps) throw new ModuleEditError(`no module "${moduleId}" on this board`);
  let byId = views.get(doc);
  if (!byId) views.set(doc, (byId = new Map()));
  const cached = byId.get(moduleId);
  if (cached && moduleMaps(doc, moduleId)?.parts === cached.getMap('parts')) return cached;
  const view = Object.create(doc) as Y.Doc;
  const getMap = doc.getMap.bind(doc);
  Object.defineProperty(view, 'getMap', {
    value: <T>(name: string): Y.Map<T> => (name === 'parts' ? maps.parts : name === 'wires' ? maps.wires : getMap(name)) as unknown as Y.Map<T>,
  });
  Object.defineProperty(view, 'transact', { value: (fn: (tr: Y.Transaction) => void, origin?: unknown) => doc.transact(fn, origin) });
  byId.set(moduleId, view);
  return view;
}

/** The maps of a level: the top (`scope` undefined) or a module's inside. */
function levelMaps(doc: Y.Doc, scope?: string): { parts: Y.Map<YRecord>; wires: Y.Map<YRecord> } {
  if (scope === undefined) return { parts: partsMap(doc), wires: wiresMap(doc) };
  const maps = moduleMaps(doc, scope);
  if (!maps) throw new ModuleEditError(`no module "${scope}" on this board`);
  return maps;
}

function freshModuleId(doc: Y.Doc, base: string): string {
  const modules = modulesMap(doc);
  const clean = base.toLowerCase().replace(/[^a-z0-9_]+/g, '_').replace(/^_+|_+$/g, '').slice(0, 40) || 'module';
  let id = clean;
  for (let k = 2; modules.has(id); k++) id = `${clean}_${k}`;
  return id;
}

export interface MakeModuleOptions {
  title?: string;
  /** port names asked of the user, keyed by a pin inside the selection on the crossing net */
  names?: Record<string, string>;
  /** the module whose inside holds the selection (the top level when absent) */
  scope?: string;
}

/**
 * Makes a module from the selected parts of a level: they move into a new module, every net crossing
 * the selection's edge becomes a port (named from a label on it, a given name, or in1/out1…), and an
 * instance takes their place, wired as they were. Inputs and outputs in the selection stay outside.
 */
export function makeModule(doc: Y.Doc, partIds: string[], origin: unknown, opts: MakeModuleOptions = {}): { moduleId: string; instanceId: string; keptOutside: string[] } {
  const maps = levelMaps(doc, opts.scope);
  const level = {
    parts: sortedEntries(maps.parts).map(([, y]) => readPart(y)),
    wires: sortedEntries(maps.wires).map(([, y]) => readWire(y)),
  };
  const title = (opts.title ?? '').trim() || 'Module';
  const moduleId = freshModuleId(doc, title);
  const instanceId = newPartId(opts.scope === undefined ? doc : moduleDoc(doc, opts.scope), 'module');
  let made;
  try {
    made = extractModule(level, partIds, { moduleId, instanceId, title, names: opts.names, modulePins: modulePinTable(readModules(doc)) });
  } catch (err) {
    throw new ModuleEditError((err as Error).message);
  }
  const keepParts = new Set(made.level.parts.map((p) => p.id));
  const keepWires = new Map(made.level.wires.map((w) => [w.id, w]));
  doc.transact(() => {
    const modules = modulesMap(doc);
    modules.set(moduleId, moduleToYMap(made.module, nextOrder(modules)));
    for (const id of [...maps.parts.keys()]) if (!keepParts.has(id)) maps.parts.delete(id);
    const instance = made.level.parts.find((p) => p.id === instanceId)!;
    maps.parts.set(instanceId, partToYMap(instance, nextOrder(maps.parts)));
    for (const [id, ymap] of [...maps.wires.entries()]) {
      const kept = keepWires.get(id);
      if (!kept) maps.wires.delete(id);
      else if (ymap.get('from') !== kept.from || ymap.get('to') !== kept.to) {
        ymap.set('from', kept.from);
        ymap.set('to', kept.to);
      }
    }
    let order = nextOrder(maps.wires);
    for (const w of made.level.wires) if (!maps.wires.has(w.id)) maps.wires.set(w.id, wireToYMap(w, order++));
  }, origin);
  return { moduleId, instanceId, keptOutside: made.keptOutside };
}

/** Places an instance of `moduleId` at (x, y) on a level; returns its id. */
export function placeInstance(doc: Y.Doc, moduleId: string, x: number, y: number, origin: unknown, scope?: string): string {
  if (!modulesMap(doc).has(moduleId)) throw new ModuleEditError(`no module "${moduleId}" on this board`);
  if (scope !== undefined && scope === moduleId) throw new ModuleEditError(`module "${moduleId}" cannot contain itself`);
  const maps = levelMaps(doc, scope);
  const id = newPartId(scope === undefined ? doc : moduleDoc(doc, scope), 'module');
  const part: Part = { id, kind: 'module', module: moduleId, x, y };
  doc.transact(() => maps.parts.set(id, partToYMap(part, nextOrder(maps.parts))), origin);
  return id;
}

/**
 * Adds modules to the board (a copy from the team library: a module with the modules it uses). An id
 * already on the board gets a new one, and the instances inside the copied modules follow. Returns the
 * new id of each given module id.
 */
export function addModules(doc: Y.Doc, modules: Module[], origin: unknown, originOf?: ModuleOrigin): Map<string, string> {
  const map = modulesMap(doc);
  const renamed = new Map<string, string>();
  const taken = new Set(map.keys());
  for (const m of modules) {
    let id = m.id;
    for (let k = 2; taken.has(id); k++) id = `${m.id}_${k}`;
    taken.add(id);
    renamed.set(m.id, id);
  }
  doc.transact(() => {
    let order = nextOrder(map);
    modules.forEach((m, i) => {
      const parts = m.parts.map((p) => (p.kind === 'module' ? { ...p, module: renamed.get(p.module) ?? p.module } : p));
      // the first module is the one placed; the ones it uses carry their own origin, if any
      const origin = i === 0 && originOf ? originOf : m.origin;
      map.set(renamed.get(m.id)!, moduleToYMap({ ...m, id: renamed.get(m.id)!, parts, ...(origin ? { origin } : {}) }, order++));
    });
  }, origin);
  return renamed;
}

/**
 * Replaces the inside of module `moduleId` with `module`'s (an "update from library"): its title, parts,
 * wires and origin change, its id and every instance stay. Wires to a pin the new version no longer has
 * are left out of the board file (docToBoard), as when a collaborator deletes a part.
 */
export function replaceModule(doc: Y.Doc, moduleId: string, module: Module, origin: unknown): void {
  const map = modulesMap(doc);
  const old = map.get(moduleId);
  if (!(old instanceof Y.Map)) throw new ModuleEditError(`no module "${moduleId}" on this board`);
  doc.transact(() => {
    const order = typeof old.get('order') === 'number' ? (old.get('order') as number) : nextOrder(map);
    map.set(moduleId, moduleToYMap({ ...module, id: moduleId }, order));
  }, origin);
}
