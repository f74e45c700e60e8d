/**
 * `analyze FILE [--inputs A,B,…] [--outputs S,C,…] [--select S1,S2,…] [--dont-cares 3,5]`: the truth table,
 * minimal SOP/POS, function names and function map as the `analyze` JSON of CONTRACTS §2, from the one
 * analysis pipeline of `shared/analysis` (its don't-care rule included).
 */
import { AnalysisError, analyzeBoard, parseRowList, type AnalyzeResult } from '../../../shared/analysis';
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

const ROWS_PER_PIECE = 8192;

/** The bytes of `JSON.stringify(result) + '\n'`, in pieces: the rows a batch at a time. */
function* compactJsonPieces(result: AnalyzeResult): Generator<string> {
  let sep = '{';
  for (const [key, value] of Object.entries(result)) {
    if (value === undefined) continue; // as JSON.stringify leaves it out
    if (key !== 'rows') { yield `${sep}${JSON.stringify(key)}:${JSON.stringify(value)}`; sep = ','; continue; }
    const rows = value as AnalyzeResult['rows'];
    yield `${sep}${JSON.stringify(key)}:[`;
    sep = ',';
    for (let i = 0; i < rows.length; i += ROWS_PER_PIECE) {
      const batch = JSON.stringify(rows.slice(i, i + ROWS_PER_PIECE));
      yield (i ? ',' : '') + batch.slice(1, -1);
    }
    yield ']';
  }
  yield sep === '{' ? '{}\n' : '}\n';
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
      // indented for people; a large table is written compact (it is for programs), in pieces
      io.stdout(result.rows.length <= 4096 ? JSON.stringify(result, null, 2) + '\n' : compactJsonPieces(result));
    } catch (err) {
      if (err instanceof AnalysisError) throw new CliError(err.message);
      throw err;
    }
  },
};

export default analyze;
