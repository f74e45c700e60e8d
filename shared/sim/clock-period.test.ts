import { describe, expect, it } from 'vitest';
import { BoardFileSchema } from '../board';
import { clockHalfPeriod, DEFAULT_CLOCK_PERIOD_GATE_DELAYS } from './clock-period';
import { compileBoard } from './compile';
import { halfPeriod } from './live';
import { Simulator } from './simulator';

const board = (period?: number) => BoardFileSchema.parse({
  format: 'gatefold-board', version: 1, title: 'Clock', family: 'ttl-74ls',
  parts: [{ id: 'ck', kind: 'clock', label: 'CK', ...(period ? { period } : {}) }, { id: 'n', kind: 'not' }, { id: 'y', kind: 'lamp', label: 'Y' }],
  wires: [{ id: 'w1', from: 'ck.out', to: 'n.in0' }, { id: 'w2', from: 'n.out', to: 'y.in' }],
});

describe('clockHalfPeriod', () => {
  it('halves the given period, else the default number of slowest gate delays, never below 1', () => {
    expect(clockHalfPeriod(20, 10)).toBe(10);
    expect(clockHalfPeriod(undefined, 10)).toBe((DEFAULT_CLOCK_PERIOD_GATE_DELAYS * 10) / 2);
    expect(clockHalfPeriod(1, 1)).toBe(1);
    expect(clockHalfPeriod(undefined, 0)).toBe(DEFAULT_CLOCK_PERIOD_GATE_DELAYS / 2);
  });

  it('is the half period of the live engine and of the Simulator’s own clocks', () => {
    for (const period of [undefined, 20, 7]) {
      const netlist = compileBoard(board(period));
      // TTL 74LS: the slowest delay is 10 ns (tPHL) in 1 ns units (shared/sim/families.ts)
      const half = clockHalfPeriod(period, 10);
      expect(halfPeriod(netlist)).toBe(half);
      const sim = new Simulator(netlist);
      sim.settle();
      const toggles: number[] = [];
      sim.onChange((t, net) => { if (net === netlist.netOf('ck', 'out')) toggles.push(t); });
      sim.runFor(4 * half);
      expect(toggles.length).toBeGreaterThanOrEqual(4);
      expect(new Set(toggles.slice(1).map((t, i) => t - toggles[i]))).toEqual(new Set([half]));
    }
  });
});
