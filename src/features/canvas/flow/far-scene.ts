/**
 * Geometry of the zoomed-out drawing (flow/far-canvas.tsx), kept free of the DOM so it can be tested:
 * which part a press lands on, which rectangle of the board the one <canvas> covers, and how each box and
 * wire is styled. The canvas draws the parts and wires in flow units under one transform; line widths are
 * given in screen pixels and divided by the zoom, so an outline stays as wide at any zoom.
 */
import type { Level } from '../../../../shared/sim';
import { MARK_COLORS, type CompareMark } from '../../../../shared/render';
import { INK, SIGNAL, levelColor } from '../lib/colors';
import type { PartNode } from './types';

export interface Rect { x: number; y: number; width: number; height: number }

/** A part's box in flow units (its size as React Flow holds it). */
export function boxOf(n: PartNode): Rect {
  return { x: n.position.x, y: n.position.y, width: n.width ?? n.measured?.width ?? 0, height: n.height ?? n.measured?.height ?? 0 };
}

/** Boxes as one flat array (x, y, w, h per part), in drawing order: the last one is on top. */
export function packBoxes(nodes: readonly PartNode[]): Float64Array {
  const out = new Float64Array(nodes.length * 4);
  nodes.forEach((n, i) => {
    const b = boxOf(n);
    out[i * 4] = b.x; out[i * 4 + 1] = b.y; out[i * 4 + 2] = b.width; out[i * 4 + 3] = b.height;
  });
  return out;
}

/**
 * Index of the part under the flow point (x, y): the topmost box that holds it, or else the nearest box
 * within `slop` flow units (a lamp is a few pixels across when zoomed out; a press just beside it is
 * meant for it). -1 when none.
 */
export function hitPart(boxes: Float64Array, x: number, y: number, slop = 0): number {
  let best = -1;
  let bestDist = slop;
  for (let i = boxes.length / 4 - 1; i >= 0; i--) {
    const bx = boxes[i * 4]; const by = boxes[i * 4 + 1]; const bw = boxes[i * 4 + 2]; const bh = boxes[i * 4 + 3];
    const dx = x < bx ? bx - x : x > bx + bw ? x - bx - bw : 0;
    const dy = y < by ? by - y : y > by + bh ? y - by - bh : 0;
    if (dx === 0 && dy === 0) return i;
    const d = Math.hypot(dx, dy);
    if (d <= bestDist) { best = i; bestDist = d; }
  }
  return best;
}

/** Whether two rectangles overlap (touching edges do not). */
export function overlaps(a: Rect, b: Rect): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

function intersect(a: Rect, b: Rect): Rect | null {
  const x = Math.max(a.x, b.x); const y = Math.max(a.y, b.y);
  const r = Math.min(a.x + a.width, b.x + b.width); const btm = Math.min(a.y + a.height, b.y + b.height);
  return r > x && btm > y ? { x, y, width: r - x, height: btm - y } : null;
}

/** Rectangle around all boxes, grown by `pad` flow units (badges, outlines and wire loops stick out). */
export function sceneBounds(boxes: Float64Array, pad: number): Rect | null {
  if (boxes.length === 0) return null;
  let x0 = Infinity; let y0 = Infinity; let x1 = -Infinity; let y1 = -Infinity;
  for (let i = 0; i < boxes.length; i += 4) {
    x0 = Math.min(x0, boxes[i]); y0 = Math.min(y0, boxes[i + 1]);
    x1 = Math.max(x1, boxes[i] + boxes[i + 2]); y1 = Math.max(y1, boxes[i + 1] + boxes[i + 3]);
  }
  return { x: x0 - pad, y: y0 - pad, width: x1 - x0 + 2 * pad, height: y1 - y0 + 2 * pad };
}

/** Most canvas pixels the drawing holds when it covers the whole board (4 M px: 16 MB of bitmap). */
export const WHOLE_BOARD_MAX_PX = 4_000_000;

/**
 * The rectangle (flow units) the canvas covers. The whole board when that is at most WHOLE_BOARD_MAX_PX
 * canvas pixels at `scale` (zoom × device pixels): then a pan never redraws. Otherwise the `view` grown by
 * half its size on every side, cut to the board: a pan redraws once the view leaves it (needsRegion).
 */
export function farRegion(bounds: Rect, view: Rect, scale: number): Rect | null {
  if (bounds.width * scale * bounds.height * scale <= WHOLE_BOARD_MAX_PX) return bounds;
  const grown = { x: view.x - view.width / 2, y: view.y - view.height / 2, width: view.width * 2, height: view.height * 2 };
  return intersect(grown, bounds);
}

/** Whether the drawn `region` (null: nothing drawn) still covers everything of the board in `view`. */
export function coversView(region: Rect | null, bounds: Rect, view: Rect): boolean {
  const need = intersect(bounds, view);
  if (!need) return true;
  if (!region) return false;
  return need.x >= region.x && need.y >= region.y && need.x + need.width <= region.x + region.width && need.y + need.height <= region.y + region.height;
}

/** The flow rectangle a view translated by (tx, ty) at `zoom` shows on a `width` × `height` px pane. */
export function viewRect(tx: number, ty: number, zoom: number, width: number, height: number): Rect {
  return { x: -tx / zoom, y: -ty / zoom, width: width / zoom, height: height / zoom };
}

/** How a box is outlined and filled: colours, the outline's width on screen (px) and its opacity. */
export interface BoxStyle { stroke: string; width: number; fill: string; alpha: number; round: boolean }

const LIT = 'rgba(255, 179, 71, 0.9)';

/** A part's box style: selection first, then a compare mark, a highlight, a collaborator's selection. */
export function boxStyle(n: PartNode): BoxStyle {
  const { part, highlight, remoteColor, mark, levels } = n.data;
  const round = part.kind === 'lamp' || part.kind === 'probe';
  // a lamp lit by the simulation shows it even as a dot: its single pin's level is high
  const fill = part.kind === 'lamp' && levels === '1' ? LIT : INK.fill;
  let stroke: string = INK.dim; let width = 1.5; let alpha = 1;
  if (n.selected) { stroke = '#ffd08a'; width = 2.5; }
  else if (mark) { stroke = MARK_COLORS[mark]; width = 2.5; alpha = mark === 'removed' ? 0.55 : 1; }
  else if (highlight) { stroke = '#4cc9f0'; width = 2.5; }
  else if (remoteColor) { stroke = remoteColor; width = 2; }
  return { stroke, width, fill, alpha, round };
}

/** A wire's stroke on the far drawing: colour, width on screen (at least one pixel) and dash (screen px). */
export function farWireStroke(level: Level | undefined, mark: CompareMark | undefined, selected: boolean | undefined, zoom: number): { color: string; width: number; dash: readonly number[] } {
  const color = selected ? '#e6edf3' : mark ? MARK_COLORS[mark] : levelColor(level);
  const flowWidth = selected ? 3 : mark ? 3.5 : level === '1' ? 2.5 : 2;
  const dashed = mark === 'removed' || level === 'Z';
  return { color, width: Math.max(flowWidth * zoom, level === '1' || selected || mark ? 1.5 : 1), dash: dashed ? [4, 3] : [] };
}

/** Badge colours by tone (as the detailed canvas's badges). */
export const BADGE_FILL = { conflict: SIGNAL.x, oscillating: SIGNAL.high, undriven: SIGNAL.z, info: '#4cc9f0' } as const;

/** How many selected parts the summary names before it only counts the rest. */
const NAMED = 12;

/**
 * The selection in words, for the live region beside the canvas (screen readers): "No part selected", or
 * how many and their names (`nameOf`: the screens' readable name, e.g. displayNames; else the label or
 * the kind and id), the first NAMED of them.
 */
export function selectionSummary(nodes: readonly PartNode[], nameOf?: (n: PartNode) => string | undefined): string {
  const names: string[] = [];
  let count = 0;
  for (const n of nodes) {
    if (!n.selected) continue;
    count++;
    if (names.length < NAMED) names.push(nameOf?.(n) ?? (n.data.part.label || `${n.data.part.kind} ${n.id}`));
  }
  if (count === 0) return 'No part selected';
  const more = count > names.length ? ` and ${count - names.length} more` : '';
  return `${count} ${count === 1 ? 'part' : 'parts'} selected: ${names.join(', ')}${more}`;
}

/** The step a wire leaves a pin by before it turns (wire-path.ts: getSmoothStepPath's offset). */
export const WIRE_STEP = 12;

/**
 * The corners of a wire from an output on the right of a part to an input on the left of a part further
 * right — nearly every wire — as a polyline (x, y pairs): along, across at the middle, along; the route
 * React Flow's smooth-step path takes there (its 4-unit rounded corners are under 2 px when zoomed out).
 * Null for any other wire, whose path the far drawing takes from wire-path.ts instead. Skips building and
 * parsing an SVG path per wire on the drawing's first paint.
 */
export function straightRoute(sx: number, sy: number, sourceSide: string, tx: number, ty: number, targetSide: string): number[] | null {
  if (sourceSide !== 'right' || targetSide !== 'left' || tx - sx <= 2 * WIRE_STEP) return null;
  if (sy === ty) return [sx, sy, tx, ty];
  const mx = (sx + tx) / 2;
  return [sx, sy, mx, sy, mx, ty, tx, ty];
}
