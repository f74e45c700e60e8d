/**
 * A wire: a right-angled path coloured by its net's level (high glows amber, Z is dashed grey,
 * no level is neutral grey). Memoised like the parts.
 */
import { memo } from 'react';
import { BaseEdge, getSmoothStepPath, useInternalNode, type EdgeProps } from '@xyflow/react';
import { levelColor } from '../lib/colors';
import { MARK_COLORS } from '../../../../shared/render';
import { selfLoopPath } from './self-loop-path';
import type { WireEdge } from './types';

function WireEdgeView({ id, source, target, sourceX, sourceY, targetX, targetY, sourcePosition, targetPosition, data, selected }: EdgeProps<WireEdge>) {
  const node = useInternalNode(source);
  // a part wired to itself: the step path would run through its body, so go around it
  const box = source === target && node ? { ...node.internals.positionAbsolute, width: node.measured.width ?? 0, height: node.measured.height ?? 0 } : null;
  const path = box ? selfLoopPath(sourceX, sourceY, targetX, targetY, box)
    : getSmoothStepPath({ sourceX, sourceY, targetX, targetY, sourcePosition, targetPosition, borderRadius: 4, offset: 12 })[0];
  const level = data?.level;
  const color = levelColor(level);
  const style = {
    stroke: selected ? '#e6edf3' : data?.mark ? MARK_COLORS[data.mark] : color,
    // A high wire is drawn a little heavier; no CSS filter (a glow filter on every wire costs whole frames
    // when a large board pans on a machine without GPU compositing).
    strokeWidth: selected ? 3 : data?.mark ? 3.5 : level === '1' ? 2.5 : 2,
    strokeDasharray: data?.mark === 'removed' || level === 'Z' ? '5 4' : undefined,
  };
  return <BaseEdge id={id} path={path} style={style} interactionWidth={12} className={level ? `gf-wire gf-level-${level}` : 'gf-wire'} />;
}

export const WireEdgeComponent = memo(WireEdgeView);
