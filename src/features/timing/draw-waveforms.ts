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
  height: number;
  view: Viewport;
  cursor: number | null;
  axis: AxisMode;
  /** device pixels per CSS pixel */
  scale: number;
}

/** Draws the whole strip (axis, rows, waveforms, cursor and its readout) onto a 2D context. */
export function drawWaveforms(ctx: CanvasRenderingContext2D, trace: Trace, o: DrawOptions): void {
  const plotW = Math.max(1, o.width - LABEL_W);
  ctx.setTransform(o.scale, 0, 0, o.scale, 0, 0);
  ctx.fillStyle = WAVE_COLOURS.surface;
  ctx.fillRect(0, 0, o.width, o.height);
  ctx.font = '11px "JetBrains Mono", ui-monospace, monospace';
  ctx.textBaseline = 'middle';
  drawAxis(ctx, trace, o, plotW);
  trace.signals.forEach((signal, row) => {
    const top = AXIS_H + row * ROW_H;
    ctx.strokeStyle = WAVE_COLOURS.grid;
    ctx.setLineDash([]);
    ctx.beginPath();
    ctx.moveTo(0, top + ROW_H - 0.5);
    ctx.lineTo(o.width, top + ROW_H - 0.5);
    ctx.stroke();
    ctx.fillStyle = WAVE_COLOURS.text;
    ctx.fillText(clip(signal.name, 11), 8, top + ROW_H / 2);
    if (o.cursor !== null) {
      const v = levelAt(signal.changes, o.cursor);
      ctx.fillStyle = colourOf(v);
      ctx.fillText(v, LABEL_W - 18, top + ROW_H / 2);
    }
    ctx.save();
    ctx.beginPath();
    ctx.rect(LABEL_W, top, plotW, ROW_H);
    ctx.clip();
    // nothing before a row's first recorded change (a signal picked later has no earlier history)
    if (signal.changes.length) drawRow(ctx, signal.changes, o, plotW, top, Math.max(trace.start, signal.changes[0].t));
    ctx.restore();
  });
  if (o.cursor !== null) {
    const x = LABEL_W + xAtTime(o.view, o.cursor, plotW);
    if (x >= LABEL_W && x <= o.width) {
      ctx.strokeStyle = WAVE_COLOURS.cursor;
      ctx.setLineDash([]);
      ctx.beginPath();
      ctx.moveTo(x + 0.5, AXIS_H);
      ctx.lineTo(x + 0.5, o.height);
      ctx.stroke();
    }
  }
}

function drawAxis(ctx: CanvasRenderingContext2D, trace: Trace, o: DrawOptions, plotW: number): void {
  ctx.fillStyle = WAVE_COLOURS.dim;
  const label = o.cursor === null ? (o.axis === 'cycles' ? 'cycles' : 'time') : `t=${fmt(o.cursor)} c${cycleAt(trace.edges, o.cursor)}`;
  ctx.fillText(clip(label, 17), 8, AXIS_H / 2);
  const ticks: { t: number; text: string }[] = [];
  if (o.axis === 'cycles') {
    const visible = trace.edges.map((t, i) => ({ t, text: String(i + 1) })).filter((e) => e.t >= o.view.start && e.t <= o.view.start + o.view.span);
    const every = Math.max(1, Math.ceil((visible.length * 40) / plotW));
    visible.forEach((e, i) => i % every === 0 && ticks.push(e));
  } else {
    const step = tickStep(o.view.span, plotW);
    for (let t = Math.ceil(o.view.start / step) * step; t <= o.view.start + o.view.span; t += step) ticks.push({ t, text: fmt(t) });
  }
  for (const tick of ticks) {
    const x = LABEL_W + xAtTime(o.view, tick.t, plotW);
    ctx.strokeStyle = WAVE_COLOURS.grid;
    ctx.setLineDash([]);
    ctx.beginPath();
    ctx.moveTo(x + 0.5, AXIS_H - 5);
    ctx.lineTo(x + 0.5, o.height);
    ctx.stroke();
    ctx.fillStyle = WAVE_COLOURS.dim;
    ctx.fillText(tick.text, x + 3, AXIS_H / 2);
  }
}

/** One signal's waveform; nothing is drawn before `from`, where its recording started. */
function drawRow(ctx: CanvasRenderingContext2D, changes: Trace['signals'][number]['changes'], o: DrawOptions, plotW: number, top: number, from: number): void {
  const hi = top + 5;
  const lo = top + ROW_H - 5;
  const mid = (hi + lo) / 2;
  const t1 = o.view.start + o.view.span;
  const segs = segmentsIn(changes, Math.max(o.view.start, from), t1, o.view.span / plotW);
  let prevY: number | null = null;
  for (const s of segs) {
    const x0 = LABEL_W + xAtTime(o.view, s.from, plotW);
    const x1 = LABEL_W + xAtTime(o.view, s.to, plotW);
    ctx.setLineDash([]);
    ctx.lineWidth = 1.5;
    if (s.v === 'X' || s.v === 'busy') {
      ctx.fillStyle = s.v === 'X' ? 'rgba(224,64,160,0.35)' : 'rgba(255,179,71,0.3)';
      ctx.fillRect(x0, hi, Math.max(1, x1 - x0), lo - hi);
      ctx.strokeStyle = s.v === 'X' ? WAVE_COLOURS.x : WAVE_COLOURS.high;
      ctx.strokeRect(x0, hi, Math.max(1, x1 - x0), lo - hi);
      prevY = null;
      continue;
    }
    const y = s.v === '1' ? hi : s.v === '0' ? lo : mid;
    ctx.strokeStyle = colourOf(s.v);
    if (s.v === 'Z') ctx.setLineDash([4, 3]);
    ctx.beginPath();
    if (prevY !== null && prevY !== y) {
      ctx.moveTo(x0, prevY);
      ctx.lineTo(x0, y);
    } else ctx.moveTo(x0, y);
    ctx.lineTo(x1, y);
    ctx.stroke();
    prevY = y;
  }
  ctx.lineWidth = 1;
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
