/**
 * Size of each part and where its pins sit, in unrotated part coordinates (inputs on the left, outputs
 * on the right, select lines at the bottom), then rotated. Pin offsets are multiples of the 20 px grid
 * wherever the shape allows, so that parts placed on the grid give straight wires. The canvas and the
 * board picture (board-svg.ts) both draw from here.
 */
import { pinsOf, pinsOfPart, type ModulePins, type PartKind, type PinSet } from '../board';
import type { Part } from '../board';

export const GRID = 20;

export type Side = 'left' | 'right' | 'top' | 'bottom';
export type Rotation = 0 | 90 | 180 | 270;

export interface PinSpot {
  pin: string;
  /** true for pins the part drives */
  output: boolean;
  x: number;
  y: number;
  side: Side;
}

export interface PartShape {
  /** unrotated box */
  w: number;
  h: number;
  pins: PinSpot[];
}

function column(names: string[], x: number, side: Side, output: boolean, top = GRID, step = GRID): PinSpot[] {
  return names.map((pin, i) => ({ pin, output, x, y: top + i * step, side }));
}

/** Unrotated shape of a part of `kind` with `inputs` gate inputs. */
export function shapeOf(kind: PartKind, inputs = 2): PartShape {
  const p = pinsOf(kind, inputs);
  switch (kind) {
    case 'switch':
      return { w: 80, h: 60, pins: column(p.outputs, 80, 'right', true) };
    case 'button':
      // pressing moves the common down from the normally-closed throw (outn, upper) to the open one (out)
      return { w: 80, h: 60, pins: [{ pin: 'outn', output: true, x: 80, y: 20, side: 'right' }, { pin: 'out', output: true, x: 80, y: 40, side: 'right' }] };
    case 'clock':
      return { w: 80, h: 40, pins: column(p.outputs, 80, 'right', true) };
    case 'const':
      return { w: 60, h: 40, pins: column(p.outputs, 60, 'right', true) };
    case 'lamp':
      return { w: 60, h: 40, pins: column(p.inputs, 0, 'left', false) };
    case 'probe':
      return { w: 80, h: 40, pins: column(p.inputs, 0, 'left', false) };
    case 'buffer':
    case 'not':
      return { w: 100, h: 40, pins: [...column(p.inputs, 0, 'left', false), ...column(p.outputs, 100, 'right', true)] };
    case 'and':
    case 'or':
    case 'nand':
    case 'nor':
    case 'xor':
    case 'xnor': {
      const h = (inputs + 1) * GRID;
      return { w: 100, h, pins: [...column(p.inputs, 0, 'left', false), { pin: 'out', output: true, x: 100, y: h / 2, side: 'right' }] };
    }
    case 'srlatch':
    case 'dlatch':
    case 'dff':
      return { w: 100, h: 80, pins: [...column(p.inputs, 0, 'left', false, 20, 40), ...column(p.outputs, 100, 'right', true, 20, 40)] };
    case 'mux2':
      return {
        w: 100, h: 100,
        pins: [{ pin: 'sel', output: false, x: 40, y: 100, side: 'bottom' },
          ...column(['d0', 'd1'], 0, 'left', false, 20, 40), { pin: 'out', output: true, x: 100, y: 40, side: 'right' }],
      };
    case 'mux4':
      return {
        w: 100, h: 120,
        pins: [{ pin: 'sel0', output: false, x: 60, y: 120, side: 'bottom' }, { pin: 'sel1', output: false, x: 40, y: 120, side: 'bottom' },
          ...column(['d0', 'd1', 'd2', 'd3'], 0, 'left', false), { pin: 'out', output: true, x: 100, y: 60, side: 'right' }],
      };
    case 'note':
      return { w: 160, h: 60, pins: [] };
    case 'port': // a port `in` (placedShape reads `dir`): a tag that drives the module's inside
      return { w: 80, h: 40, pins: column(p.outputs, 80, 'right', true) };
    case 'module': // an instance without its module's pins (placedShape gives them)
      return instanceShape(p);
    default: {
      const never: never = kind;
      throw new Error(`unknown part kind ${String(never)}`);
    }
  }
}

const SIDES_CW: Side[] = ['left', 'top', 'right', 'bottom'];

/** The side a pin faces after turning the part clockwise by `rotation`. */
export function rotateSide(side: Side, rotation: Rotation): Side {
  return SIDES_CW[(SIDES_CW.indexOf(side) + rotation / 90) % 4];
}

/** A point of a w×h box after turning the box clockwise by `rotation` (the box keeps its top-left corner). */
export function rotatePoint(x: number, y: number, w: number, h: number, rotation: Rotation): { x: number; y: number } {
  switch (rotation) {
    case 0: return { x, y };
    case 90: return { x: h - y, y: x };
    case 180: return { x: w - x, y: h - y };
    case 270: return { x: y, y: w - x };
    default: {
      const never: never = rotation;
      throw new Error(`bad rotation ${String(never)}`);
    }
  }
}

/** SVG transform that draws unrotated content turned by `rotation` inside the rotated box. */
export function rotationTransform(w: number, h: number, rotation: Rotation): string | undefined {
  switch (rotation) {
    case 0: return undefined;
    case 90: return `translate(${h} 0) rotate(90)`;
    case 180: return `translate(${w} ${h}) rotate(180)`;
    case 270: return `translate(0 ${w}) rotate(270)`;
    default: {
      const never: never = rotation;
      throw new Error(`bad rotation ${String(never)}`);
    }
  }
}

/**
 * An instance of a module: a box with a title band, its inputs down the left and its outputs down the
 * right, one grid step apart (docs/decisions/004-modules.md).
 */
export function instanceShape(pins: PinSet): PartShape {
  const rows = Math.max(1, pins.inputs.length, pins.outputs.length);
  return {
    w: 140, h: 2 * GRID + rows * GRID,
    pins: [...column(pins.inputs, 0, 'left', false, 2 * GRID), ...column(pins.outputs, 140, 'right', true, 2 * GRID)],
  };
}

function baseShape(part: Part, modules?: ModulePins): PartShape {
  switch (part.kind) {
    case 'note': return noteShape(part.text);
    case 'port': return part.dir === 'out' ? { w: 80, h: 40, pins: column(['in'], 0, 'left', false) } : shapeOf('port');
    case 'module': return instanceShape(pinsOfPart(part, modules));
    default: return shapeOf(part.kind, 'inputs' in part ? part.inputs : 2);
  }
}

/**
 * Shape of a placed part with its rotation applied: the box and the pins as they sit on the canvas.
 * An instance needs `modules` (its module's pins) to show its pins.
 */
export function placedShape(part: Part, modules?: ModulePins): PartShape & { rotation: Rotation; baseW: number; baseH: number } {
  const base = baseShape(part, modules);
  const rotation = (part.rotation ?? 0) as Rotation;
  const turned = rotation === 90 || rotation === 270;
  return {
    w: turned ? base.h : base.w,
    h: turned ? base.w : base.h,
    baseW: base.w,
    baseH: base.h,
    rotation,
    pins: base.pins.map((spot) => ({ ...spot, ...rotatePoint(spot.x, spot.y, base.w, base.h, rotation), side: rotateSide(spot.side, rotation) })),
  };
}

/** A note grows with its text (11 px mono, ~7 px a character, 15 px a line), on the 20 px grid. */
export function noteShape(text: string): PartShape {
  const lines = (text || ' ').split('\n');
  const longest = Math.max(...lines.map((l) => l.length));
  const w = Math.min(320, Math.max(160, Math.ceil((longest * 6.7 + 18) / GRID) * GRID));
  const perLine = Math.max(1, Math.floor((w - 18) / 6.7));
  const rows = lines.reduce((n, l) => n + Math.max(1, Math.ceil(l.length / perLine)), 0);
  const h = Math.max(60, Math.ceil((rows * 15 + 14) / GRID) * GRID);
  return { w, h, pins: [] };
}

/** Nearest grid point (the canvas snaps to a 20 px grid). */
export function snap(v: number): number {
  return Math.round(v / GRID) * GRID;
}
