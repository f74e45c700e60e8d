/**
 * Whether the canvas is zoomed out far enough to draw plain boxes. Read ONCE per canvas (one store
 * subscription in the canvas): zoomed out the canvas draws the parts itself (flow/far-canvas.tsx), a
 * `useStore` in every part would run a thousand selectors on every pan frame of a 1,000-part board.
 */
import type { ReactFlowState } from '@xyflow/react';

/** Below this zoom a part is drawn as a plain box: a thousand detailed symbols cost whole frames to paint. */
export const DETAIL_ZOOM = 0.45;

/**
 * Plain boxes pay off only on a large sheet: a few hundred detailed symbols still pan smoothly, and a
 * small board (the 1-bit processor demo, about 30 parts, fits to view at ≈ 0.42) must stay readable.
 * Above this many parts on the sheet shown (the top level or the open module) the canvas draws boxes
 * below DETAIL_ZOOM; the bench boards of 1,000–5,000 parts are well above it.
 */
export const LARGE_SHEET = 300;

/**
 * Below this zoom a symbol's pin names and gate marks are under about 3 px — nothing of the symbol can
 * be read — so any board, however small, is drawn as boxes.
 */
export const ILLEGIBLE_ZOOM = 0.2;

/** How far out the view is: 0 at or above DETAIL_ZOOM, 1 between ILLEGIBLE_ZOOM and it, 2 below ILLEGIBLE_ZOOM. */
export type ZoomBand = 0 | 1 | 2;

/**
 * Store selector: the zoom band. A number that changes only when the zoom crosses a threshold, so the one
 * subscription in the canvas renders nothing on pan frames or ordinary zoom steps.
 */
export const zoomBand = (s: ReactFlowState): ZoomBand => {
  const zoom = s.transform[2];
  return zoom < ILLEGIBLE_ZOOM ? 2 : zoom < DETAIL_ZOOM ? 1 : 0;
};

/** Whether a sheet of `partCount` parts is drawn as plain boxes in zoom band `band`. */
export function drawsFar(band: ZoomBand, partCount: number): boolean {
  return band === 2 || (band === 1 && partCount > LARGE_SHEET);
}

/** Store selector: true while zoomed out below DETAIL_ZOOM (whatever the board's size). */
export const zoomedOut = (s: ReactFlowState): boolean => s.transform[2] < DETAIL_ZOOM;

/** Least on-screen size (px) of a far box's title: smaller text is noise, so it is left out. */
export const FAR_TITLE_MIN_PX = 9;

/** Widest glyph advance of the title font as a share of its size (a monospace font is 0.6). */
const GLYPH = 0.6;

/**
 * The title a far box of `w` × `h` (flow units) can hold: its font size in flow units, the least zoom at
 * which that font is FAR_TITLE_MIN_PX on screen, and the text (cut with an ellipsis if it still does not
 * fit). The font is two fifths of the box's height (at most 40), made smaller — down to half that — for a
 * long text to fit the width. Null when the box cannot hold three characters. Depends on the part alone,
 * so it is worked out once per part, not on zoom frames.
 */
export function farTitle(text: string, w: number, h: number): { text: string; size: number; minZoom: number } | null {
  const full = Math.min(h * 0.4, 40);
  if (!text || !(full > 0) || !(w > 8)) return null;
  const size = Math.max(Math.min(full, (w - 8) / (text.length * GLYPH)), full / 2);
  const fits = Math.floor((w - 8) / (size * GLYPH));
  if (fits < 3) return null;
  const shown = text.length <= fits ? text : `${text.slice(0, fits - 1)}…`;
  return { text: shown, size, minZoom: FAR_TITLE_MIN_PX / size };
}

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
