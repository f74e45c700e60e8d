import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { BoardResponse, BoardsResponse, CreateBoardBody, UpdateBoardBody } from '../../../shared/api';
import { api } from '../../lib/api-client';

export const boardKeys = {
  all: ['boards'] as const,
  list: () => [...boardKeys.all, 'list'] as const,
  detail: (id: number) => [...boardKeys.all, 'detail', id] as const,
};

export const boardsQueryOptions = () =>
  queryOptions({ queryKey: boardKeys.list(), queryFn: async () => (await api.get<BoardsResponse>('/api/boards')).boards });

/**
 * One board: your role, its members, its row. An open board page shows the title and family from the
 * live document instead (they change there for everyone at once), so nothing here polls.
 */
export const boardQueryOptions = (id: number) =>
  queryOptions({
    queryKey: boardKeys.detail(id),
    queryFn: async () => (await api.get<BoardResponse>(`/api/boards/${id}`)).board,
  });

export function useCreateBoard() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: CreateBoardBody) => (await api.post<BoardResponse>('/api/boards', body)).board,
    onSuccess: (board) => {
      qc.setQueryData(boardKeys.detail(board.id), board);
      return qc.invalidateQueries({ queryKey: boardKeys.list() });
    },
  });
}

export function useUpdateBoard(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: UpdateBoardBody) => (await api.patch<BoardResponse>(`/api/boards/${id}`, body)).board,
    onSuccess: (board) => {
      qc.setQueryData(boardKeys.detail(id), board);
      return qc.invalidateQueries({ queryKey: boardKeys.list() });
    },
  });
}

export function useDeleteBoard(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete(`/api/boards/${id}`),
    onSuccess: () => {
      qc.removeQueries({ queryKey: boardKeys.detail(id) });
      return qc.invalidateQueries({ queryKey: boardKeys.list() });
    },
  });
}
