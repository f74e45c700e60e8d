import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { enumerateTable, resolveSpec } from '../../shared/analysis';
import { compileBoard } from '../../shared/sim';
import { parseBoardFile, type BoardFile } from '../../shared/board';
import { randomBoardArb } from './random-board';

/** Arrays of the table's size holding garbage (0xaa is no level code), as a reused buffer would. */
const dirty = (n: number, rows: number) => Array.from({ length: n }, () => new Uint8Array(rows).fill(0xaa));

describe('enumerateTable into the caller\u2019s arrays (EnumerateOptions.into)', () => {
  it('gives the same table as new arrays, in the arrays given, whatever they held (both kernels, two- and four-valued, X and Z)', () => {
    fc.assert(fc.property(randomBoardArb({ maxInputs: 9, loose: true, conflicts: true }), (board) => {
      const netlist = compileBoard(board);
      const spec = resolveSpec(netlist);
      for (const opts of [{}, { kernel: 'js' as const }, { fourValued: true }, { fourValued: true, kernel: 'js' as const }, { chunkRows: 64 }]) {
        const fresh = enumerateTable(netlist, spec, opts);
        const into = dirty(spec.outputs.length, fresh.rowCount);
        const reused = enumerateTable(netlist, spec, { ...opts, into });
        expect(reused.values).toEqual(fresh.values);
        reused.values.forEach((v, i) => expect(v).toBe(into[i]));
        expect({ ...reused, values: [] }).toEqual({ ...fresh, values: [] });
      }
    }), { numRuns: 25, seed: 20261203 });
  });

  it('writes every row of an output the event simulator computes (stored state) too', () => {
    // a D flip-flop's Q (sequential: event simulator) beside a NAND of the same switches (bit-parallel)
    const parsed = parseBoardFile({
      format: 'gatefold-board', version: 1, title: 'mixed', family: 'ideal',
      parts: [
        { id: 'd', kind: 'switch', label: 'D', x: 0, y: 0, on: false }, { id: 'c', kind: 'switch', label: 'C', x: 0, y: 60, on: false },
        { id: 'ff', kind: 'dff', x: 100, y: 0 }, { id: 'g', kind: 'nand', inputs: 2, x: 100, y: 80 },
        { id: 'q', kind: 'lamp', label: 'Q', x: 200, y: 0 }, { id: 'y', kind: 'lamp', label: 'Y', x: 200, y: 80 },
      ],
      wires: [
        { id: 'w1', from: 'd.out', to: 'ff.d' }, { id: 'w2', from: 'c.out', to: 'ff.clk' }, { id: 'w3', from: 'ff.q', to: 'q.in' },
        { id: 'w4', from: 'd.out', to: 'g.in0' }, { id: 'w5', from: 'c.out', to: 'g.in1' }, { id: 'w6', from: 'g.out', to: 'y.in' },
      ],
    });
    if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
    const netlist = compileBoard(parsed.board as BoardFile);
    const spec = resolveSpec(netlist);
    const fresh = enumerateTable(netlist, spec);
    expect(fresh.method).toEqual(['event', 'bit-parallel']);
    const into = dirty(2, 4);
    expect(enumerateTable(netlist, spec, { into }).values).toEqual(fresh.values);
    // NAND of D, C over DC = 00, 01, 10, 11 (textbook truth table)
    expect(Array.from(into[1])).toEqual([1, 1, 1, 0]);
  });

  it('makes new arrays where the given one has another length or is given twice', () => {
    const parsed = parseBoardFile({
      format: 'gatefold-board', version: 1, title: 'two lamps', family: 'ideal',
      parts: [{ id: 'a', kind: 'switch', label: 'A', x: 0, y: 0, on: false }, { id: 'p', kind: 'lamp', label: 'P', x: 100, y: 0 }, { id: 'n', kind: 'lamp', label: 'N', x: 100, y: 60 }],
      wires: [{ id: 'w1', from: 'a.out', to: 'p.in' }, { id: 'w2', from: 'a.outn', to: 'n.in' }],
    });
    if (!parsed.ok) throw new Error('board');
    const netlist = compileBoard(parsed.board);
    const spec = resolveSpec(netlist);
    const shared = new Uint8Array(2);
    const twice = enumerateTable(netlist, spec, { into: [shared, shared] });
    expect(twice.values[0]).toBe(shared);
    expect(twice.values[1]).not.toBe(shared);
    expect(twice.values.map((v) => Array.from(v))).toEqual([[0, 1], [1, 0]]);
    const long = new Uint8Array(4);
    const wrong = enumerateTable(netlist, spec, { into: [long] });
    expect(wrong.values[0]).not.toBe(long);
    expect(Array.from(long)).toEqual([0, 0, 0, 0]);
  });
});
