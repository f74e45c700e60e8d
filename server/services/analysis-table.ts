import { parseBoardFile, type BoardFile } from '../../shared/board';
import { compileBoard } from '../../shared/sim';
import {
  AnalysisError, CODE_CHARS, resolveSpec, runAnalysisSync,
  type AnalyzeRequest, type AnalyzeResult, type AnalysisRun,
} from '../../shared/analysis';

/**
 * The `analyze` JSON of CONTRACTS §2 with the rows not yet written out: a 20-input table is a million
 * rows (about 40 MB of JSON), so they are kept as one byte per output and row and spelled while streaming.
 */
export interface PendingAnalysis extends Omit<AnalyzeResult, 'rows'> {
  rowCount: number;
  /** per output, one level code per row (0, 1, 2 = X, 3 = Z) */
  values: Uint8Array[];
}

/** A parsed board and how many inputs its table enumerates (bad boards and choices throw AnalysisError). */
export function prepareAnalysis(raw: unknown, req: AnalyzeRequest): { board: BoardFile; inputCount: number } {
  const parsed = parseBoardFile(raw);
  if (!parsed.ok) {
    const fields: Record<string, string> = {};
    for (const p of parsed.problems) fields[p.id ?? p.path] = p.message;
    throw new AnalysisError(parsed.problems.map((p) => p.message).join('; '), fields);
  }
  const spec = resolveSpec(compileBoard(parsed.board), req.inputs, req.outputs);
  return { board: parsed.board, inputCount: spec.inputs.length };
}

/** Runs the shared pipeline straight through and keeps the table compact. */
export function analyzePending(board: BoardFile, req: AnalyzeRequest): PendingAnalysis {
  const run: AnalysisRun = runAnalysisSync(compileBoard(board), req);
  const { table } = run;
  const outputsInfo: AnalyzeResult['outputsInfo'] = {};
  table.outputs.forEach((name, o) => { outputsInfo[name] = { ...run.forms[name], sequential: table.sequential[o] }; });
  return {
    inputs: table.inputs, outputs: table.outputs, sequential: table.sequential.some(Boolean),
    outputsInfo, functionMap: run.functionMap, rowCount: table.rowCount, values: table.values,
  };
}

/** Row `r` as the contract spells it (as `analyzeJson` in shared/analysis does): inputs in binary, first most significant. */
export function rowOf(p: Pick<PendingAnalysis, 'inputs' | 'values'>, r: number): { in: string; out: string } {
  const k = p.inputs.length;
  return { in: k ? r.toString(2).padStart(k, '0') : '', out: p.values.map((v) => CODE_CHARS[v[r]]).join('') };
}
