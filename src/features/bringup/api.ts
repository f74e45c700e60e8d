/** REST of the bring-up feature: the board's bring-up record and its build photos (TanStack Query). */
import { queryOptions } from '@tanstack/react-query';
import { api, ApiError } from '../../lib/api-client';

export interface ApiObservation {
  id: number;
  in: string;
  out: string;
  expected: string | null;
  step: number | null;
  user: { id: number; name: string } | null;
  createdAt: string;
}

export interface ApiPhoto {
  id: number;
  partId: string | null;
  name: string;
  caption: string;
  width: number;
  height: number;
  uploader: { id: number; name: string } | null;
  createdAt: string;
  url: string;
  thumbUrl: string;
}

export const bringupKeys = {
  observations: (boardId: number) => ['bringup', boardId, 'observations'] as const,
  photos: (boardId: number) => ['bringup', boardId, 'photos'] as const,
};

/** The record is shared through the server: asked again on window focus and after each save (no socket). */
export const observationsQuery = (boardId: number) => queryOptions({
  queryKey: bringupKeys.observations(boardId),
  queryFn: async () => (await api.get<{ observations: ApiObservation[] }>(`/api/boards/${boardId}/bringup/observations`)).observations,
  refetchOnWindowFocus: 'always',
});

export const photosQuery = (boardId: number) => queryOptions({
  queryKey: bringupKeys.photos(boardId),
  queryFn: async () => (await api.get<{ photos: ApiPhoto[] }>(`/api/boards/${boardId}/photos`)).photos,
  refetchOnWindowFocus: 'always',
});

export const recordObservation = (boardId: number, body: { in: string; out: string; step?: number | null }) =>
  api.post<{ observation: ApiObservation }>(`/api/boards/${boardId}/bringup/observations`, body);

export const removeObservation = (boardId: number, id: number) => api.delete(`/api/boards/${boardId}/bringup/observations/${id}`);

export const clearObservations = (boardId: number) => api.delete(`/api/boards/${boardId}/bringup/observations`);

/** Multipart upload (the JSON client does not send forms). */
export async function uploadPhoto(boardId: number, file: File, partId?: string): Promise<ApiPhoto> {
  const form = new FormData();
  form.append('file', file, file.name);
  if (partId) form.append('partId', partId);
  const res = await fetch(`/api/boards/${boardId}/photos`, { method: 'POST', body: form, credentials: 'same-origin', headers: { Accept: 'application/json' } });
  const body = (await res.json().catch(() => ({}))) as { photo?: ApiPhoto; error?: { code?: string; message?: string; fields?: Record<string, string> } };
  if (!res.ok || !body.photo) throw new ApiError(res.status, body.error?.code ?? 'upload_failed', body.error?.message ?? 'The photo could not be uploaded', body.error?.fields ?? {});
  return body.photo;
}

export const deletePhoto = (boardId: number, id: number) => api.delete(`/api/boards/${boardId}/photos/${id}`);
