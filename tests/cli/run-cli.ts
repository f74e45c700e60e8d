/** Runs the real command line (`tsx server/cli/main.ts`) in a child process. */
import { execFile } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const TSX = join(root, 'node_modules', '.bin', 'tsx');

export interface CliResult { code: number; stdout: string; stderr: string }

export function runCli(args: string[]): Promise<CliResult> {
  return new Promise((resolve) => {
    execFile(TSX, [join(root, 'server', 'cli', 'main.ts'), ...args], { cwd: root, encoding: 'utf8' }, (err, stdout, stderr) => {
      const code = err ? (typeof err.code === 'number' ? err.code : 1) : 0;
      resolve({ code, stdout, stderr });
    });
  });
}
