/**
 * Conversion to NOR-only and NAND-only keeps the truth table (our analysis engine, and Icarus Verilog as
 * an independent simulator of the exported netlists) within the minimum gate counts of CHECKS.md.
 */
import { describe, expect, it } from 'vitest';
import { analyzeBoard } from '../../shared/analysis';
import { BuildError, convertBoard, type ConvertTarget } from '../../shared/build';
import { compileBoard, Simulator, toVerilog } from '../../shared/sim';
import { BoardFileSchema, type BoardFile } from '../../shared/board';
import { randomCircuit } from '../helpers/random-circuit';
import { runIverilog } from '../sim/iverilog';
import { oneGate, tubeLogicUnit, type OneGateKind } from './boards';

const table = (board: BoardFile, inputs?: string[]) => analyzeBoard(board, inputs ? { inputs } : {}).rows.map((r) => `${r.in}:${r.out}`);

// Fewest 2-input gates (CHECKS.md; Wikipedia "NOR logic" and "NAND logic"; confirmed by exhaustive search):
// [NOR only, NOR with complements, NAND only, NAND with complements]
const MINIMUM: Record<OneGateKind, [number, number, number, number]> = {
  not: [1, 0, 1, 0], or: [2, 2, 3, 1], and: [3, 1, 2, 2], nand: [4, 2, 1, 1], nor: [1, 1, 4, 2], xnor: [4, 3, 5, 3], xor: [5, 3, 4, 3],
};

describe('convertBoard: single gates', () => {
  for (const kind of Object.keys(MINIMUM) as OneGateKind[]) {
    for (const target of ['nor', 'nand'] as ConvertTarget[]) {
      it(`${kind} → ${target}-only keeps its table within the minimum counts, with and without complements`, () => {
        const [norOnly, norComp, nandOnly, nandComp] = MINIMUM[kind];
        // clocks have no complement pin: the "only" column; switches give `outn`: the "complements available" one
        for (const [source, limit] of [['clock', target === 'nor' ? norOnly : nandOnly], ['switch', target === 'nor' ? norComp : nandComp]] as const) {
          const board = oneGate(kind, source);
          const result = convertBoard(board, target);
          expect(result.board.parts.filter((p) => !['switch', 'clock', 'lamp'].includes(p.kind)).every((p) => p.kind === target)).toBe(true);
          expect(table(result.board, ['A', 'B'])).toEqual(table(board, ['A', 'B']));
          expect(result.gates).toBeLessThanOrEqual(limit);
        }
        // without the complement pins a switch counts as the "only" column too
        const plain = convertBoard(oneGate(kind, 'switch'), target, { complements: false });
        expect(plain.gates).toBeLessThanOrEqual(target === 'nor' ? norOnly : nandOnly);
        expect(plain.complementsUsed).toBe(0);
      });
    }
  }
});

describe('convertBoard: random circuits', () => {
  it('keeps the truth table of 40 random circuits (analysis engine)', () => {
    for (let seed = 1; seed <= 20; seed++) {
      const board = randomCircuit({ seed, inputs: 5, gates: 30, outputs: 4, kinds: ['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'buffer', 'mux2', 'mux4'] });
      for (const target of ['nor', 'nand'] as const) {
        const converted = convertBoard(board, target).board;
        expect(converted.parts.every((p) => p.kind === target || ['switch', 'lamp'].includes(p.kind))).toBe(true);
        expect(table(converted), `seed ${seed} → ${target}`).toEqual(table(board));
      }
    }
  });

  it('agrees with Icarus Verilog on the exported netlists of the converted circuits', () => {
    // Independent check: Icarus Verilog (Debian package iverilog) simulating IEEE Std 1364 structural Verilog.
    for (const seed of [3, 7, 11]) {
      const board = randomCircuit({ seed, inputs: 4, gates: 20, outputs: 3 });
      const inputs = board.parts.filter((p) => p.kind === 'switch').map((p) => p.label!);
      const outputs = board.parts.filter((p) => p.kind === 'lamp').map((p) => p.label!);
      const rows = Array.from({ length: 1 << inputs.length }, (_, r) => inputs.map((_, k) => (r >> (inputs.length - 1 - k)) & 1));
      const expected = analyzeBoard(board).rows.map((r) => r.out);
      for (const target of ['nor', 'nand'] as const) {
        const converted = convertBoard(board, target).board;
        expect(runIverilog(toVerilog(converted, compileBoard(converted)), inputs, outputs, rows)).toEqual(expected);
      }
    }
  });

  it('turns a ring of three NOTs into one inverter fed back (double inversions removed) that still oscillates', () => {
    // Ring oscillator: an odd number of inverters oscillates, an even number latches (CHECKS.md; Rabaey et
    // al., Digital Integrated Circuits — from memory). NOT(NOT(x)) = x, so three in a ring are one.
    const ring = BoardFileSchema.parse({ format: 'gatefold-board', version: 1, title: 'ring', family: 'ideal', parts: [
      { id: 'n0', kind: 'not', x: 0, y: 0 }, { id: 'n1', kind: 'not', x: 60, y: 0 }, { id: 'n2', kind: 'not', x: 120, y: 0 }, { id: 'y', kind: 'lamp', label: 'Y', x: 200, y: 0 },
    ], wires: [{ id: 'w0', from: 'n0.out', to: 'n1.in0' }, { id: 'w1', from: 'n1.out', to: 'n2.in0' }, { id: 'w2', from: 'n2.out', to: 'n0.in0' }, { id: 'w3', from: 'n2.out', to: 'y.in' }] });
    const converted = convertBoard(ring, 'nor').board;
    expect(converted.parts.filter((p) => p.kind === 'nor')).toHaveLength(1);
    expect(new Simulator(compileBoard(converted)).settle().settled).toBe(false);
  });
});

describe('convertBoard: storage and the demo', () => {
  it('turns an SR latch into a NOR latch that sets, holds and resets', () => {
    // SR NOR latch (CHECKS.md): S,R = 10 → Q = 1; 00 hold; 01 → Q = 0.
    const board = BoardFileSchema.parse({ format: 'gatefold-board', version: 1, title: 'sr', family: 'ideal', parts: [
      { id: 's', kind: 'switch', label: 'S', x: 0, y: 0 }, { id: 'r', kind: 'switch', label: 'R', x: 0, y: 60 },
      { id: 'l', kind: 'srlatch', x: 100, y: 0 }, { id: 'q', kind: 'lamp', label: 'Q', x: 200, y: 0 },
    ], wires: [{ id: 'w0', from: 's.out', to: 'l.s' }, { id: 'w1', from: 'r.out', to: 'l.r' }, { id: 'w2', from: 'l.q', to: 'q.in' }] });
    const converted = convertBoard(board, 'nor');
    expect(converted.gates).toBe(2);
    const sim = new Simulator(compileBoard(converted.board));
    sim.settle();
    const q = () => sim.outputValues().Q;
    sim.setInput('s', 1); sim.settle(); expect(q()).toBe('1');
    sim.setInput('s', 0); sim.settle(); expect(q()).toBe('1');
    sim.setInput('r', 1); sim.settle(); expect(q()).toBe('0');
    sim.setInput('r', 0); sim.settle(); expect(q()).toBe('0');
  });

  it('leaves the NOR-only logic unit at its own eight gates; NOR and NAND versions compute and store the same', () => {
    const { board } = tubeLogicUnit();
    const nor = convertBoard(board, 'nor');
    expect(nor.gates).toBe(8);
    expect(nor.inverters).toBe(0);
    expect(table(nor.board)).toEqual(table(board));
    for (const converted of [board, nor.board, convertBoard(board, 'nand').board]) {
      // the combinational outputs: N = NOR, D = AND, X = XOR of A and B (CHECKS.md: Wikipedia "Truth table")
      const result = analyzeBoard(converted, { inputs: ['A', 'B'], outputs: ['N', 'D', 'X'] });
      expect(result.rows.map((r) => r.out)).toEqual(['100', '001', '001', '010']);
      // the register: a gated latch stores X while LOAD is up and holds it after (common practice, no source);
      // its power-on state is the gate loop's, so only loaded values are compared
      const sim = new Simulator(compileBoard(converted));
      sim.settle();
      const step = (a: 0 | 1, b: 0 | 1, load: 0 | 1) => {
        sim.setInput('a', a); sim.setInput('b', b); sim.setInput('load', load); sim.settle();
        return sim.outputValues().Q;
      };
      expect([step(1, 0, 1), step(1, 0, 0), step(1, 1, 0), step(1, 1, 1), step(1, 1, 0), step(0, 1, 0)]).toEqual(['1', '1', '1', '0', '0', '0']);
    }
  });

  it('refuses a board with nothing to convert', () => {
    const board = BoardFileSchema.parse({ format: 'gatefold-board', version: 1, title: 'empty', family: 'ideal', parts: [{ id: 'a', kind: 'switch', label: 'A', x: 0, y: 0 }], wires: [] });
    expect(() => convertBoard(board, 'nor')).toThrow(BuildError);
    expect(() => convertBoard(board, 'nor')).toThrow(/nothing to convert/);
  });
});
