/**
 * Pure derivation of React Flow nodes and edges from a board. Unchanged parts and wires keep the
 * very same node/edge objects from one derivation to the next, so memoised components do not
 * re-render and nothing is allocated for them.
 */
import { allPins, splitPinRef, type BoardFile, type ModulePins, type Part, type PinSet, type Wire } from '../../../../shared/board';
import type { Level } from '../../../../shared/sim';
import type { CompareMark } from '../../../../shared/render';
import type { NodeHandle, Position } from '@xyflow/react';
import { placedShape } from '../lib/geometry';
import { stabilizeModules } from '../modules/stabilize-modules';
import type { PartBadge, PartNode, WireEdge } from './types';

export interface DeriveNodesInput {
  parts: readonly Part[];
  levels?: ReadonlyMap<string, Level>;
  badges?: ReadonlyMap<string, PartBadge>;
  highlight?: ReadonlySet<string>;
  tryOut?: ReadonlyMap<string, boolean>;
  /** part id → colour of a collaborator who has it selected */
  remoteSelection?: ReadonlyMap<string, string>;
  /** part id → live position while a collaborator drags it */
  remoteDrag?: ReadonlyMap<string, { x: number; y: number }>;
  readOnly: boolean;
  /** part id → a snapshot compare's mark */
  marks?: ReadonlyMap<string, CompareMark>;
  /** the pins of each module's instances (modulePinTable of the board's modules) */
  modulePins?: ModulePins;
}

/** Pin levels of a part as a short string (one character per pin, '-' where unknown). */
export function pinLevels(part: Part, levels: ReadonlyMap<string, Level> | undefined, modulePins?: ModulePins): string {
  if (!levels || levels.size === 0) return '';
  let s = '';
  for (const pin of allPins(part, modulePins)) s += levels.get(`${part.id}.${pin}`) ?? '-';
  return s;
}

function shownState(part: Part, tryOut: ReadonlyMap<string, boolean> | undefined): boolean {
  const mine = tryOut?.get(part.id);
  if (part.kind === 'switch') return mine ?? part.on;
  if (part.kind === 'button') return mine ?? part.pressed;
  return false;
}

function samePins(a: PinSet | undefined, b: PinSet | undefined): boolean {
  if (a === b) return true;
  if (!a || !b) return false;
  return a.inputs.join('\n') === b.inputs.join('\n') && a.outputs.join('\n') === b.outputs.join('\n');
}

/** Side length of a pin's box on the canvas (canvas.css `.gf-pin`), centred on the pin's spot. */
export const PIN_BOX = 8;

/** A part's size and its pins as React Flow handle boxes (what it would measure in the page). */
export function shapeWithHandles(part: Part, pins: PinSet | undefined): { w: number; h: number; handles: NodeHandle[] } {
  const shape = placedShape(part, pins && part.kind === 'module' ? new Map([[part.module, pins]]) : undefined);
  const half = PIN_BOX / 2;
  const handles = shape.pins.map((spot): NodeHandle => ({
    id: spot.pin, type: spot.output ? 'source' : 'target', position: spot.side as Position,
    x: spot.x - half, y: spot.y - half, width: PIN_BOX, height: PIN_BOX,
  }));
  return { w: shape.w, h: shape.h, handles };
}

/** Nodes for `input.parts`, reusing the node in `prev` (by id) wherever nothing it shows has changed. */
export function deriveNodes(input: DeriveNodesInput, prev: ReadonlyMap<string, PartNode>): PartNode[] {
  const out: PartNode[] = new Array(input.parts.length);
  input.parts.forEach((part, i) => {
    const old = prev.get(part.id);
    const levels = pinLevels(part, input.levels, input.modulePins);
    // an instance's pins are its module's ports: the node keeps the old pin set while they read the same
    const freshPins = part.kind === 'module' ? input.modulePins?.get(part.module) ?? { inputs: [], outputs: [] } : undefined;
    const pins = samePins(old?.data.pins, freshPins) ? old?.data.pins : freshPins;
    const shown = shownState(part, input.tryOut);
    // The bench sends fresh badge objects with every simulation step: keep the old one while it says the same.
    const fresh = input.badges?.get(part.id);
    const badge = fresh && old?.data.badge && old.data.badge.tone === fresh.tone && old.data.badge.text === fresh.text ? old.data.badge : fresh;
    const highlight = input.highlight?.has(part.id) ?? false;
    const mark = input.marks?.get(part.id);
    const remoteColor = input.remoteSelection?.get(part.id);
    const drag = input.remoteDrag?.get(part.id);
    const x = drag ? drag.x : part.x;
    const y = drag ? drag.y : part.y;
    if (old) {
      const d = old.data;
      if (d.part === part && d.levels === levels && d.shown === shown && d.badge === badge && d.highlight === highlight
        && d.remoteColor === remoteColor && d.readOnly === input.readOnly && d.mark === mark && d.pins === pins && old.position.x === x && old.position.y === y) {
        out[i] = old;
        return;
      }
    }
    const same = old && old.data.part === part && old.data.pins === pins;
    const shape = same ? { w: old.width as number, h: old.height as number, handles: old.handles as NodeHandle[] }
      : shapeWithHandles(part, pins);
    out[i] = {
      id: part.id,
      type: 'part',
      position: old && old.position.x === x && old.position.y === y ? old.position : { x, y },
      width: shape.w,
      height: shape.h,
      // Size and pin boxes are known from the geometry: React Flow draws the wires at once and never
      // measures a part in the page (a getBoundingClientRect per pin of every part on opening).
      measured: same && old.measured ? old.measured : { width: shape.w, height: shape.h },
      handles: shape.handles,
      draggable: !input.readOnly,
      connectable: !input.readOnly,
      deletable: !input.readOnly,
      data: { part, levels, shown, badge, highlight, remoteColor, readOnly: input.readOnly, mark, ...(pins ? { pins } : {}) },
    };
  });
  return out;
}

/** Edges for the wires, coloured by the level of each wire's `from` pin; unchanged wires keep their edge. */
export function deriveEdges(wires: readonly Wire[], levels: ReadonlyMap<string, Level> | undefined, readOnly: boolean,
  prev: ReadonlyMap<string, WireEdge>, marks?: ReadonlyMap<string, CompareMark>): WireEdge[] {
  const out: WireEdge[] = [];
  for (const wire of wires) {
    const from = splitPinRef(wire.from);
    const to = splitPinRef(wire.to);
    if (!from || !to) continue;
    const level = levels?.get(wire.from);
    const old = prev.get(wire.id);
    const mark = marks?.get(wire.id);
    if (old && old.source === from.part && old.sourceHandle === from.pin && old.target === to.part && old.targetHandle === to.pin
      && old.data?.level === level && old.data?.mark === mark && old.deletable === !readOnly) {
      out.push(old);
      continue;
    }
    out.push({ id: wire.id, type: 'wire', source: from.part, sourceHandle: from.pin, target: to.part, targetHandle: to.pin,
      deletable: !readOnly, data: { level, mark } });
  }
  return out;
}

/** Index of a derived list by id (the `prev` of the next derivation). */
export function byId<T extends { id: string }>(list: readonly T[]): Map<string, T> {
  const m = new Map<string, T>();
  for (const item of list) m.set(item.id, item);
  return m;
}

type Local = { id: string; selected?: boolean; dragging?: boolean; measured?: unknown; position?: { x: number; y: number } };

/**
 * Joins freshly derived items with React Flow's local view state (selection, measured size, a drag in
 * progress), which never goes into the shared document. `bases` remembers which derived item each
 * local item was made from, so an unchanged derived item keeps the local object as it is.
 * Returns `local` itself when nothing changed.
 */
export function mergeLocal<T extends Local>(derived: readonly T[], local: readonly T[], bases: Map<string, T>): readonly T[] {
  const localById = byId(local);
  let changed = derived.length !== local.length;
  const out = derived.map((d, i) => {
    const l = localById.get(d.id);
    let next: T;
    if (!l) next = d;
    else if (bases.get(d.id) === d) next = l;
    else if (d.position === undefined) next = { ...d, selected: l.selected };
    else next = { ...d, selected: l.selected, measured: d.measured ?? l.measured, dragging: l.dragging, position: l.dragging ? l.position : d.position };
    bases.set(d.id, d);
    if (next !== local[i]) changed = true;
    return next;
  });
  if (bases.size > derived.length * 2 + 64) {
    const keep = new Set(derived.map((d) => d.id));
    for (const id of bases.keys()) if (!keep.has(id)) bases.delete(id);
  }
  return changed ? out : local;
}

/** The board with unchanged parts and wires taken from `prev` (same objects); `prev` itself if nothing changed. */
export function stabilizeBoard(prev: BoardFile | null, next: BoardFile): BoardFile {
  if (!prev) return next;
  const oldParts = byId(prev.parts);
  const oldWires = byId(prev.wires);
  let same = prev.title === next.title && prev.family === next.family && prev.parts.length === next.parts.length
    && prev.wires.length === next.wires.length;
  const parts = next.parts.map((p, i) => {
    const o = oldParts.get(p.id);
    const keep = o && shallowEqual(o, p) ? o : p;
    if (keep !== prev.parts[i]) same = false;
    return keep;
  });
  const wires = next.wires.map((w, i) => {
    const o = oldWires.get(w.id);
    const keep = o && o.from === w.from && o.to === w.to ? o : w;
    if (keep !== prev.wires[i]) same = false;
    return keep;
  });
  // an edit inside a module leaves the top level as it was, but is a new board all the same
  const modules = stabilizeModules(prev.modules, next.modules);
  if (modules !== prev.modules) same = false;
  return same ? prev : { ...next, parts, wires, ...(modules ? { modules } : {}) };
}

function shallowEqual(a: object, b: object): boolean {
  const ka = Object.keys(a);
  if (ka.length !== Object.keys(b).length) return false;
  for (const k of ka) if ((a as Record<string, unknown>)[k] !== (b as Record<string, unknown>)[k]) return false;
  return true;
}
