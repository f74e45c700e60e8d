/**
 * `npm run -s cli -- <command> …`: runs the built command line (dist-cli/gatefold.cjs) with plain node,
 * building it first when it is missing, not the file that was built, or older than one of its sources (a
 * quick check of sizes and times against dist-cli/build.json; a new command file is listed once
 * server/cli/commands/index.ts, which is, registers it).
 *
 * The bundle is compiled with V8's code cache: dist-cli/code-cache/<bundle SHA-256>-<node>-<arch>.bin,
 * made by the build (scripts/build-cli.mjs) or else by the first call, written when the call ends. The
 * hash is the build's, so no call reads the whole bundle twice; V8 also refuses a cache made by another
 * V8 version or flags (then the call compiles as usual and writes a fresh one). GATEFOLD_CLI_CODE_CACHE=0
 * turns the cache off (to measure it).
 */
/* global process -- the global, not `import process`, whose module facade would read process.stdout and so open it */
// Node's modules through process.getBuiltinModule (Node ≥ 20.16) rather than `import`: an ES import of
// node:fs makes its module facade, which reads every export and so loads the file streams — a tenth of
// a small call's time
const builtin = process.getBuiltinModule ?? (await import('node:module')).createRequire(import.meta.url);
const { mkdirSync, readFileSync, renameSync, statSync, writeFileSync } = builtin('node:fs');
const { createRequire } = builtin('node:module');
const { dirname, join } = builtin('node:path');
const vm = builtin('node:vm');

const ROOT = join(import.meta.dirname, '..');
const BUNDLE = join(ROOT, 'dist-cli', 'gatefold.cjs');
const RECORD = join(ROOT, 'dist-cli', 'build.json');
const CACHE_DIR = join(ROOT, 'dist-cli', 'code-cache');

/** The build record when the bundle is the file it describes and newer than every source; else null. */
function current() {
  let record;
  try {
    record = JSON.parse(readFileSync(RECORD, 'utf8'));
    const { size, mtimeMs } = statSync(BUNDLE);
    if (size !== record.bundle.size || mtimeMs !== record.bundle.mtimeMs) return null;
  } catch {
    return null;
  }
  for (const file of record.sources) {
    const st = statSync(join(ROOT, file), { throwIfNoEntry: false });
    if (!st || st.mtimeMs > record.bundle.mtimeMs) return null; // a source changed, moved or was removed
  }
  return record;
}

let record = current();
if (!record) {
  const { buildCli } = await import('./build-cli.mjs');
  await buildCli();
  record = current();
}

const useCache = process.env.GATEFOLD_CLI_CODE_CACHE !== '0' && record !== null;
const cacheFile = useCache ? join(CACHE_DIR, `${record.bundle.sha256}-${process.version}-${process.arch}.bin`) : '';
let cachedData;
if (useCache) {
  try {
    cachedData = readFileSync(cacheFile);
  } catch {
    cachedData = undefined;
  }
}
const source = readFileSync(BUNDLE, 'utf8');
// Node's own CommonJS wrapper, so that the bundle sees require, module and its file name as usual
const script = new vm.Script(`(function (exports, require, module, __filename, __dirname) {${source}\n})`, { filename: BUNDLE, cachedData });
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
script.runInThisContext()(bundleModule.exports, createRequire(BUNDLE), bundleModule, BUNDLE, dirname(BUNDLE));
