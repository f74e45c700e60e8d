/**
 * The team library on a board (docs/decisions/004-modules.md): placing an entry copies its modules in
 * with the named edit `addModules` and places an instance; "update from library" replaces the board's
 * copy with `replaceModule`. Both are ordinary edits with the caller's origin (per-user undo).
 */
import type * as Y from 'yjs';
import { addModules, ModuleSchema, placeInstance, readModules, replaceModule, type Module, type ModuleOrigin } from '../../../shared/board';

/** What the library route gives for an entry (`GET /api/library/:id`): the module first, then the ones it uses. */
export interface LibraryContent {
  moduleId: string;
  modules: Module[];
  origin: ModuleOrigin;
}

/** Whether module `moduleId` uses module `target` (directly or deeper), or is it. */
function uses(doc: Y.Doc, moduleId: string, target: string): boolean {
  const byId = new Map(readModules(doc).map((m) => [m.id, m]));
  const seen = new Set<string>();
  const queue = [moduleId];
  while (queue.length) {
    const id = queue.pop()!;
    if (id === target) return true;
    if (seen.has(id)) continue;
    seen.add(id);
    for (const p of byId.get(id)?.parts ?? []) if (p.kind === 'module') queue.push(p.module);
  }
  return false;
}

/**
 * Places one instance of a library entry at (x, y) on the top level or inside module `scope`; returns the
 * module and instance ids. The first placement copies the entry's modules onto the board; later ones reuse
 * the board's copy (whatever its version: "update from library" is how a copy takes a newer one), so every
 * instance of one entry shares one module.
 */
export function placeFromLibrary(doc: Y.Doc, content: LibraryContent, x: number, y: number, origin: unknown, scope?: string): { moduleId: string; instanceId: string } {
  const copy = libraryCopies(doc).get(content.origin.library);
  if (copy) {
    if (scope !== undefined && uses(doc, copy.moduleId, scope)) throw new Error(`"${copy.moduleId}" uses the open module "${scope}": a module cannot contain itself`);
    return { moduleId: copy.moduleId, instanceId: placeInstance(doc, copy.moduleId, x, y, origin, scope) };
  }
  const renamed = addModules(doc, content.modules, origin, content.origin);
  const moduleId = renamed.get(content.moduleId) ?? content.moduleId;
  return { moduleId, instanceId: placeInstance(doc, moduleId, x, y, origin, scope) };
}

/** The board's copies of library entries: library entry id → the board module and the version it holds. */
export function libraryCopies(doc: Y.Doc): Map<string, { moduleId: string; version: number }> {
  return copiesAmong(readModules(doc));
}

/** `libraryCopies` of a list of the board's modules (the newest copy of each entry). */
export function copiesAmong(modules: readonly Pick<Module, 'id' | 'origin'>[]): Map<string, { moduleId: string; version: number }> {
  const out = new Map<string, { moduleId: string; version: number }>();
  for (const m of modules) {
    if (!m.origin) continue;
    const known = out.get(m.origin.library);
    if (!known || known.version < m.origin.version) out.set(m.origin.library, { moduleId: m.id, version: m.origin.version });
  }
  return out;
}

const sorted = (v: unknown): unknown =>
  Array.isArray(v) ? v.map(sorted) : v && typeof v === 'object' ? Object.fromEntries(Object.entries(v).sort(([a], [b]) => (a < b ? -1 : 1)).map(([k, x]) => [k, sorted(x)])) : v;
/** A module's inside as one comparable text (defaults filled in, keys in order). */
const bodyKey = (m: Module) => {
  const parsed = ModuleSchema.safeParse(m);
  const { parts, wires } = parsed.success ? parsed.data : m;
  return JSON.stringify(sorted([parts, wires]));
};

/**
 * Replaces the board's module `moduleId` with the entry's newer version (its instances stay). A module the
 * new version uses is the board's own when the board has one with the same inside (same id or a copy of it),
 * else it is added (a new id when the id is taken).
 */
export function updateFromLibrary(doc: Y.Doc, moduleId: string, content: LibraryContent, origin: unknown): void {
  const [top, ...nested] = content.modules;
  if (!top) return;
  const onBoard = readModules(doc);
  const rename = new Map<string, string>();
  const withRefs = (m: Module): Module => ({ ...m, parts: m.parts.map((p) => (p.kind === 'module' ? { ...p, module: rename.get(p.module) ?? p.module } : p)) });
  const toAdd: Module[] = [];
  // the modules it uses come after the ones that use them: settle the used ones first
  for (const m of [...nested].reverse()) {
    const key = bodyKey(withRefs(m));
    const same = onBoard.find((b) => (b.id === m.id || b.id.startsWith(`${m.id}_`)) && bodyKey(b) === key);
    if (same) rename.set(m.id, same.id);
    else toAdd.push(m);
  }
  if (toAdd.length) {
    const added = addModules(doc, toAdd.reverse().map(withRefs), origin);
    for (const [from, to] of added) rename.set(from, to);
  }
  replaceModule(doc, moduleId, { ...withRefs(top), id: moduleId, origin: content.origin }, origin);
}
