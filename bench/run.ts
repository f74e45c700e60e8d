/**
 * `npm run bench [names…]`: runs the benchmark modules in bench/ (files named *.bench.ts, each with a
 * default export returning rows) and prints one table: each figure beside its goal and the reference
 * measured in the same run, with the ratio. Without names the default set runs (bounded: a few
 * minutes); a name selects the files whose name contains it and asks them for their heavy rows too
 * (`npm run bench analysis`). Speed and memory targets live here, never in tests.
 */
import { readdirSync } from 'node:fs';
import { loadavg } from 'node:os';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { dirname, join } from 'node:path';

export interface BenchRow {
  /** what was measured */
  name: string;
  /** the figure */
  value: number;
  unit: string;
  /** the target: `max` (at most) or `min` (at least), on the value or on the ratio */
  goal?: { max?: number; min?: number; on?: 'value' | 'ratio' };
  /** the reference measured in the same run (Icarus Verilog, the naive evaluator, the previous size…) */
  reference?: { name: string; value: number; unit?: string };
  /** value ÷ reference (computed when both are in the same unit and no ratio is given) */
  ratio?: number;
  /** context: how it was measured */
  note?: string;
}

/** Options a benchmark module receives. */
export interface BenchOptions {
  /** true when the run names this module: heavy rows too */
  full: boolean;
}

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv.slice(2);
const files = readdirSync(here).filter((f) => f.endsWith('.bench.ts')).filter((f) => !only.length || only.some((o) => f.includes(o))).sort();
const rows: (BenchRow & { suite: string })[] = [];
for (const file of files) {
  const mod = (await import(pathToFileURL(join(here, file)).href)) as { default: (opts: BenchOptions) => Promise<BenchRow[]> };
  const suite = file.replace(/\.bench\.ts$/, '');
  try {
    for (const row of await mod.default({ full: only.length > 0 })) rows.push({ ...row, suite });
  } catch (err) {
    rows.push({ suite, name: 'FAILED', value: NaN, unit: '', note: (err as Error).message });
  }
}

const fmt = (v: number) => (Number.isFinite(v) ? (Math.abs(v) >= 100 ? v.toFixed(0) : v.toPrecision(3)) : '—');
const ratioOf = (r: BenchRow) => r.ratio ?? (r.reference && (r.reference.unit ?? r.unit) === r.unit && r.reference.value ? r.value / r.reference.value : undefined);
function goalCells(r: BenchRow): [string, string] {
  if (!r.goal) return ['', ''];
  const onRatio = r.goal.on === 'ratio';
  const v = onRatio ? ratioOf(r) : r.value;
  const unit = onRatio ? '×' : ` ${r.unit}`;
  const text = [r.goal.max !== undefined ? `≤ ${fmt(r.goal.max)}${unit}` : '', r.goal.min !== undefined ? `≥ ${fmt(r.goal.min)}${unit}` : ''].filter(Boolean).join(', ');
  const met = v !== undefined && Number.isFinite(v) && (r.goal.max === undefined || v <= r.goal.max) && (r.goal.min === undefined || v >= r.goal.min);
  return [`${onRatio ? 'ratio ' : ''}${text}`, met ? 'yes' : 'NO'];
}
const table = [
  ['suite', 'measure', 'value', 'unit', 'goal', 'met', 'reference (same run)', 'ratio', 'note'],
  ...rows.map((r) => {
    const ratio = ratioOf(r);
    return [r.suite, r.name, fmt(r.value), r.unit, ...goalCells(r),
      r.reference ? `${r.reference.name}: ${fmt(r.reference.value)} ${r.reference.unit ?? r.unit}` : '',
      ratio !== undefined ? `${ratio < 0.01 ? ratio.toPrecision(2) : fmt(ratio)}×` : '', r.note ?? ''];
  }),
];
const widths = table[0].map((_, c) => Math.max(...table.map((r) => r[c].length)));
const line = (r: string[]) => '| ' + r.map((cell, c) => cell.padEnd(widths[c])).join(' | ') + ' |';
console.log(line(table[0]));
console.log('|' + widths.map((w) => '-'.repeat(w + 2)).join('|') + '|');
for (const r of table.slice(1)) console.log(line(r));
console.log(`\nmachine load (1-minute average) at the end: ${loadavg()[0].toFixed(1)} on ${(await import('node:os')).availableParallelism()} cores`);
process.exit(0);
