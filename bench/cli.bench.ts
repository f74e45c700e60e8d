/**
 * The command line as a whole process (start, read, analyse, write): `node scripts/cli.cjs`, which is
 * what `npm run -s cli` runs (the command's bundle built ahead of time, compiled with its V8 code cache),
 * against bare node started in the same rounds, the same without the code cache, the TypeScript loader it
 * used to start through (tsx server/cli/main.ts), and Icarus Verilog enumerating the same exported netlist.
 *
 * The small call is compared with bare node round by round (the ratio of each round, then the median), so
 * that the load of a shared machine, which changes from second to second, hits both alike. When the
 * environment sets NODE_EXTRA_CA_CERTS, every node process — bare node too — parses that certificate file
 * before it runs any code (on a machine that points it at the system's bundle, most of bare node's start);
 * the note then gives the same comparison without it, as most machines start node.
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
const ROUNDS = 15;

/** Wall time of one process, in ms; throws when it fails. */
function timed(cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): number {
  const t0 = performance.now();
  const r = spawnSync(cmd, args, { cwd: ROOT, env, stdio: ['ignore', 'ignore', 'pipe'], maxBuffer: 1 << 30 });
  const ms = performance.now() - t0;
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')}: exit ${r.status} ${r.stderr?.toString().split('\n')[0]}`);
  return ms;
}

/** Each case's times over `runs` rounds, each round running every case once (so load changes hit all alike). */
function interleaved(runs: number, cases: Record<string, () => number>): Record<string, number[]> {
  const times: Record<string, number[]> = Object.fromEntries(Object.keys(cases).map((k) => [k, []]));
  for (let i = 0; i < runs; i++) for (const [k, run] of Object.entries(cases)) times[k].push(run());
  return times;
}

/** Median of the round-by-round ratios a[i] / b[i]. */
const pairedRatio = (a: number[], b: number[]) => median(a.map((v, i) => v / b[i]));

export default async function cliBench(): Promise<BenchRow[]> {
  // a fresh build and the code cache of analyze, so that no call below builds
  execFileSync(process.execPath, ['scripts/build-cli.mjs'], { cwd: ROOT });
  const cli = (args: string[], env: NodeJS.ProcessEnv = process.env) => timed(process.execPath, ['scripts/cli.cjs', ...args], env);
  const noCache = { ...process.env, GATEFOLD_CLI_CODE_CACHE: '0' };
  const viaTsx = (...args: string[]) => timed(join(ROOT, 'node_modules/.bin/tsx'), ['server/cli/main.ts', ...args]);
  cli(['analyze', HALF_ADDER]);
  const small = interleaved(ROUNDS, {
    bare: () => timed(process.execPath, ['-e', '0']),
    cli: () => cli(['analyze', HALF_ADDER]),
    noCache: () => cli(['analyze', HALF_ADDER], noCache),
  });
  const smallTsx = median(Array.from({ length: 3 }, () => viaTsx('analyze', HALF_ADDER)));
  let withoutCaCerts = '';
  if (process.env.NODE_EXTRA_CA_CERTS) {
    const env = { ...process.env };
    delete env.NODE_EXTRA_CA_CERTS;
    const plain = interleaved(ROUNDS, { bare: () => timed(process.execPath, ['-e', '0'], env), cli: () => cli(['analyze', HALF_ADDER], env) });
    withoutCaCerts = `; without NODE_EXTRA_CA_CERTS (set here, parsed by every node start): bare ${median(plain.bare).toFixed(0)} ms, ` +
      `${median(plain.cli).toFixed(0)} ms, ${pairedRatio(plain.cli, plain.bare).toFixed(2)}× bare`;
  }

  const dir = mkdtempSync(join(tmpdir(), 'gatefold-bench-cli-'));
  try {
    const board = board16();
    const file = join(dir, 'random-16x1000.gatefold.json');
    writeFileSync(file, JSON.stringify(board));
    const big = median(Array.from({ length: 3 }, () => cli(['analyze', file])));
    const bigTsx = viaTsx('analyze', file);
    const icarus = icarusTable(board);
    const ratio = pairedRatio(small.cli, small.bare);
    return [
      { name: 'analyze half adder (6 parts), whole process', value: median(small.cli), unit: 'ms', goal: { max: 200 }, reference: { name: 'bare node -e 0', value: median(small.bare) },
        ratio,
        note: `node scripts/cli.cjs (what npm run -s cli runs), median of ${ROUNDS} rounds interleaved with bare node, ratio the median of the rounds' ratios; ` +
          `without the code cache ${median(small.noCache).toFixed(0)} ms (${pairedRatio(small.noCache, small.bare).toFixed(2)}× bare); via tsx ${smallTsx.toFixed(0)} ms${withoutCaCerts}` },
      { name: 'analyze 16 inputs × 1,000 gates, whole process', value: big, unit: 'ms', goal: { max: 0.05, on: 'ratio' }, reference: { name: 'Icarus Verilog (compile + enumerate)', value: icarus.ms },
        note: `65,536 rows, 8 outputs, minimal forms (heuristic above 12 inputs); median of 3; via tsx: ${bigTsx.toFixed(0)} ms` },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
