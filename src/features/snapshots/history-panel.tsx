/**
 * The history panel: take a named snapshot (editors; button or Ctrl+Alt+S), the table of snapshots
 * with preview, compare, copy, restore and delete (owner), and "Make my own copy" for every member.
 */
import { useEffect, useMemo, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import type { ApiSnapshot, BoardRole } from '../../../shared/api';
import { Button } from '../../components/ui/button';
import { notifyError, notifySuccess } from '../../lib/notify';
import { canEdit, isOwner } from '../../lib/roles';
import { snapshotsQueryOptions, useCopyBoard, useDeleteSnapshot, useRenameSnapshot, useTakeSnapshot } from './api';
import { HistoryTable, type HistoryActions } from './history-table';
import type { SnapshotView } from './use-snapshot-view';
import { isTakeSnapshotKey } from './take-snapshot-key';


export interface HistoryPanelProps {
  boardId: number;
  role: BoardRole;
  view: SnapshotView;
  onRestore(id: number, name: string): void;
}

export function HistoryPanel({ boardId, role, view, onRestore }: HistoryPanelProps) {
  const list = useQuery(snapshotsQueryOptions(boardId));
  const take = useTakeSnapshot(boardId);
  const rename = useRenameSnapshot(boardId);
  const remove = useDeleteSnapshot(boardId);
  const copy = useCopyBoard(boardId);
  const navigate = useNavigate();
  const [name, setName] = useState('');
  const editor = canEdit(role);

  const takeNamed = () => {
    if (!editor || take.isPending) return;
    take.mutate(name.trim() || undefined, {
      onSuccess: (s) => { setName(''); notifySuccess(`Snapshot “${s.name}” taken`); },
      onError: (err) => notifyError(err, 'Could not take a snapshot'),
    });
  };
  // re-subscribed each render, so the handler always sees the current name and mutation
  useEffect(() => {
    if (!editor) return;
    const onKey = (e: KeyboardEvent) => {
      if (!isTakeSnapshotKey(e)) return;
      e.preventDefault();
      takeNamed();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  });

  const makeCopy = (snapshotId?: number) =>
    copy.mutate(snapshotId, {
      onSuccess: (board) => { notifySuccess(`“${board.title}” is yours`, 'Opened your copy.'); navigate(`/boards/${board.id}`); },
      onError: (err) => notifyError(err, 'Could not make a copy'),
    });

  const actions = useMemo<HistoryActions>(() => ({
    canRename: editor,
    isOwner: isOwner(role),
    activeId: view.snapshot?.id ?? null,
    preview: (s: ApiSnapshot) => view.open('preview', s),
    compare: (s: ApiSnapshot) => view.open('compare', s),
    restore: (s: ApiSnapshot) => onRestore(s.id, s.name),
    copy: (s: ApiSnapshot) => makeCopy(s.id),
    remove: (s: ApiSnapshot) => remove.mutate(s.id, { onError: (err) => notifyError(err, 'Could not delete the snapshot') }),
    rename: (s: ApiSnapshot, n: string) => rename.mutate({ id: s.id, name: n }, { onError: (err) => notifyError(err, 'Could not rename') }),
  }), [editor, role, view.snapshot?.id, view.open, onRestore]);

  return (
    <section className="border-t border-mat-700 p-3" aria-label="History" data-testid="history-panel">
      <div className="mb-2 flex items-center justify-between gap-2">
        <h2 className="text-xs font-semibold uppercase tracking-wide text-slate-400">History</h2>
        <Button size="sm" variant="ghost" busy={copy.isPending} onClick={() => makeCopy()} data-testid="make-copy"
          title="A new board of your own with what this board holds now">Make my own copy</Button>
      </div>
      {editor && (
        <form className="mb-2 flex gap-1.5" onSubmit={(e) => { e.preventDefault(); takeNamed(); }}>
          <input value={name} onChange={(e) => setName(e.target.value)} maxLength={120} placeholder="Snapshot name (optional)" aria-label="Snapshot name"
            className="min-w-0 flex-1 rounded border border-mat-600 bg-mat-950 px-2 py-1 text-xs text-slate-100" data-testid="snapshot-name-input"
            onKeyDown={(e) => e.stopPropagation()} />
          <Button size="sm" type="submit" busy={take.isPending} data-testid="take-snapshot" title="Take a named snapshot (Ctrl+Alt+S)">Take snapshot</Button>
        </form>
      )}
      {list.isPending ? (
        <p className="text-xs text-slate-400">Loading the history…</p>
      ) : list.isError ? (
        <p className="text-xs text-rose-300">Could not load the history. <button type="button" className="underline" onClick={() => list.refetch()}>Try again</button></p>
      ) : list.data.length === 0 ? (
        <p className="text-xs text-slate-400" data-testid="history-empty">No snapshots yet.{editor ? ' Take one to keep this stage.' : ''}</p>
      ) : (
        <HistoryTable snapshots={list.data} actions={actions} />
      )}
    </section>
  );
}
