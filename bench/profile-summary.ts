/**
 * Summaries of a browser profile for the canvas benchmark: the JavaScript functions with the most self
 * time in a V8 CPU profile (.cpuprofile, from the DevTools protocol's Profiler domain), and the renderer
 * main thread's time by kind of work (script, style, layout, paint, garbage collection) from a trace of
 * the `devtools.timeline` category (Tracing domain). A trace event's own time excludes the events nested
 * in it, so a layout forced inside a script counts as layout, not twice.
 */

/** A V8 CPU profile as the Profiler domain returns it. */
export interface CpuProfile {
  nodes: { id: number; callFrame: { functionName: string; url: string; lineNumber: number; columnNumber: number }; children?: number[] }[];
  samples: number[];
  timeDeltas: number[];
}

/** One trace event (Chrome's trace event format). */
export interface TraceEvent { name: string; ph: string; ts: number; dur?: number; pid: number; tid: number; args?: { name?: string } }

/** The `top` functions by self time: `[ms, share of the profile, "name file:line"]`. */
export function topFunctions(profile: CpuProfile, top = 15): [number, number, string][] {
  const byNode = new Map<number, number>();
  profile.samples.forEach((id, i) => byNode.set(id, (byNode.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0)));
  const byName = new Map<string, number>();
  let total = 0;
  for (const n of profile.nodes) {
    const us = byNode.get(n.id) ?? 0;
    total += us;
    const file = n.callFrame.url.split('/').pop() ?? '';
    const key = `${n.callFrame.functionName || '(anonymous)'} ${file}${file ? `:${n.callFrame.lineNumber + 1}` : ''}`;
    byName.set(key, (byName.get(key) ?? 0) + us);
  }
  return [...byName].sort((a, b) => b[1] - a[1]).slice(0, top).map(([k, us]) => [us / 1000, total ? us / total : 0, k]);
}

const KIND: [RegExp, string][] = [
  [/^(UpdateLayoutTree|RecalculateStyles|ParseAuthorStyleSheet|ScheduleStyleRecalculation)$/, 'style'],
  [/^(Layout|UpdateLayerTree|LayoutShift|IntersectionObserverController::computeIntersections)$/, 'layout'],
  [/^(Paint|PrePaint|PaintImage|Layerize|Commit|UpdateLayer|CompositeLayers|RasterTask|PaintSetup|Decode Image)$/, 'paint'],
  [/^(MinorGC|MajorGC|V8\.GC.*|BlinkGC\..*|GCEvent|ThreadState::.*)$/, 'gc'],
  [/^(FunctionCall|EvaluateScript|TimerFire|EventDispatch|FireAnimationFrame|RunMicrotasks|v8\..*|V8\..*|XHRReadyStateChange|XHRLoad|FireIdleCallback|ParseHTML|HandlePostMessage|WebSocketReceive.*|v8.compile|CompileScript|CompileCode)$/, 'script'],
];

/**
 * Main-thread time of the renderer showing the page, by kind, in ms: its top-level tasks (`RunTask`) in
 * all, and the own time of the events within them classified as script, style, layout, paint, gc; the
 * rest of the tasks' time is `other`. Also the event names with the most own time.
 */
export function mainThreadTime(events: TraceEvent[]): { task: number; kinds: Record<string, number>; top: [number, string][] } {
  const names = events.filter((e) => e.ph === 'M' && e.name === 'thread_name' && e.args?.name === 'CrRendererMain');
  // the renderer main thread with the most task time (other tabs or processes have little)
  const taskTime = new Map<string, number>();
  for (const e of events) if (e.ph === 'X' && e.name === 'RunTask' && names.some((m) => m.pid === e.pid && m.tid === e.tid)) taskTime.set(`${e.pid}:${e.tid}`, (taskTime.get(`${e.pid}:${e.tid}`) ?? 0) + (e.dur ?? 0));
  const main = [...taskTime].sort((a, b) => b[1] - a[1])[0]?.[0];
  const kinds: Record<string, number> = { script: 0, style: 0, layout: 0, paint: 0, gc: 0, other: 0 };
  if (!main) return { task: 0, kinds, top: [] };
  const own = new Map<string, number>();
  const xs = events.filter((e) => e.ph === 'X' && `${e.pid}:${e.tid}` === main && e.dur !== undefined).sort((a, b) => a.ts - b.ts || (b.dur ?? 0) - (a.dur ?? 0));
  const stack: { end: number; name: string; self: number }[] = [];
  const close = (upTo: number) => {
    while (stack.length && stack[stack.length - 1].end <= upTo) { const e = stack.pop()!; own.set(e.name, (own.get(e.name) ?? 0) + e.self); }
  };
  for (const e of xs) {
    close(e.ts);
    const dur = e.dur ?? 0;
    if (stack.length) stack[stack.length - 1].self -= dur;
    stack.push({ end: e.ts + dur, name: e.name, self: dur });
  }
  close(Infinity);
  let task = 0;
  for (const e of xs) if (e.name === 'RunTask') task += e.dur ?? 0;
  for (const [name, us] of own) {
    const kind = KIND.find(([re]) => re.test(name))?.[1] ?? 'other';
    kinds[kind] += us / 1000;
  }
  const top = [...own].sort((a, b) => b[1] - a[1]).slice(0, 12).map(([n, us]): [number, string] => [us / 1000, n]);
  return { task: task / 1000, kinds, top };
}

/** "script 52 %, style 18 %, …" of a mainThreadTime result. */
export function kindShares(t: ReturnType<typeof mainThreadTime>): string {
  const sum = Object.values(t.kinds).reduce((a, b) => a + b, 0) || 1;
  return Object.entries(t.kinds).map(([k, ms]) => `${k} ${((100 * ms) / sum).toFixed(0)} % (${ms.toFixed(0)} ms)`).join(', ');
}
