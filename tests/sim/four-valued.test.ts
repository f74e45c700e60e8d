/**
 * The four-valued tables of the gate evaluators, written out literally from IEEE Std 1364 (gate and
 * switch primitives, the and/or/xor truth tables with 0, 1, x, z — from memory), and a property test:
 * a settled combinational circuit matches a direct Boolean evaluation (common practice, no source) and
 * does not depend on the gate delays.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { codeLevel, compileBoard, levelCode, Simulator, type Level } from '../../shared/sim';
import { evalGate, evalNot, evalBuffer } from '../../shared/sim/parts/gates';
import { evalMux2 } from '../../shared/sim/parts/mux';
import { randomCircuit } from '../helpers/random-circuit';

const V: Level[] = ['0', '1', 'X', 'Z'];
// rows: first input 0 1 X Z, columns: second input 0 1 X Z (IEEE Std 1364 primitive tables, from memory)
const TABLES: Record<'and' | 'or' | 'xor', string[]> = {
  and: ['0000', '01XX', '0XXX', '0XXX'],
  or: ['01XX', '1111', 'X1XX', 'X1XX'],
  xor: ['01XX', '10XX', 'XXXX', 'XXXX'],
};

function gate2(kind: 'and' | 'or' | 'xor' | 'nand' | 'nor' | 'xnor', a: Level, b: Level): Level {
  return codeLevel(evalGate(kind, Uint8Array.of(levelCode(a), levelCode(b)), 2));
}

describe('four-valued gate tables', () => {
  for (const kind of ['and', 'or', 'xor'] as const) {
    it(`${kind} and its complement follow the IEEE Std 1364 table`, () => {
      const inverse = { and: 'nand', or: 'nor', xor: 'xnor' } as const;
      const not = (l: string) => (l === '0' ? '1' : l === '1' ? '0' : 'X');
      V.forEach((a, i) => V.forEach((b, j) => {
        expect(gate2(kind, a, b), `${a} ${kind} ${b}`).toBe(TABLES[kind][i][j]);
        expect(gate2(inverse[kind], a, b), `${a} ${inverse[kind]} ${b}`).toBe(not(TABLES[kind][i][j]));
      }));
    });
  }

  it('not and buf turn X and Z into X', () => {
    expect(V.map((v) => codeLevel(evalNot(levelCode(v))))).toEqual(['1', '0', 'X', 'X']);
    expect(V.map((v) => codeLevel(evalBuffer(levelCode(v))))).toEqual(['0', '1', 'X', 'X']);
  });

  it('a controlling value wins in any position of an 8-input gate', () => {
    for (let pos = 0; pos < 8; pos++) {
      const inp = new Uint8Array(8).fill(levelCode('X'));
      inp[pos] = levelCode('0');
      expect(codeLevel(evalGate('and', inp, 8))).toBe('0');
      inp[pos] = levelCode('1');
      expect(codeLevel(evalGate('or', inp, 8))).toBe('1');
    }
  });

  it('mux2 with an X or Z select gives the data only when both data agree', () => {
    const m = (s: Level, d0: Level, d1: Level) => codeLevel(evalMux2(Uint8Array.of(levelCode(s), levelCode(d0), levelCode(d1))));
    expect(m('X', '1', '1')).toBe('1');
    expect(m('Z', '0', '0')).toBe('0');
    expect(m('X', '0', '1')).toBe('X');
    expect(m('0', 'Z', '1')).toBe('X');
    expect(m('1', 'Z', '1')).toBe('1');
  });
});

/** Direct recursive Boolean evaluation of a random board (no events, no delays). */
function direct(board: ReturnType<typeof randomCircuit>, inputs: number[]): Record<string, string> {
  const src = new Map(board.wires.map((w) => [w.to, w.from]));
  const part = new Map(board.parts.map((p) => [p.id, p]));
  const memo = new Map<string, number>();
  const value = (ref: string): number => {
    const id = ref.slice(0, ref.lastIndexOf('.'));
    if (memo.has(id)) return memo.get(id)!;
    const p = part.get(id)!;
    const inp = (pin: string) => value(src.get(`${id}.${pin}`)!);
    const ins = 'inputs' in p ? Array.from({ length: p.inputs }, (_, k) => inp(`in${k}`)) : [];
    let v: number;
    switch (p.kind) {
      case 'switch': v = inputs[Number(id.slice(1))]; break;
      case 'not': v = 1 - inp('in0'); break;
      case 'buffer': v = inp('in0'); break;
      case 'and': v = ins.every(Boolean) ? 1 : 0; break;
      case 'nand': v = ins.every(Boolean) ? 0 : 1; break;
      case 'or': v = ins.some(Boolean) ? 1 : 0; break;
      case 'nor': v = ins.some(Boolean) ? 0 : 1; break;
      case 'xor': v = ins.reduce((a, b) => a ^ b, 0); break;
      case 'xnor': v = 1 - ins.reduce((a, b) => a ^ b, 0); break;
      case 'mux2': v = inp('sel') ? inp('d1') : inp('d0'); break;
      default: throw new Error(p.kind);
    }
    memo.set(id, v);
    return v;
  };
  const out: Record<string, string> = {};
  for (const p of board.parts) if (p.kind === 'lamp') out[p.label!] = String(value(src.get(`${p.id}.in`)!));
  return out;
}

describe('random combinational circuits (fast-check)', () => {
  it('settle to the direct Boolean evaluation, whatever the family delays', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.array(fc.integer({ min: 0, max: 1 }), { minLength: 5, maxLength: 5 }), (seed, bits) => {
      const board = randomCircuit({ seed, inputs: 5, gates: 60, outputs: 6, kinds: ['and', 'or', 'nand', 'nor', 'xor', 'xnor', 'not', 'buffer', 'mux2'] });
      const expected = direct(board, bits);
      for (const family of ['ideal', 'ttl-74ls', 'relay'] as const) {
        const sim = new Simulator(compileBoard(board, { family }));
        bits.forEach((b, i) => sim.setInput(`i${i}`, b as 0 | 1));
        if (!sim.settle().settled) return false;
        expect(sim.outputValues(), `${family}, seed ${seed}`).toEqual(expected);
      }
      return true;
    }), { numRuns: 60, seed: 7 });
  });
});
