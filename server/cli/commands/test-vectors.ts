/**
 * `test-vectors FILE [--outputs Y,…] [--seed N]`: vectors that detect every detectable single stuck-at
 * fault, with the expected lamps (the `test-vectors` JSON of CONTRACTS §2, extended) from shared/bringup.
 */
import { BringupError, testVectors } from '../../../shared/bringup';
import { parseCommandArgs } from '../args';
import { readBoard } from '../board-file';
import { CliError } from '../errors';
import type { CliCommand } from './types';

/** A comma-separated flag as a list (undefined when absent). */
export function labelList(v: string | boolean | undefined, flag: string): string[] | undefined {
  if (v === undefined) return undefined;
  if (typeof v !== 'string') throw new CliError(`--${flag} needs a comma-separated list`);
  const items = v.split(',').map((s) => s.trim()).filter(Boolean);
  if (!items.length) throw new CliError(`--${flag} needs at least one label`);
  return items;
}

/** A whole-number flag (undefined when absent). */
export function wholeNumber(v: string | boolean | undefined, flag: string): number | undefined {
  if (v === undefined) return undefined;
  if (typeof v !== 'string' || !/^\d{1,9}$/.test(v)) throw new CliError(`--${flag} needs a whole number`);
  return Number(v);
}

export const testVectorsCommand: CliCommand = {
  usage: 'test-vectors FILE [--outputs Y,…] [--seed N]',
  run(args, io) {
    const { positionals, values } = parseCommandArgs(args, { outputs: { type: 'string' }, seed: { type: 'string' } });
    const board = readBoard(positionals[0]);
    try {
      const result = testVectors(board, { outputs: labelList(values.outputs, 'outputs'), seed: wholeNumber(values.seed, 'seed') });
      io.stdout(JSON.stringify(result, null, 2) + '\n');
    } catch (err) {
      if (err instanceof BringupError) throw new CliError(err.message);
      throw err;
    }
  },
};

export default testVectorsCommand;
