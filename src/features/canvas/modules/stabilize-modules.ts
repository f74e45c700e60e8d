/**
 * Keeps the board's module objects from one derivation of the document to the next when their inside did
 * not change, so `board.modules` changes identity exactly when some module changed. The board of the
 * session is only replaced when something in it changed: without this an edit inside an open module
 * (the top level untouched) never reached the canvas.
 */
import type { Module } from '../../../../shared/board';

type Flat = Record<string, unknown>;

function sameFields(a: Flat, b: Flat): boolean {
  const ka = Object.keys(a);
  if (ka.length !== Object.keys(b).length) return false;
  for (const k of ka) if (a[k] !== b[k]) return false;
  return true;
}

function sameList<T extends object>(a: readonly T[], b: readonly T[]): boolean {
  return a.length === b.length && a.every((x, i) => sameFields(x as Flat, b[i] as Flat));
}

function sameModule(a: Module, b: Module): boolean {
  return a.id === b.id && a.title === b.title
    && a.origin?.library === b.origin?.library && a.origin?.version === b.origin?.version
    && sameList(a.parts, b.parts) && sameList(a.wires, b.wires);
}

/** `next`, with each module equal to the one of `prev` with its id replaced by that one; `prev` itself when nothing changed. */
export function stabilizeModules(prev: readonly Module[] | undefined, next: Module[] | undefined): Module[] | undefined {
  if (!prev || !next) return next;
  const old = new Map(prev.map((m) => [m.id, m]));
  let same = prev.length === next.length;
  const kept = next.map((m, i) => {
    const o = old.get(m.id);
    const keep = o && sameModule(o, m) ? o : m;
    if (keep !== prev[i]) same = false;
    return keep;
  });
  return same ? (prev as Module[]) : kept;
}
