/**
 * Flattened semantics: a board with modules and the same board drawn flat are the same circuit — equal
 * truth tables (analyze) and equal `simulate --clock` traces — for hand-made boards and for random
 * module splits of random circuits (fast-check).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { flattenBoard, flattenWithPins, type BoardFile } from '../../shared/board';
import { analyzeBoard } from '../../shared/analysis';
import { compileBoard } from '../../shared/sim';
import { simulate } from '../../server/cli/commands/simulate';
import { randomCircuit } from '../helpers/random-circuit';
import { randomSequentialCircuit, splitIntoModules } from '../helpers/module-split';
import { fullAdderFlat, fullAdderOfModules } from './boards';

const dir = mkdtempSync(join(tmpdir(), 'gatefold-modules-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Runs the real `simulate` command in this process and returns its JSON. */
function simulateJson(board: BoardFile, args: string[]): { trace: { cycle: number; outputs: Record<string, string> }[]; outputs: Record<string, string> } {
  const file = join(dir, `b${Math.random().toString(36).slice(2)}.gatefold.json`);
  writeFileSync(file, JSON.stringify(board));
  let out = '';
  void simulate.run([file, ...args], { stdout: (t) => { out += typeof t === 'string' ? t : [...t].join(''); }, writeFile: () => undefined });
  return JSON.parse(out) as ReturnType<typeof simulateJson>;
}

describe('flattenBoard', () => {
  it('names inner parts by path and keeps no ports or instances', () => {
    const flat = flattenBoard(fullAdderOfModules());
    expect(flat.modules).toBeUndefined();
    expect(flat.parts.map((p) => p.id)).toEqual(['a', 'b', 'cin', 'u1/g1', 'u1/g2', 'u2/g1', 'u2/g2', 'g1', 's', 'co']);
    const net = compileBoard(fullAdderOfModules());
    // the sum of the first half adder drives the second: one net joins u1/g1.out and u2/g1.in0
    expect(net.netOf('u1/g1', 'out')).toBe(net.netOf('u2/g1', 'in0'));
    expect(net.nets[net.netOf('u1/g1', 'out')].name).toBe('u1/g1_out');
  });

  it('tells where each instance pin went', () => {
    const board = fullAdderOfModules();
    const { junctions } = flattenWithPins(board);
    const net = compileBoard(board);
    const netOfRef = (ref: string | null | undefined) => { const [part, pin] = ref!.split('.'); return net.netOf(part, pin); };
    expect(netOfRef(junctions.get('u1.A'))).toBe(net.netOf('a', 'out'));
    expect(netOfRef(junctions.get('u1/a.out'))).toBe(net.netOf('a', 'out'));
    expect(netOfRef(junctions.get('u2.S'))).toBe(net.netOf('u2/g1', 'out'));
    expect(netOfRef(junctions.get('u1.C'))).toBe(net.netOf('g1', 'in0'));
  });

  it('leaves a board without modules as it is', () => {
    const board = randomCircuit({ seed: 3 });
    expect(flattenBoard(board)).toBe(board);
  });

  it('gives the full adder of half adders the textbook full-adder table, equal to the flat drawing', () => {
    // full adder: S = A ⊕ B ⊕ CIN, COUT = majority(A, B, CIN) (any digital-design textbook, e.g. M. Morris
    // Mano, Digital Design, the full adder of two half adders and an OR gate; from memory)
    const expected = Array.from({ length: 8 }, (_, n) => {
      const [a, b, c] = [(n >> 2) & 1, (n >> 1) & 1, n & 1];
      return { in: `${a}${b}${c}`, out: `${a ^ b ^ c}${a + b + c >= 2 ? 1 : 0}` };
    });
    const modular = analyzeBoard(fullAdderOfModules());
    expect(modular.rows).toEqual(expected);
    expect(analyzeBoard(fullAdderFlat()).rows).toEqual(modular.rows);
  });
});

describe('random module splits', () => {
  it('make modules, nested ones among them', () => {
    const split = splitIntoModules(randomCircuit({ seed: 7, gates: 30 }), 5, 6);
    expect(split.modules!.length).toBeGreaterThanOrEqual(3);
    expect(split.modules!.some((m) => m.parts.some((p) => p.kind === 'module'))).toBe(true);
  });

  it('keep the truth table of random circuits', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 1, max: 4 }), (seed, splitSeed, splits) => {
      const flat = randomCircuit({ seed, inputs: 4, gates: 24, outputs: 3, kinds: ['and', 'or', 'nand', 'nor', 'xor', 'not', 'mux2'] });
      const split = splitIntoModules(flat, splitSeed, splits);
      expect(analyzeBoard(split).rows).toEqual(analyzeBoard(flat).rows);
    }), { numRuns: 40 });
  });

  it('keep the simulate --clock trace of random circuits with flip-flops', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 1, max: 1_000_000 }), (seed, splitSeed) => {
      const flat = randomSequentialCircuit({ seed, inputs: 3, gates: 20, outputs: 3, flipFlops: 3 });
      const split = splitIntoModules(flat, splitSeed, 3);
      const args = ['--clock', 'CLK', '--cycles', '6', '--set', 'I0=1,I2=1'];
      expect(simulateJson(split, args).trace).toEqual(simulateJson(flat, args).trace);
    }), { numRuns: 25 });
  });
});
