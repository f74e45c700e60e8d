/**
 * `npm run -s cli -- <command> …`: Gatefold's command line (CONTRACTS §2). JSON or text on stdout;
 * bad input or usage → exit 2 with one line `error: …` on stderr and nothing on stdout; never a stack.
 */
import { writeFileSync } from 'node:fs';
import { COMMANDS } from './commands';
import { CliError } from './errors';
import type { CliIo } from './commands/types';

async function main(argv: string[]): Promise<number> {
  const [name, ...args] = argv;
  const load = name && Object.hasOwn(COMMANDS, name) ? COMMANDS[name] : undefined;
  if (!load) {
    const known = Object.keys(COMMANDS).sort().join(', ');
    throw new CliError(name ? `unknown command "${name}" (commands: ${known})` : `no command given (commands: ${known})`);
  }
  // output is held until the command has finished, so that a failure half-way leaves stdout empty; a
  // large result comes as pieces (an iterable) and is written piece by piece, never as one string
  const out: (string | Iterable<string>)[] = [];
  const files: [string, string][] = [];
  const io: CliIo = { stdout: (text) => { out.push(text); }, writeFile: (path, text) => { files.push([path, text]); } };
  await (await load()).run(args, io);
  for (const [path, text] of files) {
    try {
      writeFileSync(path, text);
    } catch (err) {
      throw new CliError(`cannot write ${path} (${(err as NodeJS.ErrnoException).code ?? 'error'})`);
    }
  }
  for (const part of out) {
    for (const piece of typeof part === 'string' ? [part] : part) await write(piece);
  }
  return 0;
}

/** Writes to stdout, waiting for the pipe to drain when its buffer is full. */
function write(text: string): Promise<void> | void {
  if (process.stdout.write(text)) return;
  return new Promise((resolve) => process.stdout.once('drain', resolve));
}

// a reader that stops early (`… | head`) closes the pipe: end quietly instead of printing a stack
process.stdout.on('error', (err: NodeJS.ErrnoException) => {
  if (err.code === 'EPIPE') process.exit(process.exitCode ?? 0);
  process.stderr.write(`error: cannot write output (${err.code ?? err.message})\n`);
  process.exit(1);
});

main(process.argv.slice(2)).then(
  (code) => { process.exitCode = code; },
  (err: unknown) => {
    const usage = err instanceof CliError;
    const message = err instanceof Error ? err.message : String(err);
    process.stderr.write(`error: ${usage ? '' : 'internal: '}${message.replace(/\s*\n\s*/g, ' ')}\n`);
    process.exitCode = usage ? 2 : 1;
  },
);
