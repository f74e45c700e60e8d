import { describe, expect, it } from 'vitest';
import { PART_KINDS, pinsOf } from '../../../../shared/board';
import { placedShape, rotatePoint, rotateSide, shapeOf, snap, type Rotation } from './geometry';

describe('shapeOf', () => {
  it('has a spot for every pin of every kind (names exactly as pinsOf), on the box edge', () => {
    for (const kind of PART_KINDS) {
      for (const n of kind === 'and' ? [2, 3, 8] : [2]) {
        const shape = shapeOf(kind, n);
        const pins = pinsOf(kind, n);
        expect(shape.pins.map((p) => p.pin).sort()).toEqual([...pins.inputs, ...pins.outputs].sort());
        for (const spot of shape.pins) {
          expect(spot.output).toBe(pins.outputs.includes(spot.pin));
          const onEdge = spot.x === 0 || spot.x === shape.w || spot.y === 0 || spot.y === shape.h;
          expect(onEdge, `${kind}.${spot.pin}`).toBe(true);
        }
      }
    }
  });

  it('puts gate inputs on the 20 px grid so parts on the grid get straight wires', () => {
    const shape = shapeOf('nand', 4);
    expect(shape.pins.filter((p) => !p.output).map((p) => p.y)).toEqual([20, 40, 60, 80]);
    expect(shape.h).toBe(100);
  });
});

describe('rotation', () => {
  // Turning a box clockwise: its left side faces up (common practice, no source).
  it('turns sides clockwise', () => {
    expect(rotateSide('left', 90)).toBe('top');
    expect(rotateSide('top', 90)).toBe('right');
    expect(rotateSide('right', 180)).toBe('left');
    expect(rotateSide('bottom', 270)).toBe('right');
  });

  it('maps the corners of a w×h box onto the turned box', () => {
    expect(rotatePoint(0, 0, 100, 60, 90)).toEqual({ x: 60, y: 0 });
    expect(rotatePoint(100, 60, 100, 60, 90)).toEqual({ x: 0, y: 100 });
    expect(rotatePoint(100, 30, 100, 60, 180)).toEqual({ x: 0, y: 30 });
    expect(rotatePoint(0, 30, 100, 60, 270)).toEqual({ x: 30, y: 100 });
  });

  it('comes back to the start after four quarter turns', () => {
    let p = { x: 13, y: 7 };
    let [w, h] = [100, 60];
    for (let i = 0; i < 4; i++) {
      p = rotatePoint(p.x, p.y, w, h, 90);
      [w, h] = [h, w];
    }
    expect(p).toEqual({ x: 13, y: 7 });
  });

  it('swaps the box of a part turned by 90 or 270 and moves its pins with it', () => {
    for (const rotation of [0, 90, 180, 270] as Rotation[]) {
      const s = placedShape({ id: 'g', kind: 'and', inputs: 2, x: 0, y: 0, rotation });
      expect([s.w, s.h]).toEqual(rotation % 180 ? [60, 100] : [100, 60]);
      const out = s.pins.find((p) => p.pin === 'out')!;
      expect(out.side).toBe(rotateSide('right', rotation));
    }
  });
});

describe('snap', () => {
  it('rounds to the nearest grid point', () => {
    expect([snap(9), snap(10), snap(29), snap(-11)]).toEqual([0, 20, 20, -20]);
  });
});
