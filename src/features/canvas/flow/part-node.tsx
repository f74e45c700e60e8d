/**
 * One part on the canvas: its IEEE Std 91 symbol, a handle per pin (named as in the board file),
 * its label in JetBrains Mono, badges from the bench and outlines for selection and highlights.
 * Memoised: React Flow re-renders it only when its node object changes.
 */
import { memo, useMemo, useState, type MouseEvent } from 'react';
import { Handle, Position, type NodeProps } from '@xyflow/react';
import { allPins } from '../../../../shared/board';
import type { Level } from '../../../../shared/sim';
import { levelColor } from '../lib/colors';
import { placedShape, rotationTransform, type Side } from '../lib/geometry';
import { PartSymbol } from '../symbols';
import { NoteSymbol } from '../symbols/note-symbol';
import { PartLabel } from './label-editor';
import { usePartActions } from './part-actions';
import type { PartNode } from './types';

const POSITION: Record<Side, Position> = { left: Position.Left, right: Position.Right, top: Position.Top, bottom: Position.Bottom };

function PartNodeView({ data, selected }: NodeProps<PartNode>) {
  const { part, levels, shown, badge, highlight, remoteColor, readOnly, mark, pins } = data;
  const modulePins = useMemo(() => (pins && part.kind === 'module' ? new Map([[part.module, pins]]) : undefined), [part, pins]);
  const shape = useMemo(() => placedShape(part, modulePins), [part, modulePins]);
  const pinNames = useMemo(() => allPins(part, modulePins), [part, modulePins]);
  const actions = usePartActions();
  const [renaming, setRenaming] = useState(false);
  const level = (pin: string): Level | undefined => {
    const c = levels[pinNames.indexOf(pin)];
    return c === '0' || c === '1' || c === 'X' || c === 'Z' ? c : undefined;
  };
  const classes = ['gf-part', `gf-kind-${part.kind}`];
  if (selected) classes.push('gf-selected');
  if (highlight) classes.push('gf-highlight');
  if (mark) classes.push(`gf-mark gf-mark-${mark}`);
  // A collaborator's selection (box-shadow) shows even when the part is selected here too (dashed outline).
  const outline = remoteColor ? { boxShadow: `0 0 0 2px ${remoteColor}` } : undefined;
  const onDoubleClick = part.kind === 'module' ? (e: MouseEvent) => { e.stopPropagation(); actions.openModule(part.module); }
    : part.kind === 'note' || readOnly ? undefined : (e: MouseEvent) => { e.stopPropagation(); setRenaming(true); };
  const badgeMark = badge ? <div className={`gf-badge gf-badge-${badge.tone}`} title={badge.text} data-testid={`badge-${part.id}`}>!</div> : null;
  return (
    <div className={classes.join(' ')} data-testid={`part-${part.id}`} data-kind={part.kind}
      style={{ width: shape.w, height: shape.h, ...outline }} onDoubleClick={onDoubleClick}>
      <PartLabel partId={part.id} label={part.label} editing={renaming} onDone={() => setRenaming(false)} />
      {part.kind === 'note' ? (
        <NoteSymbol part={part} />
      ) : (
        <svg width={shape.w} height={shape.h} viewBox={`0 0 ${shape.w} ${shape.h}`} className="gf-symbol" overflow="visible">
          <g transform={rotationTransform(shape.baseW, shape.baseH, shape.rotation)}>
            <PartSymbol part={part} w={shape.baseW} h={shape.baseH} level={level} shown={shown} />
          </g>
        </svg>
      )}
      {shape.pins.map((spot) => {
        const style = { left: spot.x, top: spot.y, right: 'auto', bottom: 'auto', transform: 'translate(-50%, -50%)', borderColor: levelColor(level(spot.pin)) };
        const testId = `pin-${part.id}-${spot.pin}`;
        const title = `${part.id}.${spot.pin}`;
        return (
          <Handle key={spot.pin} id={spot.pin} type={spot.output ? 'source' : 'target'} position={POSITION[spot.side]}
            isConnectable={!readOnly} data-testid={testId} title={title}
            className={spot.output ? 'gf-pin gf-pin-out' : 'gf-pin gf-pin-in'} style={style} />
        );
      })}
      {badgeMark}
    </div>
  );
}

export const PartNodeComponent = memo(PartNodeView);
