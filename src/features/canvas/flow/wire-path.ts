/**
 * A wire's path and stroke, shared by the wire edge (zoomed in, one React Flow edge per wire) and the
 * zoomed-out wires (one drawing of them all, far-wires.tsx), so both draw the same line.
 */
import { getSmoothStepPath, Position, type NodeHandle } from '@xyflow/react';
import { MARK_COLORS, type CompareMark } from '../../../../shared/render';
import type { Level } from '../../../../shared/sim';
import { levelColor } from '../lib/colors';
import { selfLoopPath, type Box } from './self-loop-path';

export interface WireEnds {
  sourceX: number; sourceY: number; sourcePosition: Position;
  targetX: number; targetY: number; targetPosition: Position;
}

/** SVG path data of a wire: right angles, or around the part for a part wired to itself (`loop`: its box). */
export function wirePath(ends: WireEnds, loop: Box | null): string {
  return loop ? selfLoopPath(ends.sourceX, ends.sourceY, ends.targetX, ends.targetY, loop)
    : getSmoothStepPath({ ...ends, borderRadius: 4, offset: 12 })[0];
}

/** The stroke of a wire by its level, compare mark and selection. */
export function wireStyle(level: Level | undefined, mark: CompareMark | undefined, selected: boolean | undefined) {
  return {
    stroke: selected ? '#e6edf3' : mark ? MARK_COLORS[mark] : levelColor(level),
    // A high wire is drawn a little heavier; no CSS filter (a glow filter on every wire costs whole frames
    // when a large board pans on a machine without GPU compositing).
    strokeWidth: selected ? 3 : mark ? 3.5 : level === '1' ? 2.5 : 2,
    strokeDasharray: mark === 'removed' || level === 'Z' ? '5 4' : undefined,
  };
}

/** Where a wire meets a pin: the middle of the pin box's side that faces out (as React Flow places it). */
export function pinEnd(node: { position: { x: number; y: number }; handles?: NodeHandle[] }, pin: string | null | undefined): { x: number; y: number; position: Position } | null {
  const h = node.handles?.find((c) => c.id === pin);
  if (!h) return null;
  const x = node.position.x + h.x;
  const y = node.position.y + h.y;
  const w = h.width ?? 1;
  const hh = h.height ?? 1;
  switch (h.position) {
    case Position.Left: return { x, y: y + hh / 2, position: h.position };
    case Position.Right: return { x: x + w, y: y + hh / 2, position: h.position };
    case Position.Top: return { x: x + w / 2, y, position: h.position };
    case Position.Bottom: return { x: x + w / 2, y: y + hh, position: h.position };
  }
}
