/**
 * Box selection (Shift-drag) while the parts are drawn as plain boxes. React Flow draws the selection
 * rectangle but skips hidden nodes when it picks what is inside, and zoomed out every part is a hidden
 * node (flow/far-canvas.tsx). So, while the far drawing is on, the canvas watches the rectangle in React
 * Flow's store and selects the boxes itself, with React Flow's own rule for the detailed canvas
 * (SelectionMode.Full, its default: a part is picked when its whole box is inside the rectangle) and the
 * wires touching a picked part, as React Flow picks them. The selection goes to the nodes' `selected`
 * like any other, so the awareness selection and the commands see it unchanged.
 */
import { useEffect } from 'react';
import { useStoreApi, type ReactFlowState } from '@xyflow/react';
import type { PartNode } from './types';

export interface ScreenRect { x: number; y: number; width: number; height: number }

/** Ids of the parts whose whole box lies in `rect` (pane pixels) for the view `transform` ([x, y, zoom]). */
export function partsInside(nodes: readonly PartNode[], rect: ScreenRect, transform: readonly [number, number, number]): Set<string> {
  const [tx, ty, zoom] = transform;
  const left = (rect.x - tx) / zoom;
  const top = (rect.y - ty) / zoom;
  const right = left + rect.width / zoom;
  const bottom = top + rect.height / zoom;
  const inside = new Set<string>();
  for (const n of nodes) {
    if (n.selectable === false) continue;
    const w = n.width ?? n.measured?.width ?? 0;
    const h = n.height ?? n.measured?.height ?? 0;
    const { x, y } = n.position;
    if (x >= left && y >= top && x + w <= right && y + h <= bottom) inside.add(n.id);
  }
  return inside;
}

function sameSet(a: Set<string>, b: Set<string>): boolean {
  if (a.size !== b.size) return false;
  for (const v of a) if (!b.has(v)) return false;
  return true;
}

/**
 * While `active`, selects the parts inside React Flow's selection rectangle as it changes (`select` gets
 * the whole new set, which replaces the selection, as React Flow's own rectangle does). One store
 * subscription, which only compares the rectangle object on other store changes (pan frames).
 */
export function useFarBoxSelect(active: boolean, nodes: () => readonly PartNode[], select: (ids: Set<string>) => void): void {
  const store = useStoreApi();
  useEffect(() => {
    if (!active) return undefined;
    let lastRect: ReactFlowState['userSelectionRect'] = null;
    let lastSet = new Set<string>();
    return store.subscribe((s) => {
      const rect = s.userSelectionRect;
      if (rect === lastRect) return;
      lastRect = rect;
      if (!rect || !s.userSelectionActive) { lastSet = new Set(); return; }
      const inside = partsInside(nodes(), rect, s.transform);
      if (sameSet(inside, lastSet)) return;
      lastSet = inside;
      select(inside);
    });
  }, [active, nodes, select, store]);
}
