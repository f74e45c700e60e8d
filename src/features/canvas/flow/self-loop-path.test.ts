import { describe, expect, it } from 'vitest';
import { selfLoopPath } from './self-loop-path';

describe('selfLoopPath', () => {
  it('goes around the part, clear of its box on every side it passes', () => {
    // a NOT gate 100 × 40 at (200, 100): output pin at its right edge, input pin at its left edge
    const box = { x: 200, y: 100, width: 100, height: 40 };
    const d = selfLoopPath(300, 120, 200, 120, box);
    expect(d).toBe('M300 120 H316 V84 H184 V120 H200');
    // every horizontal run above the box, every vertical run beside it
    const nums = d.match(/-?\d+/g)!.map(Number);
    expect(nums[2]).toBeGreaterThan(box.x + box.width);
    expect(nums[3]).toBeLessThan(box.y);
    expect(nums[4]).toBeLessThan(box.x);
  });
});
