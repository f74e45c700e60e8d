/**
 * Runs one call of the command line: the command named first, its output held until it has finished (so
 * that a failure half-way leaves stdout empty), then written. Bad input or usage → exit 2 with one line
 * `error: …` on stderr and nothing on stdout; never a stack. Used by main.ts (every command) and by the
 * one-command bundles that scripts/build-cli.mjs makes.
 */
import { writeFileSync } from 'node:fs';
import type { CliCommand, CliIo } from './commands/types';
import { CliError } from './errors';
import { writeError, writeOutput } from './output';

/** name → a loader of the command */
export type CommandTable = Record<string, () => CliCommand | Promise<CliCommand>>;

async function main(argv: string[], commands: CommandTable, known: string[]): Promise<void> {
  const [name, ...args] = argv;
  const load = name && Object.hasOwn(commands, name) ? commands[name] : undefined;
  if (!load) {
    const list = [...known].sort().join(', ');
    throw new CliError(name ? `unknown command "${name}" (commands: ${list})` : `no command given (commands: ${list})`);
  }
  // a large result comes as pieces (an iterable) and is written piece by piece, never as one string
  const out: (string | Iterable<string | Uint8Array>)[] = [];
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
  await writeOutput(out);
}

/** Runs the call `argv` (the arguments after the program) and sets process.exitCode. */
export function runCli(argv: string[], commands: CommandTable, known: string[] = Object.keys(commands)): Promise<void> {
  return main(argv, commands, known).then(
    () => { process.exitCode = 0; },
    (err: unknown) => {
      const usage = err instanceof CliError;
      const message = err instanceof Error ? err.message : String(err);
      writeError(`error: ${usage ? '' : 'internal: '}${message.replace(/\s*\n\s*/g, ' ')}\n`);
      process.exitCode = usage ? 2 : 1;
    },
  );
}
