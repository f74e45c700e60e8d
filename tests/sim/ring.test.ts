/**
 * Ring oscillators. Source: Rabaey et al., *Digital Integrated Circuits*, 2nd ed., 2003 — from memory:
 * N (odd) inverting stages oscillate with period T = 2·N·t_pd, or N·(t_PLH + t_PHL) with unequal
 * delays; an even N settles (latches) instead.
 */
import { describe, expect, it } from 'vitest';
import type { FamilyId } from '../../shared/board';
import { compileBoard, familyDelays, Simulator } from '../../shared/sim';
import { BoardBuilder } from './board-builder';
import { inverterRing, ringOscillator } from './circuits';

/** Periods between successive rising edges of the ring's last net over a run. */
function periods(n: number, family: FamilyId, run: number): { report: ReturnType<Simulator['settle']>; periods: number[] } {
  const netlist = compileBoard(ringOscillator(n, new BoardBuilder(family)).board());
  const sim = new Simulator(netlist, { eventBudget: 2000 });
  sim.settle(); // EN = 0: the ring rests
  const net = netlist.netOf(`r${n - 1}`, 'out');
  const rises: number[] = [];
  sim.onChange((t, id, level) => { if (id === net && level === '1') rises.push(t); });
  sim.setInput('en', 1);
  const report = sim.settle();
  sim.runFor(run);
  return { report, periods: rises.slice(1).map((t, i) => t - rises[i]) };
}

describe('ring oscillator', () => {
  for (const n of [3, 5]) {
    it(`${n} stages oscillate, reported with the ring's nets named, period 2·N·t_pd = ${2 * n}`, () => {
      const { report, periods: p } = periods(n, 'ideal', 200);
      expect(report.settled).toBe(false);
      expect(report.oscillating).toContain('Y');
      expect(report.oscillating).toHaveLength(n);
      expect(p.length).toBeGreaterThan(5);
      expect(new Set(p)).toEqual(new Set([2 * n]));
    });

    it(`${n} stages with unequal delays (74LS) oscillate with period N·(t_PLH + t_PHL)`, () => {
      const d = familyDelays('ttl-74ls');
      expect(d.rise).not.toBe(d.fall);
      const { periods: p } = periods(n, 'ttl-74ls', 2000);
      expect(new Set(p)).toEqual(new Set([n * (d.rise + d.fall)]));
    });
  }

  for (const n of [2, 4]) {
    it(`${n} stages settle (latch) once enabled`, () => {
      const netlist = compileBoard(ringOscillator(n).board());
      const sim = new Simulator(netlist, { eventBudget: 2000 });
      sim.settle();
      sim.setInput('en', 1);
      const r = sim.settle();
      expect(r.settled).toBe(true);
      expect(r.oscillating).toEqual([]);
      expect(['0', '1']).toContain(sim.outputValues().Y);
    });
  }

  it('a ring of plain inverters powers on at X and stays X (nothing breaks the symmetry; see decision 002)', () => {
    for (const n of [2, 3, 4, 5]) {
      const sim = new Simulator(compileBoard(inverterRing(n).board()));
      expect(sim.settle().settled).toBe(true);
      expect(sim.outputValues().Y).toBe('X');
    }
  });
});
