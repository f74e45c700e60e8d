import { parseBoardFile, type BoardFile } from '../board';
import { compileBoard } from '../sim';
import type { OutputForms } from './forms';
import type { FunctionMapEntry } from './function-map';
import { finish, runAnalysisSync, tableAnalysisSteps, type AnalysisRun, type AnalyzeRequest } from './pipeline';
import { AnalysisError } from './table-spec';
import { CODE_CHARS, type TruthTable } from './truth-table';

export type { AnalyzeRequest } from './pipeline';
export { dontCareSets } from './dont-cares';

/** Per-output result: the contract's `sop`, `pos`, `function`, and more. */
export interface OutputInfo extends OutputForms {
  sequential: boolean;
}

/** The `analyze` JSON of CONTRACTS §2. */
export interface AnalyzeResult {
  inputs: string[];
  outputs: string[];
  sequential: boolean;
  rows: { in: string; out: string }[];
  outputsInfo: Record<string, OutputInfo>;
  functionMap: FunctionMapEntry[];
}

/** A run of the pipeline as the `analyze` JSON of CONTRACTS §2. */
export function analyzeJson(run: Pick<AnalysisRun, 'table' | 'forms' | 'functionMap'>): AnalyzeResult {
  const { table } = run;
  const k = table.inputs.length;
  const rows: AnalyzeResult['rows'] = new Array(table.rowCount);
  const { values } = table;
  for (let r = 0; r < table.rowCount; r++) {
    let out = '';
    for (let o = 0; o < values.length; o++) out += CODE_CHARS[values[o][r]];
    rows[r] = { in: k ? r.toString(2).padStart(k, '0') : '', out };
  }
  const outputsInfo: Record<string, OutputInfo> = {};
  table.outputs.forEach((name, o) => { outputsInfo[name] = { ...run.forms[name], sequential: table.sequential[o] }; });
  return {
    inputs: table.inputs, outputs: table.outputs, sequential: table.sequential.some(Boolean),
    rows, outputsInfo, functionMap: run.functionMap,
  };
}

/** The analysis of a truth table: rows, minimal forms and names per output, the function map. */
export function analyzeTable(table: TruthTable, req: AnalyzeRequest = {}): AnalyzeResult {
  return analyzeJson(finish(tableAnalysisSteps(table, req)));
}

/** Enumerates the board's table (synchronously) and analyses it. */
export function analyzeBoard(board: BoardFile, req: AnalyzeRequest = {}): AnalyzeResult {
  return analyzeJson(runAnalysisSync(compileBoard(board), req));
}

/** Parses a board file (unknown JSON) and analyses it; bad files throw an AnalysisError naming the ids. */
export function analyzeBoardFile(raw: unknown, req: AnalyzeRequest = {}): AnalyzeResult {
  const parsed = parseBoardFile(raw);
  if (!parsed.ok) {
    const fields: Record<string, string> = {};
    for (const p of parsed.problems) fields[p.id ?? p.path] = p.message;
    throw new AnalysisError(parsed.problems.map((p) => p.message).join('; '), fields);
  }
  return analyzeBoard(parsed.board, req);
}
