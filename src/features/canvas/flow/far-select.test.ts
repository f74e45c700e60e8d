import { describe, expect, it } from 'vitest';
import type { PartNode } from './types';
import { partsInside } from './far-select';

const node = (id: string, x: number, y: number, w: number, h: number): PartNode =>
  ({ id, type: 'part', position: { x, y }, width: w, height: h, data: {} as PartNode['data'] }) as PartNode;

describe('partsInside', () => {
  const nodes = [node('a', 0, 0, 100, 50), node('b', 200, 0, 100, 50), node('c', 1000, 1000, 60, 40)];
  it('picks the parts whose whole box is inside the rectangle (pane pixels → flow units)', () => {
    // view at zoom 0.25 translated by (10, 20): the pane rectangle (10, 20)–(70, 40) is flow (0, 0)–(240, 80)
    expect([...partsInside(nodes, { x: 10, y: 20, width: 60, height: 20 }, [10, 20, 0.25])]).toEqual(['a']);
    // widened to flow x 320: b too
    expect([...partsInside(nodes, { x: 10, y: 20, width: 80, height: 20 }, [10, 20, 0.25])].sort()).toEqual(['a', 'b']);
  });
  it('leaves out a part the rectangle only crosses, as React Flow does by default', () => {
    expect(partsInside(nodes, { x: 10, y: 20, width: 12, height: 20 }, [10, 20, 0.25]).size).toBe(0);
  });
  it('leaves out parts that cannot be selected', () => {
    const locked = { ...node('d', 0, 0, 10, 10), selectable: false };
    expect(partsInside([locked], { x: 0, y: 0, width: 100, height: 100 }, [0, 0, 1]).size).toBe(0);
  });
});
