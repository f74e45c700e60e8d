/**
 * `convert FILE --to nor|nand [--no-complements]`: the board with only NOR (or NAND) gates, inputs and
 * outputs, and the same truth table, as a board file on stdout. `--no-complements` makes inverters
 * instead of using the switches' complement pins (`outn`).
 */
import { canonicalBoard } from '../../../shared/board';
import { BuildError, convertBoard } from '../../../shared/build';
import { parseCommandArgs } from '../args';
import { readBoard } from '../board-file';
import { CliError } from '../errors';
import type { CliCommand } from './types';

export const convert: CliCommand = {
  usage: 'convert FILE --to nor|nand [--no-complements]',
  run(args, io) {
    const { positionals, values } = parseCommandArgs(args, { to: { type: 'string' }, 'no-complements': { type: 'boolean' } });
    const to = values.to;
    if (to !== 'nor' && to !== 'nand') throw new CliError(to === undefined ? 'missing --to nor|nand' : `--to ${String(to)}: convert to nor or nand`);
    const board = readBoard(positionals[0]);
    try {
      const result = convertBoard(board, to, { complements: values['no-complements'] !== true });
      io.stdout(`${JSON.stringify(canonicalBoard(result.board), null, 2)}\n`);
    } catch (err) {
      if (err instanceof BuildError) throw new CliError(err.message);
      throw err;
    }
  },
};

export default convert;
