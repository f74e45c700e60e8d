/**
 * Runs the real command line as `npm run -s cli` does — `node scripts/cli.cjs`, the bundle built ahead of
 * time (rebuilt first when older than its sources) — in a child process.
 */
import { execFile } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');

export interface CliResult { code: number; stdout: string; stderr: string }

export function runCli(args: string[]): Promise<CliResult> {
  return new Promise((resolve) => {
    execFile(process.execPath, [join(root, 'scripts', 'cli.cjs'), ...args], { cwd: root, encoding: 'utf8' }, (err, stdout, stderr) => {
      const code = err ? (typeof err.code === 'number' ? err.code : 1) : 0;
      resolve({ code, stdout, stderr });
    });
  });
}
