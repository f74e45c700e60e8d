/** Reads and checks a board file for a command; every failure is a one-line CliError naming the fault. */
import { readFileSync } from 'node:fs';
import { parseBoardFile, type BoardFile } from '../../shared/board';
import { CliError } from './errors';

/** The board in FILE, validated (parseBoardFile), or a CliError naming the offending id. */
export function readBoard(file: string | undefined): BoardFile {
  if (!file) throw new CliError('missing FILE (a *.gatefold.json board file)');
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code ?? 'unreadable';
    throw new CliError(`cannot read ${file} (${code})`);
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (err) {
    throw new CliError(`${file} is not valid JSON (${(err as Error).message.split('\n')[0]})`);
  }
  const parsed = parseBoardFile(raw);
  if (!parsed.ok) {
    const [first, ...rest] = parsed.problems;
    throw new CliError(`${file}: ${first.message}${rest.length ? ` (and ${rest.length} more problem${rest.length > 1 ? 's' : ''})` : ''}`);
  }
  return parsed.board;
}
