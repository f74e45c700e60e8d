/**
 * The band over the canvas while it shows a snapshot: what is shown, that it is read-only, the
 * differences when comparing, one click back to the live board, and restore for the owner.
 */
import { Button } from '../../components/ui/button';
import { ConfirmButton } from '../../components/ui/confirm-button';
import { MARK_COLORS } from '../../../shared/render';
import { CompareList } from './compare-list';
import type { SnapshotView } from './use-snapshot-view';

export interface SnapshotBannerProps {
  view: SnapshotView;
  canRestore: boolean;
  onRestore(id: number, name: string): void;
}

export function SnapshotBanner({ view, canRestore, onRestore }: SnapshotBannerProps) {
  const { snapshot, mode, diff } = view;
  if (!snapshot || !mode) return null;
  const counts = diff
    ? `${diff.added.parts.length + diff.added.wires.length} added · ${diff.removed.parts.length + diff.removed.wires.length} removed · ${diff.changed.parts.length + diff.changed.wires.length + diff.changed.meta.length} changed`
    : '';
  return (
    <section className="shrink-0 border-y-2 border-violet-400/70 bg-violet-950/70 px-4 py-2 text-sm text-slate-100" data-testid="snapshot-banner" data-mode={mode}
      aria-label={mode === 'preview' ? 'Snapshot preview' : 'Snapshot compare'}>
      <div className="flex flex-wrap items-center gap-3">
        <strong className="font-semibold">
          {mode === 'preview' ? 'Preview of snapshot' : 'Comparing snapshot'} “{snapshot.name}”
        </strong>
        <span className="text-xs text-violet-200">
          {mode === 'preview' ? 'read-only — the live board is unchanged' : `with the live board: ${counts}`}
        </span>
        {view.loading && <span className="text-xs text-slate-300">loading…</span>}
        {mode === 'compare' && (
          <span className="flex items-center gap-2 text-[11px] text-slate-300" aria-label="Legend">
            {(['added', 'removed', 'changed'] as const).map((m) => (
              <span key={m} className="flex items-center gap-1"><span className="h-2.5 w-2.5 rounded-sm border-2" style={{ borderColor: MARK_COLORS[m] }} />{m}</span>
            ))}
          </span>
        )}
        <div className="ml-auto flex items-center gap-2">
          {canRestore && (
            <ConfirmButton size="sm" title={`Restore “${snapshot.name}” for everyone?`} confirmLabel="Restore" data-testid="banner-restore"
              description="Every connected screen changes to this snapshot at once. A “Before restoring…” snapshot is taken first, so you can go back."
              onConfirm={() => onRestore(snapshot.id, snapshot.name)}>
              Restore this snapshot
            </ConfirmButton>
          )}
          <Button size="sm" variant="primary" onClick={view.close} data-testid="back-to-live">Back to live</Button>
        </div>
      </div>
      {mode === 'compare' && diff && <div className="mt-1.5"><CompareList diff={diff} /></div>}
    </section>
  );
}
