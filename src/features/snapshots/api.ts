import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type {
  BoardResponse, RestoreResponse, SnapshotDetailResponse, SnapshotResponse, SnapshotsResponse,
} from '../../../shared/api';
import { api } from '../../lib/api-client';

export const snapshotKeys = {
  list: (boardId: number) => ['boards', 'detail', boardId, 'snapshots'] as const,
  detail: (boardId: number, id: number) => ['boards', 'detail', boardId, 'snapshots', id] as const,
};

/** The board's history, newest first. */
export const snapshotsQueryOptions = (boardId: number) =>
  queryOptions({
    queryKey: snapshotKeys.list(boardId),
    queryFn: async () => (await api.get<SnapshotsResponse>(`/api/boards/${boardId}/snapshots`)).snapshots,
  });

/** One snapshot with its board file (a snapshot never changes, only its name). */
export const snapshotQueryOptions = (boardId: number, id: number) =>
  queryOptions({
    queryKey: snapshotKeys.detail(boardId, id),
    queryFn: () => api.get<SnapshotDetailResponse>(`/api/boards/${boardId}/snapshots/${id}`),
    staleTime: Infinity,
  });

function useInvalidateList(boardId: number) {
  const qc = useQueryClient();
  return () => qc.invalidateQueries({ queryKey: snapshotKeys.list(boardId) });
}

export function useTakeSnapshot(boardId: number) {
  const done = useInvalidateList(boardId);
  return useMutation({
    mutationFn: async (name?: string) => (await api.post<SnapshotResponse>(`/api/boards/${boardId}/snapshots`, name ? { name } : {})).snapshot,
    onSuccess: done,
  });
}

export function useRenameSnapshot(boardId: number) {
  const done = useInvalidateList(boardId);
  return useMutation({
    mutationFn: async ({ id, name }: { id: number; name: string }) => (await api.patch<SnapshotResponse>(`/api/boards/${boardId}/snapshots/${id}`, { name })).snapshot,
    onSuccess: done,
  });
}

export function useDeleteSnapshot(boardId: number) {
  const done = useInvalidateList(boardId);
  return useMutation({ mutationFn: (id: number) => api.delete(`/api/boards/${boardId}/snapshots/${id}`), onSuccess: done });
}

export function useRestoreSnapshot(boardId: number) {
  const done = useInvalidateList(boardId);
  return useMutation({ mutationFn: (id: number) => api.post<RestoreResponse>(`/api/boards/${boardId}/snapshots/${id}/restore`), onSuccess: done });
}

/** Copies the live board (no id) or one snapshot into a new board owned by the caller. */
export function useCopyBoard(boardId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (snapshotId?: number) => (await api.post<BoardResponse>(`/api/boards/${boardId}/copy`, snapshotId ? { snapshotId } : {})).board,
    onSuccess: () => qc.invalidateQueries({ queryKey: ['boards', 'list'] }),
  });
}
