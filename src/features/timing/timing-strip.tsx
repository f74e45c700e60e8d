import { useEffect, useMemo, useRef, useState } from 'react';
import { toast } from 'sonner';
import { AXIS_H, LABEL_W, ROW_H, drawWaveforms, type AxisMode, type DrawOptions } from './draw-waveforms';
import { canvasPng, download, fileStem } from './export';
import { SignalPicker, type SignalChoice } from './signal-picker';
import { cycleAt, readout, risingEdges, type Trace } from './trace';
import { traceToVcd } from './vcd-export';
import { pan, placed, timeAtX, zoom, type Viewport } from './viewport';

export interface TimingStripProps {
  trace: Trace;
  /** bumps whenever the trace grew, so the strip redraws without copying the trace */
  version: number;
  available: SignalChoice[];
  chosen: string[];
  /** what the strip records until someone picks (the picker's "Inputs + outputs") */
  defaults?: string[];
  onChoose(names: string[]): void;
  /** forget the recording so far */
  onClear(): void;
  /** nanoseconds per simulated time unit of the board's family (for the VCD timescale) */
  timeUnitNs: number;
  title: string;
}

const INITIAL: Viewport = { start: 0, span: 400, follow: true };

/** The timing strip: waveforms of chosen signals over simulated time, with zoom, cursor and export. */
export function TimingStrip(props: TimingStripProps) {
  const { trace, version, available, chosen, defaults, onChoose, onClear, timeUnitNs, title } = props;
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const wrapRef = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(800);
  // the part of the rows the scrolled area shows: the canvas is that big and stays in place (sticky)
  const [box, setBox] = useState({ height: 200, top: 0 });
  const [view, setView] = useState<Viewport>(INITIAL);
  const [hover, setHover] = useState<number | null>(null);
  const [pinned, setPinned] = useState<number | null>(null);
  const [axis, setAxis] = useState<AxisMode>('time');
  const height = AXIS_H + Math.max(1, trace.signals.length) * ROW_H;
  const canvasH = Math.max(AXIS_H + ROW_H, Math.min(height, box.height));
  const top = Math.max(0, Math.min(box.top, height - canvasH));
  // a following window starts where the recording started: each level shows as a line from the start
  const shown = placed(view, trace.end, trace.start);
  const cursor = hover ?? pinned;

  useEffect(() => {
    const el = wrapRef.current;
    if (!el) return;
    const ro = new ResizeObserver(([entry]) => {
      setWidth(Math.max(200, Math.floor(entry.contentRect.width)));
      setBox((b) => ({ ...b, height: Math.floor(entry.contentRect.height) }));
    });
    ro.observe(el);
    return () => ro.disconnect();
  }, []);

  const traceRef = useRef(trace);
  traceRef.current = trace;
  // One drawing per frame at most, of what the canvas shows (the trace grows with every state message).
  const drawing = useRef<{ frame: number; options: DrawOptions | null }>({ frame: 0, options: null });
  useEffect(() => {
    const d = drawing.current;
    d.options = { width, height: canvasH, view: shown, cursor, axis, scale: window.devicePixelRatio || 1, top };
    if (d.frame) return;
    d.frame = requestAnimationFrame(() => {
      d.frame = 0;
      const canvas = canvasRef.current;
      const ctx = canvas?.getContext('2d');
      const o = d.options;
      if (!canvas || !ctx || !o) return;
      const w = Math.round(o.width * o.scale);
      const h = Math.round(o.height * o.scale);
      if (canvas.width !== w) canvas.width = w;
      if (canvas.height !== h) canvas.height = h;
      drawWaveforms(ctx, traceRef.current, o);
    });
  }, [trace, version, width, canvasH, shown.start, shown.span, cursor, axis, top]);
  useEffect(() => () => {
    cancelAnimationFrame(drawing.current.frame);
    drawing.current.frame = 0;
  }, []);

  const values = useMemo(() => (cursor === null ? [] : readout(trace, cursor)), [trace, version, cursor]);
  const rises = useMemo(() => trace.signals.map((s) => risingEdges(s.changes)), [trace, version]);

  const timeAt = (e: { clientX: number }) => {
    const rect = canvasRef.current!.getBoundingClientRect();
    const x = e.clientX - rect.left - LABEL_W;
    return { t: timeAtX(shown, x, width - LABEL_W) };
  };
  // The wheel zooms (shift + wheel pans). React's wheel handlers are passive, so the page would scroll
  // as well; a native listener can keep the wheel to itself.
  const wheelView = useRef({ shown, width });
  wheelView.current = { shown, width };
  const hasCanvas = trace.signals.length > 0;
  useEffect(() => {
    const canvas = canvasRef.current;
    if (!canvas) return;
    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      const { shown: v, width: w } = wheelView.current;
      const x = e.clientX - canvas.getBoundingClientRect().left - LABEL_W;
      const frac = Math.min(1, Math.max(0, x / (w - LABEL_W)));
      if (e.shiftKey) setView(pan(v, (e.deltaY / 400) * v.span));
      else setView(zoom(v, e.deltaY > 0 ? 1.25 : 0.8, frac));
    };
    canvas.addEventListener('wheel', onWheel, { passive: false });
    return () => canvas.removeEventListener('wheel', onWheel);
  }, [hasCanvas]);
  const exportVcd = () => {
    try {
      download(new Blob([traceToVcd(trace, timeUnitNs)], { type: 'text/plain' }), `${fileStem(title)}.vcd`);
    } catch (err) {
      toast.error(`VCD export failed: ${(err as Error).message}`);
    }
  };
  // the whole strip, every row, as the screen would show it unscrolled
  const exportPng = () => {
    const canvas = document.createElement('canvas');
    const scale = window.devicePixelRatio || 1;
    canvas.width = Math.round(width * scale);
    canvas.height = Math.round(height * scale);
    const ctx = canvas.getContext('2d');
    if (!ctx) { toast.error('the browser could not draw the timing strip'); return; }
    drawWaveforms(ctx, trace, { width, height, view: shown, cursor, axis, scale });
    canvasPng(canvas).then((blob) => download(blob, `${fileStem(title)}-timing.png`), (err: Error) => toast.error(err.message));
  };

  return (
    <section aria-label="Timing strip" data-testid="timing-strip" className="flex h-full flex-col bg-mat-900 text-xs text-slate-200">
      <div className="flex flex-wrap items-center gap-2 border-b border-mat-700 px-2 py-1">
        <span className="font-semibold text-amber-300">Timing strip</span>
        <SignalPicker available={available} chosen={chosen} defaults={defaults} onChoose={onChoose} />
        <div role="group" aria-label="Time axis" className="flex overflow-hidden rounded border border-mat-600">
          {(['time', 'cycles'] as const).map((m) => (
            <button key={m} type="button" aria-pressed={axis === m} onClick={() => setAxis(m)} className={axis === m ? 'bg-mat-600 px-2' : 'px-2 hover:bg-mat-700'}>
              {m === 'time' ? 'Time' : 'Clock cycles'}
            </button>
          ))}
        </div>
        <button type="button" aria-label="Zoom in" className="rounded border border-mat-600 px-2 hover:bg-mat-700" onClick={() => setView(zoom(shown, 0.5))}>+</button>
        <button type="button" aria-label="Zoom out" className="rounded border border-mat-600 px-2 hover:bg-mat-700" onClick={() => setView(zoom(shown, 2))}>−</button>
        <button type="button" className="rounded border border-mat-600 px-2 hover:bg-mat-700" onClick={() => setView({ start: trace.start, span: Math.max(8, (trace.end - trace.start) * 1.05), follow: false })}>Fit</button>
        <button type="button" className="rounded border border-mat-600 px-2 hover:bg-mat-700" title="Forget the recording so far"
          onClick={() => { onClear(); setPinned(null); setView(INITIAL); }}>Clear</button>
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={view.follow} onChange={(e) => setView({ ...shown, follow: e.target.checked })} /> Follow
        </label>
        <span className="ml-auto flex gap-2">
          <button type="button" className="rounded border border-mat-600 px-2 hover:bg-mat-700" onClick={exportVcd}>Export VCD</button>
          <button type="button" className="rounded border border-mat-600 px-2 hover:bg-mat-700" onClick={exportPng}>Export PNG</button>
        </span>
      </div>
      <div ref={wrapRef} className="min-h-0 flex-1 overflow-auto" onScroll={(e) => { const t = e.currentTarget.scrollTop; setBox((b) => (b.top === t ? b : { ...b, top: t })); }}>
        {trace.signals.length === 0 ? (
          <p className="p-3 text-slate-400">Pick signals to record their waveforms.</p>
        ) : (
          <div style={{ height }} data-testid="timing-rows" data-rows={trace.signals.length}>
            <canvas
              ref={canvasRef}
              data-testid="timing-canvas"
              data-top={top}
              style={{ width, height: canvasH, display: 'block', cursor: 'crosshair', position: 'sticky', top: 0 }}
              onPointerMove={(e) => setHover(Math.max(0, timeAt(e).t))}
              onPointerLeave={() => setHover(null)}
              onClick={(e) => setPinned(Math.max(0, timeAt(e).t))}
            />
          </div>
        )}
      </div>
      <div data-testid="timing-readout" aria-live="polite" className="flex flex-wrap gap-3 border-t border-mat-700 px-2 py-1 font-mono">
        {cursor === null ? (
          <>
            <span className="text-slate-400">Move over the waveforms for a readout; click to pin the cursor.</span>
            {trace.signals.map((s, i) => (
              <span key={s.name} data-testid="timing-summary" data-signal={s.name} data-rises={rises[i]} title="rising edges recorded">
                {s.name} ↑{rises[i]}
              </span>
            ))}
          </>
        ) : (
          <>
            <span className="text-slate-400">t = {cursor.toFixed(1)} · cycle {cycleAt(trace.edges, cursor)}</span>
            {values.map((r) => (
              <span key={r.name} data-signal={r.name} data-level={r.level}>
                {r.name} = {r.level}
              </span>
            ))}
          </>
        )}
      </div>
    </section>
  );
}
