import { describe, expect, it } from 'vitest';
import { getViewportForBounds } from '@xyflow/react';
import { readFileSync } from 'node:fs';
import { DETAIL_ZOOM, drawsFar, FAR_TITLE_MIN_PX, farTitle, gridRect, ILLEGIBLE_ZOOM, LARGE_SHEET, LEAST_ZOOM, leastZoom, zoomBand, type ZoomBand } from './zoom-detail';

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

describe('drawsFar', () => {
  const band = (zoom: number): ZoomBand => zoomBand({ transform: [0, 0, zoom] } as never);
  it('keeps the full drawing on a small board at a fitted zoom below DETAIL_ZOOM', () => {
    // the demo 1-bit processor: its top level holds 29 parts and fits to view at about 0.42
    const demo = JSON.parse(readFileSync(new URL('../../../../examples/one-bit-processor.gatefold.json', import.meta.url), 'utf8')) as { parts: unknown[] };
    expect(demo.parts.length).toBeLessThanOrEqual(LARGE_SHEET);
    expect(drawsFar(band(0.42), demo.parts.length)).toBe(false);
    expect(drawsFar(band(0.25), demo.parts.length)).toBe(false);
  });
  it('draws boxes on any board once symbols cannot be read', () => {
    expect(drawsFar(band(ILLEGIBLE_ZOOM - 0.01), 1)).toBe(true);
    expect(drawsFar(band(0.1), 120)).toBe(true);
  });
  it('draws boxes on a large board below DETAIL_ZOOM only', () => {
    expect(drawsFar(band(DETAIL_ZOOM - 0.01), LARGE_SHEET + 1)).toBe(true);
    expect(drawsFar(band(DETAIL_ZOOM - 0.01), LARGE_SHEET)).toBe(false);
    expect(drawsFar(band(DETAIL_ZOOM), 5000)).toBe(false);
    expect(drawsFar(band(1), 5000)).toBe(false);
  });
  it('gives the same band across a band, so pan frames and small zoom steps render nothing', () => {
    expect(band(0.3)).toBe(band(0.44));
    expect(band(0.05)).toBe(band(0.19));
    expect(band(0.5)).toBe(band(2));
  });
});

describe('farTitle', () => {
  it('fits the text to the box and says from which zoom it is readable', () => {
    const t = farTitle('rom', 200, 100)!;
    expect(t.size).toBe(40);
    expect(t.text).toBe('rom');
    expect(t.minZoom).toBeCloseTo(FAR_TITLE_MIN_PX / 40);
    // at that zoom the font is FAR_TITLE_MIN_PX on screen
    expect(t.size * t.minZoom).toBeCloseTo(FAR_TITLE_MIN_PX);
  });
  it('makes the font smaller for a longer text, so it fits the width', () => {
    const t = farTitle('logic unit', 200, 100)!;
    expect(t.text).toBe('logic unit');
    expect(t.size).toBeCloseTo(192 / 6);
    expect(t.text.length * t.size * 0.6).toBeLessThanOrEqual(200 - 8 + 1e-9);
  });
  it('cuts a text too long even at half the font, with an ellipsis', () => {
    const t = farTitle('a very long module title for a narrow box', 120, 60)!;
    // font 24 → at least 12 flow units, 0.6 em per character: (120 - 8) / 7.2 → 15 characters
    expect(t.size).toBe(12);
    expect(t.text).toBe('a very long mo…');
    expect(t.text.length * t.size * 0.6).toBeLessThanOrEqual(120 - 8);
  });
  it('gives nothing for an empty text or a box too small for three characters', () => {
    expect(farTitle('', 200, 100)).toBeNull();
    expect(farTitle('ABCD', 12, 20)).toBeNull();
  });
});
