/**
 * `analyze FILE [--inputs A,B,…] [--outputs S,C,…] [--select S1,S2,…] [--dont-cares 3,5]`: the truth table,
 * minimal SOP/POS, function names and function map as the `analyze` JSON of CONTRACTS §2, from the one
 * analysis pipeline of `shared/analysis` (its don't-care rule included).
 */
import { AnalysisError, analyzeBoard, parseRowList } from '../../../shared/analysis';
import { parseCommandArgs } from '../args';
import { readBoard } from '../board-file';
import { CliError } from '../errors';
import type { CliCommand } from './types';

function list(v: string | boolean | undefined, flag: string): string[] | undefined {
  if (v === undefined) return undefined;
  if (typeof v !== 'string') throw new CliError(`--${flag} needs a comma-separated list`);
  const items = v.split(',').map((s) => s.trim()).filter(Boolean);
  if (!items.length) throw new CliError(`--${flag} needs at least one label`);
  return items;
}

export const analyze: CliCommand = {
  usage: 'analyze FILE [--inputs A,B,…] [--outputs Y,…] [--select S1,S2,…] [--dont-cares ROW,…]',
  run(args, io) {
    const { positionals, values } = parseCommandArgs(args, {
      inputs: { type: 'string' }, outputs: { type: 'string' }, select: { type: 'string' }, 'dont-cares': { type: 'string' },
    });
    const board = readBoard(positionals[0]);
    try {
      const rows = list(values['dont-cares'], 'dont-cares');
      const result = analyzeBoard(board, {
        inputs: list(values.inputs, 'inputs'), outputs: list(values.outputs, 'outputs'), select: list(values.select, 'select'),
        dontCares: rows && parseRowList(rows.join(',')),
      });
      // indented for people; a million-row table is written compact (it is for programs)
      io.stdout(JSON.stringify(result, null, result.rows.length <= 4096 ? 2 : undefined) + '\n');
    } catch (err) {
      if (err instanceof AnalysisError) throw new CliError(err.message);
      throw err;
    }
  },
};
