/**
 * The snapshots feature on the board page in one hook: the history panel, the banner over the canvas,
 * the session the canvas should show (the live one, or a read-only one holding the snapshot or the
 * compare), the compare marks, the restore action and everyone's restore notices.
 */
import { useCallback, type ReactNode } from 'react';
import { ChunkBoundary } from '../../components/ui/chunk-boundary';
import { lazyNamed } from '../../lib/lazy-named';
import { useQueryClient } from '@tanstack/react-query';
import type * as Y from 'yjs';
import type { BoardRole } from '../../../shared/api';
import type { BoardFile } from '../../../shared/board';
import { isOwner } from '../../lib/roles';
import { notifyError } from '../../lib/notify';
import { snapshotKeys, useRestoreSnapshot } from './api';
import { SnapshotBanner } from './snapshot-banner';
import { useRestoreNotices } from './use-restore-notices';
import { useSnapshotView, type SnapshotMarks } from './use-snapshot-view';

// The history panel (its table) is a chunk of its own, loaded when the panel mounts: the board's first
// draw does not wait for its code.
const HistoryPanel = lazyNamed(() => import('./history-panel'), 'HistoryPanel');

interface SessionLike {
  doc: Y.Doc;
  board: BoardFile;
  readOnly: boolean;
  canUndo: boolean;
  canRedo: boolean;
  undo(): void;
  redo(): void;
}

export interface BoardHistory<S extends SessionLike> {
  /** the live session, or a read-only copy of it showing the snapshot (preview) or the compare */
  session: S;
  /** true while the canvas shows a snapshot rather than the live board */
  viewing: boolean;
  marks: SnapshotMarks | undefined;
  banner: ReactNode;
  panel: ReactNode;
}

const noop = () => undefined;

export function useBoardHistory<S extends SessionLike>(boardId: number, role: BoardRole, session: S): BoardHistory<S> {
  const view = useSnapshotView(boardId, session.board);
  const restore = useRestoreSnapshot(boardId);
  const qc = useQueryClient();
  useRestoreNotices(session.doc, () => void qc.invalidateQueries({ queryKey: snapshotKeys.list(boardId) }));
  const { close } = view;
  const onRestore = useCallback((id: number) => {
    restore.mutate(id, { onSuccess: () => close(), onError: (err) => notifyError(err, 'Could not restore') });
  }, [restore, close]);
  const shown = view.board ? { ...session, board: view.board, readOnly: true, canUndo: false, canRedo: false, undo: noop, redo: noop } : session;
  return {
    session: shown,
    viewing: view.board !== null,
    marks: view.mode === 'compare' ? view.marks : undefined,
    banner: <SnapshotBanner view={view} canRestore={isOwner(role)} onRestore={onRestore} />,
    panel: (
      <ChunkBoundary what="history panel">
        <HistoryPanel boardId={boardId} role={role} view={view} onRestore={onRestore} />
      </ChunkBoundary>
    ),
  };
}
