import { describe, expect, it } from 'vitest';
import { Position } from '@xyflow/react';
import { pinEnd, wirePath, wireStyle } from './wire-path';

describe('pinEnd', () => {
  const node = { position: { x: 200, y: 60 }, handles: [
    { id: 'in0', type: 'target' as const, position: Position.Left, x: -4, y: 16, width: 8, height: 8 },
    { id: 'out', type: 'source' as const, position: Position.Right, x: 96, y: 26, width: 8, height: 8 },
    { id: 'clk', type: 'target' as const, position: Position.Bottom, x: 46, y: 56, width: 8, height: 8 },
  ] };
  it('is the middle of the outer side of the pin box, as React Flow ends an edge there', () => {
    expect(pinEnd(node, 'in0')).toEqual({ x: 196, y: 80, position: Position.Left });
    expect(pinEnd(node, 'out')).toEqual({ x: 304, y: 90, position: Position.Right });
    expect(pinEnd(node, 'clk')).toEqual({ x: 250, y: 124, position: Position.Bottom });
    expect(pinEnd(node, 'nope')).toBeNull();
  });
});

describe('wirePath and wireStyle', () => {
  it('draws right angles between two pins and goes around a part wired to itself', () => {
    const ends = { sourceX: 304, sourceY: 90, sourcePosition: Position.Right, targetX: 396, targetY: 120, targetPosition: Position.Left };
    expect(wirePath(ends, null)).toMatch(/^M ?304[ ,]90/);
    expect(wirePath({ ...ends, targetX: 196, targetY: 80 }, { x: 200, y: 60, width: 100, height: 60 })).toBe('M304 90 H320 V44 H180 V80 H196');
  });
  it('colours by level, mark and selection', () => {
    expect(wireStyle('1', undefined, false)).toMatchObject({ stroke: '#ffb347', strokeWidth: 2.5 });
    expect(wireStyle('Z', undefined, false).strokeDasharray).toBe('5 4');
    expect(wireStyle('0', undefined, true)).toMatchObject({ stroke: '#e6edf3', strokeWidth: 3 });
  });
});
