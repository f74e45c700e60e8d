import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { loadConfig } from './config';
import { runMain, type RunningServer } from './index';
import { startBanner } from './start-banner';

const ROOT = resolve(import.meta.dirname, '..');

/** Newest modification time of any file under `path` (0 when missing). */
function newestMtime(path: string): number {
  if (!existsSync(path)) return 0;
  const st = statSync(path);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = 0;
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtime(join(path, entry)));
  return newest;
}

/** Builds the client when dist/index.html is missing or older than its sources. */
function buildClientIfNeeded(distDir: string): void {
  const index = resolve(ROOT, distDir, 'index.html');
  const built = existsSync(index) ? statSync(index).mtimeMs : 0;
  const sources = Math.max(...['src', 'shared', 'index.html'].map((p) => newestMtime(resolve(ROOT, p))));
  if (built && built >= sources) return;
  const started = Date.now();
  console.log(built ? 'Client sources changed: building the client…' : 'First start: building the client…');
  // quiet: only warnings and errors (the bundler's timing checks are off in vite.config.ts)
  const r = spawnSync(resolve(ROOT, 'node_modules/.bin/vite'), ['build', '--logLevel', 'warn'], { cwd: ROOT, stdio: 'inherit' });
  if (r.status !== 0) console.error('warning: the client build failed; the API still runs, the pages may be missing or old');
  else console.log(`Client built in ${Math.round((Date.now() - started) / 1000)} s.`);
}

try {
  const config = loadConfig();
  buildClientIfNeeded(config.distDir);
  await runMain({ ...config, seedDemo: true }, (running: RunningServer) => console.log(startBanner(running.url, config).join('\n')));
} catch (err) {
  console.error(`error: ${(err as Error).message}`);
  process.exit(1);
}
