/** Reads and checks a board file for a command; every failure is a one-line CliError naming the fault. */
import { readFileSync } from 'node:fs';
import { checkBoard, type BoardFile, type BoardProblem } from '../../shared/board';
import { parseBoardFile } from './board-check';
import { BOARD_SHAPE } from './board-spec';
import { CliError } from './errors';
import { conform, DOUBT } from './shape';

function problemLine(file: string, problems: BoardProblem[]): string {
  const [first, ...rest] = problems;
  return `${file}: ${first.message}${rest.length ? ` (and ${rest.length} more problem${rest.length > 1 ? 's' : ''})` : ''}`;
}

/**
 * The board in FILE, validated as parseBoardFile validates it, or a CliError naming the offending id. A
 * well-shaped file is checked by the quick shape check and then the board's meaning (checkBoard, as
 * parseBoardFile does after its zod parse); anything the quick check is not sure of goes through zod.
 */
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
  const shaped = BOARD_SHAPE ? conform(BOARD_SHAPE, raw) : DOUBT;
  if (shaped !== DOUBT) {
    const board = shaped as BoardFile;
    const problems = checkBoard(board);
    if (problems.length) throw new CliError(problemLine(file, problems));
    return board;
  }
  const parsed = parseBoardFile(raw);
  if (!parsed.ok) throw new CliError(problemLine(file, parsed.problems));
  return parsed.board;
}
