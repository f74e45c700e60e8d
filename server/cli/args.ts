/** Flag parsing for the commands (node:util parseArgs, strict: an unknown flag is a usage error). */
import { parseArgs, type ParseArgsConfig } from 'node:util';
import { CliError } from './errors';

/** Parsed positionals and flag values of one command. */
export interface ParsedArgs {
  positionals: string[];
  values: Record<string, string | boolean | undefined>;
}

/** Parses args against the options; unknown flags, missing values and stray arguments become CliErrors. */
export function parseCommandArgs(args: string[], options: NonNullable<ParseArgsConfig['options']>, maxPositionals = 1): ParsedArgs {
  let parsed;
  try {
    parsed = parseArgs({ args: joinNegativeValues(args, options), options, allowPositionals: true, strict: true });
  } catch (err) {
    throw new CliError((err as Error).message.split('\n')[0].split('. ')[0]);
  }
  if (parsed.positionals.length > maxPositionals) throw new CliError(`unexpected argument "${parsed.positionals[maxPositionals]}"`);
  return { positionals: parsed.positionals, values: parsed.values as ParsedArgs['values'] };
}

/**
 * `--cycles -1` → `--cycles=-1`: parseArgs takes a value starting with a dash for a flag ("argument is
 * ambiguous"); a negative number after a flag that takes a value is that value, for the command to judge.
 */
function joinNegativeValues(args: string[], options: NonNullable<ParseArgsConfig['options']>): string[] {
  const out: string[] = [];
  for (let i = 0; i < args.length; i++) {
    const name = /^--([^=]+)$/.exec(args[i])?.[1];
    if (name && options[name]?.type === 'string' && /^-\d/.test(args[i + 1] ?? '')) out.push(`${args[i]}=${args[++i]}`);
    else out.push(args[i]);
  }
  return out;
}
