import { minimalForms } from './forms';
import type { FunctionId } from './function-names';
import { AnalysisError } from './table-spec';
import type { TruthTable } from './truth-table';
import type { FunctionRows } from './minimise';

/** The function one output computes of the data inputs for one select combination. */
export interface MappedFunction {
  /** exactly two data inputs and every row 0 or 1: the id (A = first data input, B = second) */
  name?: FunctionId;
  sop: string;
  pos: string;
}

/** One row of the function map (CONTRACTS §2). */
export interface FunctionMapEntry {
  /** the select inputs' values, first select input first */
  select: string;
  data: string[];
  functions: Record<string, MappedFunction>;
}

/**
 * Per-output function rows with don't-cares: X and Z rows and the rows the user marked become
 * don't-cares (2).
 */
export function functionRows(table: TruthTable, output: number, dontCares?: ReadonlySet<number>): FunctionRows {
  const src = table.values[output];
  const fn = new Uint8Array(table.rowCount);
  for (let r = 0; r < fn.length; r++) fn[r] = dontCares?.has(r) ? 2 : src[r] < 2 ? src[r] : 2;
  return fn;
}

/**
 * The function map: for every select combination (binary, first select input most significant), the
 * function of the remaining (data) inputs for each output — its name when exactly two remain, and its
 * minimal SOP and POS.
 */
export function functionMap(table: TruthTable, select: string[], dontCares: Record<string, ReadonlySet<number>> = {}): FunctionMapEntry[] {
  const k = table.inputs.length;
  const selPos = select.map((name) => {
    const i = table.inputs.indexOf(name);
    if (i < 0) throw new AnalysisError(`select input "${name}" is not one of the analysed inputs (${table.inputs.join(', ') || 'none'})`, { select: name });
    return i;
  });
  if (new Set(selPos).size !== selPos.length) throw new AnalysisError('a select input is listed twice', { select: select.join(',') });
  const dataPos = table.inputs.map((_, i) => i).filter((i) => !selPos.includes(i));
  const data = dataPos.map((i) => table.inputs[i]);
  const s = selPos.length;
  const d = dataPos.length;
  const full = table.outputs.map((name, o) => functionRows(table, o, dontCares[name]));
  const entries: FunctionMapEntry[] = [];
  for (let c = 0; c < 2 ** s; c++) {
    let base = 0;
    selPos.forEach((pos, j) => { if ((c >>> (s - 1 - j)) & 1) base |= 1 << (k - 1 - pos); });
    const functions: Record<string, MappedFunction> = {};
    table.outputs.forEach((name, o) => {
      const fn = new Uint8Array(2 ** d);
      for (let r = 0; r < fn.length; r++) {
        let row = base;
        dataPos.forEach((pos, q) => { if ((r >>> (d - 1 - q)) & 1) row |= 1 << (k - 1 - pos); });
        fn[r] = full[o][row];
      }
      const { forms } = minimalForms(data, fn);
      functions[name] = forms.function ? { name: forms.function, sop: forms.sop, pos: forms.pos } : { sop: forms.sop, pos: forms.pos };
    });
    entries.push({ select: s ? c.toString(2).padStart(s, '0') : '', data, functions });
  }
  return entries;
}
