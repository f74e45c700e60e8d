import { describe, expect, it } from 'vitest';
import { VerilogNames } from './verilog-names';

describe('VerilogNames', () => {
  it('keeps legal labels as they are and escapes keywords (IEEE Std 1364-2005 §3.7.1)', () => {
    const names = new VerilogNames();
    expect(names.label('begin')).toBe('\\begin ');
    expect(names.label('p_begin')).toBe('p_begin');
    expect(names.label('A')).toBe('A');
  });

  it('gives generated names way to the labels taken first', () => {
    const names = new VerilogNames();
    names.label('begin');
    names.label('g_x');
    expect(names.take('begin')).toBe('n_begin');
    expect(names.take('g_x')).toBe('g_x_2');
  });
});
