import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseBoardFile } from '../../../shared/board';
import { codeLevel, LiveEngine, type LiveUpdate, type Timers } from '../../../shared/sim';
import { AXIS_H, LABEL_W, ROW_H, WAVE_COLOURS, drawWaveforms, rowsInView } from './draw-waveforms';
import { defaultSignals } from './signals';
import { emptyTrace, pushChange, type Trace } from './trace';
import { placed, type Viewport } from './viewport';

/** A 2D context that records what is stroked (each line with its colour) and the text written. */
function recordingContext() {
  let path: number[][] = [];
  let at: number[] = [0, 0];
  const lines: { colour: string; x0: number; y0: number; x1: number; y1: number }[] = [];
  const texts: string[] = [];
  let strokes = 0;
  const ctx = {
    fillStyle: '', strokeStyle: '', font: '', textBaseline: '', lineWidth: 1,
    setTransform() {}, fillRect() {}, save() {}, restore() {}, clip() {}, setLineDash() {}, fill() {},
    rect() {},
    beginPath() { path = []; },
    moveTo(x: number, y: number) { at = [x, y]; },
    lineTo(x: number, y: number) { path.push([at[0], at[1], x, y]); at = [x, y]; },
    stroke() { strokes++; for (const [x0, y0, x1, y1] of path) lines.push({ colour: ctx.strokeStyle, x0, y0, x1, y1 }); },
    fillText(t: string) { texts.push(t); },
  };
  return { ctx: ctx as unknown as CanvasRenderingContext2D, lines, texts, strokes: () => strokes };
}

const INITIAL: Viewport = { start: 0, span: 400, follow: true };
const WIDTH = 800;
const stillTimers: Timers = { now: () => 0, setTimeout: () => undefined, clearTimeout: () => undefined };

/** The waveform lines (level colours) drawn in row `row`'s band. */
const rowLines = (lines: ReturnType<typeof recordingContext>['lines'], row: number) => lines.filter((l) =>
  (l.colour === WAVE_COLOURS.high || l.colour === WAVE_COLOURS.low) && l.y0 > AXIS_H + row * ROW_H && l.y0 < AXIS_H + (row + 1) * ROW_H);

describe('timing strip right after it opens', () => {
  it('draws each signal\'s present level as a line across the strip, also when the recording starts late (the 1-bit processor)', () => {
    // the bench's engine on the demo processor: its first recording starts when power-on has settled
    const parsed = parseBoardFile(JSON.parse(readFileSync(new URL('../../../examples/one-bit-processor.gatefold.json', import.meta.url), 'utf8')));
    if (!parsed.ok) throw new Error('fixture');
    const sent: LiveUpdate[] = [];
    const engine = new LiveEngine((m) => sent.push(m), stillTimers);
    engine.handle({ type: 'load', board: parsed.board, tryOut: [] });
    const compiled = sent.find((m): m is Extract<LiveUpdate, { type: 'compiled' }> => m.type === 'compiled')!;
    engine.handle({ type: 'subscribe', signals: defaultSignals(compiled) });
    // fold the state messages as the page does (bench trace-store): the rows, then the changes
    let trace: Trace = emptyTrace();
    for (const m of sent) {
      if (m.type !== 'state') continue;
      if (m.traceReset) trace = emptyTrace(m.traceReset.signals, m.traceReset.at);
      for (let i = 0; i + 2 < m.trace.length; i += 3) pushChange(trace.signals[m.trace[i]].changes, m.trace[i + 1], codeLevel(m.trace[i + 2]));
      if (trace.signals.length && m.time > trace.end) trace.end = m.time;
    }
    expect(trace.signals.length).toBe(13);
    // nothing has changed since: the recording is one instant, later than the strip's first window
    expect(trace.end).toBe(trace.start);
    expect(trace.start).toBeGreaterThan(INITIAL.span);
    expect(trace.signals.every((s) => s.changes.length === 1)).toBe(true);

    const { ctx, lines } = recordingContext();
    const height = AXIS_H + trace.signals.length * ROW_H;
    drawWaveforms(ctx, trace, { width: WIDTH, height, view: placed(INITIAL, trace.end, trace.start), cursor: null, axis: 'time', scale: 1 });
    trace.signals.forEach((s, row) => {
      const level = s.changes[0].v;
      const drawn = rowLines(lines, row);
      expect(drawn, `${s.name} (${level})`).toHaveLength(1);
      expect(drawn[0]).toMatchObject({ colour: level === '1' ? WAVE_COLOURS.high : WAVE_COLOURS.low, x0: LABEL_W, x1: WIDTH });
    });
    // the window the strip had before: it ended where the recording starts, so every row was empty
    const { ctx: before, lines: old } = recordingContext();
    drawWaveforms(before, trace, { width: WIDTH, height, view: { ...INITIAL, start: trace.end - INITIAL.span }, cursor: null, axis: 'time', scale: 1 });
    expect(trace.signals.map((_, row) => rowLines(old, row).length)).toEqual(trace.signals.map(() => 0));
  });

  it('slides once the recording is longer than the window, the newest time at the right', () => {
    expect(placed(INITIAL, 5_000, 5_000).start).toBe(5_000);
    expect(placed(INITIAL, 5_300, 5_000).start).toBe(5_000);
    expect(placed(INITIAL, 5_600, 5_000).start).toBe(5_200);
    expect(placed({ ...INITIAL, follow: false, start: 10 }, 5_600, 5_000).start).toBe(10);
  });
});

describe('drawing only what the strip shows', () => {
  // 500 recorded signals (the 1,000-part bench board's switches and lamps), one change each, and two toggling
  const trace = emptyTrace(Array.from({ length: 500 }, (_, i) => `S${i}`), 0);
  trace.signals.forEach((s, i) => s.changes.push({ t: 0, v: i % 2 ? '1' : '0' }));
  trace.end = 1_000;

  it('works out the rows in view from the scroll position and the canvas height', () => {
    expect(rowsInView(500, 0, AXIS_H + 5 * ROW_H)).toEqual({ first: 0, end: 5 });
    expect(rowsInView(500, 100 * ROW_H + 3, AXIS_H + 5 * ROW_H)).toEqual({ first: 100, end: 106 });
    expect(rowsInView(500, 498 * ROW_H, AXIS_H + 5 * ROW_H)).toEqual({ first: 498, end: 500 });
    expect(rowsInView(3, 0, 1_000)).toEqual({ first: 0, end: 3 });
  });

  it('writes and draws only the rows in view, each kind of line as one stroke', () => {
    const { ctx, texts, lines, strokes } = recordingContext();
    const top = 100 * ROW_H;
    drawWaveforms(ctx, trace, { width: WIDTH, height: AXIS_H + 5 * ROW_H, view: { start: 0, span: 1_000, follow: false }, cursor: null, axis: 'time', scale: 1, top });
    expect(texts.filter((t) => t.startsWith('S'))).toEqual(['S100', 'S101', 'S102', 'S103', 'S104']);
    const waves = lines.filter((l) => l.colour === WAVE_COLOURS.high || l.colour === WAVE_COLOURS.low);
    expect(waves).toHaveLength(5);
    // row 100 is drawn in the first row's place under the axis, its level 0 at the bottom of the band
    expect(waves.find((l) => l.colour === WAVE_COLOURS.low)?.y0).toBe(AXIS_H + ROW_H - 5);
    // axis grid, row lines, the two levels: a handful of strokes however many rows there are
    expect(strokes()).toBeLessThanOrEqual(5);
  });
});
