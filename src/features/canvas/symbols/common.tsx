/** Pieces shared by the part symbols: pin stubs coloured by level, and the props every symbol takes. */
import type { Level } from '../../../../shared/sim';
import type { Part } from '../../../../shared/board';
import { INK, levelColor } from '../lib/colors';

export interface SymbolProps<P extends Part = Part> {
  part: P;
  /** unrotated box */
  w: number;
  h: number;
  /** level of a pin, when the bench simulates */
  level: (pin: string) => Level | undefined;
}

export const strokeProps = { stroke: INK.stroke, strokeWidth: 2, fill: INK.fill, strokeLinejoin: 'round' as const };

/** A straight pin stub, coloured by the pin's level (dashed when undriven). */
export function Stub({ x1, y1, x2, y2, level }: { x1: number; y1: number; x2: number; y2: number; level: Level | undefined }) {
  return (
    <line x1={x1} y1={y1} x2={x2} y2={y2} stroke={levelColor(level)} strokeWidth={2}
      strokeDasharray={level === 'Z' ? '3 3' : undefined} strokeLinecap="round" />
  );
}

/** The inversion bubble of IEEE Std 91 (a small circle on a pin). */
export function Bubble({ cx, cy, r = 4 }: { cx: number; cy: number; r?: number }) {
  return <circle cx={cx} cy={cy} r={r} {...strokeProps} strokeWidth={1.8} />;
}

export const monoFont = '"JetBrains Mono", ui-monospace, monospace';
