/**
 * Whether the canvas is zoomed out far enough to draw plain boxes. Read ONCE per canvas (one store
 * subscription in the canvas): zoomed out the canvas draws the parts itself (flow/far-parts.tsx), a
 * `useStore` in every part would run a thousand selectors on every pan frame of a 1,000-part board.
 */
import type { ReactFlowState } from '@xyflow/react';

/** Below this zoom a part is drawn as a plain box: a thousand detailed symbols cost whole frames to paint. */
export const DETAIL_ZOOM = 0.45;

/** Store selector: true while zoomed out below DETAIL_ZOOM. */
export const zoomedOut = (s: ReactFlowState): boolean => s.transform[2] < DETAIL_ZOOM;

/** The canvas's least zoom on an ordinary board. */
export const LEAST_ZOOM = 0.1;

/**
 * The least zoom for a board whose parts span `bounds` on a canvas of `width` × `height` px: LEAST_ZOOM,
 * or lower when the whole board would not fit at that zoom with fitView's `padding` (the canvas less
 * canvas / (1 + padding)) — else fit-to-view stops at LEAST_ZOOM and leaves the parts outside the view
 * undrawn (the canvas draws only what is in view).
 */
export function leastZoom(bounds: { width: number; height: number }, width: number, height: number, padding = 0.15): number {
  if (!(width > 0 && height > 0 && bounds.width > 0 && bounds.height > 0)) return LEAST_ZOOM;
  const fit = Math.min(width / (bounds.width * (1 + padding)), height / (bounds.height * (1 + padding)));
  return Math.min(LEAST_ZOOM, Math.floor(fit * 1000) / 1000);
}

/**
 * The rectangle (flow coordinates) the dot grid covers for a view translated by (x, y) at `zoom` on a
 * `width` × `height` px canvas: 3 × 3 cells around the view's middle, a cell two canvases wide at the
 * zoom rounded down to a power of two (whole thousands, so the dots stay on the grid). The view can pan
 * over a canvas and a half, or zoom out to half, before the rectangle changes — so the grid is drawn
 * again once in many frames, never on each one.
 */
export function gridRect(x: number, y: number, zoom: number, width: number, height: number): { left: number; top: number; width: number; height: number } {
  if (!(width > 0 && height > 0 && zoom > 0)) return { left: 0, top: 0, width: 0, height: 0 };
  const level = 2 ** Math.floor(Math.log2(zoom));
  const cw = Math.ceil((2 * width) / level / 1000) * 1000;
  const ch = Math.ceil((2 * height) / level / 1000) * 1000;
  const cx = (width / 2 - x) / zoom;
  const cy = (height / 2 - y) / zoom;
  return { left: (Math.floor(cx / cw) - 1) * cw, top: (Math.floor(cy / ch) - 1) * ch, width: 3 * cw, height: 3 * ch };
}
