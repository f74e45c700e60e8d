/**
 * The demo boards in examples/ are what users see first: each must be a valid file, laid out on the
 * 20-px grid left to right, and must compute what its title promises — checked with our simulator and
 * analyser against references outside the project (named beside each check).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseBoardFile } from '../../shared/board';
import type { BoardFile } from '../../shared/board';
import { canonicalBoard } from '../../shared/board';
import { compileBoard, Simulator } from '../../shared/sim';
import { analyzeBoard } from '../../shared/analysis';

const NAMES = ['half-adder', 'mux-logic-unit', 'debounced-clock', 'ripple-counter-4bit'] as const;
function load(name: string): { text: string; board: BoardFile } {
  const text = readFileSync(new URL(`../../examples/${name}.gatefold.json`, import.meta.url), 'utf8');
  const parsed = parseBoardFile(JSON.parse(text));
  if (!parsed.ok) throw new Error(parsed.problems.map((p) => p.message).join('; '));
  return { text, board: parsed.board };
}

describe('demo board files', () => {
  it.each(NAMES)('%s is valid, in export form, and on the 20-px grid', (name) => {
    const { text, board } = load(name);
    expect(JSON.stringify(canonicalBoard(board), null, 2) + '\n').toBe(text);
    for (const p of board.parts) expect([p.id, p.x % 20, p.y % 20]).toEqual([p.id, 0, 0]);
    // left to right: every wire's driver sits left of its reader, except feedback and notes
    const x = new Map(board.parts.map((p) => [p.id, p.x]));
    const forward = board.wires.filter((w) => x.get(w.from.split('.')[0])! < x.get(w.to.split('.')[0])!);
    expect(forward.length / board.wires.length).toBeGreaterThan(0.6);
  });

  it('half adder: S and C are the two bits of A + B', () => {
    // Check against integer addition A + B = 2C + S (common practice, no source).
    const result = analyzeBoard(load('half-adder').board);
    expect(result.inputs).toEqual(['A', 'B']);
    for (const row of result.rows) {
      const [a, b] = [...row.in].map(Number);
      const [s, c] = [...row.out].map(Number);
      expect(2 * c + s).toBe(a + b);
    }
    // Function names: Wikipedia "Truth table", section "Binary operations": 0110 XOR, 0001 AND.
    expect(result.outputsInfo.S.function).toBe('XOR');
    expect(result.outputsInfo.C.function).toBe('AND');
  });

  it('mux logic unit: each select code gives a different function of A and B', () => {
    // 4:1 mux Y = S1'S0'D0 + S1'S0D1 + S1S0'D2 + S1S0D3 (textbook standard); with D0..D3 = AND, OR, XOR,
    // NOT A, the function names are those of Wikipedia "Truth table", "Binary operations"
    // (0001 AND, 0111 OR, 0110 XOR, 1100 NOT_A).
    const result = analyzeBoard(load('mux-logic-unit').board, { inputs: ['S1', 'S0', 'A', 'B'], select: ['S1', 'S0'] });
    const names = Object.fromEntries(result.functionMap.map((e) => [e.select, e.functions.Y.name]));
    expect(names).toEqual({ '00': 'AND', '01': 'OR', '10': 'XOR', '11': 'NOT_A' });
  });

  it('debounced clock: each press of the changeover button gives one clean rise, and two presses count 2', () => {
    // Raj Kamal, *Digital Systems: Principles and Design*, Fig. 14.4: bounce on one contact of a
    // changeover switch leaves the cross-coupled NAND latch unchanged. The counter: rising-edge D
    // flip-flops, each Q' to its own D and clocking the next, count k mod 4 (common practice, no source).
    const netlist = compileBoard(load('debounced-clock').board);
    for (const seed of [1, 5, 42]) {
      const sim = new Simulator(netlist, { seed });
      expect(sim.settle().settled).toBe(true);
      expect(sim.outputValues()).toEqual({ RAW: '0', CLEAN: '0', C0: '0', C1: '0' });
      let raw = 0;
      let rest = 0;
      const clean: string[] = [];
      sim.onChange((_t, net, level) => {
        if (net === netlist.netOf('push', 'out')) raw++;
        if (net === netlist.netOf('push', 'outn')) rest++;
        if (net === netlist.netOf('g_q', 'out')) clean.push(level);
      });
      const counts: string[] = [];
      for (let press = 0; press < 2; press++) {
        // one person, one button: press, then release (nothing else is held)
        sim.setInput('push', 1); expect(sim.settle().settled).toBe(true);
        sim.setInput('push', 0); expect(sim.settle().settled).toBe(true);
        const out = sim.outputValues();
        counts.push(`${out.C1}${out.C0}`);
      }
      expect(raw).toBeGreaterThanOrEqual(2 * 3); // the push throw bounced on each press (≥ 3 changes)
      expect(rest).toBeGreaterThanOrEqual(2 * 3); // the rest throw bounced on each release
      expect(clean).toEqual(['1', '0', '1', '0']); // one clean rise and fall per press
      expect(counts).toEqual(['01', '10']);
    }
  });

  it('ripple counter: after k clock cycles Q3..Q0 reads k mod 16', () => {
    // CHECKS: 4-bit ripple counter of rising-edge D flip-flops, each Q' fed back to its own D and clocking
    // the next stage, all starting at 0: after k cycles Q3..Q0 = k mod 16 (common practice, no source).
    const sim = new Simulator(compileBoard(load('ripple-counter-4bit').board));
    sim.settle();
    for (let k = 1; k <= 20; k++) {
      sim.setInput('clk', 1); sim.settle();
      sim.setInput('clk', 0); sim.settle();
      const out = sim.outputValues();
      expect(Number.parseInt(`${out.Q3}${out.Q2}${out.Q1}${out.Q0}`, 2)).toBe(k % 16);
    }
  });
});
