/**
 * What the canvas shows besides the live board: a snapshot in preview (read-only) or a compare of a
 * snapshot with the live board (the live board plus the removed parts, each difference marked).
 */
import { useMemo, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { ApiSnapshot } from '../../../shared/api';
import type { BoardFile } from '../../../shared/board';
import { compareBoard, diffBoards, diffMarks, type BoardDiff, type CompareMark } from '../../../shared/render';
import { snapshotQueryOptions } from './api';

export type SnapshotViewMode = 'preview' | 'compare';

export interface SnapshotMarks {
  parts: ReadonlyMap<string, CompareMark>;
  wires: ReadonlyMap<string, CompareMark>;
}

export interface SnapshotView {
  mode: SnapshotViewMode | null;
  snapshot: ApiSnapshot | null;
  /** the board the canvas shows instead of the live one (null: the live board, or still loading) */
  board: BoardFile | null;
  /** the snapshot's own board file, once loaded */
  snapshotBoard: BoardFile | null;
  diff: BoardDiff | null;
  marks: SnapshotMarks | undefined;
  loading: boolean;
  open(mode: SnapshotViewMode, snapshot: ApiSnapshot): void;
  close(): void;
}

export function useSnapshotView(boardId: number, live: BoardFile): SnapshotView {
  const [state, setState] = useState<{ mode: SnapshotViewMode; snapshot: ApiSnapshot } | null>(null);
  const detail = useQuery({ ...snapshotQueryOptions(boardId, state?.snapshot.id ?? 0), enabled: state !== null });
  const snapshotBoard = state ? (detail.data?.board ?? null) : null;
  const diff = useMemo(() => (state?.mode === 'compare' && snapshotBoard ? diffBoards(snapshotBoard, live) : null), [state?.mode, snapshotBoard, live]);
  const marks = useMemo(() => (diff ? diffMarks(diff) : undefined), [diff]);
  const board = useMemo(() => {
    if (!state || !snapshotBoard) return null;
    return state.mode === 'preview' ? snapshotBoard : diff ? compareBoard(live, diff) : null;
  }, [state, snapshotBoard, diff, live]);
  return {
    mode: state?.mode ?? null,
    snapshot: state?.snapshot ?? null,
    board,
    snapshotBoard,
    diff,
    marks,
    loading: state !== null && detail.isPending,
    open: (mode, snapshot) => setState({ mode, snapshot }),
    close: () => setState(null),
  };
}
