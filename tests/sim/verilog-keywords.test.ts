/**
 * Labels that are Verilog keywords: the export writes them as escaped identifiers (IEEE Std 1364-2005
 * §3.7.1, `\begin `) and leaves every other legal label as the user wrote it; Icarus Verilog (Debian
 * package `iverilog`, an independent IEEE 1364 compiler) compiles the result and computes the same table.
 */
import { describe, expect, it } from 'vitest';
import { analyzeBoard } from '../../shared/analysis';
import { compileBoard, toVerilog } from '../../shared/sim';
import { BoardBuilder } from './board-builder';
import { runIverilog } from './iverilog';

describe('Verilog export of keyword labels', () => {
  const board = new BoardBuilder().switch('a', 'begin').switch('b', 'p_begin')
    .gate('g', 'and', ['a.out', 'b.out']).gate('h', 'xor', ['a.out', 'b.out'])
    .lamp('y', 'end', 'g.out').lamp('z', 'p_end', 'h.out').board();
  const verilog = toVerilog(board, compileBoard(board));

  it('keeps legal labels and escapes keywords instead of renaming into the labels\' name space', () => {
    const header = /^module\s+\S+\s*\((.*)\);$/m.exec(verilog)?.[1];
    expect(header).toBe('\\begin , p_begin, \\end , p_end');
    expect(verilog).not.toMatch(/p_begin_2|p_end_2/);
  });

  it('compiles under Icarus Verilog and gives the simulator\'s table', () => {
    const rows = [[0, 0], [0, 1], [1, 0], [1, 1]];
    const icarus = runIverilog(verilog, ['\\begin ', 'p_begin'], ['\\end ', 'p_end'], rows);
    const ours = analyzeBoard(board).rows.map((r) => r.out);
    expect(icarus).toEqual(ours);
    // AND and XOR of two inputs (Wikipedia "Truth table", "Binary operations": 0001, 0110)
    expect(icarus).toEqual(['00', '01', '01', '10']);
  });
});
