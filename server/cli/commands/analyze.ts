/**
 * `analyze FILE [--inputs A,B,…] [--outputs S,C,…] [--select S1,S2,…] [--dont-cares 3,5]`: the truth table,
 * minimal SOP/POS, function names and function map as the `analyze` JSON of CONTRACTS §2, from the one
 * analysis pipeline of `shared/analysis` (its don't-care rule included).
 */
import { AnalysisError, analyzeJson, parseRowList, runAnalysisSync, type AnalysisRun, type AnalyzeResult } from '../../../shared/analysis';
import { compileBoard } from '../../../shared/sim';
import { parseCommandArgs } from '../args';
import { readBoard } from '../board-file';
import { CliError } from '../errors';
import { rowsJson } from '../table-json';
import type { CliCommand } from './types';

function list(v: string | boolean | undefined, flag: string): string[] | undefined {
  if (v === undefined) return undefined;
  if (typeof v !== 'string') throw new CliError(`--${flag} needs a comma-separated list`);
  const items = v.split(',').map((s) => s.trim()).filter(Boolean);
  if (!items.length) throw new CliError(`--${flag} needs at least one label`);
  return items;
}

/** Above this many rows the result is written compact (it is for programs), and streamed. */
const LARGE = 4096;

/**
 * The bytes of `JSON.stringify(analyzeJson(run)) + '\n'`, in pieces: every field but the rows as
 * analyzeJson gives it (asked of the table without its rows, before any output), the rows from the
 * table's code arrays.
 */
function compactJsonPieces(run: AnalysisRun): Iterable<string | Uint8Array> {
  const result: AnalyzeResult = analyzeJson({ ...run, table: { ...run.table, rowCount: 0 } });
  return pieces(result, run.table);
}

function* pieces(result: AnalyzeResult, table: AnalysisRun['table']): Generator<string | Uint8Array> {
  let sep = '{';
  for (const [key, value] of Object.entries(result)) {
    if (value === undefined) continue; // as JSON.stringify leaves it out
    if (key === 'rows') {
      yield `${sep}${JSON.stringify(key)}:[`;
      yield* rowsJson(table);
      yield ']';
    } else {
      yield `${sep}${JSON.stringify(key)}:${JSON.stringify(value)}`;
    }
    sep = ',';
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
      const run = runAnalysisSync(compileBoard(board), {
        inputs: list(values.inputs, 'inputs'), outputs: list(values.outputs, 'outputs'), select: list(values.select, 'select'),
        dontCares: rows && parseRowList(rows.join(',')),
      });
      // indented for people; a large table is written compact (it is for programs), in pieces
      io.stdout(run.table.rowCount <= LARGE ? JSON.stringify(analyzeJson(run), null, 2) + '\n' : compactJsonPieces(run));
    } catch (err) {
      if (err instanceof AnalysisError) throw new CliError(err.message);
      throw err;
    }
  },
};

export default analyze;
