import { describe, expect, it } from 'vitest';
import { ClockDriver, MAX_RATE, MIN_RATE, type Timers } from './clock-driver';

function fakeTimers() {
  let now = 0;
  const queue: (() => void)[] = [];
  const timers: Timers = { now: () => now, setTimeout: (fn) => queue.push(fn), clearTimeout: () => queue.splice(0) };
  const advance = (ms: number) => {
    now += ms;
    queue.splice(0).forEach((fn) => fn());
  };
  return { timers, advance };
}

describe('ClockDriver', () => {
  it('asks for the half-cycles wall time says are due at the rate', () => {
    const { timers, advance } = fakeTimers();
    const asked: number[] = [];
    const clock = new ClockDriver((n) => asked.push(n), timers);
    clock.setRate(4);
    clock.run();
    advance(250); // a quarter second at 4 Hz: one full cycle = two half-cycles
    advance(125);
    expect(asked).toEqual([2, 1]);
    clock.pause();
    advance(1000);
    expect(asked).toEqual([2, 1]);
  });
  it('counts rising edges and clamps the rate', () => {
    const clock = new ClockDriver(() => {}, fakeTimers().timers);
    clock.toggle();
    clock.toggle();
    clock.toggle();
    expect([clock.phase, clock.cycles]).toEqual([true, 2]);
    clock.restart();
    expect([clock.phase, clock.cycles]).toEqual([false, 0]);
    clock.setRate(1e9);
    expect(clock.rate).toBe(MAX_RATE);
    clock.setRate(0);
    expect(clock.rate).toBe(MIN_RATE);
  });
});
