/**
 * Which module a canvas document edits. While a module is open the canvas's session carries the module's
 * view of the document (`moduleDoc`), which the canvas commands use like the board's own; they ask here
 * whether they edit inside a module (what may be pasted or placed differs, io/level-fit.ts).
 */
import type * as Y from 'yjs';

const views = new WeakMap<Y.Doc, string>();

/** Notes that `doc` is the view of module `moduleId`'s inside. */
export function markModuleView(doc: Y.Doc, moduleId: string): void {
  views.set(doc, moduleId);
}

/** The module whose inside `doc` edits, or null for the board's top level. */
export function openModuleOf(doc: Y.Doc): string | null {
  return views.get(doc) ?? null;
}
