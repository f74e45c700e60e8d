import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { ApiNewShareLink, ApiShareInfo, ApiShareLink, CreateShareLinkBody } from '../../../shared/api';
import { api } from '../../lib/api-client';

export const shareKeys = {
  links: (boardId: number) => ['share-links', boardId] as const,
  info: (token: string) => ['share', token] as const,
};

/** A board's share links (owner), with how many guests each has in now; refreshed while the class panel is open. */
export const shareLinksQueryOptions = (boardId: number) =>
  queryOptions({
    queryKey: shareKeys.links(boardId),
    queryFn: async () => (await api.get<{ links: ApiShareLink[] }>(`/api/boards/${boardId}/share-links`)).links,
    refetchInterval: 5000,
  });

export function useCreateShareLink(boardId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: CreateShareLinkBody) => (await api.post<{ link: ApiNewShareLink }>(`/api/boards/${boardId}/share-links`, body)).link,
    onSuccess: () => qc.invalidateQueries({ queryKey: shareKeys.links(boardId) }),
  });
}

export function useRevokeShareLink(boardId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (linkId: number) => api.delete(`/api/boards/${boardId}/share-links/${linkId}`),
    onSuccess: () => qc.invalidateQueries({ queryKey: shareKeys.links(boardId) }),
  });
}

/** What a share link opens, and whether this browser already joined through it. */
export const shareInfoQueryOptions = (token: string) =>
  queryOptions({ queryKey: shareKeys.info(token), queryFn: async () => (await api.get<{ share: ApiShareInfo }>(`/api/share/${encodeURIComponent(token)}`)).share, retry: false });

export function useJoinShare(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (name: string) =>
      (await api.post<{ join: { boardId: number; role: string; guest: { name: string } | null } }>(`/api/share/${encodeURIComponent(token)}/join`, { name })).join,
    onSuccess: () => qc.invalidateQueries({ queryKey: shareKeys.info(token) }),
  });
}
