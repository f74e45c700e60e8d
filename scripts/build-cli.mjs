/**
 * Builds the command line ahead of time: server/cli/main.ts and everything it imports (every command
 * registered in server/cli/commands, shared/, the npm packages) bundled by esbuild into one plain
 * JavaScript file, dist-cli/gatefold.mjs, so that a call starts with plain node and no TypeScript loader.
 * Runs at `npm install` / `npm ci` (the `prepare` script) and from scripts/cli.mjs when the bundle is
 * missing or older than one of its sources. The sources are listed beside it (dist-cli/inputs.json) for
 * that check. Written to a temporary name and renamed, so that concurrent builds never leave half a file.
 */
import console from 'node:console';
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { performance } from 'node:perf_hooks';
import process from 'node:process';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

export const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
export const OUT_DIR = join(ROOT, 'dist-cli');
export const BUNDLE = join(OUT_DIR, 'gatefold.mjs');
export const INPUTS = join(OUT_DIR, 'inputs.json');

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
    format: 'esm',
    target: 'node20',
    minify: true,
    legalComments: 'none',
    metafile: true,
    logLevel: 'warning',
    // CommonJS packages inside an ES module bundle call require(): give them Node's
    banner: { js: "import { createRequire as __gfRequire } from 'node:module'; const require = __gfRequire(import.meta.url);" },
  });
  const inputs = Object.keys(result.metafile.inputs);
  // the project's own files are checked for staleness; packages change only with package-lock.json
  const sources = [...inputs.filter((p) => !p.includes('node_modules')), 'package-lock.json', 'scripts/build-cli.mjs'];
  writeFileSync(`${INPUTS}.${process.pid}.tmp`, JSON.stringify(sources));
  renameSync(`${INPUTS}.${process.pid}.tmp`, INPUTS);
  renameSync(tmp, BUNDLE);
  return sources;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const t0 = performance.now();
  const sources = await buildCli();
  console.log(`built ${relative(ROOT, BUNDLE)} from ${sources.length} sources in ${(performance.now() - t0).toFixed(0)} ms`);
}
