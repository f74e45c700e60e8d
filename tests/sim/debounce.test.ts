/**
 * Contact bounce and the changeover-switch latch debouncer. Source: Raj Kamal, *Digital Systems:
 * Principles and Design*, Fig. 14.4 — a break-before-make changeover switch with its common to ground,
 * each throw to one input of a cross-coupled NAND latch with pull-ups; bounce on one contact leaves the
 * latch unchanged. Here each throw is a push button (contact made = 1) and its pulled-up line is an
 * inverter of it (line low while the contact is made: common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { compileBoard, Simulator } from '../../shared/sim';
import { BoardBuilder } from './board-builder';

function debouncer() {
  const b = new BoardBuilder();
  b.part({ id: 'ta', kind: 'button', label: 'A', pressed: true }); // rest throw, contact made at rest
  b.part({ id: 'tb', kind: 'button', label: 'B', bounce: true }); // working throw, bounces
  b.gate('sb', 'not', ['tb.out']).gate('rb', 'not', ['ta.out']);
  b.gate('q', 'nand', ['sb.out', 'qn.out']).gate('qn', 'nand', ['rb.out', 'q.out']);
  b.lamp('lq', 'Q', 'q.out');
  return compileBoard(b.board());
}

function edges(levels: string[]): number {
  let n = 0;
  for (let i = 1; i < levels.length; i++) if (levels[i] !== levels[i - 1]) n++;
  return n;
}

describe('push-button contact bounce', () => {
  it('bounces a few times after each change, the same way for the same seed', () => {
    const run = (seed: number) => {
      const netlist = compileBoard(new BoardBuilder().part({ id: 'b', kind: 'button', label: 'B', bounce: true }).board());
      const sim = new Simulator(netlist, { seed });
      const seen: string[] = [];
      sim.onChange((t, net, level) => { if (net === netlist.netOf('b', 'out')) seen.push(`${t}:${level}`); });
      sim.setInput('b', 1); sim.settle();
      sim.setInput('b', 0); sim.settle();
      return seen;
    };
    const a = run(7);
    expect(a.length).toBeGreaterThanOrEqual(6); // each change plus ≥ 2 toggles after it
    expect(a.at(-1)?.endsWith(':0')).toBe(true);
    expect(run(7)).toEqual(a);
  });
});

describe('changeover-switch latch debouncer', () => {
  for (const seed of [1, 2, 3, 99]) {
    it(`turns a bouncing contact into one clean edge each way (seed ${seed})`, () => {
      const netlist = debouncer();
      const sim = new Simulator(netlist, { seed });
      const q: string[] = [];
      const contact: string[] = [];
      sim.settle();
      expect(sim.outputValues().Q).toBe('0');
      sim.onChange((_t, net, level) => {
        if (net === netlist.netOf('q', 'out')) q.push(level);
        if (net === netlist.netOf('tb', 'out')) contact.push(level);
      });
      // press: the rest contact breaks, then the working contact makes (and bounces)
      sim.setInput('ta', 0); expect(sim.settle().settled).toBe(true);
      sim.setInput('tb', 1); expect(sim.settle().settled).toBe(true);
      expect(sim.outputValues().Q).toBe('1');
      // release: the working contact breaks (and bounces), then the rest contact makes
      sim.setInput('tb', 0); sim.settle();
      sim.setInput('ta', 1); sim.settle();
      expect(sim.outputValues().Q).toBe('0');
      expect(edges(['0', ...contact])).toBeGreaterThanOrEqual(6);
      expect(q).toEqual(['1', '0']);
    });
  }
});
