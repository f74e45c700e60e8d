/**
 * What differs between a snapshot and the live board: parts and wires added since the snapshot,
 * removed since it, and changed field by field (a move is a change of x and y, flagged `moved`).
 * The compare route returns it as JSON; the history panel lists it and marks it on the canvas.
 */
import { PART_FIELDS, type BoardFile, type Part, type Wire } from '../board';
import type { CompareMark } from './theme';

/** One field that differs: its value in the snapshot (`from`) and on the live board (`to`). */
export interface FieldChange {
  field: string;
  from: unknown;
  to: unknown;
}

export interface PartChange {
  id: string;
  kind: Part['kind'];
  label?: string;
  /** x or y differs */
  moved: boolean;
  fields: FieldChange[];
}

export interface WireChange {
  id: string;
  fields: FieldChange[];
}

export interface BoardDiff {
  /** on the live board, not in the snapshot */
  added: { parts: Part[]; wires: Wire[] };
  /** in the snapshot, not on the live board */
  removed: { parts: Part[]; wires: Wire[] };
  /** on both, with different fields; `meta` lists a changed title or family */
  changed: { parts: PartChange[]; wires: WireChange[]; meta: FieldChange[] };
}

function fieldChanges(a: Record<string, unknown>, b: Record<string, unknown>, fields: readonly string[]): FieldChange[] {
  const out: FieldChange[] = [];
  for (const field of fields) {
    if (field === 'id') continue;
    if (a[field] !== b[field]) out.push({ field, from: a[field] ?? null, to: b[field] ?? null });
  }
  return out;
}

/** The difference from `snapshot` to `live` (both board files). */
export function diffBoards(snapshot: BoardFile, live: BoardFile): BoardDiff {
  const oldParts = new Map(snapshot.parts.map((p) => [p.id, p]));
  const newParts = new Map(live.parts.map((p) => [p.id, p]));
  const oldWires = new Map(snapshot.wires.map((w) => [w.id, w]));
  const newWires = new Map(live.wires.map((w) => [w.id, w]));
  const diff: BoardDiff = {
    added: { parts: live.parts.filter((p) => !oldParts.has(p.id)), wires: live.wires.filter((w) => !oldWires.has(w.id)) },
    removed: { parts: snapshot.parts.filter((p) => !newParts.has(p.id)), wires: snapshot.wires.filter((w) => !newWires.has(w.id)) },
    changed: { parts: [], wires: [], meta: [] },
  };
  for (const p of live.parts) {
    const old = oldParts.get(p.id);
    if (!old) continue;
    const fields = fieldChanges(old as Record<string, unknown>, p as Record<string, unknown>, PART_FIELDS);
    if (fields.length) {
      diff.changed.parts.push({ id: p.id, kind: p.kind, ...(p.label ? { label: p.label } : {}), moved: fields.some((f) => f.field === 'x' || f.field === 'y'), fields });
    }
  }
  for (const w of live.wires) {
    const old = oldWires.get(w.id);
    if (!old) continue;
    const fields = fieldChanges(old, w, ['from', 'to']);
    if (fields.length) diff.changed.wires.push({ id: w.id, fields });
  }
  diff.changed.meta = fieldChanges(snapshot as Record<string, unknown>, live as Record<string, unknown>, ['title', 'family']);
  return diff;
}

/** True when the two boards hold the same parts, wires, title and family. */
export function isSameBoard(diff: BoardDiff): boolean {
  return !diff.added.parts.length && !diff.added.wires.length && !diff.removed.parts.length && !diff.removed.wires.length
    && !diff.changed.parts.length && !diff.changed.wires.length && !diff.changed.meta.length;
}

/** Marks per part and wire id, for drawing a compare. */
export function diffMarks(diff: BoardDiff): { parts: Map<string, CompareMark>; wires: Map<string, CompareMark> } {
  const parts = new Map<string, CompareMark>();
  const wires = new Map<string, CompareMark>();
  diff.added.parts.forEach((p) => parts.set(p.id, 'added'));
  diff.removed.parts.forEach((p) => parts.set(p.id, 'removed'));
  diff.changed.parts.forEach((p) => parts.set(p.id, 'changed'));
  diff.added.wires.forEach((w) => wires.set(w.id, 'added'));
  diff.removed.wires.forEach((w) => wires.set(w.id, 'removed'));
  diff.changed.wires.forEach((w) => wires.set(w.id, 'changed'));
  return { parts, wires };
}

/**
 * The board a compare shows: the live board plus, where they were, the parts and wires the snapshot
 * had and the live board no longer has (drawn marked as removed).
 */
export function compareBoard(live: BoardFile, diff: BoardDiff): BoardFile {
  return { ...live, parts: [...live.parts, ...diff.removed.parts], wires: [...live.wires, ...diff.removed.wires] };
}
