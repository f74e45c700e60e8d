/**
 * The command line writes the rows of a large truth table as bytes straight from the table
 * (server/cli/table-json.ts); they must be exactly `JSON.stringify` of the rows as CONTRACTS §2 defines
 * them (inputs counted in binary, first most significant; one character 0, 1, X or Z per output) — the
 * reference here is JSON.stringify over rows built the contract's way, on tables with every code.
 */
import { describe, expect, it } from 'vitest';
import { CODE_CHARS, type TruthTable } from '../../shared/analysis';
import { rowsJson } from '../../server/cli/table-json';

function table(k: number, m: number, seed: number): TruthTable {
  const rowCount = 2 ** k;
  let s = seed;
  const next = () => (s = (Math.imul(s, 1103515245) + 12345) >>> 0) >>> 16;
  const values = Array.from({ length: m }, () => Uint8Array.from({ length: rowCount }, () => next() & 3));
  return {
    inputs: Array.from({ length: k }, (_, i) => `I${i}`), outputs: Array.from({ length: m }, (_, o) => `O${o}`),
    inputIds: [], outputIds: [], rowCount, values, sequential: values.map(() => false), method: values.map(() => 'bit-parallel' as const),
  };
}

function expected(t: TruthTable): string {
  const rows = [];
  for (let r = 0; r < t.rowCount; r++) {
    rows.push({ in: t.inputs.length ? r.toString(2).padStart(t.inputs.length, '0') : '', out: t.values.map((v) => CODE_CHARS[v[r]]).join('') });
  }
  return JSON.stringify(rows).slice(1, -1);
}

describe('rows of a large table as JSON bytes', () => {
  it('are the bytes of JSON.stringify of the contract rows, in blocks of about 1 MB', () => {
    for (const [k, m] of [[0, 1], [1, 0], [3, 2], [13, 3], [16, 8], [17, 1]]) {
      const t = table(k, m, k * 31 + m);
      const blocks = [...rowsJson(t)];
      expect(Buffer.concat(blocks).toString('latin1')).toBe(expected(t));
      for (const b of blocks) expect(b.length).toBeLessThanOrEqual(1 << 20);
      if (k === 16) expect(blocks.length).toBeGreaterThan(1);
    }
  });
});
