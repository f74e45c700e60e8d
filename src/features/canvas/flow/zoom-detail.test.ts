import { describe, expect, it } from 'vitest';
import { getViewportForBounds } from '@xyflow/react';
import { gridRect, LEAST_ZOOM, leastZoom } from './zoom-detail';

describe('leastZoom', () => {
  it('is the usual least zoom when the board fits at it', () => {
    expect(leastZoom({ width: 6480, height: 3020 }, 944, 551)).toBe(LEAST_ZOOM);
    expect(leastZoom({ width: 0, height: 0 }, 944, 551)).toBe(LEAST_ZOOM);
    expect(leastZoom({ width: 400, height: 300 }, 0, 0)).toBe(LEAST_ZOOM);
  });
  it('goes below it so that fit-to-view shows the whole of a larger board', () => {
    // the 5,000-part bench board (about 10,460 × 6,280) on a 944 × 551 canvas did not fit at 0.1
    const bounds = { x: 0, y: 0, width: 10460, height: 6280 };
    const least = leastZoom(bounds, 944, 551);
    expect(least).toBeLessThan(LEAST_ZOOM);
    // React Flow's own fit with that least zoom: every corner of the board is inside the canvas
    const v = getViewportForBounds(bounds, 944, 551, least, 1.25, 0.15);
    expect(v.zoom).toBeGreaterThanOrEqual(least);
    expect(v.x).toBeGreaterThanOrEqual(0);
    expect(v.y).toBeGreaterThanOrEqual(0);
    expect(v.x + bounds.width * v.zoom).toBeLessThanOrEqual(944);
    expect(v.y + bounds.height * v.zoom).toBeLessThanOrEqual(551);
  });
});

describe('gridRect', () => {
  const covers = (r: ReturnType<typeof gridRect>, x: number, y: number, zoom: number, w: number, h: number) =>
    r.left <= -x / zoom && r.top <= -y / zoom && r.left + r.width >= (w - x) / zoom && r.top + r.height >= (h - y) / zoom;
  it('covers the visible canvas at any pan and zoom', () => {
    for (const zoom of [0.02, 0.076, 0.1, 0.133, 0.45, 0.5, 1, 1.25, 2.9]) {
      for (const [x, y] of [[0, 0], [-51, -39.5], [123456, -98765], [-1e6, 5e5]]) {
        expect(covers(gridRect(x, y, zoom, 944, 551), x, y, zoom, 944, 551)).toBe(true);
      }
    }
  });
  it('stays the same while the view pans less than a canvas or zooms within a power of two', () => {
    const r = gridRect(-51, -39.5, 0.133, 944, 551);
    expect(gridRect(-51 - 300, -39.5 + 200, 0.133, 944, 551)).toEqual(r);
    expect(gridRect(-51, -39.5, 0.2, 944, 551)).toEqual(gridRect(-51, -39.5, 0.13, 944, 551));
    expect(Math.abs(r.left % 100)).toBe(0);
    expect(Math.abs(r.top % 100)).toBe(0);
  });
  it('is empty before the canvas has a size', () => {
    expect(gridRect(0, 0, 1, 0, 0).width).toBe(0);
  });
});
