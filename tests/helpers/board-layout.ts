/**
 * Layout checks of a drawn circuit (the top level of a board or the inside of one of its modules): parts
 * whose boxes overlap (labels counted above the box), and wires whose drawn route runs through the box
 * of a part that is neither of its ends. Boxes and routes are the canvas's own (shared/render).
 */
import { modulePinTable, splitPinRef, type BoardFile, type Part } from '../../shared/board';
import { placedShape } from '../../shared/render/geometry';
import { wireRoute } from '../../shared/render/board-svg';

const LABEL_ROOM = 16;

export interface LayoutReport {
  overlaps: Array<[string, string]>;
  /** wire id → the parts its route crosses */
  crossings: Array<{ wire: string; part: string }>;
}

/** Overlapping parts and wires crossing boxes in one circuit of `board` (`parts`/`wires` of the top level or a module). */
export function layoutReport(board: BoardFile, circuit: { parts: Part[]; wires: Array<{ id: string; from: string; to: string }> }): LayoutReport {
  const pins = modulePinTable(board.modules ?? []);
  const box = new Map(circuit.parts.map((p) => {
    const s = placedShape(p, pins);
    const top = p.y - ('label' in p && p.label && p.kind !== 'port' ? LABEL_ROOM : 0);
    return [p.id, { x0: p.x, y0: top, x1: p.x + s.w, y1: p.y + s.h, pins: new Map(s.pins.map((q) => [q.pin, { x: p.x + q.x, y: p.y + q.y, side: q.side }])) }];
  }));
  const overlaps: Array<[string, string]> = [];
  const ids = [...box.keys()];
  for (let i = 0; i < ids.length; i++) {
    for (let j = i + 1; j < ids.length; j++) {
      const a = box.get(ids[i])!;
      const b = box.get(ids[j])!;
      if (a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1) overlaps.push([ids[i], ids[j]]);
    }
  }
  const crossings: Array<{ wire: string; part: string }> = [];
  for (const w of circuit.wires) {
    const f = splitPinRef(w.from);
    const t = splitPinRef(w.to);
    if (!f || !t) continue;
    const a = box.get(f.part)?.pins.get(f.pin);
    const b = box.get(t.part)?.pins.get(t.pin);
    if (!a || !b) continue;
    const route = wireRoute(a, b);
    for (const [id, bx] of box) {
      if (id === f.part || id === t.part) continue;
      for (let k = 0; k + 1 < route.length; k++) {
        const p = route[k];
        const q = route[k + 1];
        const [sx0, sx1] = [Math.min(p.x, q.x), Math.max(p.x, q.x)];
        const [sy0, sy1] = [Math.min(p.y, q.y), Math.max(p.y, q.y)];
        // strictly inside the box (a wire along an edge does not cross it)
        if (sx0 < bx.x1 && sx1 > bx.x0 && sy0 < bx.y1 && sy1 > bx.y0 && (sx0 !== sx1 ? sy0 > bx.y0 && sy0 < bx.y1 : sx0 > bx.x0 && sx0 < bx.x1)) {
          crossings.push({ wire: w.id, part: id });
          break;
        }
      }
    }
  }
  return { overlaps, crossings };
}
