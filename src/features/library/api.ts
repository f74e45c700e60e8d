import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { ApiLibraryContent, ApiLibraryModule } from '../../../shared/api';
import { api } from '../../lib/api-client';

export const libraryKeys = {
  list: ['library'] as const,
  entry: (id: number) => ['library', id] as const,
};

/** Every library the user may read (their own and those of the owners of their boards). */
export const libraryQueryOptions = () =>
  queryOptions({
    queryKey: libraryKeys.list,
    queryFn: async () => (await api.get<{ modules: ApiLibraryModule[] }>('/api/library')).modules,
  });

/** One entry with its content (the modules to copy in and the origin to record). */
export const fetchLibraryEntry = async (id: number) => (await api.get<{ module: ApiLibraryContent }>(`/api/library/${id}`)).module;

/** Publishes a module of a board into the board owner's library (a new entry, or the next version). */
export function usePublishModule() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: { boardId: number; moduleId: string }) => (await api.post<{ module: ApiLibraryContent }>('/api/library', body)).module,
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.list }),
  });
}

export function useDeleteLibraryModule() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete(`/api/library/${id}`),
    onSuccess: () => qc.invalidateQueries({ queryKey: libraryKeys.list }),
  });
}
