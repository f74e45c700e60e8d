import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CODE_CHARS, enumerateTable, resolveSpec } from '../../shared/analysis';
import { compileBitProgram } from '../../shared/analysis/bit-program';
import { tableCone } from '../../shared/analysis/cone';
import { familyOf, compileBoard } from '../../shared/sim';
import { randomCircuit, type RandomKind } from '../helpers/random-circuit';
import { randomBoardArb } from './random-board';

const ALL_KINDS: RandomKind[] = ['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'buffer', 'mux2', 'mux4'];
const column = (values: Uint8Array) => Array.from(values, (v) => CODE_CHARS[v]).join('');

/** Whether the table of the board's default outputs runs on the two-valued program. */
function twoValued(board: ReturnType<typeof randomCircuit>): boolean {
  const netlist = compileBoard(board);
  const spec = resolveSpec(netlist);
  const nets = spec.outputs.map((o) => o.inputs[0]);
  return compileBitProgram(netlist, tableCone(netlist, nets), spec.inputs, nets, familyOf(netlist.family).floating, 1).twoValued;
}

describe('two-valued fast path', () => {
  // Reference: the four-valued planes of the same program (themselves checked against the event simulator
  // and Icarus Verilog in bit-parallel.test.ts). Combinational boards without open inputs or conflicts
  // can never produce X or Z, so both paths must give the same 0/1 table.
  it('equals the four-valued path on random combinational boards', () => {
    const arb = fc.record({
      seed: fc.integer(), inputs: fc.integer({ min: 1, max: 12 }), gates: fc.integer({ min: 1, max: 120 }),
      outputs: fc.integer({ min: 1, max: 6 }), maxFanIn: fc.integer({ min: 2, max: 5 }),
    }).map((o) => randomCircuit({ ...o, kinds: ALL_KINDS }));
    fc.assert(fc.property(arb, (board) => {
      expect(twoValued(board)).toBe(true);
      const netlist = compileBoard(board);
      const spec = resolveSpec(netlist);
      const fast = enumerateTable(netlist, spec, { chunkRows: 64 });
      const four = enumerateTable(netlist, spec, { fourValued: true });
      fast.values.forEach((v, i) => {
        expect(v.every((c) => c <= 1)).toBe(true);
        expect(column(v), fast.outputs[i]).toBe(column(four.values[i]));
      });
    }), { numRuns: 150 });
  });

  it('is not taken when an open input or two drivers can make X', () => {
    fc.assert(fc.property(randomBoardArb({ loose: true, conflicts: true }), (board) => {
      const netlist = compileBoard(board);
      const spec = resolveSpec(netlist);
      const table = enumerateTable(netlist, spec);
      const four = enumerateTable(netlist, spec, { fourValued: true });
      table.values.forEach((v, i) => expect(column(v)).toBe(column(four.values[i])));
      // an X or Z in a driven output's column means the four-valued program ran
      const sawX = table.values.some((v, i) => netlist.nets[spec.outputs[i].inputs[0]].drivers.length > 0 && v.some((c) => c >= 2));
      if (sawX) expect(twoValued(board)).toBe(false);
    }), { numRuns: 150 });
  });
});
