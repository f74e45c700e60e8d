/** Node and edge types of the canvas (React Flow), derived from the board. */
import type { Edge, Node } from '@xyflow/react';
import type { Part, PinSet } from '../../../../shared/board';
import type { Level } from '../../../../shared/sim';
import type { CompareMark } from '../../../../shared/render';

export type BadgeTone = 'conflict' | 'oscillating' | 'undriven' | 'info';
export interface PartBadge { tone: BadgeTone; text: string }

export interface PartNodeData extends Record<string, unknown> {
  part: Part;
  /** one character per pin of `allPins(part)`: 0 1 X Z, or '-' for no level */
  levels: string;
  /** the switch/button state to draw (a viewer's try-out value wins over the document) */
  shown: boolean;
  badge?: PartBadge;
  highlight: boolean;
  /** colour of a collaborator who has this part selected */
  remoteColor?: string;
  readOnly: boolean;
  /** a snapshot compare's mark (added, removed, changed) */
  mark?: CompareMark;
  /** an instance's pins (its module's ports), absent for other parts */
  pins?: PinSet;
}
export type PartNode = Node<PartNodeData, 'part'>;

export interface WireEdgeData extends Record<string, unknown> {
  level?: Level;
  /** a snapshot compare's mark */
  mark?: CompareMark;
}
export type WireEdge = Edge<WireEdgeData, 'wire'>;
