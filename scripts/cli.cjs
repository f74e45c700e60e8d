/**
 * `npm run -s cli -- <command> …`: runs the built command line with plain node — the bundle of the
 * command called (dist-cli/commands/NAME.cjs), or dist-cli/gatefold.cjs (every command) for a name that
 * is none — building first when the bundle is missing, not the file that was built, or older than one of
 * its sources (a quick check of sizes and times against dist-cli/build.json; a new command file is seen
 * once server/cli/commands/index.ts, which is a source of every bundle, registers it).
 *
 * A CommonJS script, not an ES module: node starts an ES module through its ES module loader, which costs
 * a small call about a tenth more than the call's own work (scripts/cli.mjs, which runs this file, is
 * kept for those who call it by that name).
 *
 * The bundle is compiled with V8's code cache: dist-cli/code-cache/<bundle SHA-256>-<node>-<arch>.bin,
 * made by the build (scripts/build-cli.mjs, for `analyze`) or else by the first call, written when the
 * call ends. The hash is the build's, so no call reads the bundle twice; V8 also refuses a cache made by
 * another V8 version or flags (then the call compiles as usual and writes a fresh one).
 * GATEFOLD_CLI_CODE_CACHE=0 turns the cache off (to measure it).
 */
'use strict';
/* global require, __dirname, process -- a CommonJS script run by node */
/* eslint-disable @typescript-eslint/no-require-imports -- a CommonJS script loads with require */
const { mkdirSync, readFileSync, renameSync, statSync, writeFileSync } = require('node:fs');
const { dirname, join } = require('node:path');
const vm = require('node:vm');

const ROOT = join(__dirname, '..');
const OUT_DIR = join(ROOT, 'dist-cli');
const RECORD = join(OUT_DIR, 'build.json');
const CACHE_DIR = join(OUT_DIR, 'code-cache');
const command = process.argv[2];

/**
 * The bundle to run and its record entry, when that bundle is current; else null. With `check` false, the
 * bundle the record names whenever it is there (after a build, which a concurrent build may have replaced
 * with the same code a moment later).
 */
function current(check = true) {
  let record;
  try {
    record = JSON.parse(readFileSync(RECORD, 'utf8'));
  } catch {
    return null;
  }
  if (record.version !== 2) return null;
  const name = command && Object.hasOwn(record.commands, command) ? record.commands[command] : 'gatefold.cjs';
  const entry = record.bundles[name];
  const file = join(OUT_DIR, name);
  const st = statSync(file, { throwIfNoEntry: false });
  if (!entry || !st) return null;
  if (!check) return { file, entry };
  if (st.size !== entry.size || st.mtimeMs !== entry.mtimeMs) return null;
  for (const source of entry.sources) {
    const s = statSync(join(ROOT, source), { throwIfNoEntry: false });
    if (!s || s.mtimeMs > entry.mtimeMs) return null; // a source changed, moved or was removed
  }
  return { file, entry };
}

/** Compiles the bundle (with its code cache) and runs it as node runs a CommonJS file. */
function run(bundle) {
  const useCache = process.env.GATEFOLD_CLI_CODE_CACHE !== '0';
  const cacheFile = useCache ? join(CACHE_DIR, `${bundle.entry.sha256}-${process.version}-${process.arch}.bin`) : '';
  let cachedData;
  if (useCache) {
    try {
      cachedData = readFileSync(cacheFile);
    } catch {
      cachedData = undefined;
    }
  }
  const source = readFileSync(bundle.file, 'utf8');
  // Node's own CommonJS wrapper, so that the bundle sees require, module and its file name as usual
  const script = new vm.Script(`(function (exports, require, module, __filename, __dirname) {${source}\n})`, { filename: bundle.file, cachedData });
  if (useCache && (!cachedData || script.cachedDataRejected)) {
    // at the end, so that the functions this call compiled are in the cache too
    process.once('exit', () => {
      try {
        mkdirSync(CACHE_DIR, { recursive: true });
        const tmp = `${cacheFile}.${process.pid}.tmp`;
        writeFileSync(tmp, script.createCachedData());
        renameSync(tmp, cacheFile);
      } catch {
        // a read-only install runs without a cache
      }
    });
  }
  const bundleModule = { exports: {} };
  script.runInThisContext()(bundleModule.exports, require('node:module').createRequire(bundle.file), bundleModule, bundle.file, dirname(bundle.file));
}

const bundle = current();
if (bundle) {
  run(bundle);
} else {
  import(require('node:url').pathToFileURL(join(__dirname, 'build-cli.mjs')).href)
    .then(({ buildCli }) => buildCli())
    .then(() => {
      const built = current(false);
      if (!built) throw new Error('the build left no bundle');
      run(built);
    })
    .catch((err) => {
      process.stderr.write(`error: internal: cannot build the command line (${String(err?.message ?? err).split('\n')[0]})\n`);
      process.exitCode = 1;
    });
}
