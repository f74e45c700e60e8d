import { describe, expect, it } from 'vitest';
import type { PartNode } from './types';
import { mapViewBox, partsBounds } from './parts-map';

const node = (id: string, x: number, y: number, w: number, h: number): PartNode =>
  ({ id, type: 'part', position: { x, y }, width: w, height: h, data: {} as PartNode['data'] }) as PartNode;

describe('partsBounds', () => {
  it('is the rectangle around every box', () => {
    expect(partsBounds([node('a', -40, 10, 100, 50), node('b', 500, 300, 60, 40)])).toEqual({ x: -40, y: 10, width: 600, height: 330 });
    expect(partsBounds([])).toBeNull();
  });
});

describe('mapViewBox', () => {
  it('holds both the parts and the view, with the map aspect', () => {
    const parts = { x: 0, y: 0, width: 1000, height: 200 };
    const view = { x: 800, y: -300, width: 400, height: 300 };
    const box = mapViewBox(parts, view, 160, 110);
    expect(box.x).toBeLessThanOrEqual(0);
    expect(box.y).toBeLessThanOrEqual(-300);
    expect(box.x + box.width).toBeGreaterThanOrEqual(1200);
    expect(box.y + box.height).toBeGreaterThanOrEqual(200);
    expect(box.width / box.height).toBeCloseTo(160 / 110);
  });
  it('falls back to the view when there are no parts', () => {
    const view = { x: 0, y: 0, width: 160, height: 110 };
    const box = mapViewBox(null, view, 160, 110, 0);
    expect(box).toEqual(view);
  });
});
