import { parseBoardFile, type BoardFile } from '../board';
import { compileBoard } from '../sim';
import { minimalForms, type OutputForms } from './forms';
import { functionMap, functionRows, type FunctionMapEntry } from './function-map';
import { AnalysisError, resolveSpec } from './table-spec';
import { CODE_CHARS, enumerateTable, type TruthTable } from './truth-table';
import type { MinimiseOptions } from './minimise';

/** What to analyse; every field optional (defaults as CONTRACTS §2). */
export interface AnalyzeRequest {
  inputs?: string[];
  outputs?: string[];
  select?: string[];
  /** rows (indices into the table) the user marked don't-care: for every output, or per output label */
  dontCares?: number[] | Record<string, number[]>;
  minimise?: MinimiseOptions;
}

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

/** Normalises the don't-care rows to one set per output, checking that each row exists. */
export function dontCareSets(table: TruthTable, dc: AnalyzeRequest['dontCares']): Record<string, Set<number>> {
  const out: Record<string, Set<number>> = {};
  if (!dc) return out;
  const check = (r: number) => {
    if (!Number.isInteger(r) || r < 0 || r >= table.rowCount) throw new AnalysisError(`don't-care row ${r} is not a row of the table (0 … ${table.rowCount - 1})`, { dontCares: String(r) });
    return r;
  };
  if (Array.isArray(dc)) {
    const set = new Set(dc.map(check));
    for (const o of table.outputs) out[o] = set;
    return out;
  }
  for (const [name, rows] of Object.entries(dc)) {
    if (!table.outputs.includes(name)) throw new AnalysisError(`don't-cares given for "${name}", which is not an analysed output`, { dontCares: name });
    out[name] = new Set(rows.map(check));
  }
  return out;
}

/** The analysis of a truth table: rows, minimal forms and names per output, the function map. */
export function analyzeTable(table: TruthTable, req: AnalyzeRequest = {}): AnalyzeResult {
  const k = table.inputs.length;
  const dcs = dontCareSets(table, req.dontCares);
  const rows = Array.from({ length: table.rowCount }, (_, r) => ({
    in: k ? r.toString(2).padStart(k, '0') : '',
    out: table.values.map((v) => CODE_CHARS[v[r]]).join(''),
  }));
  const outputsInfo: Record<string, OutputInfo> = {};
  table.outputs.forEach((name, o) => {
    const { forms } = minimalForms(table.inputs, functionRows(table, o, dcs[name]), req.minimise);
    outputsInfo[name] = { ...forms, sequential: table.sequential[o] };
  });
  return {
    inputs: table.inputs, outputs: table.outputs, sequential: table.sequential.some(Boolean),
    rows, outputsInfo, functionMap: req.select?.length ? functionMap(table, req.select, dcs) : [],
  };
}

/** Enumerates the board's table (synchronously) and analyses it. */
export function analyzeBoard(board: BoardFile, req: AnalyzeRequest = {}): AnalyzeResult {
  const netlist = compileBoard(board);
  const spec = resolveSpec(netlist, req.inputs, req.outputs);
  return analyzeTable(enumerateTable(netlist, spec), req);
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
