/**
 * `build-sheet FILE --family F [--set R1=22k,VN=-12,…]`: the build estimate as JSON (CONTRACTS §2),
 * with `levelCheck` for tube and transistor families. `--family` defaults to the board's own family.
 */
import { BuildError, buildSheet } from '../../../shared/build';
import { parseCommandArgs } from '../args';
import { readBoard } from '../board-file';
import { CliError } from '../errors';
import type { CliCommand } from './types';

export const buildSheetCommand: CliCommand = {
  usage: 'build-sheet FILE [--family F] [--set R1=22k,R2=33k,…]',
  run(args, io) {
    const { positionals, values } = parseCommandArgs(args, { family: { type: 'string' }, set: { type: 'string' } });
    const board = readBoard(positionals[0]);
    try {
      const sheet = buildSheet(board, typeof values.family === 'string' ? values.family : board.family, { set: typeof values.set === 'string' ? values.set : undefined });
      io.stdout(`${JSON.stringify(sheet, null, 2)}\n`);
    } catch (err) {
      if (err instanceof BuildError) throw new CliError(err.message);
      throw err;
    }
  },
};

export default buildSheetCommand;
