/**
 * Explain, step by step (shared/sim/explain.ts).
 * Reasons are checked against each gate's truth table — the Boolean definitions of AND, OR, NAND, NOR,
 * XOR (odd parity) and XNOR (even parity), common practice, no source — computed here with JavaScript's
 * integer operators; the four-valued cases follow IEEE Std 1364's gate primitives (a controlling value
 * wins over X). The final levels of an explanation are compared with the simulator's own settle.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  compileBoard, explainRow, explainRowCount, gateReason, rowInputs, Simulator, type Level,
} from '../../shared/sim';
import { BoardFileSchema } from '../../shared/board';
import { BoardBuilder } from './board-builder';

const KINDS = ['and', 'or', 'nand', 'nor', 'xor', 'xnor'] as const;
type Kind = (typeof KINDS)[number];

function reference(kind: Kind, bits: number[]): number {
  const all = bits.every((b) => b === 1);
  const any = bits.some((b) => b === 1);
  const parity = bits.reduce((a, b) => a ^ b, 0);
  switch (kind) {
    case 'and': return all ? 1 : 0;
    case 'or': return any ? 1 : 0;
    case 'nand': return all ? 0 : 1;
    case 'nor': return any ? 0 : 1;
    case 'xor': return parity;
    case 'xnor': return 1 - parity;
  }
}

function bitsOf(row: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => (row >> (n - 1 - i)) & 1);
}

describe('gate reasons against the truth tables', () => {
  for (const kind of KINDS) {
    for (const n of [2, 3]) {
      it(`${kind.toUpperCase()} with ${n} inputs: output and the fact the reason names`, () => {
        for (let row = 0; row < 2 ** n; row++) {
          const bits = bitsOf(row, n);
          const { out, reason } = gateReason(kind, bits.map((b) => String(b) as Level));
          const want = String(reference(kind, bits));
          expect(out).toBe(want);
          expect(reason.endsWith(`so the output is ${want}`)).toBe(true);
          const cited = /^input (\d) is ([01]),/.exec(reason);
          if (kind === 'xor' || kind === 'xnor') {
            const ones = bits.filter((b) => b === 1).length;
            expect(reason).toContain(ones % 2 ? 'odd' : 'even');
            expect(reason.startsWith(`${ones} input`)).toBe(true);
          } else if (cited) {
            // the cited input really has that level, and it is the controlling value of the gate
            const k = Number(cited[1]) - 1;
            expect(String(bits[k])).toBe(cited[2]);
            expect(cited[2]).toBe(kind === 'and' || kind === 'nand' ? '0' : '1');
          } else {
            // no controlling input: every input has the other value
            const other = kind === 'and' || kind === 'nand' ? 1 : 0;
            expect(bits.every((b) => b === other)).toBe(true);
            expect(reason).toMatch(new RegExp(`(both|all) inputs are ${other}`));
          }
        }
      });
    }
  }

  it('names the examples in plain words', () => {
    expect(gateReason('nor', ['0', '1', '0']).reason).toBe('input 2 is 1, so the output is 0');
    expect(gateReason('and', ['1', '1', '1']).reason).toBe('all inputs are 1, so the output is 1');
    expect(gateReason('nand', ['1', '0']).reason).toBe('input 2 is 0, so the output is 1');
    expect(gateReason('xor', ['1', '1', '1']).reason).toBe('3 inputs are 1 (an odd number), so the output is 1');
  });

  it('four-valued cases: a controlling value wins over X (IEEE Std 1364 gate primitives), otherwise X', () => {
    expect(gateReason('and', ['X', '0'])).toEqual({ out: '0', reason: 'input 2 is 0, so the output is 0' });
    expect(gateReason('or', ['Z', '1']).out).toBe('1');
    expect(gateReason('and', ['1', 'X'])).toEqual({ out: 'X', reason: 'no input is 0 and input 2 is unknown (X), so the output is X' });
    expect(gateReason('nor', ['Z', '0']).out).toBe('X');
    expect(gateReason('xor', ['1', 'X'])).toEqual({ out: 'X', reason: 'input 2 is unknown (X), so the output is X' });
    expect(gateReason('not', ['X']).out).toBe('X');
  });
});

function settled(board: Parameters<typeof compileBoard>[0], row: number): Map<string, Level> {
  const netlist = compileBoard(board);
  const sim = new Simulator(netlist);
  for (const [id, v] of Object.entries(rowInputs(netlist, row))) sim.setInput(id, v);
  sim.settle();
  return sim.levels();
}

describe('explainRow', () => {
  it('a two-level circuit: steps in time order, each gate step agrees with its truth table, final levels = the settle', () => {
    const b = new BoardBuilder();
    b.switch('a').switch('b').switch('c');
    b.gate('g1', 'nand', ['a.out', 'b.out']).gate('g2', 'nor', ['g1.out', 'c.out']).gate('g3', 'xor', ['g2.out', 'a.out']);
    b.lamp('y', 'Y', 'g3.out');
    const board = b.board();
    const netlist = compileBoard(board);
    expect(explainRowCount(netlist)).toBe(8);
    for (let row = 0; row < 8; row++) {
      const ex = explainRow(board, row);
      expect(ex.settled).toBe(true);
      expect(ex.levels).toEqual(settled(board, row));
      const times = ex.steps.map((s) => s.time);
      expect([...times].sort((x, y) => x - y)).toEqual(times);
      const [a, bb, c] = bitsOf(row, 3);
      const g1 = reference('nand', [a, bb]);
      const g2 = reference('nor', [g1, c]);
      const g3 = reference('xor', [g2, a]);
      const last = (id: string) => ex.steps.filter((s) => s.partId === id).at(-1)!;
      expect(last('g1').to).toBe(String(g1));
      expect(last('g2').to).toBe(String(g2));
      expect(last('g3').to).toBe(String(g3));
      expect(last('g2').reason.startsWith('NOR g2: ')).toBe(true);
      for (const s of ex.steps.filter((x) => x.cause === 'input')) expect(s.partId).toMatch(/^[abc]$/);
    }
  });

  it('the mux logic unit: every row, the mux step passes the selected function', () => {
    const board = BoardFileSchema.parse(JSON.parse(readFileSync('examples/mux-logic-unit.gatefold.json', 'utf8')));
    const netlist = compileBoard(board);
    const n = explainRowCount(netlist);
    expect(n).toBe(16);
    for (let row = 0; row < n; row++) {
      const ex = explainRow(netlist, row);
      expect(ex.levels).toEqual(settled(board, row));
      const ins = ex.inputs;
      const a = Number(ins.a); const bv = Number(ins.b);
      const sel = Number(ins.s1) * 2 + Number(ins.s0);
      // the note on the board: 00 A AND B, 01 A OR B, 10 A XOR B, 11 NOT A
      const y = [a & bv, a | bv, a ^ bv, 1 - a][sel];
      const mux = ex.steps.filter((s) => s.partId === 'mux').at(-1)!;
      expect(mux.to).toBe(String(y));
      expect(mux.reason).toContain(`select S1 S0 is ${ins.s1}${ins.s0}, so the output passes d${sel}, which is ${y}`);
    }
  });

  it('a latch of two NOR gates: power-on gives the loop a level, set and reset are explained', () => {
    const b = new BoardBuilder();
    b.switch('s').switch('r');
    b.part({ id: 'n1', kind: 'nor', inputs: 2 }).part({ id: 'n2', kind: 'nor', inputs: 2 });
    b.wire('r.out', 'n1.in0').wire('n2.out', 'n1.in1').wire('s.out', 'n2.in0').wire('n1.out', 'n2.in1');
    b.lamp('q', 'Q', 'n1.out');
    const board = b.board();
    const hold = explainRow(board, 0); // S = 0, R = 0
    expect(hold.steps.some((s) => s.cause === 'power-on')).toBe(true);
    expect(hold.levels).toEqual(settled(board, 0));
    const set = explainRow(board, 2); // S = 1, R = 0
    expect(set.levels.get('q.in')).toBe('1');
    expect(set.steps.find((s) => s.partId === 'n2')!.reason).toBe('NOR n2: input 1 is 1, so the output is 0');
    expect(set.levels).toEqual(settled(board, 2));
  });

  it('built-in storage: a D flip-flop clocked by a switch and an SR latch', () => {
    const b = new BoardBuilder();
    b.switch('d').switch('c');
    b.part({ id: 'ff', kind: 'dff' }).wire('d.out', 'ff.d').wire('c.out', 'ff.clk');
    b.part({ id: 'sr', kind: 'srlatch' }).wire('d.out', 'sr.s').wire('c.out', 'sr.r');
    b.lamp('q', 'Q', 'ff.q');
    const board = b.board();
    const ex = explainRow(board, 3); // D = 1, clock switch 0 → 1
    const q = ex.steps.find((s) => s.partId === 'ff' && s.pin === 'q')!;
    expect(q.reason).toBe('D flip-flop ff: rising clock edge with D = 1, so Q becomes 1');
    const srq = ex.steps.find((s) => s.partId === 'sr' && s.pin === 'q');
    // S = 1 and R = 1 together: both outputs 0 (not allowed); Q starts at 0, Q' changes
    expect(srq).toBeUndefined();
    expect(ex.steps.find((s) => s.partId === 'sr' && s.pin === 'qn')!.reason).toContain('not allowed');
    const set = explainRow(board, 2); // D = 1, clock stays 0
    expect(set.steps.find((s) => s.partId === 'sr' && s.pin === 'q')!.reason).toBe('SR latch sr: S is 1 and R is 0: set, so Q is 1');
    expect(set.steps.some((s) => s.partId === 'ff')).toBe(false);
    expect(ex.levels).toEqual(settled(board, 3));
  });
});
