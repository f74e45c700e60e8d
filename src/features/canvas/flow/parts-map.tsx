/**
 * The canvas's minimap, drawn from the part list itself. React Flow's own minimap leaves out hidden
 * nodes, and zoomed out every part is one (flow/far-canvas.tsx), so it went blank exactly when an overview
 * helps most. This one draws a box per part from the nodes the canvas holds, whichever drawing is on.
 *
 * The boxes are one memoised group (drawn again only when the parts change); a pan or zoom frame changes
 * the view box and the view's outline only. A press or drag on the map centres the view there (same zoom);
 * the wheel over it zooms the view.
 */
import { memo, useCallback, useMemo, useRef, type PointerEvent, type WheelEvent } from 'react';
import { Panel, useReactFlow, useStore, type ReactFlowState } from '@xyflow/react';
import type { PartNode } from './types';

export interface PartsMapProps {
  nodes: readonly PartNode[];
  width: number;
  height: number;
}

interface Rect { x: number; y: number; width: number; height: number }

/** The rectangle around the parts' boxes (null when there are none). */
export function partsBounds(nodes: readonly PartNode[]): Rect | null {
  if (nodes.length === 0) return null;
  let x0 = Infinity; let y0 = Infinity; let x1 = -Infinity; let y1 = -Infinity;
  for (const n of nodes) {
    const w = n.width ?? n.measured?.width ?? 0;
    const h = n.height ?? n.measured?.height ?? 0;
    x0 = Math.min(x0, n.position.x); y0 = Math.min(y0, n.position.y);
    x1 = Math.max(x1, n.position.x + w); y1 = Math.max(y1, n.position.y + h);
  }
  return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
}

/**
 * The minimap's view box (flow units) for the parts' `bounds` and the view `view`, on a map of
 * `w` × `h` px: both rectangles, centred, the map's aspect kept, with at least `margin` map pixels around.
 */
export function mapViewBox(bounds: Rect | null, view: Rect, w: number, h: number, margin = 5): Rect {
  const b = bounds ?? view;
  const x0 = Math.min(b.x, view.x); const y0 = Math.min(b.y, view.y);
  const x1 = Math.max(b.x + b.width, view.x + view.width); const y1 = Math.max(b.y + b.height, view.y + view.height);
  const scale = Math.max((x1 - x0) / Math.max(1, w - 2 * margin), (y1 - y0) / Math.max(1, h - 2 * margin)) || 1;
  const vw = scale * w; const vh = scale * h;
  return { x: x0 - (vw - (x1 - x0)) / 2, y: y0 - (vh - (y1 - y0)) / 2, width: vw, height: vh };
}

const transformOf = (s: ReactFlowState) => s.transform;
const paneW = (s: ReactFlowState) => s.width;
const paneH = (s: ReactFlowState) => s.height;

function PartsMapView({ nodes, width, height }: PartsMapProps) {
  const rf = useReactFlow();
  const [tx, ty, zoom] = useStore(transformOf);
  const w = useStore(paneW);
  const h = useStore(paneH);
  const bounds = useMemo(() => partsBounds(nodes), [nodes]);
  const view = { x: -tx / zoom, y: -ty / zoom, width: w / zoom, height: h / zoom };
  const box = mapViewBox(bounds, view, width, height);
  const svg = useRef<SVGSVGElement>(null);
  const pressed = useRef(false);

  const toFlow = useCallback((e: { clientX: number; clientY: number }) => {
    const r = svg.current!.getBoundingClientRect();
    return { x: box.x + ((e.clientX - r.left) / r.width) * box.width, y: box.y + ((e.clientY - r.top) / r.height) * box.height };
  }, [box.x, box.y, box.width, box.height]);
  const centre = useCallback((e: PointerEvent<SVGSVGElement>) => {
    const p = toFlow(e);
    void rf.setCenter(p.x, p.y, { zoom: rf.getZoom() });
  }, [rf, toFlow]);
  const onPointerDown = (e: PointerEvent<SVGSVGElement>) => {
    if (e.button !== 0) return;
    pressed.current = true;
    e.currentTarget.setPointerCapture?.(e.pointerId);
    centre(e);
  };
  const onPointerMove = (e: PointerEvent<SVGSVGElement>) => { if (pressed.current) centre(e); };
  const onPointerUp = () => { pressed.current = false; };
  const onWheel = (e: WheelEvent<SVGSVGElement>) => { void (e.deltaY < 0 ? rf.zoomIn() : rf.zoomOut()); };

  const m = box.width / width;
  return (
    <Panel position="bottom-right" className="react-flow__minimap gf-parts-map" data-testid="parts-map" style={{ width, height }}>
      <svg ref={svg} width={width} height={height} viewBox={`${box.x} ${box.y} ${box.width} ${box.height}`} role="img" aria-label="Minimap"
        style={{ background: '#12161c', display: 'block', cursor: 'pointer' }}
        onPointerDown={onPointerDown} onPointerMove={onPointerMove} onPointerUp={onPointerUp} onPointerCancel={onPointerUp} onWheel={onWheel}>
        <MapBoxes nodes={nodes} />
        <path d={`M${box.x - m},${box.y - m}h${box.width + 2 * m}v${box.height + 2 * m}h${-box.width - 2 * m}z M${view.x},${view.y}h${view.width}v${view.height}h${-view.width}z`}
          fill="rgba(13,16,20,0.7)" fillRule="evenodd" pointerEvents="none" />
      </svg>
    </Panel>
  );
}

/** The parts' boxes, one group; unchanged parts list, no render. */
const MapBoxes = memo(function MapBoxes({ nodes }: { nodes: readonly PartNode[] }) {
  return (
    <g fill="#3a4654" data-testid="parts-map-boxes">
      {nodes.map((n) => (
        <rect key={n.id} x={n.position.x} y={n.position.y} width={n.width ?? n.measured?.width ?? 0} height={n.height ?? n.measured?.height ?? 0}
          fill={n.selected ? '#ffd08a' : undefined} />
      ))}
    </g>
  );
});

export const PartsMap = memo(PartsMapView);
