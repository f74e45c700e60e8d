import { describe, expect, it } from 'vitest';
import { toCsv, toTsv } from './table-export';

// Half adder table (CONTRACTS §2): S = A XOR B, C = A AND B.
const table = { inputs: ['A', 'B'], outputs: ['S', 'C'], rowCount: 4, values: [Uint8Array.of(0, 1, 1, 0), Uint8Array.of(0, 0, 0, 1)] };

describe('table export', () => {
  it('writes tab-separated rows with a header, marks as –', () => {
    expect(toTsv(table, { S: [3] })).toBe('A\tB\tS\tC\n0\t0\t0\t0\n0\t1\t1\t0\n1\t0\t1\t0\n1\t1\t-\t1\n');
  });
  // RFC 4180: CRLF line ends, fields with commas or quotes quoted (common practice for CSV).
  it('writes RFC 4180 CSV', () => {
    expect(toCsv(table)).toBe('A,B,S,C\r\n0,0,0,0\r\n0,1,1,0\r\n1,0,1,0\r\n1,1,0,1\r\n');
    expect(toCsv({ ...table, outputs: ['S,1', 'C"'] }).split('\r\n')[0]).toBe('A,B,"S,1","C"""');
  });
});
