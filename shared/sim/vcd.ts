/**
 * Value change dump writer (IEEE Std 1364 four-state VCD: header, definitions, value changes).
 * Pure: the caller passes the date and version strings.
 */
import type { Level } from './levels';

/** One dumped signal (a 1-bit wire). */
export interface VcdSignal {
  /** reference name; characters a VCD reader would split on are replaced by `_` */
  name: string;
  /** scope (module) it sits in, `a/b` for scope b inside scope a; default the top scope */
  scope?: string;
}

/** A change of signal `signal` (index into signals) to `level` at `time`. */
export interface VcdSample {
  time: number;
  signal: number;
  level: Level;
}

/** Options of toVcd. */
export interface VcdOptions {
  /** e.g. `1 ns` (default), `10 ns`, `100 us` */
  timescale?: string;
  /** name of the top scope (default `gatefold`) */
  top?: string;
  /** levels at the start time (default X) */
  initial?: Level[];
  /** time of the $dumpvars block (default 0) */
  start?: number;
  date?: string;
  version?: string;
}

/** Short identifier codes of printable ASCII `!`…`~` (base 94), as VCD writers use. */
export function vcdId(i: number): string {
  let s = '';
  let n = i;
  do {
    s += String.fromCharCode(33 + (n % 94));
    n = Math.floor(n / 94);
  } while (n > 0);
  return s;
}

/** The timescale string for a time unit in ns (1, 10 or 100 times a power of 1000 of a second). */
export function timescaleFor(unitNs: number): string {
  const units: [number, string][] = [[1e9, 's'], [1e6, 'ms'], [1e3, 'us'], [1, 'ns'], [1e-3, 'ps'], [1e-6, 'fs']];
  for (const [scale, name] of units) {
    const m = unitNs / scale;
    for (const k of [1, 10, 100]) if (Math.abs(m - k) < 1e-9 * k) return `${k} ${name}`;
  }
  return '1 ns';
}

const CODE: Record<Level, string> = { '0': '0', '1': '1', X: 'x', Z: 'z' };

/** Writes samples (any order; equal levels in a row are dropped) as a VCD text. */
export function toVcd(samples: VcdSample[], signals: VcdSignal[], opts: VcdOptions = {}): string {
  const lines: string[] = [];
  lines.push('$date', `  ${opts.date ?? 'unknown'}`, '$end');
  lines.push('$version', `  ${opts.version ?? 'Gatefold'}`, '$end');
  lines.push(`$timescale ${opts.timescale ?? '1 ns'} $end`);
  const top = opts.top ?? 'gatefold';
  lines.push(`$scope module ${top} $end`);
  const scopes = new Map<string, number[]>();
  signals.forEach((s, i) => {
    const key = s.scope ?? '';
    if (!scopes.has(key)) scopes.set(key, []);
    scopes.get(key)!.push(i);
  });
  const ref = (name: string) => name.replace(/[\s$]+/g, '_') || '_';
  for (const i of scopes.get('') ?? []) lines.push(`$var wire 1 ${vcdId(i)} ${ref(signals[i].name)} $end`);
  // a scope with `/` nests: `u3/u1` is scope u1 inside scope u3 (the path of an instance inside an instance)
  const tree = new Map<string, string[]>();
  const childrenOf = (path: string) => tree.get(path) ?? (tree.set(path, []), tree.get(path)!);
  for (const scope of scopes.keys()) {
    if (scope === '') continue;
    const steps = scope.split('/');
    for (let k = 1; k <= steps.length; k++) {
      const path = steps.slice(0, k).join('/');
      const parent = steps.slice(0, k - 1).join('/');
      const list = childrenOf(parent);
      if (!list.includes(path)) list.push(path);
    }
  }
  const emit = (path: string) => {
    lines.push(`$scope module ${ref(path.slice(path.lastIndexOf('/') + 1))} $end`);
    for (const i of scopes.get(path) ?? []) lines.push(`$var wire 1 ${vcdId(i)} ${ref(signals[i].name)} $end`);
    for (const child of tree.get(path) ?? []) emit(child);
    lines.push('$upscope $end');
  };
  for (const path of tree.get('') ?? []) emit(path);
  lines.push('$upscope $end', '$enddefinitions $end');
  const start = opts.start ?? 0;
  const current: Level[] = signals.map((_, i) => opts.initial?.[i] ?? 'X');
  const sorted = samples.map((s, k) => ({ s, k })).sort((a, b) => a.s.time - b.s.time || a.k - b.k).map((x) => x.s);
  let i = 0;
  // changes at the start time fold into the initial values
  for (; i < sorted.length && sorted[i].time <= start; i++) current[sorted[i].signal] = sorted[i].level;
  lines.push(`#${start}`, '$dumpvars');
  current.forEach((level, k) => lines.push(`${CODE[level]}${vcdId(k)}`));
  lines.push('$end');
  let lastTime = start;
  for (; i < sorted.length; i++) {
    const { time, signal, level } = sorted[i];
    if (current[signal] === level) continue;
    current[signal] = level;
    if (time !== lastTime) { lines.push(`#${time}`); lastTime = time; }
    lines.push(`${CODE[level]}${vcdId(signal)}`);
  }
  return lines.join('\n') + '\n';
}
