import { describe, expect, it } from 'vitest';
import { MIN_SPAN, pan, placed, tickStep, timeAtX, xAtTime, zoom } from './viewport';

describe('viewport', () => {
  const v = { start: 100, span: 200, follow: false };
  it('zooms around the anchor, keeping the time under it fixed', () => {
    const z = zoom(v, 0.5, 0.25);
    expect(z.span).toBe(100);
    expect(timeAtX(z, 25, 100)).toBeCloseTo(timeAtX(v, 25, 100));
    expect(zoom(v, 1e-9).span).toBe(MIN_SPAN);
  });
  it('never pans before time 0 and stops following when moved', () => {
    expect(pan({ ...v, follow: true }, -500)).toEqual({ start: 0, span: 200, follow: false });
  });
  it('slides a following window to the newest time', () => {
    expect(placed({ start: 0, span: 200, follow: true }, 1000).start).toBe(800);
    expect(placed(v, 1000)).toBe(v);
  });
  it('maps time and pixels both ways', () => {
    expect(xAtTime(v, 150, 400)).toBe(100);
    expect(timeAtX(v, 100, 400)).toBe(150);
  });
  it('picks 1-2-5 tick steps at least the given pixels apart (common practice for chart axes, no source)', () => {
    expect(tickStep(1000, 700, 70)).toBe(100);
    expect(tickStep(1000, 500, 70)).toBe(200);
    expect(tickStep(3000, 500, 70)).toBe(500);
  });
});
