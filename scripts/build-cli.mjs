/**
 * Builds the command line ahead of time into plain JavaScript (esbuild), so that a call starts with plain
 * node and no TypeScript loader:
 * - dist-cli/commands/NAME.cjs — one bundle per command (server/cli/commands/NAME.ts run by
 *   server/cli/run.ts), holding only the code that command uses: `analyze` reads neither the Verilog, VCD,
 *   build-sheet nor bring-up code, nor yjs;
 * - dist-cli/gatefold.cjs — every command (server/cli/main.ts), for an unknown command and direct runs;
 * - dist-cli/board-check.cjs — the zod check of a board file (server/cli/board-check.ts), loaded by the
 *   bundles only for a file the quick shape check is not sure of (an invalid one). The quick check's
 *   description of the board schema (server/cli/board-spec.ts) is derived here, once, from the schema.
 * Project modules are marked free of side effects, so that esbuild leaves out a module none of whose
 * exports a bundle uses (shared/board/schema.ts and with it zod, when only checkBoard is used).
 *
 * Runs at `npm install` / `npm ci` (the `prepare` script) and from scripts/cli.cjs when a bundle is missing
 * or older than one of its sources. dist-cli/build.json records each bundle (SHA-256, size, time, sources)
 * for that check and to name the V8 code cache. Files are written to temporary names and renamed, so that
 * concurrent builds never leave half a file.
 *
 * Start-up: the bundles are scripts (CommonJS), not ES modules, so that scripts/cli.cjs can compile them
 * with V8's code cache (vm.Script `cachedData`, files in dist-cli/code-cache/ named by the bundle's hash
 * and the Node version). Run directly, this script also makes the cache of `analyze` with one small call.
 */
import console from 'node:console';
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
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
const COMMANDS_DIR = join(ROOT, 'server/cli/commands');
const BOARD_CHECK = 'board-check.cjs';

/** Command names: server/cli/commands/NAME.ts, each the default export of its file (commands/index.ts). */
export function commandNames() {
  return readdirSync(COMMANDS_DIR)
    .filter((f) => f.endsWith('.ts') && !f.endsWith('.test.ts') && f !== 'index.ts' && f !== 'types.ts')
    .map((f) => f.slice(0, -3))
    .sort();
}

/**
 * zod's `z.locales` namespace holds the error messages of some fifty languages (about 260 kB); the command
 * line never selects one (zod's default English comes from locales/en.js, imported on its own).
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

/**
 * The project's own modules have no side effects on import (no module is imported for its effects), so a
 * module whose exports a bundle does not use is left out, with what it alone imports.
 */
const ownModulesPure = {
  name: 'own-modules-pure',
  setup(b) {
    b.onResolve({ filter: /^\.\.?\// }, async (args) => {
      if (args.pluginData?.pure || args.kind === 'entry-point' || args.importer.includes('node_modules')) return undefined;
      const r = await b.resolve(args.path, { kind: args.kind, resolveDir: args.resolveDir, importer: args.importer, pluginData: { pure: true } });
      if (r.errors.length || r.external || r.path.includes(`${join('node_modules', '')}`)) return r;
      return { ...r, sideEffects: false };
    });
  },
};

/**
 * In the command bundles: board-spec.ts is replaced by the description derived here, and board-check.ts
 * by a function that requires dist-cli/board-check.cjs on its first call.
 */
function cliModules(shape, boardCheckPath) {
  return {
    name: 'cli-modules',
    setup(b) {
      b.onLoad({ filter: /[\\/]server[\\/]cli[\\/]board-spec\.ts$/ }, () => ({
        // JSON.parse of a string: V8 reads data faster so than as an object literal
        contents: `export const BOARD_SHAPE = JSON.parse(${JSON.stringify(JSON.stringify(shape))});`,
        loader: 'js',
      }));
      if (!boardCheckPath) return;
      b.onLoad({ filter: /[\\/]server[\\/]cli[\\/]board-check\.ts$/ }, () => ({
        contents: `let m;\nexport function parseBoardFile(raw) { m ??= require(${JSON.stringify(boardCheckPath)}); return m.parseBoardFile(raw); }`,
        loader: 'js',
      }));
      b.onResolve({ filter: /board-check\.cjs$/ }, (args) => ({ path: args.path, external: true }));
    },
  };
}

const COMMON = {
  absWorkingDir: ROOT,
  bundle: true,
  platform: 'node',
  format: 'cjs',
  target: 'node20',
  minify: true,
  legalComments: 'none',
  metafile: true,
  logLevel: 'warning',
};

/** Project files (relative to the root) a build read; not the generated entries, which are no files. */
function ownInputs(metafile) {
  return Object.keys(metafile.inputs).filter((p) => !p.includes('node_modules') && statSync(join(ROOT, p), { throwIfNoEntry: false }));
}

/** The board schema's description for the quick check (server/cli/board-spec.ts), and its sources. */
async function deriveBoardShape() {
  const result = await build({
    ...COMMON, minify: false, write: false, outfile: join(OUT_DIR, 'board-spec.cjs'),
    stdin: { contents: "export { BOARD_SHAPE } from './server/cli/board-spec';", resolveDir: ROOT, sourcefile: 'board-spec-entry.js', loader: 'js' },
    plugins: [englishOnly],
  });
  const mod = { exports: {} };
  new Function('module', 'exports', 'require', result.outputFiles[0].text)(mod, mod.exports, () => {
    throw new Error('the board spec needs no module outside its bundle');
  });
  const shape = mod.exports.BOARD_SHAPE;
  if (!shape) console.warn('the board schema uses something the quick check does not model: every board file goes through zod');
  return { shape: shape ?? null, sources: ownInputs(result.metafile) };
}

/** Builds one bundle to OUT_DIR/out; returns its record entry (hash, size, time, sources). */
async function buildBundle(out, options, extraSources) {
  const file = join(OUT_DIR, out);
  mkdirSync(dirname(file), { recursive: true });
  const tmp = `${file}.${process.pid}.tmp`;
  const result = await build({ ...COMMON, ...options, outfile: tmp });
  // GATEFOLD_CLI_BUILD_META=1 keeps esbuild's account of each bundle (which modules, how many bytes) beside it
  if (process.env.GATEFOLD_CLI_BUILD_META) writeFileSync(`${file}.meta.json`, JSON.stringify(result.metafile));
  const sources = [...new Set([...ownInputs(result.metafile), ...extraSources])].sort();
  const sha256 = createHash('sha256').update(readFileSync(tmp)).digest('hex');
  renameSync(tmp, file);
  const { size, mtimeMs } = statSync(file);
  return { sha256, size, mtimeMs, sources };
}

/** Builds every bundle and the record; returns the record. */
export async function buildCli() {
  mkdirSync(OUT_DIR, { recursive: true });
  const fixed = ['package-lock.json', 'scripts/build-cli.mjs'];
  const spec = await deriveBoardShape();
  const bundles = {};
  bundles[BOARD_CHECK] = await buildBundle(BOARD_CHECK, { entryPoints: ['server/cli/board-check.ts'], plugins: [englishOnly, ownModulesPure] }, fixed);
  // a bundle's sources: its own, the schema its board description comes from, and board-check.cjs's
  const shared = [...spec.sources, ...bundles[BOARD_CHECK].sources];
  bundles['gatefold.cjs'] = await buildBundle('gatefold.cjs', {
    entryPoints: ['server/cli/main.ts'], plugins: [englishOnly, ownModulesPure, cliModules(spec.shape, `./${BOARD_CHECK}`)],
  }, shared);
  const commands = {};
  for (const name of commandNames()) {
    const out = `commands/${name}.cjs`;
    bundles[out] = await buildBundle(out, {
      stdin: {
        contents: [
          `import command from './server/cli/commands/${name}';`,
          "import { runCli } from './server/cli/run';",
          `void runCli(process.argv.slice(2), { ${JSON.stringify(name)}: () => command });`,
        ].join('\n'),
        resolveDir: ROOT, sourcefile: `${name}-entry.js`, loader: 'ts',
      },
      plugins: [englishOnly, ownModulesPure, cliModules(spec.shape, `../${BOARD_CHECK}`)],
    }, [...shared, 'server/cli/commands/index.ts']);
    commands[name] = out;
  }
  writeFileSync(`${RECORD}.${process.pid}.tmp`, JSON.stringify({ version: 2, commands, bundles }));
  renameSync(`${RECORD}.${process.pid}.tmp`, RECORD);
  // caches of earlier bundles, and what earlier builds left
  rmSync(CACHE_DIR, { recursive: true, force: true });
  rmSync(join(OUT_DIR, 'gatefold.mjs'), { force: true });
  rmSync(join(OUT_DIR, 'inputs.json'), { force: true });
  return JSON.parse(readFileSync(RECORD, 'utf8'));
}

/** Makes the code cache of the `analyze` bundle just built by running it once on the half adder. */
export function makeCodeCache() {
  const r = spawnSync(process.execPath, [join(ROOT, 'scripts/cli.cjs'), 'analyze', join(ROOT, 'examples/half-adder.gatefold.json')], { cwd: ROOT, stdio: ['ignore', 'ignore', 'pipe'] });
  if (r.status !== 0) console.warn(`code cache not made: ${r.stderr.toString().split('\n')[0]}`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const t0 = performance.now();
  const record = await buildCli();
  const built = performance.now();
  makeCodeCache();
  const sizes = Object.entries(record.bundles).map(([f, b]) => `${f} ${(b.size / 1024).toFixed(0)} kB`).join(', ');
  console.log(`built ${relative(ROOT, OUT_DIR)}/ (${sizes}) in ${(built - t0).toFixed(0)} ms, code cache in ${(performance.now() - built).toFixed(0)} ms`);
}
