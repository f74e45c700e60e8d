import { CODE_CHARS } from '../../../shared/analysis';

/** What the export needs of a table. */
export interface ExportTable {
  inputs: string[];
  outputs: string[];
  rowCount: number;
  values: Uint8Array[];
}

/** The cell text of output `o` in row `r`: 0, 1, X, Z, or – when the user marked it don't-care. */
export function cellText(t: ExportTable, o: number, r: number, dontCares?: Record<string, readonly number[]>): string {
  if (dontCares?.[t.outputs[o]]?.includes(r)) return '-';
  return CODE_CHARS[t.values[o][r]];
}

/** Rows of the table as cells: header first, then one row per input combination (first input most significant). */
function* cells(t: ExportTable, dontCares?: Record<string, readonly number[]>): Generator<string[]> {
  yield [...t.inputs, ...t.outputs];
  const k = t.inputs.length;
  const marks = Object.fromEntries(Object.entries(dontCares ?? {}).map(([name, rows]) => [name, new Set(rows)]));
  for (let r = 0; r < t.rowCount; r++) {
    const row = t.inputs.map((_, i) => String((r >>> (k - 1 - i)) & 1));
    t.outputs.forEach((name, o) => row.push(marks[name]?.has(r) ? '-' : CODE_CHARS[t.values[o][r]]));
    yield row;
  }
}

/** Tab-separated text (for the clipboard; spreadsheets paste it as cells). */
export function toTsv(t: ExportTable, dontCares?: Record<string, readonly number[]>): string {
  const lines: string[] = [];
  for (const row of cells(t, dontCares)) lines.push(row.join('\t'));
  return lines.join('\n') + '\n';
}

/** RFC 4180 CSV: comma-separated, CRLF line ends, fields quoted when they hold a comma, quote or line break. */
export function toCsv(t: ExportTable, dontCares?: Record<string, readonly number[]>): string {
  const q = (s: string) => (/[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
  const lines: string[] = [];
  for (const row of cells(t, dontCares)) lines.push(row.map(q).join(','));
  return lines.join('\r\n') + '\r\n';
}
