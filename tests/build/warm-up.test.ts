/**
 * Heater warm-up: until a tube conducts its plate sits at the supply, so every tube gate's output is high
 * and indicators light at switch-on, then go out as the logic takes over (CHECKS.md indicator stage,
 * common practice, no source). Checked in the Simulator and in what the timing strip records.
 */
import { describe, expect, it } from 'vitest';
import { compileBoard, LiveEngine, Simulator, type LiveUpdate, type Timers } from '../../shared/sim';
import { tubeLogicUnit } from './boards';

// time only paces a running clock, which these tests never start
const timers: Timers = { now: () => 0, setTimeout: () => 0, clearTimeout: () => undefined };

describe('warm-up', () => {
  it('holds every gate output high until the heaters warm, then the logic takes over', () => {
    const { board } = tubeLogicUnit();
    const sim = new Simulator(compileBoard(board), { warmUp: 1000 });
    sim.settle();
    // cold: N, D, X and Q all lit although A = B = 0 makes D and X low
    expect(sim.outputValues()).toEqual({ N: '1', D: '1', X: '1', Q: '1' });
    expect(sim.warmUntil).toBeGreaterThanOrEqual(1000);
    sim.runFor(sim.warmUntil - sim.time + 200);
    sim.settle();
    // warm: N = NOR(0, 0) = 1, D = 0, X = 0; the register's latch settles instead of racing
    expect(sim.outputValues()).toMatchObject({ N: '1', D: '0', X: '0' });
    expect(['0', '1']).toContain(sim.outputValues().Q);
    expect(sim.settle().settled).toBe(true);
  });

  it('is off by default and after a reset without it', () => {
    const sim = new Simulator(compileBoard(tubeLogicUnit().board));
    sim.settle();
    expect(sim.outputValues()).toMatchObject({ N: '1', D: '0', X: '0' });
    sim.resetState({ warmUp: 500 });
    sim.settle();
    expect(sim.outputValues().D).toBe('1');
    sim.runFor(sim.warmUntil - sim.time + 200);
    sim.resetState();
    sim.settle();
    expect(sim.outputValues().D).toBe('0');
  });

  it('shows in the timing strip: D recorded high at power-on and low after the warm-up', () => {
    const posts: LiveUpdate[] = [];
    const engine = new LiveEngine((m) => posts.push(m), timers);
    const { board } = tubeLogicUnit();
    engine.handle({ type: 'load', board, tryOut: [] });
    engine.handle({ type: 'subscribe', signals: ['D'] });
    engine.handle({ type: 'warm-up', units: 5000 });
    const trace = posts.flatMap((m) => (m.type === 'state' ? m.trace : []));
    // [signal index, time, level code] triples for D: high (cold) then low after ≥ 5000 units
    const changes: [number, number][] = [];
    for (let i = 0; i < trace.length; i += 3) changes.push([trace[i + 1], trace[i + 2]]);
    const high = changes.find(([, code]) => code === 1);
    const lowAfter = changes.find(([t, code]) => code === 0 && high !== undefined && t >= high[0] + 5000);
    expect(high).toBeDefined();
    expect(lowAfter).toBeDefined();
    engine.dispose();
  });
});
