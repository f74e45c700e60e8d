/**
 * The command line as a whole process (start, read, analyse, write): `node scripts/cli.mjs`, which is
 * what `npm run -s cli` runs (the bundle built ahead of time), against the TypeScript loader it used to
 * start through (tsx server/cli/main.ts) and against Icarus Verilog enumerating the same exported netlist.
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
function timed(cmd: string, args: string[]): number {
  const t0 = performance.now();
  const r = spawnSync(cmd, args, { cwd: ROOT, stdio: ['ignore', 'ignore', 'pipe'], maxBuffer: 1 << 30 });
  const ms = performance.now() - t0;
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')}: exit ${r.status} ${r.stderr?.toString().split('\n')[0]}`);
  return ms;
}

export default async function cliBench(): Promise<BenchRow[]> {
  execFileSync(process.execPath, ['scripts/build-cli.mjs'], { cwd: ROOT }); // a fresh bundle, so no call below builds
  const cli = (...args: string[]) => timed(process.execPath, ['scripts/cli.mjs', ...args]);
  const viaTsx = (...args: string[]) => timed(join(ROOT, 'node_modules/.bin/tsx'), ['server/cli/main.ts', ...args]);
  const bare = median(Array.from({ length: 5 }, () => timed(process.execPath, ['-e', '0'])));
  cli('analyze', HALF_ADDER);
  const small = median(Array.from({ length: 7 }, () => cli('analyze', HALF_ADDER)));
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
      { name: 'analyze half adder (6 parts), whole process', value: small, unit: 'ms', goal: { max: 200 }, reference: { name: 'tsx server/cli/main.ts', value: smallTsx },
        note: `node scripts/cli.mjs (what npm run -s cli runs), median of 7; bare node -e 0: ${bare.toFixed(0)} ms` },
      { name: 'analyze 16 inputs × 1,000 gates, whole process', value: big, unit: 'ms', goal: { max: 0.05, on: 'ratio' }, reference: { name: 'Icarus Verilog (compile + enumerate)', value: icarus.ms },
        note: `65,536 rows, 8 outputs, minimal forms (heuristic above 12 inputs); median of 3; via tsx: ${bigTsx.toFixed(0)} ms` },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
