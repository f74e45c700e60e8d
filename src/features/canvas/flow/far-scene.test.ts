import { describe, expect, it } from 'vitest';
import { getSmoothStepPath, Position } from '@xyflow/react';
import type { Part } from '../../../../shared/board';
import { MARK_COLORS } from '../../../../shared/render';
import { SIGNAL } from '../lib/colors';
import type { PartNode } from './types';
import {
  boxStyle, coversView, straightRoute, farRegion, farWireStroke, hitPart, packBoxes, sceneBounds, selectionSummary, viewRect, WHOLE_BOARD_MAX_PX,
} from './far-scene';

const node = (id: string, x: number, y: number, w: number, h: number, part: Partial<Part> = {}, extra: Partial<PartNode> = {}): PartNode =>
  ({ id, type: 'part', position: { x, y }, width: w, height: h, data: { part: { id, kind: 'nand', ...part }, levels: '', highlight: false }, ...extra }) as unknown as PartNode;

describe('hitPart', () => {
  // b overlaps a's right half; c far away
  const boxes = packBoxes([node('a', 0, 0, 100, 50), node('b', 60, 10, 100, 50), node('c', 1000, 1000, 10, 10)]);
  it('picks the topmost box (the last drawn) under the point', () => {
    expect(hitPart(boxes, 10, 10)).toBe(0);
    expect(hitPart(boxes, 80, 20)).toBe(1);
    expect(hitPart(boxes, 1005, 1005)).toBe(2);
  });
  it('counts the edges of a box as inside', () => {
    expect(hitPart(boxes, 0, 0)).toBe(0);
    expect(hitPart(boxes, 1010, 1010)).toBe(2);
  });
  it('takes the nearest box within the slop, and nothing beyond it', () => {
    expect(hitPart(boxes, 1013, 1004)).toBe(-1);
    expect(hitPart(boxes, 1013, 1004, 4)).toBe(2);
    // 3 units right of c and 6 left of a point between: the nearer wins
    expect(hitPart(packBoxes([node('p', 0, 0, 10, 10), node('q', 19, 0, 10, 10)]), 13, 5, 8)).toBe(0);
    expect(hitPart(packBoxes([node('p', 0, 0, 10, 10), node('q', 19, 0, 10, 10)]), 16, 5, 8)).toBe(1);
  });
  it('finds nothing on an empty board', () => {
    expect(hitPart(new Float64Array(0), 0, 0, 100)).toBe(-1);
  });
});

describe('farRegion and coversView', () => {
  const boxes = packBoxes([node('a', 0, 0, 100, 50), node('b', 9900, 4950, 100, 50)]);
  const bounds = sceneBounds(boxes, 10)!;
  it('bounds every box with the padding', () => {
    expect(bounds).toEqual({ x: -10, y: -10, width: 10020, height: 5020 });
    expect(sceneBounds(new Float64Array(0), 10)).toBeNull();
  });
  it('covers the whole board while it fits in the pixel budget, so no pan repaints', () => {
    const scale = Math.sqrt(WHOLE_BOARD_MAX_PX / (bounds.width * bounds.height)) * 0.99;
    const view = viewRect(0, 0, scale, 800, 600);
    const region = farRegion(bounds, view, scale);
    expect(region).toEqual(bounds);
    // panned anywhere, the whole board is still painted
    expect(coversView(region, bounds, viewRect(-3000 * scale, -2000 * scale, scale, 800, 600))).toBe(true);
  });
  it('past the budget, covers the view grown by half on each side, cut to the board; a pan out of it needs a repaint', () => {
    const zoom = 0.4;
    const view = viewRect(-2000 * zoom, -1000 * zoom, zoom, 800, 600); // flow 2000, 1000, 2000 × 1500
    expect(view).toEqual({ x: 2000, y: 1000, width: 2000, height: 1500 });
    const region = farRegion(bounds, view, zoom)!;
    expect(region).toEqual({ x: 1000, y: 250, width: 4000, height: 3000 });
    expect(coversView(region, bounds, view)).toBe(true);
    // half a view to the right: still inside; a whole view: not
    expect(coversView(region, bounds, viewRect(-3000 * zoom, -1000 * zoom, zoom, 800, 600))).toBe(true);
    expect(coversView(region, bounds, viewRect(-4000 * zoom, -1000 * zoom, zoom, 800, 600))).toBe(false);
    // a view wholly off the board needs nothing
    expect(coversView(region, bounds, viewRect(-20000 * zoom, 0, zoom, 800, 600))).toBe(true);
    // nothing painted yet: any view over the board needs a paint
    expect(coversView(null, bounds, view)).toBe(false);
  });
  it('cuts the grown view at the board edge', () => {
    const zoom = 0.4;
    const region = farRegion(bounds, viewRect(0, 0, zoom, 800, 600), zoom)!;
    expect(region.x).toBe(-10);
    expect(region.y).toBe(-10);
    expect(region.width).toBe(3010);
  });
});

describe('boxStyle', () => {
  it('outlines a plain part in the dim ink, a lamp and a probe round', () => {
    expect(boxStyle(node('g', 0, 0, 60, 40))).toMatchObject({ stroke: '#8b95a3', width: 1.5, round: false, alpha: 1 });
    expect(boxStyle(node('l', 0, 0, 60, 40, { kind: 'lamp' })).round).toBe(true);
    expect(boxStyle(node('p', 0, 0, 60, 40, { kind: 'probe' })).round).toBe(true);
  });
  it('fills a lamp whose input is high in the high colour', () => {
    const lit = node('l', 0, 0, 60, 40, { kind: 'lamp' });
    lit.data.levels = '1';
    expect(boxStyle(lit).fill).toMatch(/^rgba\(255, 179, 71/);
    expect(boxStyle(node('l', 0, 0, 60, 40, { kind: 'lamp' })).fill).toBe('#1a2028');
  });
  it('shows the selection above a compare mark, a mark above a highlight, a highlight above a collaborator', () => {
    const n = node('g', 0, 0, 60, 40, {}, { selected: true });
    n.data.mark = 'removed';
    n.data.highlight = true;
    n.data.remoteColor = '#123456';
    expect(boxStyle(n).stroke).toBe('#ffd08a');
    n.selected = false;
    expect(boxStyle(n)).toMatchObject({ stroke: MARK_COLORS.removed, alpha: 0.55 });
    n.data.mark = undefined;
    expect(boxStyle(n).stroke).toBe('#4cc9f0');
    n.data.highlight = false;
    expect(boxStyle(n).stroke).toBe('#123456');
  });
});

describe('farWireStroke', () => {
  it('colours by level and keeps a wire at least a pixel wide when zoomed out', () => {
    expect(farWireStroke('1', undefined, false, 0.1)).toEqual({ color: SIGNAL.high, width: 1.5, dash: [] });
    expect(farWireStroke('0', undefined, false, 0.1)).toEqual({ color: SIGNAL.low, width: 1, dash: [] });
    expect(farWireStroke(undefined, undefined, false, 0.1).color).toBe(SIGNAL.none);
    expect(farWireStroke('X', undefined, false, 0.1).color).toBe(SIGNAL.x);
  });
  it('dashes an undriven wire and a removed one; a selected wire is light', () => {
    expect(farWireStroke('Z', undefined, false, 0.3).dash).toEqual([4, 3]);
    expect(farWireStroke(undefined, 'removed', false, 0.3)).toMatchObject({ color: MARK_COLORS.removed, dash: [4, 3] });
    expect(farWireStroke('1', undefined, true, 0.3).color).toBe('#e6edf3');
  });
  it('scales with the zoom once the flow width is wider than the least', () => {
    expect(farWireStroke('0', undefined, false, 0.44).width).toBe(1);
    expect(farWireStroke('1', undefined, false, 0.8).width).toBeCloseTo(2);
    expect(farWireStroke(undefined, 'added', false, 0.44).width).toBeCloseTo(3.5 * 0.44);
  });
});

describe('selectionSummary', () => {
  it('says when nothing is selected', () => {
    expect(selectionSummary([node('a', 0, 0, 1, 1)])).toBe('No part selected');
  });
  it('names the selected parts by label, else by the given names, else kind and id', () => {
    const nodes = [node('s', 0, 0, 1, 1, { kind: 'switch', label: 'A' }, { selected: true }), node('g', 0, 0, 1, 1, {}, { selected: true }), node('h', 0, 0, 1, 1)];
    expect(selectionSummary(nodes)).toBe('2 parts selected: A, nand g');
    expect(selectionSummary(nodes, (n) => (n.id === 'g' ? 'NAND 1' : n.data.part.label))).toBe('2 parts selected: A, NAND 1');
  });
  it('names the first twelve and counts the rest', () => {
    const nodes = Array.from({ length: 15 }, (_, i) => node(`p${i}`, 0, 0, 1, 1, { label: `P${i}` }, { selected: true }));
    expect(selectionSummary(nodes)).toBe('15 parts selected: P0, P1, P2, P3, P4, P5, P6, P7, P8, P9, P10, P11 and 3 more');
  });
});

describe('straightRoute', () => {
  /** The x, y pairs written in an SVG path (React Flow writes corners as quadratic curves around each corner point). */
  const pairs = (d: string) => [...d.matchAll(/(-?[\d.]+)[ ,](-?[\d.]+)/g)].map((m) => `${Number(m[1])},${Number(m[2])}`);
  const smooth = (sx: number, sy: number, tx: number, ty: number) =>
    getSmoothStepPath({ sourceX: sx, sourceY: sy, sourcePosition: Position.Right, targetX: tx, targetY: ty, targetPosition: Position.Left, borderRadius: 4, offset: 12 })[0];

  it('turns where React Flow\'s smooth step turns: halfway across, at the source and target heights', () => {
    for (const [sx, sy, tx, ty] of [[100, 40, 300, 160], [0, 0, 140, -60], [80, 30, 108, 31]]) {
      const route = straightRoute(sx, sy, 'right', tx, ty, 'left')!;
      expect(route).toEqual([sx, sy, (sx + tx) / 2, sy, (sx + tx) / 2, ty, tx, ty]);
      const drawn = pairs(smooth(sx, sy, tx, ty));
      // both ends, and both corners (the control point of each rounded corner)
      for (let k = 0; k < route.length; k += 2) expect(drawn).toContain(`${route[k]},${route[k + 1]}`);
    }
  });
  it('is one straight line when both ends are level', () => {
    expect(straightRoute(0, 50, 'right', 200, 50, 'left')).toEqual([0, 50, 200, 50]);
  });
  it('leaves every other wire to the full path: backwards, too short for the two steps, other sides', () => {
    expect(straightRoute(300, 0, 'right', 100, 50, 'left')).toBeNull();
    expect(straightRoute(100, 0, 'right', 124, 50, 'left')).toBeNull();
    expect(straightRoute(0, 0, 'bottom', 200, 50, 'left')).toBeNull();
    expect(straightRoute(0, 0, 'right', 200, 50, 'top')).toBeNull();
  });
});
