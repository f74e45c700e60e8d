/**
 * `npm run bench`: runs every benchmark module in bench/ (files named *.bench.ts, each with a default
 * export returning rows) and prints one table. Speed and memory targets live here, never in tests.
 */
import { readdirSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { dirname, join } from 'node:path';

export interface BenchRow {
  /** what was measured */
  name: string;
  /** the figure */
  value: number;
  unit: string;
  /** the naive reference or context, e.g. "naive: 812 ms (ratio 14.2x)" */
  note?: string;
}

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv.slice(2);
const files = readdirSync(here).filter((f) => f.endsWith('.bench.ts')).filter((f) => !only.length || only.some((o) => f.includes(o))).sort();
const rows: (BenchRow & { suite: string })[] = [];
for (const file of files) {
  const mod = (await import(pathToFileURL(join(here, file)).href)) as { default: () => Promise<BenchRow[]> };
  const suite = file.replace(/\.bench\.ts$/, '');
  try {
    for (const row of await mod.default()) rows.push({ ...row, suite });
  } catch (err) {
    rows.push({ suite, name: 'FAILED', value: NaN, unit: '', note: (err as Error).message });
  }
}
const fmt = (v: number) => (Number.isFinite(v) ? (Math.abs(v) >= 100 ? v.toFixed(0) : v.toPrecision(3)) : '—');
const table = [['suite', 'measure', 'value', 'unit', 'note'], ...rows.map((r) => [r.suite, r.name, fmt(r.value), r.unit, r.note ?? ''])];
const widths = table[0].map((_, c) => Math.max(...table.map((r) => r[c].length)));
const line = (r: string[]) => '| ' + r.map((cell, c) => cell.padEnd(widths[c])).join(' | ') + ' |';
console.log(line(table[0]));
console.log('|' + widths.map((w) => '-'.repeat(w + 2)).join('|') + '|');
for (const r of table.slice(1)) console.log(line(r));
process.exit(0);
