/**
 * The canvas's dot grid, drawn inside the viewport (in flow coordinates) instead of React Flow's
 * Background: that one moves its pattern on every pan frame, and without a GPU the repaint of a
 * full-canvas pattern (and the re-layering it brings) was half of a pan frame. Here the grid moves with
 * the parts as one layer, and is drawn again only when the view has moved far enough to need more of it
 * (gridRect) or the zoom crosses the plain-box level (every fifth dot).
 */
import { memo } from 'react';
import { useStore, ViewportPortal, type ReactFlowState } from '@xyflow/react';
import { INK } from '../lib/colors';
import { GRID } from '../lib/geometry';
import { gridRect } from '../flow/zoom-detail';

/** Radius of a dot in flow units (React Flow's dots were 1.2 units across). */
const DOT = 0.6;

const gridKey = (s: ReactFlowState): string => {
  const r = gridRect(s.transform[0], s.transform[1], s.transform[2], s.width, s.height);
  return `${r.left} ${r.top} ${r.width} ${r.height}`;
};

function CanvasGridView({ far }: { far: boolean }) {
  const key = useStore(gridKey);
  const [left, top, width, height] = key.split(' ').map(Number);
  const gap = far ? GRID * 5 : GRID;
  if (!width || !height) return null;
  return (
    <ViewportPortal>
      <div className="gf-grid" data-testid="canvas-grid" aria-hidden="true" style={{
        left, top, width, height,
        backgroundImage: `radial-gradient(circle at ${DOT}px ${DOT}px, ${INK.grid} ${DOT}px, transparent ${DOT}px)`,
        backgroundSize: `${gap}px ${gap}px`,
        // the dots where React Flow's pattern put them: half a gap before each grid line
        backgroundPosition: `${-gap / 2}px ${-gap / 2}px`,
      }} />
    </ViewportPortal>
  );
}

export const CanvasGrid = memo(CanvasGridView);
