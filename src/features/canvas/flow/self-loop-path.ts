/**
 * The path of a wire from a part back to one of its own pins (a gate's output fed to its own input):
 * out to the right of the output pin, over the top of the part with a clearance, down the left side
 * and into the input pin — never through the part's body, where it would be hidden.
 */
export interface Box { x: number; y: number; width: number; height: number }

const CLEAR = 16;

/** SVG path data from the source pin (sx, sy) around `box` to the target pin (tx, ty), right angles only. */
export function selfLoopPath(sx: number, sy: number, tx: number, ty: number, box: Box): string {
  const right = Math.max(sx, box.x + box.width) + CLEAR;
  const left = Math.min(tx, box.x) - CLEAR;
  const top = box.y - CLEAR;
  return `M${sx} ${sy} H${right} V${top} H${left} V${ty} H${tx}`;
}
