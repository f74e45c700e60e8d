import { describe, expect, it } from 'vitest';
import { MAX_RATE, MIN_RATE } from '../../../shared/sim';
import { rateFromSlider, sliderFromRate } from './clock-controls';
import { formatNs } from './bench-panel';

describe('rate slider', () => {
  it('spans the rates on a log scale and round-trips', () => {
    expect(rateFromSlider(0)).toBe(MIN_RATE);
    expect(rateFromSlider(100)).toBe(MAX_RATE);
    // one slider step is under 10 % of the rate
    for (const hz of [0.5, 1, 10, 100]) expect(Math.abs(rateFromSlider(sliderFromRate(hz)) - hz) / hz).toBeLessThan(0.1);
  });
});

describe('formatNs', () => {
  it('says times in the unit a builder would use', () => {
    expect(formatNs(7)).toBe('7 ns');
    expect(formatNs(2500)).toBe('2.5 µs');
    expect(formatNs(5e6)).toBe('5 ms');
    expect(formatNs(1.5e9)).toBe('1.5 s');
  });
});
