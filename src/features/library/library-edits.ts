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

/** Copies an entry onto the board and places one instance at (x, y); returns the module and instance ids. */
export function placeFromLibrary(doc: Y.Doc, content: LibraryContent, x: number, y: number, origin: unknown, scope?: string): { moduleId: string; instanceId: string } {
  const renamed = addModules(doc, content.modules, origin, content.origin);
  const moduleId = renamed.get(content.moduleId) ?? content.moduleId;
  return { moduleId, instanceId: placeInstance(doc, moduleId, x, y, origin, scope) };
}

/** The board's copies of library entries: library entry id → the board module and the version it holds. */
export function libraryCopies(doc: Y.Doc): Map<string, { moduleId: string; version: number }> {
  const out = new Map<string, { moduleId: string; version: number }>();
  for (const m of readModules(doc)) {
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
