/** Build photos beside the sheet: thumbnails that open full size, upload for editors, delete for the uploader or the owner. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useRef, useState } from 'react';
import type { BoardRole } from '../../../shared/api';
import { Button } from '../../components/ui/button';
import { errorMessage } from '../../lib/api-client';
import { canEdit, isOwner } from '../../lib/roles';
import { bringupKeys, deletePhoto, photosQuery, uploadPhoto } from './api';

export function PhotosStrip({ boardId, role, me, partId }: { boardId: number; role: BoardRole; me: number | null; partId?: string }) {
  const qc = useQueryClient();
  const photos = useQuery(photosQuery(boardId));
  const input = useRef<HTMLInputElement>(null);
  const [error, setError] = useState<string | null>(null);
  const refresh = () => qc.invalidateQueries({ queryKey: bringupKeys.photos(boardId) });
  const upload = useMutation({
    mutationFn: (file: File) => uploadPhoto(boardId, file, partId),
    onSuccess: () => { setError(null); void refresh(); },
    onError: (err) => setError(errorMessage(err)),
  });
  const remove = useMutation({ mutationFn: (id: number) => deletePhoto(boardId, id), onSuccess: () => void refresh(), onError: (err) => setError(errorMessage(err)) });
  return (
    <div className="space-y-2" data-testid="bringup-photos">
      <div className="flex items-center gap-2">
        <h3 className="text-xs font-semibold uppercase tracking-wide text-slate-400">Build photos</h3>
        {canEdit(role) && (
          <>
            <input ref={input} type="file" accept="image/jpeg,image/png,image/webp" className="hidden" data-testid="photo-input"
              onChange={(e) => { const f = e.target.files?.[0]; if (f) upload.mutate(f); e.target.value = ''; }} />
            <Button size="sm" busy={upload.isPending} onClick={() => input.current?.click()}>Add photo</Button>
          </>
        )}
      </div>
      {error && <p role="alert" className="text-xs text-rose-300">{error}</p>}
      {photos.data && photos.data.length === 0 && <p className="text-xs text-slate-500">No photos of the build yet.</p>}
      <ul className="grid grid-cols-3 gap-1.5">
        {photos.data?.map((p) => (
          <li key={p.id} className="group relative">
            <a href={p.url} target="_blank" rel="noreferrer" title={`${p.name}${p.partId ? ` · ${p.partId}` : ''} · ${p.uploader?.name ?? 'someone'}`}>
              <img src={p.thumbUrl} alt={p.caption || p.name} className="aspect-square w-full rounded border border-mat-700 object-cover" loading="lazy" />
            </a>
            {(isOwner(role) || (me !== null && p.uploader?.id === me && canEdit(role))) && (
              <button type="button" aria-label={`Delete ${p.name}`} onClick={() => remove.mutate(p.id)}
                className="absolute right-0.5 top-0.5 hidden rounded bg-mat-900/80 px-1 text-[10px] text-rose-300 group-hover:block">✕</button>
            )}
          </li>
        ))}
      </ul>
    </div>
  );
}
