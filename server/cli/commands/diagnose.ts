/**
 * `diagnose FILE --observed OBS.json [--outputs Y,…]`: the suspects that explain what the bench showed
 * (OBS: `[{"in": "0101", "out": "11"}]`, `?` for a lamp not read) and the next vector to try — the
 * `diagnose` JSON of CONTRACTS §2, extended. For a board with storage the observations are the steps of
 * one sequence from power-on, in order.
 */
import { readFileSync } from 'node:fs';
import { BringupError, diagnose, type Observation } from '../../../shared/bringup';
import { parseCommandArgs } from '../args';
import { readBoard } from '../board-file';
import { CliError } from '../errors';
import { labelList } from './test-vectors';
import type { CliCommand } from './types';

function readObservations(file: string | boolean | undefined): Observation[] {
  if (typeof file !== 'string' || !file) throw new CliError('missing --observed OBS.json (a list of {"in", "out"})');
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (err) {
    throw new CliError(`cannot read ${file} (${(err as NodeJS.ErrnoException).code ?? 'unreadable'})`);
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (err) {
    throw new CliError(`${file} is not valid JSON (${(err as Error).message.split('\n')[0]})`);
  }
  const list = Array.isArray(raw) ? raw : (raw as { observed?: unknown })?.observed;
  if (!Array.isArray(list)) throw new CliError(`${file} must hold a list of {"in", "out"} observations`);
  return list as Observation[];
}

export const diagnoseCommand: CliCommand = {
  usage: 'diagnose FILE --observed OBS.json [--outputs Y,…]',
  run(args, io) {
    const { positionals, values } = parseCommandArgs(args, { observed: { type: 'string' }, outputs: { type: 'string' } });
    const board = readBoard(positionals[0]);
    const observed = readObservations(values.observed);
    try {
      io.stdout(JSON.stringify(diagnose(board, observed, { outputs: labelList(values.outputs, 'outputs') }), null, 2) + '\n');
    } catch (err) {
      if (err instanceof BringupError) throw new CliError(err.message);
      throw err;
    }
  },
};

export default diagnoseCommand;
