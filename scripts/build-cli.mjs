/**
 * Builds the command line ahead of time: server/cli/main.ts and everything it imports (every command
 * registered in server/cli/commands, shared/, the npm packages) bundled by esbuild into one plain
 * JavaScript file, dist-cli/gatefold.cjs, so that a call starts with plain node and no TypeScript loader.
 * Runs at `npm install` / `npm ci` (the `prepare` script) and from scripts/cli.mjs when the bundle is
 * missing or older than one of its sources. dist-cli/build.json records the bundle (its SHA-256, size and
 * time) and its sources, for that check and to name the V8 code cache. Files are written to temporary
 * names and renamed, so that concurrent builds never leave half a file.
 *
 * Start-up: the bundle is a script (CommonJS), not an ES module, so that scripts/cli.mjs can compile it
 * with V8's code cache (vm.Script `cachedData`, files in dist-cli/code-cache/ named by the bundle's hash
 * and the Node version); each command is a lazy import, whose modules run only when that command is
 * called. Run directly, this script also makes the cache with one small `analyze` call.
 */
import console from 'node:console';
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { performance } from 'node:perf_hooks';
import process from 'node:process';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

export const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
export const OUT_DIR = join(ROOT, 'dist-cli');
export const BUNDLE = join(OUT_DIR, 'gatefold.cjs');
export const RECORD = join(OUT_DIR, 'build.json');
export const CACHE_DIR = join(OUT_DIR, 'code-cache');

/**
 * zod's `z.locales` namespace holds the error messages of some fifty languages (about 260 kB of the
 * bundle); the command line never selects one (zod's default English comes from locales/en.js, imported
 * on its own), so only English is bundled.
 */
const englishOnly = {
  name: 'zod-english-only',
  setup(b) {
    b.onLoad({ filter: /[\\/]zod[\\/]v4[\\/]locales[\\/]index\.js$/ }, (args) => ({
      contents: "export { default as en } from './en.js';",
      resolveDir: dirname(args.path),
      loader: 'js',
    }));
  },
};

/** Builds the bundle; returns the source files it was made from (relative to the project root). */
export async function buildCli() {
  mkdirSync(OUT_DIR, { recursive: true });
  const tmp = `${BUNDLE}.${process.pid}.tmp`;
  const result = await build({
    absWorkingDir: ROOT,
    entryPoints: ['server/cli/main.ts'],
    outfile: tmp,
    bundle: true,
    platform: 'node',
    format: 'cjs',
    target: 'node20',
    minify: true,
    legalComments: 'none',
    metafile: true,
    logLevel: 'warning',
    plugins: [englishOnly],
  });
  const inputs = Object.keys(result.metafile.inputs);
  // the project's own files are checked for staleness; packages change only with package-lock.json
  const sources = [...inputs.filter((p) => !p.includes('node_modules')), 'package-lock.json', 'scripts/build-cli.mjs'];
  const sha256 = createHash('sha256').update(readFileSync(tmp)).digest('hex');
  renameSync(tmp, BUNDLE);
  const { size, mtimeMs } = statSync(BUNDLE);
  writeFileSync(`${RECORD}.${process.pid}.tmp`, JSON.stringify({ bundle: { sha256, size, mtimeMs }, sources }));
  renameSync(`${RECORD}.${process.pid}.tmp`, RECORD);
  rmSync(CACHE_DIR, { recursive: true, force: true }); // caches of earlier bundles
  rmSync(join(OUT_DIR, 'gatefold.mjs'), { force: true }); // the ES module bundle of earlier builds
  rmSync(join(OUT_DIR, 'inputs.json'), { force: true });
  return sources;
}

/** Makes the code cache of the bundle just built by running `analyze` on the half adder once. */
export function makeCodeCache() {
  const r = spawnSync(process.execPath, [join(ROOT, 'scripts/cli.mjs'), 'analyze', join(ROOT, 'examples/half-adder.gatefold.json')], { cwd: ROOT, stdio: ['ignore', 'ignore', 'pipe'] });
  if (r.status !== 0) console.warn(`code cache not made: ${r.stderr.toString().split('\n')[0]}`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const t0 = performance.now();
  const sources = await buildCli();
  const built = performance.now();
  makeCodeCache();
  console.log(`built ${relative(ROOT, BUNDLE)} from ${sources.length} sources in ${(built - t0).toFixed(0)} ms, code cache in ${(performance.now() - built).toFixed(0)} ms`);
}
