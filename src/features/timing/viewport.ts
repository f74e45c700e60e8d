/** The visible window of the timing strip, in simulated time units. */
export interface Viewport {
  start: number;
  span: number;
  /** while true the window keeps the newest time at its right edge */
  follow: boolean;
}

export const MIN_SPAN = 4;
export const MAX_SPAN = 1e9;

/** Zooms by `factor` (>1 zooms out) keeping the time under `anchor` (0…1 across the width) in place. */
export function zoom(v: Viewport, factor: number, anchor = 0.5): Viewport {
  const span = Math.min(MAX_SPAN, Math.max(MIN_SPAN, v.span * factor));
  const at = v.start + v.span * anchor;
  return { start: Math.max(0, at - span * anchor), span, follow: false };
}

/** Moves the window by `dt` time units, never before time 0. */
export function pan(v: Viewport, dt: number): Viewport {
  return { ...v, start: Math.max(0, v.start + dt), follow: false };
}

/**
 * Where the window is for a recording from `start` to `end`: a following window begins where the
 * recording began, so each signal's level shows as a line from there on even before anything changed
 * (a recording that starts late in a run — a late joiner, a board whose power-on took long — has
 * start = end at first), and slides once the recording is longer than the window, `end` at the right.
 */
export function placed(v: Viewport, end: number, start = 0): Viewport {
  if (!v.follow) return v;
  return { ...v, start: Math.max(0, start, end - v.span) };
}

/** Time at pixel `x` of a strip `width` pixels wide, and the inverse. */
export function timeAtX(v: Viewport, x: number, width: number): number {
  return v.start + (x / Math.max(1, width)) * v.span;
}
export function xAtTime(v: Viewport, t: number, width: number): number {
  return ((t - v.start) / v.span) * width;
}

/**
 * Tick spacing for the time axis: a 1-2-5 step giving ticks at least `minPx` pixels apart
 * (common practice for chart axes, no source).
 */
export function tickStep(span: number, width: number, minPx = 70): number {
  const raw = (span * minPx) / Math.max(1, width);
  const pow = 10 ** Math.floor(Math.log10(Math.max(raw, 1e-9)));
  for (const m of [1, 2, 5, 10]) if (m * pow >= raw) return Math.max(1, m * pow);
  return Math.max(1, 10 * pow);
}
