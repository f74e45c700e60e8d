/**
 * One part on the bench: its IEEE Std 91 symbol, a handle per pin (named as in the board file),
 * its label in JetBrains Mono, badges from the bench and outlines for selection and highlights.
 * Memoised: React Flow re-renders it only when its node object changes.
 */
import { memo, useMemo, useState } from 'react';
import { Handle, Position, useStore, type NodeProps, type ReactFlowState } from '@xyflow/react';
import { allPins } from '../../../../shared/board/validate';
import type { Level } from '../../../../shared/sim/levels';
import { levelColor } from '../lib/colors';
import { placedShape, rotationTransform, type Side } from '../lib/geometry';
import { PartSymbol } from '../symbols';
import { NoteSymbol } from '../symbols/note-symbol';
import { PartLabel } from './label-editor';
import type { PartNode } from './types';

/** Below this zoom a part is drawn as a plain box: a thousand detailed symbols cost whole frames to paint. */
const DETAIL_ZOOM = 0.45;
const zoomedOut = (s: ReactFlowState) => s.transform[2] < DETAIL_ZOOM;

const POSITION: Record<Side, Position> = { left: Position.Left, right: Position.Right, top: Position.Top, bottom: Position.Bottom };

function PartNodeView({ data, selected }: NodeProps<PartNode>) {
  const { part, levels, shown, badge, highlight, remoteColor, readOnly } = data;
  const shape = useMemo(() => placedShape(part), [part]);
  const pinNames = useMemo(() => allPins(part), [part]);
  const [renaming, setRenaming] = useState(false);
  const far = useStore(zoomedOut);
  const level = (pin: string): Level | undefined => {
    const c = levels[pinNames.indexOf(pin)];
    return c === '0' || c === '1' || c === 'X' || c === 'Z' ? c : undefined;
  };
  const classes = ['gf-part', `gf-kind-${part.kind}`];
  if (selected) classes.push('gf-selected');
  if (highlight) classes.push('gf-highlight');
  // A collaborator's selection (box-shadow) shows even when the part is selected here too (dashed outline).
  const outline = remoteColor ? { boxShadow: `0 0 0 2px ${remoteColor}` } : undefined;
  return (
    <div className={classes.join(' ')} data-testid={`part-${part.id}`} data-kind={part.kind}
      style={{ width: shape.w, height: shape.h, ...outline }}
      onDoubleClick={part.kind === 'note' || readOnly ? undefined : (e) => { e.stopPropagation(); setRenaming(true); }}>
      <PartLabel partId={part.id} label={part.label} editing={renaming} onDone={() => setRenaming(false)} />
      {far ? (
        <div className="gf-far" data-kind={part.kind} />
      ) : part.kind === 'note' ? (
        <NoteSymbol part={part} />
      ) : (
        <svg width={shape.w} height={shape.h} viewBox={`0 0 ${shape.w} ${shape.h}`} className="gf-symbol" overflow="visible">
          <g transform={rotationTransform(shape.baseW, shape.baseH, shape.rotation)}>
            <PartSymbol part={part} w={shape.baseW} h={shape.baseH} level={level} shown={shown} />
          </g>
        </svg>
      )}
      {shape.pins.map((spot) => (
        <Handle key={spot.pin} id={spot.pin} type={spot.output ? 'source' : 'target'} position={POSITION[spot.side]}
          isConnectable={!readOnly} data-testid={`pin-${part.id}-${spot.pin}`} title={`${part.id}.${spot.pin}`}
          className={`${spot.output ? 'gf-pin gf-pin-out' : 'gf-pin gf-pin-in'}${far ? ' gf-pin-far' : ''}`}
          style={{ left: spot.x, top: spot.y, right: 'auto', bottom: 'auto', transform: 'translate(-50%, -50%)', borderColor: levelColor(level(spot.pin)) }} />
      ))}
      {badge ? <div className={`gf-badge gf-badge-${badge.tone}`} title={badge.text} data-testid={`badge-${part.id}`}>!</div> : null}
    </div>
  );
}

export const PartNodeComponent = memo(PartNodeView);
