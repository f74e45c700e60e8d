/**
 * Wires as SVG paths inside the viewport, drawn from the parts' positions and pin boxes (the same paths as
 * the wire edges, wire-path.ts). Zoomed out every wire is painted on the far canvas (far-canvas.tsx); this
 * draws over it only the few wires of a net that does not settle, as elements with the classes and
 * data-id the bench's pulse style targets, so that they pulse at any zoom. Not clickable.
 */
import { memo, useMemo } from 'react';
import { ViewportPortal } from '@xyflow/react';
import type { PartNode, WireEdge } from './types';
import { pinEnd, wirePath, wireStyle } from './wire-path';

function FarWiresView({ nodes, edges }: { nodes: readonly PartNode[]; edges: readonly WireEdge[] }) {
  const byId = useMemo(() => new Map(nodes.map((n) => [n.id, n])), [nodes]);
  return (
    <ViewportPortal>
      <svg className="gf-far-wires" data-testid="far-wires" aria-hidden="true">
        {edges.map((e) => {
          const from = byId.get(e.source);
          const to = byId.get(e.target);
          const s = from && pinEnd(from, e.sourceHandle);
          const t = to && pinEnd(to, e.targetHandle);
          if (!s || !t) return null;
          const loop = e.source === e.target && from ? { ...from.position, width: from.width ?? 0, height: from.height ?? 0 } : null;
          const d = wirePath({ sourceX: s.x, sourceY: s.y, sourcePosition: s.position, targetX: t.x, targetY: t.y, targetPosition: t.position }, loop);
          return <FarWire key={e.id} id={e.id} d={d} level={e.data?.level} mark={e.data?.mark} selected={e.selected} />;
        })}
      </svg>
    </ViewportPortal>
  );
}

const FarWire = memo(function FarWire({ id, d, level, mark, selected }: { id: string; d: string } & Pick<NonNullable<WireEdge['data']>, 'level' | 'mark'> & { selected?: boolean }) {
  return (
    <g className={`react-flow__edge ${level ? `gf-wire gf-level-${level}` : 'gf-wire'}`} data-id={id}>
      <path className="react-flow__edge-path" d={d} style={wireStyle(level, mark, selected)} />
    </g>
  );
});

export const FarWires = memo(FarWiresView);
