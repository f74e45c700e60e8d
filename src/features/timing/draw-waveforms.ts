import { cycleAt, levelAt, segmentsIn, type Trace } from './trace';
import { tickStep, xAtTime, type Viewport } from './viewport';

/** Our signal colours (tailwind.config.ts `signal`), repeated here because a canvas cannot read classes. */
export const WAVE_COLOURS = {
  high: '#ffb347',
  low: '#5b7a99',
  x: '#e040a0',
  z: '#8a8f98',
  surface: '#12161c',
  grid: '#242c36',
  text: '#c9d1db',
  dim: '#6b7785',
  cursor: '#ffd08a',
} as const;

export const LABEL_W = 132;
export const AXIS_H = 20;
export const ROW_H = 22;

export type AxisMode = 'time' | 'cycles';

export interface DrawOptions {
  width: number;
  /** height of the canvas: the axis, then as many rows as fit */
  height: number;
  view: Viewport;
  cursor: number | null;
  axis: AxisMode;
  /** device pixels per CSS pixel */
  scale: number;
  /** how far the rows are scrolled (CSS pixels); the axis stays at the top */
  top?: number;
}

/** The rows a canvas `height` pixels high shows when the rows are scrolled by `top` pixels: [first, end). */
export function rowsInView(count: number, top: number, height: number): { first: number; end: number } {
  const first = Math.max(0, Math.floor(top / ROW_H));
  const end = Math.min(count, Math.ceil((top + Math.max(0, height - AXIS_H)) / ROW_H));
  return { first, end: Math.max(first, end) };
}

/** One straight piece of a waveform, in canvas pixels. */
interface Line { x0: number; y0: number; x1: number; y1: number }
/** What a row draws: level lines (with the edges into them) by level, and boxes where it is unknown or busy. */
export interface RowStrokes { one: Line[]; zero: Line[]; z: Line[]; x: Line[]; busy: Line[] }

/**
 * Draws the strip (axis, the rows in view, their waveforms in the visible time, cursor and its readout)
 * onto a 2D context: only what the canvas shows, each kind of stroke as one path.
 */
export function drawWaveforms(ctx: CanvasRenderingContext2D, trace: Trace, o: DrawOptions): void {
  const plotW = Math.max(1, o.width - LABEL_W);
  const top = o.top ?? 0;
  ctx.setTransform(o.scale, 0, 0, o.scale, 0, 0);
  ctx.fillStyle = WAVE_COLOURS.surface;
  ctx.fillRect(0, 0, o.width, o.height);
  ctx.font = '11px "JetBrains Mono", ui-monospace, monospace';
  ctx.textBaseline = 'middle';
  ctx.lineWidth = 1;
  ctx.setLineDash([]);
  drawAxis(ctx, trace, o, plotW);
  const { first, end } = rowsInView(trace.signals.length, top, o.height);
  const strokes: RowStrokes = { one: [], zero: [], z: [], x: [], busy: [] };
  ctx.save();
  ctx.beginPath();
  ctx.rect(0, AXIS_H, o.width, Math.max(0, o.height - AXIS_H));
  ctx.clip();
  ctx.strokeStyle = WAVE_COLOURS.grid;
  ctx.beginPath();
  for (let row = first; row < end; row++) {
    const y = AXIS_H + row * ROW_H - top + ROW_H - 0.5;
    ctx.moveTo(0, y);
    ctx.lineTo(o.width, y);
  }
  ctx.stroke();
  for (let row = first; row < end; row++) {
    const signal = trace.signals[row];
    const rowTop = AXIS_H + row * ROW_H - top;
    ctx.fillStyle = WAVE_COLOURS.text;
    ctx.fillText(clip(signal.name, 11), 8, rowTop + ROW_H / 2);
    if (o.cursor !== null) {
      const v = levelAt(signal.changes, o.cursor);
      ctx.fillStyle = colourOf(v);
      ctx.fillText(v, LABEL_W - 18, rowTop + ROW_H / 2);
    }
    // nothing before a row's first recorded change (a signal picked later has no earlier history)
    if (signal.changes.length) rowStrokes(signal.changes, o.view, plotW, rowTop, Math.max(trace.start, signal.changes[0].t), strokes);
  }
  ctx.lineWidth = 1.5;
  strokeLines(ctx, strokes.one, WAVE_COLOURS.high);
  strokeLines(ctx, strokes.zero, WAVE_COLOURS.low);
  ctx.setLineDash([4, 3]);
  strokeLines(ctx, strokes.z, WAVE_COLOURS.z);
  ctx.setLineDash([]);
  boxes(ctx, strokes.x, 'rgba(224,64,160,0.35)', WAVE_COLOURS.x);
  boxes(ctx, strokes.busy, 'rgba(255,179,71,0.3)', WAVE_COLOURS.high);
  ctx.lineWidth = 1;
  ctx.restore();
  if (o.cursor !== null) {
    const x = LABEL_W + xAtTime(o.view, o.cursor, plotW);
    if (x >= LABEL_W && x <= o.width) {
      ctx.strokeStyle = WAVE_COLOURS.cursor;
      ctx.beginPath();
      ctx.moveTo(x + 0.5, AXIS_H);
      ctx.lineTo(x + 0.5, o.height);
      ctx.stroke();
    }
  }
}

function strokeLines(ctx: CanvasRenderingContext2D, lines: Line[], colour: string): void {
  if (!lines.length) return;
  ctx.strokeStyle = colour;
  ctx.beginPath();
  for (const l of lines) {
    ctx.moveTo(l.x0, l.y0);
    ctx.lineTo(l.x1, l.y1);
  }
  ctx.stroke();
}

/** Boxes (x0, y0)–(x1, y1): filled, then outlined, each kind as one path. */
function boxes(ctx: CanvasRenderingContext2D, list: Line[], fill: string, stroke: string): void {
  if (!list.length) return;
  ctx.beginPath();
  for (const b of list) ctx.rect(b.x0, b.y0, b.x1 - b.x0, b.y1 - b.y0);
  ctx.fillStyle = fill;
  ctx.fill();
  ctx.strokeStyle = stroke;
  ctx.stroke();
}

function drawAxis(ctx: CanvasRenderingContext2D, trace: Trace, o: DrawOptions, plotW: number): void {
  ctx.fillStyle = WAVE_COLOURS.dim;
  const label = o.cursor === null ? (o.axis === 'cycles' ? 'cycles' : 'time') : `t=${fmt(o.cursor)} c${cycleAt(trace.edges, o.cursor)}`;
  ctx.fillText(clip(label, 17), 8, AXIS_H / 2);
  const ticks: { t: number; text: string }[] = [];
  const t1 = o.view.start + o.view.span;
  if (o.axis === 'cycles') {
    // the edges in view only (a long run has many): edges[k] is the start of cycle k + 1
    const from = firstAtOrAfter(trace.edges, o.view.start);
    const to = cycleAt(trace.edges, t1);
    const every = Math.max(1, Math.ceil(((to - from) * 40) / plotW));
    for (let k = from; k < to; k++) if ((k - from) % every === 0) ticks.push({ t: trace.edges[k], text: String(k + 1) });
  } else {
    const step = tickStep(o.view.span, plotW);
    for (let t = Math.ceil(o.view.start / step) * step; t <= t1; t += step) ticks.push({ t, text: fmt(t) });
  }
  ctx.strokeStyle = WAVE_COLOURS.grid;
  ctx.beginPath();
  for (const tick of ticks) {
    const x = LABEL_W + xAtTime(o.view, tick.t, plotW);
    ctx.moveTo(x + 0.5, AXIS_H - 5);
    ctx.lineTo(x + 0.5, o.height);
  }
  ctx.stroke();
  ctx.fillStyle = WAVE_COLOURS.dim;
  for (const tick of ticks) ctx.fillText(tick.text, LABEL_W + xAtTime(o.view, tick.t, plotW) + 3, AXIS_H / 2);
}

/** Index of the first time in `sorted` at or after `t`. */
function firstAtOrAfter(sorted: readonly number[], t: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] < t) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * The strokes of one signal's waveform in the view, for a row whose top is at `top` (canvas pixels),
 * added to `out`; nothing is drawn before `from`, where its recording started.
 */
export function rowStrokes(changes: Trace['signals'][number]['changes'], view: Viewport, plotW: number, top: number, from: number, out: RowStrokes): void {
  const hi = top + 5;
  const lo = top + ROW_H - 5;
  const mid = (hi + lo) / 2;
  const t1 = view.start + view.span;
  const segs = segmentsIn(changes, Math.max(view.start, from), t1, view.span / plotW);
  let prevY: number | null = null;
  for (const s of segs) {
    const x0 = LABEL_W + xAtTime(view, s.from, plotW);
    const x1 = LABEL_W + xAtTime(view, s.to, plotW);
    if (s.v === 'X' || s.v === 'busy') {
      (s.v === 'X' ? out.x : out.busy).push({ x0, y0: hi, x1: x0 + Math.max(1, x1 - x0), y1: lo });
      prevY = null;
      continue;
    }
    const y = s.v === '1' ? hi : s.v === '0' ? lo : mid;
    const list = s.v === '1' ? out.one : s.v === '0' ? out.zero : out.z;
    // the edge into a level is drawn in that level's colour
    if (prevY !== null && prevY !== y) list.push({ x0, y0: prevY, x1: x0, y1: y });
    list.push({ x0, y0: y, x1, y1: y });
    prevY = y;
  }
}

function colourOf(v: string): string {
  return v === '1' ? WAVE_COLOURS.high : v === '0' ? WAVE_COLOURS.low : v === 'X' ? WAVE_COLOURS.x : WAVE_COLOURS.z;
}

function clip(text: string, n: number): string {
  return text.length > n ? `${text.slice(0, n - 1)}…` : text;
}

function fmt(t: number): string {
  return Number.isInteger(t) ? String(t) : t.toFixed(1);
}
