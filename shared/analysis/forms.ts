import { formatPos, formatSop, posTerms, readablePos, readableSop, sopTerms, type ReadableStyle, type Term } from './expression';
import { functionIdOfColumn, type FunctionId } from './function-names';
import { minimiseOnes, minimiseZeros, type FunctionRows, type MinimiseOptions } from './minimise';

/** Covers with more terms than this are not written out as strings (a 20-input parity has 524,288). */
export const MAX_FORMATTED_TERMS = 4096;

/**
 * Minimal two-level forms of one output, in the machine form of CONTRACTS §2 and as terms for display.
 * An output that is X or Z in every row has no forms: `unknown` is true and `sop`/`pos` are null.
 */
export interface OutputForms {
  sop: string | null;
  pos: string | null;
  /** every minimal SOP found (the first is `sop`) */
  sopAll: string[];
  posAll: string[];
  /** false when a cover is heuristic (not proven minimal) */
  exact: boolean;
  /** two inputs: the function's id (A the first input, B the second) */
  function?: FunctionId;
  /** why a form is not exact or not complete */
  note?: string;
  /** true when the output is X or Z in every row: its function is unknown */
  unknown?: true;
}

/** Forms of an output that has a 0 or a 1 in some row. */
export type KnownForms = OutputForms & { sop: string; pos: string };

/** The forms of an output that is X or Z in every row: no expression, said so. */
export function unknownForms(): { forms: OutputForms; terms: OutputTerms } {
  return {
    forms: { sop: null, pos: null, sopAll: [], posAll: [], exact: true, unknown: true, note: 'the output is X or Z in every row: its function is unknown' },
    terms: { sop: [], pos: [] },
  };
}

/** The same forms kept as terms, for readable rendering. */
export interface OutputTerms {
  sop: Term[];
  pos: Term[];
}

/**
 * Minimal SOP and POS of a function given per row (0, 1, or 2 = don't-care), over the named inputs
 * (first name most significant). Minimal = fewest terms, then fewest literals.
 */
export function minimalForms(names: string[], fn: FunctionRows, opts: MinimiseOptions = {}): { forms: KnownForms; terms: OutputTerms } {
  const n = names.length;
  const ones = minimiseOnes(n, fn, opts);
  const zeros = minimiseZeros(n, fn, opts);
  const notes = [ones.note && `SOP: ${ones.note}`, zeros.note && `POS: ${zeros.note}`, ones.truncated && 'more minimal SOPs exist than listed', zeros.truncated && 'more minimal POSs exist than listed'].filter(Boolean);
  const big = (c: unknown[]) => c.length > MAX_FORMATTED_TERMS;
  if (ones.covers.some(big) || zeros.covers.some(big)) notes.push(`a cover has more than ${MAX_FORMATTED_TERMS} terms; only its term count is given`);
  const sopAll = ones.covers.map((c) => (big(c) ? `(${c.length} terms)` : formatSop(sopTerms(c, names))));
  const posAll = zeros.covers.map((c) => (big(c) ? `(${c.length} terms)` : formatPos(posTerms(c, names))));
  const forms: KnownForms = { sop: sopAll[0], pos: posAll[0], sopAll, posAll, exact: ones.exact && zeros.exact };
  if (n === 2) {
    const column = Array.from(fn, (v) => (v === 1 ? '1' : v === 0 ? '0' : '-')).join('');
    const id = functionIdOfColumn(column);
    if (id) forms.function = id;
  }
  if (notes.length) forms.note = notes.join('; ');
  const terms: OutputTerms = {
    sop: big(ones.covers[0]) ? [] : sopTerms(ones.covers[0], names),
    pos: big(zeros.covers[0]) ? [] : posTerms(zeros.covers[0], names),
  };
  return { forms, terms };
}

/** Readable SOP and POS of terms (¬ or overbar notation). */
export function readableForms(terms: OutputTerms, style: ReadableStyle = 'logic'): { sop: string; pos: string } {
  return { sop: readableSop(terms.sop, style), pos: readablePos(terms.pos, style) };
}
