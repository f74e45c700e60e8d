/**
 * `npm run -s cli -- <command> …`: runs the built command line (dist-cli/gatefold.mjs) with plain node,
 * building it first when it is missing or older than one of its sources (a quick mtime check of the
 * files listed in dist-cli/inputs.json; a new command file is listed once server/cli/commands/index.ts,
 * which is, registers it).
 */
import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';

const ROOT = join(import.meta.dirname, '..');
const BUNDLE = join(ROOT, 'dist-cli', 'gatefold.mjs');
const INPUTS = join(ROOT, 'dist-cli', 'inputs.json');

function stale() {
  let built;
  let sources;
  try {
    built = statSync(BUNDLE).mtimeMs;
    sources = JSON.parse(readFileSync(INPUTS, 'utf8'));
  } catch {
    return true;
  }
  for (const file of sources) {
    try {
      if (statSync(join(ROOT, file)).mtimeMs > built) return true;
    } catch {
      return true; // a source moved or was removed
    }
  }
  return false;
}

if (stale()) {
  const { buildCli } = await import('./build-cli.mjs');
  await buildCli();
}
await import(pathToFileURL(BUNDLE).href);
