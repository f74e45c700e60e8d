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

  it('with powerOn: \'x\' a ring of plain inverters powers on at X and stays X (IEEE Std 1364 semantics)', () => {
    for (const n of [2, 3, 4, 5]) {
      const sim = new Simulator(compileBoard(inverterRing(n).board()), { powerOn: 'x' });
      const r = sim.settle();
      expect(r.settled).toBe(true);
      expect(r.powerOn).toEqual([]);
      expect(sim.outputValues().Y).toBe('X');
    }
  });
});

/** Rising edges of Y in a plain inverter ring from power-on (default powerOn: 'resolve'). */
function plainRing(n: number, family: FamilyId, run: number) {
  const netlist = compileBoard(inverterRing(n, new BoardBuilder(family)).board());
  const sim = new Simulator(netlist, { eventBudget: 2000 });
  const y = netlist.netOf(`i${n - 1}`, 'out');
  const rises: number[] = [];
  sim.onChange((t, id, level) => { if (id === y && level === '1') rises.push(t); });
  const report = sim.settle();
  sim.runFor(run);
  // the first rise follows the power-on choice, not a whole lap of the ring
  return { sim, netlist, report, periods: rises.slice(2).map((t, i) => t - rises[i + 1]) };
}

describe('ring of plain inverters (no enable gate) from power-on', () => {
  for (const n of [3, 5]) {
    it(`${n} inverters: power-on picks a level, the ring oscillates with period 2·N·t_pd = ${2 * n}`, () => {
      const { netlist, report, periods: p } = plainRing(n, 'ideal', 300);
      expect(report.powerOn).toEqual(['i0_out']); // the first part listed is the one that powers on low
      expect(report.settled).toBe(false);
      const ringNets = Array.from({ length: n }, (_, i) => netlist.nets[netlist.netOf(`i${i}`, 'out')].name);
      expect([...report.oscillating].sort()).toEqual([...ringNets].sort());
      expect(p.length).toBeGreaterThan(10);
      expect(new Set(p)).toEqual(new Set([2 * n]));
    });

    it(`${n} inverters with unequal delays (74LS): period N·(t_PLH + t_PHL)`, () => {
      const d = familyDelays('ttl-74ls');
      const { report, periods: p } = plainRing(n, 'ttl-74ls', 3000);
      expect(report.settled).toBe(false);
      expect(p.length).toBeGreaterThan(5);
      expect(new Set(p)).toEqual(new Set([n * (d.rise + d.fall)]));
    });
  }

  for (const n of [2, 4]) {
    it(`${n} inverters settle to alternating 0/1 (the first listed low)`, () => {
      const { sim, report, periods: p } = plainRing(n, 'ideal', 100);
      expect(report.settled).toBe(true);
      expect(report.oscillating).toEqual([]);
      expect(report.powerOn).toEqual(['i0_out']);
      expect(p).toEqual([]);
      expect(Array.from({ length: n }, (_, i) => sim.pinLevel(`i${i}`, 'out')).join('')).toBe('01'.repeat(n / 2));
    });
  }
});
