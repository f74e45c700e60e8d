/** Snapshots of a board: the history panel, preview and compare on the canvas, restore, copies, restore notices. */
export { useBoardHistory, type BoardHistory } from './use-board-history';
export { isTakeSnapshotKey } from './take-snapshot-key';
export { snapshotsQueryOptions } from './api';
export type { SnapshotMarks } from './use-snapshot-view';
