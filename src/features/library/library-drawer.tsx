/**
 * The Library drawer of the parts tray. "On this board": the board's modules, where each stands with the
 * team library, and "Publish to library". "Team library": the entries the user can read; "Place" puts an
 * instance in the middle of the view (the first one copies the entry's modules in, with its origin and
 * version recorded), "Update from library" replaces the board's older copy. Placing and updating are
 * named edits with the caller's origin, so undo stays per user. Editors only: viewers see no tray.
 */
import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { toast } from 'sonner';
import type * as Y from 'yjs';
import type { ApiLibraryModule } from '../../../shared/api';
import { fetchLibraryEntry, libraryQueryOptions, useDeleteLibraryModule } from './api';
import { copiesAmong, placeFromLibrary, updateFromLibrary } from './library-edits';
import { copyIsStale, libraryStanding, standingText } from './library-status';
import { PublishModuleButton } from './publish-module';
import { useBoardModules } from './use-board-modules';

interface Props {
  doc: Y.Doc;
  boardId: number;
  /** the local user's edit origin (the one their undo manager tracks) */
  origin: unknown;
  canEdit: boolean;
  /** where a placed instance goes (e.g. the middle of the view) */
  placeAt(): { x: number; y: number };
  /** the module open on the canvas, if any: the instance goes inside it */
  scope?: string;
}

const heading = 'mb-1 mt-2 text-[10px] font-semibold uppercase tracking-wider text-slate-500';
const smallButton = 'rounded bg-mat-700 px-1.5 py-0.5 text-slate-100 hover:bg-mat-600 disabled:opacity-50';

export function LibraryDrawer({ doc, boardId, origin, canEdit, placeAt, scope }: Props) {
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState<number | null>(null);
  const [deleting, setDeleting] = useState<number | null>(null);
  const list = useQuery({ ...libraryQueryOptions(), enabled: open });
  const remove = useDeleteLibraryModule();
  const modules = useBoardModules(doc, open);
  const copies = copiesAmong(modules);

  const run = async (entry: ApiLibraryModule, action: 'place' | 'update') => {
    setBusy(entry.id);
    try {
      const content = await fetchLibraryEntry(entry.id);
      const copy = copies.get(content.origin.library);
      if (action === 'update' && copy) {
        updateFromLibrary(doc, copy.moduleId, content, origin);
        toast.success(`Updated “${entry.title}” on this board to v${content.version}`);
      } else {
        const { x, y } = placeAt();
        placeFromLibrary(doc, content, x, y, origin, scope);
        toast.success(copy ? `Placed the board's copy of “${entry.title}” (v${copy.version})` : `Placed “${entry.title}” v${content.version} from the library`);
      }
    } catch (err) {
      toast.error(`Could not ${action === 'place' ? 'place' : 'update'} “${entry.title}”: ${(err as Error).message}`);
    } finally {
      setBusy(null);
    }
  };

  return (
    <section className="shrink-0 border-t border-mat-700" data-testid="library-drawer" aria-label="Library">
      <button type="button" data-testid="library-toggle" aria-expanded={open} onClick={() => setOpen(!open)}
        className="flex w-full items-center justify-between px-2 py-2 text-[11px] font-semibold uppercase tracking-wider text-slate-400 hover:text-slate-200">
        Library <span aria-hidden="true">{open ? '▾' : '▸'}</span>
      </button>
      {open && (
        <div className="max-h-[45vh] overflow-y-auto px-2 pb-2 text-xs text-slate-200" data-testid="library-content">
          {modules.length > 0 && (
            <>
              <h3 className={heading}>On this board</h3>
              <ul className="space-y-1">
                {modules.map((m) => {
                  const standing = libraryStanding(list.data, boardId, m);
                  return (
                    <li key={m.id} className="rounded border border-mat-700 bg-mat-800/40 p-1.5" data-testid={`board-module-${m.id}`}>
                      <div className="truncate font-mono text-[11px]" title={m.title}>{m.title}</div>
                      <div className="text-[10px] text-slate-500" data-testid="module-standing">{list.data ? standingText(standing) : '…'}</div>
                      {canEdit && <div className="mt-1"><PublishModuleButton boardId={boardId} module={m} /></div>}
                    </li>
                  );
                })}
              </ul>
            </>
          )}
          <h3 className={heading}>Team library</h3>
          {list.isPending && <p className="text-slate-400">Loading…</p>}
          {list.isError && <p role="alert" className="text-red-300">{list.error.message}</p>}
          {list.data?.length === 0 && <p className="text-slate-400">No modules yet. Publish one of this board's modules, or make one from a selection (M).</p>}
          <ul className="space-y-1">
            {list.data?.map((entry) => {
              const copy = copies.get(String(entry.id));
              const stale = copy !== undefined && copyIsStale(entry, boardId, copy);
              return (
                <li key={entry.id} className="rounded border border-mat-700 p-1.5" data-testid={`library-entry-${entry.id}`}>
                  <div className="flex items-baseline justify-between gap-1">
                    <span className="truncate font-mono text-[11px]" title={entry.title}>{entry.title}</span>
                    <span className="shrink-0 font-mono text-[10px] text-amber-300" data-testid="library-version">v{entry.version}</span>
                  </div>
                  <div className="text-[10px] text-slate-500">
                    {entry.mine ? 'your library' : `${entry.ownerName}'s library`}
                    {copy ? <span data-testid="library-copy"> · on this board: v{copy.version}</span> : null}
                  </div>
                  {canEdit && (
                    <div className="mt-1 flex flex-wrap gap-1">
                      <button type="button" className={smallButton} disabled={busy !== null} data-testid={`library-place-${entry.id}`}
                        title={copy ? `Place another instance of the board's copy (v${copy.version})` : 'Copy it onto this board and place an instance in the middle of the view'}
                        onClick={() => void run(entry, 'place')}>Place</button>
                      {stale && (
                        <button type="button" className="rounded border border-amber-glow/60 px-1.5 py-0.5 text-amber-300 hover:bg-mat-700 disabled:opacity-50"
                          disabled={busy !== null} data-testid={`library-update-${entry.id}`} title={`Replace the board's v${copy.version} with v${entry.version}; every instance follows`}
                          onClick={() => void run(entry, 'update')}>Update from library</button>
                      )}
                      {entry.mine && (deleting === entry.id ? (
                        <>
                          <button type="button" className="rounded bg-red-900/60 px-1.5 py-0.5 text-red-100 hover:bg-red-800" disabled={remove.isPending}
                            onClick={() => remove.mutate(entry.id, { onSettled: () => setDeleting(null), onError: (err) => toast.error(err.message) })}>Delete it</button>
                          <button type="button" className="rounded px-1.5 py-0.5 text-slate-400 hover:text-slate-200" onClick={() => setDeleting(null)}>Keep</button>
                        </>
                      ) : (
                        <button type="button" className="rounded px-1.5 py-0.5 text-slate-400 hover:text-red-300" onClick={() => setDeleting(entry.id)}
                          aria-label={`Delete ${entry.title} from the library`} title="Delete from the library (copies on boards stay)">Delete</button>
                      ))}
                    </div>
                  )}
                </li>
              );
            })}
          </ul>
        </div>
      )}
    </section>
  );
}
