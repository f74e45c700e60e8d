/**
 * The Library drawer of the parts tray: the team library's modules, "Place" copies one onto the board and
 * places an instance, "Update from library" replaces the board's older copy. Both are named edits with the
 * caller's origin, so undo stays per user.
 */
import { useEffect, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import type * as Y from 'yjs';
import type { ApiLibraryModule } from '../../../shared/api';
import { modulesMap } from '../../../shared/board';
import { fetchLibraryEntry, libraryQueryOptions, useDeleteLibraryModule } from './api';
import { libraryCopies, placeFromLibrary, updateFromLibrary } from './library-edits';

interface Props {
  doc: Y.Doc;
  /** the local user's edit origin (the one their undo manager tracks) */
  origin: unknown;
  canEdit: boolean;
  /** where a placed instance goes (e.g. the middle of the view) */
  placeAt(): { x: number; y: number };
  /** the module open on the canvas, if any: the instance goes inside it */
  scope?: string;
}

function useCopies(doc: Y.Doc) {
  const [copies, setCopies] = useState(() => libraryCopies(doc));
  useEffect(() => {
    const map = modulesMap(doc);
    const update = () => setCopies(libraryCopies(doc));
    map.observeDeep(update);
    return () => map.unobserveDeep(update);
  }, [doc]);
  return copies;
}

export function LibraryDrawer({ doc, origin, canEdit, placeAt, scope }: Props) {
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const list = useQuery({ ...libraryQueryOptions(), enabled: open });
  const remove = useDeleteLibraryModule();
  const copies = useCopies(doc);

  const run = async (entry: ApiLibraryModule, action: 'place' | 'update') => {
    setBusy(entry.id);
    setError(null);
    try {
      const content = await fetchLibraryEntry(entry.id);
      const copy = copies.get(content.origin.library);
      if (action === 'update' && copy) updateFromLibrary(doc, copy.moduleId, content, origin);
      else {
        const { x, y } = placeAt();
        placeFromLibrary(doc, content, x, y, origin, scope);
      }
    } catch (err) {
      setError((err as Error).message);
    } finally {
      setBusy(null);
    }
  };

  return (
    <section className="border-t border-mat-700" data-testid="library-drawer" aria-label="Library">
      <button type="button" className="flex w-full items-center justify-between p-2 text-[11px] font-semibold uppercase tracking-wider text-slate-400" aria-expanded={open} onClick={() => setOpen(!open)}>
        Library <span aria-hidden="true">{open ? '▾' : '▸'}</span>
      </button>
      {open && (
        <div className="max-h-64 overflow-y-auto px-2 pb-2 text-xs text-slate-200">
          {list.isPending && <p className="text-slate-400">Loading…</p>}
          {list.isError && <p role="alert" className="text-red-300">{list.error.message}</p>}
          {error && <p role="alert" className="text-red-300">{error}</p>}
          {list.data?.length === 0 && <p className="text-slate-400">No modules yet. Publish one from a board's module.</p>}
          <ul className="space-y-1">
            {list.data?.map((entry) => {
              const copy = copies.get(String(entry.id));
              const stale = copy !== undefined && copy.version < entry.version;
              return (
                <li key={entry.id} className="rounded border border-mat-700 p-1.5" data-testid="library-entry">
                  <div className="flex items-baseline justify-between gap-1">
                    <span className="truncate font-medium" title={entry.title}>{entry.title}</span>
                    <span className="shrink-0 text-slate-400">v{entry.version}</span>
                  </div>
                  <div className="text-[10px] text-slate-500">{entry.mine ? 'your library' : `${entry.ownerName}'s library`}{copy ? ` · on this board: v${copy.version}` : ''}</div>
                  {canEdit && (
                    <div className="mt-1 flex flex-wrap gap-1">
                      <button type="button" className="rounded bg-mat-700 px-1.5 py-0.5 hover:bg-mat-600" disabled={busy !== null} onClick={() => void run(entry, 'place')}>Place</button>
                      {stale && (
                        <button type="button" className="rounded border border-mat-500 px-1.5 py-0.5 hover:bg-mat-600" disabled={busy !== null} onClick={() => void run(entry, 'update')}>Update from library</button>
                      )}
                      {entry.mine && (
                        <button type="button" className="rounded px-1.5 py-0.5 text-slate-400 hover:text-red-300" disabled={remove.isPending} onClick={() => remove.mutate(entry.id)} aria-label={`Delete ${entry.title} from the library`}>Delete</button>
                      )}
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
