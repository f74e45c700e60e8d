/**
 * The `rows` of a large `analyze` result as JSON bytes, straight from the truth table's code arrays: the
 * same bytes as `JSON.stringify(rows)` without its brackets (rows `{"in":"0101","out":"10"}` as CONTRACTS
 * §2 gives them: inputs counted in binary, first input most significant; one code character per output),
 * in blocks of about 1 MB, so that 65,536 rows never become 65,536 objects or one giant string.
 *
 * Every row has the same length, so a block is a pattern of rows copied in (native copies) with the
 * output characters written into it. The pattern's input digits are made by doubling — rows [n, 2n) are
 * rows [0, n) with one more digit set — and the digits above a block's own change between blocks as a
 * counter's do, so the input columns cost about two byte writes per row in all; the code runs once per
 * call, mostly before V8 has optimised it, so byte writes are what costs.
 */
import { CODE_CHARS, type TruthTable } from '../../shared/analysis';

const BLOCK_BYTES = 1 << 20;

/** The rows of the table, as blocks of JSON text (bytes) joined by commas; nothing for no rows. */
export function* rowsJson(table: TruthTable): Generator<Uint8Array> {
  const k = table.inputs.length;
  const { values, rowCount } = table;
  const m = values.length;
  const codes = Buffer.from(CODE_CHARS.join(''), 'latin1'); // one byte per code
  if (codes.length !== CODE_CHARS.length) throw new Error('code characters must be single bytes');
  const head = Buffer.from('{"in":"');
  const mid = Buffer.from('","out":"');
  const tail = Buffer.from('"}');
  // a row: `,` head k digits mid m characters tail (the table's first row without its comma)
  const rowBytes = 1 + head.length + k + mid.length + m + tail.length;
  const row = Buffer.alloc(rowBytes);
  let at = 0;
  row[at++] = 0x2c; // ,
  at += head.copy(row, at);
  const inAt = at;
  row.fill(0x30, at, at + k); // digits 0
  at += k;
  at += mid.copy(row, at);
  const outAt = at;
  at += m;
  tail.copy(row, at);

  // rows per block: a power of two (at least one row)
  let bits = 0;
  while (bits < k && (2 << bits) * rowBytes <= BLOCK_BYTES) bits++;
  const per = Math.min(1 << bits, Math.max(rowCount, 1));
  const pattern = Buffer.allocUnsafe(per * rowBytes);
  row.copy(pattern, 0);
  for (let n = 1, bit = 0; n < per; n *= 2, bit++) {
    pattern.copy(pattern, n * rowBytes, 0, n * rowBytes);
    for (let p = n * rowBytes + inAt + k - 1 - bit, end = 2 * n * rowBytes; p < end; p += rowBytes) pattern[p] = 0x31;
  }
  for (let start = 0; start < rowCount; start += per) {
    // the digits above the block's own: the pattern keeps the previous block's, change those that differ
    for (let bit = bits; bit < k; bit++) {
      const digit = 0x30 | ((start >>> bit) & 1);
      const col = inAt + k - 1 - bit;
      if (pattern[col] !== digit) for (let p = col; p < pattern.length; p += rowBytes) pattern[p] = digit;
    }
    const end = Math.min(rowCount, start + per);
    const block = Buffer.allocUnsafe((end - start) * rowBytes);
    pattern.copy(block, 0, 0, block.length);
    for (let o = 0; o < m; o++) {
      const column = values[o];
      for (let r = start, p = outAt + o; r < end; r++, p += rowBytes) block[p] = codes[column[r]];
    }
    yield start === 0 ? block.subarray(1) : block; // the first row has no comma before it
  }
}
