/**
 * The command line as a whole process (start, read, analyse, write): `node scripts/cli.mjs`, which is
 * what `npm run -s cli` runs (the bundle built ahead of time, compiled with its V8 code cache), against
 * bare node started in the same rounds, the same without the code cache, the TypeScript loader it used to
 * start through (tsx server/cli/main.ts), and Icarus Verilog enumerating the same exported netlist.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { BenchRow } from './run';
import { board16, icarusTable, median } from './boards';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
const HALF_ADDER = join(ROOT, 'tests/fixtures/half-adder.gatefold.json');

/** Wall time of one process, in ms; throws when it fails. */
function timed(cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): number {
  const t0 = performance.now();
  const r = spawnSync(cmd, args, { cwd: ROOT, env, stdio: ['ignore', 'ignore', 'pipe'], maxBuffer: 1 << 30 });
  const ms = performance.now() - t0;
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')}: exit ${r.status} ${r.stderr?.toString().split('\n')[0]}`);
  return ms;
}

/** Medians of `runs` rounds, each round running every case once (so that load changes hit all alike). */
function interleaved(runs: number, cases: Record<string, () => number>): Record<string, number> {
  const times: Record<string, number[]> = Object.fromEntries(Object.keys(cases).map((k) => [k, []]));
  for (let i = 0; i < runs; i++) for (const [k, run] of Object.entries(cases)) times[k].push(run());
  return Object.fromEntries(Object.entries(times).map(([k, v]) => [k, median(v)]));
}

export default async function cliBench(): Promise<BenchRow[]> {
  // a fresh bundle and its code cache, so that no call below builds
  execFileSync(process.execPath, ['scripts/build-cli.mjs'], { cwd: ROOT });
  const cli = (...args: string[]) => timed(process.execPath, ['scripts/cli.mjs', ...args]);
  const noCache = { ...process.env, GATEFOLD_CLI_CODE_CACHE: '0' };
  const viaTsx = (...args: string[]) => timed(join(ROOT, 'node_modules/.bin/tsx'), ['server/cli/main.ts', ...args]);
  cli('analyze', HALF_ADDER);
  const small = interleaved(15, {
    bare: () => timed(process.execPath, ['-e', '0']),
    cli: () => cli('analyze', HALF_ADDER),
    noCache: () => timed(process.execPath, ['scripts/cli.mjs', 'analyze', HALF_ADDER], noCache),
  });
  const smallTsx = median(Array.from({ length: 3 }, () => viaTsx('analyze', HALF_ADDER)));

  const dir = mkdtempSync(join(tmpdir(), 'gatefold-bench-cli-'));
  try {
    const board = board16();
    const file = join(dir, 'random-16x1000.gatefold.json');
    writeFileSync(file, JSON.stringify(board));
    const big = median(Array.from({ length: 3 }, () => cli('analyze', file)));
    const bigTsx = viaTsx('analyze', file);
    const icarus = icarusTable(board);
    return [
      { name: 'analyze half adder (6 parts), whole process', value: small.cli, unit: 'ms', goal: { max: 200 }, reference: { name: 'bare node -e 0', value: small.bare },
        note: `node scripts/cli.mjs (what npm run -s cli runs), median of 15, interleaved with bare node; without the code cache ${small.noCache.toFixed(0)} ms (${(small.noCache / small.bare).toFixed(2)}× bare); via tsx ${smallTsx.toFixed(0)} ms` },
      { name: 'analyze 16 inputs × 1,000 gates, whole process', value: big, unit: 'ms', goal: { max: 0.05, on: 'ratio' }, reference: { name: 'Icarus Verilog (compile + enumerate)', value: icarus.ms },
        note: `65,536 rows, 8 outputs, minimal forms (heuristic above 12 inputs); median of 3; via tsx: ${bigTsx.toFixed(0)} ms` },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
