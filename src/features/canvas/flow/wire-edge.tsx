/**
 * A wire: a right-angled path coloured by its net's level (high glows amber, Z is dashed grey,
 * no level is neutral grey). Memoised like the parts. Zoomed out the wires are drawn by far-wires.tsx.
 */
import { memo } from 'react';
import { BaseEdge, useInternalNode, type EdgeProps } from '@xyflow/react';
import { wirePath, wireStyle } from './wire-path';
import type { WireEdge } from './types';

function WireEdgeView({ id, source, target, sourceX, sourceY, targetX, targetY, sourcePosition, targetPosition, data, selected }: EdgeProps<WireEdge>) {
  const node = useInternalNode(source);
  // a part wired to itself: the step path would run through its body, so go around it
  const box = source === target && node ? { ...node.internals.positionAbsolute, width: node.measured.width ?? 0, height: node.measured.height ?? 0 } : null;
  const path = wirePath({ sourceX, sourceY, targetX, targetY, sourcePosition, targetPosition }, box);
  const level = data?.level;
  return <BaseEdge id={id} path={path} style={wireStyle(level, data?.mark, selected)} interactionWidth={12} className={level ? `gf-wire gf-level-${level}` : 'gf-wire'} />;
}

export const WireEdgeComponent = memo(WireEdgeView);
