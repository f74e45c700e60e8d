/**
 * The one don't-care rule of every analysis (panel, API, command line): a don't-care is a row number of
 * the table, 0 … rowCount − 1 (row r spells the inputs in binary, first input most significant), given
 * for every output or per analysed output label. Anything else is refused with an AnalysisError naming
 * the offending value in `fields.dontCares` — never dropped in silence.
 */
import { AnalysisError } from './table-spec';
import type { TruthTable } from './truth-table';

/** Rows marked don't-care: for every output, or per output label. */
export type DontCares = number[] | Record<string, number[]>;

/** Reads a comma-separated list of row numbers (`3,5`), as the command line and the query string give it. */
export function parseRowList(text: string): number[] {
  return text.split(',').map((s) => s.trim()).filter(Boolean).map((s) => {
    const n = Number(s);
    if (!Number.isSafeInteger(n) || n < 0) throw new AnalysisError(`don't-care row "${s}" is not a row number`, { dontCares: s });
    return n;
  });
}

/** Normalises the don't-care rows to one set per output, checking each output and each row. */
export function dontCareSets(table: TruthTable, dc: DontCares | undefined): Record<string, Set<number>> {
  const out: Record<string, Set<number>> = {};
  if (!dc) return out;
  const rowsOf = (rows: unknown, output?: string): Set<number> => {
    if (!Array.isArray(rows)) throw new AnalysisError(`don't-cares${output === undefined ? '' : ` of "${output}"`} must be a list of row numbers`, { dontCares: output ?? String(rows) });
    return new Set(rows.map((r: unknown) => {
      if (typeof r !== 'number' || !Number.isInteger(r) || r < 0 || r >= table.rowCount) {
        throw new AnalysisError(`don't-care row ${String(r)} is not a row of the table (0 … ${table.rowCount - 1})`, { dontCares: String(r) });
      }
      return r;
    }));
  };
  if (Array.isArray(dc)) {
    const set = rowsOf(dc);
    for (const o of table.outputs) out[o] = set;
    return out;
  }
  if (typeof dc !== 'object') throw new AnalysisError('don\'t-cares must be row numbers, or row numbers per output', { dontCares: String(dc) });
  for (const [name, rows] of Object.entries(dc)) {
    if (!table.outputs.includes(name)) throw new AnalysisError(`don't-cares given for "${name}", which is not an analysed output`, { dontCares: name });
    out[name] = rowsOf(rows, name);
  }
  return out;
}
