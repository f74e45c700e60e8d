/** Gatefold's own signal colours (PRODUCT.md "Look"). */
import type { Level } from '../../../../shared/sim';

export const SIGNAL = {
  high: '#ffb347',
  low: '#5b7a99',
  x: '#e040a0',
  z: '#8a8f98',
  /** a wire or pin with no level information */
  none: '#7d8590',
} as const;

export const INK = {
  /** outline of a symbol */
  stroke: '#c7ced8',
  /** body fill of a symbol */
  fill: '#1a2028',
  /** text on the canvas */
  text: '#d5dbe3',
  dim: '#8b95a3',
  grid: '#2a323d',
  /** the canvas background under the grid */
  canvas: '#0f1318',
} as const;

/** Colour of a signal level; undefined level means "not simulated". */
export function levelColor(level: Level | undefined): string {
  switch (level) {
    case undefined: return SIGNAL.none;
    case '1': return SIGNAL.high;
    case '0': return SIGNAL.low;
    case 'X': return SIGNAL.x;
    case 'Z': return SIGNAL.z;
    default: {
      const never: never = level;
      throw new Error(`bad level ${String(never)}`);
    }
  }
}

/** Presence colours for collaborators (chosen away from the signal colours). */
