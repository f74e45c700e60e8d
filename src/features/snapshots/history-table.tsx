/** The history as a compact table (TanStack Table): picture, name (rename in place), author, time, kind, counts, actions. */
import { useMemo, useState } from 'react';
import { flexRender, getCoreRowModel, useReactTable, type ColumnDef } from '@tanstack/react-table';
import type { ApiSnapshot, SnapshotKind } from '../../../shared/api';
import { ConfirmButton } from '../../components/ui/confirm-button';
import { formatDateTime } from '../../lib/format';

const KIND_TEXT: Record<SnapshotKind, string> = { named: 'named', automatic: 'auto', 'before-restore': 'before restore', 'copied-from': 'copied' };

export interface HistoryActions {
  canRename: boolean;
  isOwner: boolean;
  activeId: number | null;
  preview(s: ApiSnapshot): void;
  compare(s: ApiSnapshot): void;
  restore(s: ApiSnapshot): void;
  copy(s: ApiSnapshot): void;
  remove(s: ApiSnapshot): void;
  rename(s: ApiSnapshot, name: string): void;
}

function NameCell({ s, actions }: { s: ApiSnapshot; actions: HistoryActions }) {
  const [draft, setDraft] = useState<string | null>(null);
  if (draft !== null) {
    const save = () => { if (draft.trim() && draft.trim() !== s.name) actions.rename(s, draft.trim()); setDraft(null); };
    return (
      <input autoFocus value={draft} maxLength={120} aria-label="Snapshot name" data-testid={`rename-${s.id}`}
        className="w-full rounded border border-amber-glow bg-mat-950 px-1 text-[11px] text-slate-100"
        onChange={(e) => setDraft(e.target.value)} onBlur={save}
        onKeyDown={(e) => { e.stopPropagation(); if (e.key === 'Enter') save(); if (e.key === 'Escape') setDraft(null); }} />
    );
  }
  return (
    <span className={`block break-words font-medium text-slate-100 ${actions.canRename ? 'cursor-text' : ''}`} title={actions.canRename ? 'Double-click to rename' : undefined}
      onDoubleClick={() => actions.canRename && setDraft(s.name)} data-testid="snapshot-name">{s.name}</span>
  );
}

const link = 'rounded px-1.5 py-0.5 text-[11px] text-slate-300 hover:bg-mat-700 hover:text-slate-100';

export function HistoryTable({ snapshots, actions }: { snapshots: ApiSnapshot[]; actions: HistoryActions }) {
  const columns = useMemo<ColumnDef<ApiSnapshot>[]>(() => [
    { id: 'picture', header: '', cell: ({ row }) => <img src={row.original.thumbnailUrl} alt="" loading="lazy" className="h-9 w-12 min-w-12 max-w-none rounded border border-mat-700 bg-mat-950 object-contain" /> },
    { id: 'name', header: 'Name', cell: ({ row }) => <NameCell s={row.original} actions={actions} /> },
    { id: 'author', header: 'By', accessorFn: (s) => s.authorName ?? 'server' },
    { id: 'time', header: 'When', accessorFn: (s) => formatDateTime(s.createdAt) },
    { id: 'kind', header: 'Kind', accessorFn: (s) => KIND_TEXT[s.kind] },
    { id: 'counts', header: 'Parts / wires', accessorFn: (s) => `${s.partCount} / ${s.wireCount}` },
  ], [actions]);
  const table = useReactTable({ data: snapshots, columns, getCoreRowModel: getCoreRowModel(), getRowId: (s) => String(s.id) });
  return (
    <table className="w-full border-collapse text-left text-[11px] text-slate-300" data-testid="history-table">
      <caption className="sr-only">Snapshots of this board, newest first</caption>
      <thead className="text-[10px] uppercase tracking-wide text-slate-500">
        {table.getHeaderGroups().map((g) => (
          <tr key={g.id}>{g.headers.map((h) => <th key={h.id} scope="col" className="px-1 py-1 font-medium">{flexRender(h.column.columnDef.header, h.getContext())}</th>)}</tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => {
          const s = row.original;
          return [
            <tr key={row.id} className={`border-t border-mat-700 align-top ${actions.activeId === s.id ? 'bg-violet-950/50' : ''}`} data-testid="snapshot-row" data-kind={s.kind}>
              {row.getVisibleCells().map((cell) => <td key={cell.id} className="px-1 pt-1.5">{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>)}
            </tr>,
            <tr key={`${row.id}-actions`} className={actions.activeId === s.id ? 'bg-violet-950/50' : ''}>
              <td colSpan={columns.length} className="px-1 pb-1.5">
                <div className="flex flex-wrap items-center gap-0.5">
                  <button type="button" className={link} onClick={() => actions.preview(s)} data-testid={`preview-${s.id}`}>Preview</button>
                  <button type="button" className={link} onClick={() => actions.compare(s)} data-testid={`compare-${s.id}`}>Compare</button>
                  <button type="button" className={link} onClick={() => actions.copy(s)} data-testid={`copy-${s.id}`} title="A new board of your own with this snapshot">Copy</button>
                  {actions.isOwner && (
                    <>
                      <ConfirmButton size="sm" variant="ghost" className="h-6 px-1.5 text-[11px]" title={`Restore “${s.name}” for everyone?`} confirmLabel="Restore"
                        description="Every connected screen changes to this snapshot at once. A “Before restoring…” snapshot is taken first, so you can go back."
                        onConfirm={() => actions.restore(s)} data-testid={`restore-${s.id}`}>Restore</ConfirmButton>
                      <ConfirmButton size="sm" variant="ghost" className="h-6 px-1.5 text-[11px]" title={`Delete the snapshot “${s.name}”?`} confirmLabel="Delete"
                        onConfirm={() => actions.remove(s)} data-testid={`delete-${s.id}`}>Delete</ConfirmButton>
                    </>
                  )}
                </div>
              </td>
            </tr>,
          ];
        })}
      </tbody>
    </table>
  );
}
