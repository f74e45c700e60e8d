import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type {
  AddMemberBody,
  AddMemberResponse,
  BoardResponse,
  InvitationInfoResponse,
  MemberResponse,
  MembersResponse,
  UpdateMemberBody,
} from '../../../shared/api';
import { api } from '../../lib/api-client';

export const memberKeys = {
  list: (boardId: number) => ['boards', 'members', boardId] as const,
  invitation: (token: string) => ['invitations', token] as const,
};

export const membersQueryOptions = (boardId: number) =>
  queryOptions({ queryKey: memberKeys.list(boardId), queryFn: () => api.get<MembersResponse>(`/api/boards/${boardId}/members`) });

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: memberKeys.invitation(token),
    queryFn: async () => (await api.get<InvitationInfoResponse>(`/api/invitations/${encodeURIComponent(token)}`)).invitation,
    retry: false,
  });

/** Member changes also change the board's member count, so the board caches are refreshed too. */
function useInvalidateBoard(boardId: number) {
  const qc = useQueryClient();
  return () => Promise.all([qc.invalidateQueries({ queryKey: memberKeys.list(boardId) }), qc.invalidateQueries({ queryKey: ['boards'] })]);
}

export function useAddMember(boardId: number) {
  const refresh = useInvalidateBoard(boardId);
  return useMutation({
    mutationFn: (body: AddMemberBody) => api.post<AddMemberResponse>(`/api/boards/${boardId}/members`, body),
    onSuccess: refresh,
  });
}

export function useUpdateMemberRole(boardId: number) {
  const refresh = useInvalidateBoard(boardId);
  return useMutation({
    mutationFn: ({ userId, ...body }: UpdateMemberBody & { userId: number }) =>
      api.patch<MemberResponse>(`/api/boards/${boardId}/members/${userId}`, body),
    onSuccess: refresh,
  });
}

export function useRemoveMember(boardId: number) {
  const refresh = useInvalidateBoard(boardId);
  return useMutation({
    mutationFn: (userId: number) => api.delete(`/api/boards/${boardId}/members/${userId}`),
    onSuccess: refresh,
  });
}

/** Owners: withdraw an invitation nobody has accepted yet (its link stops working). */
export function useRevokeInvitation(boardId: number) {
  const refresh = useInvalidateBoard(boardId);
  return useMutation({
    mutationFn: (invitationId: number) => api.delete(`/api/boards/${boardId}/invitations/${invitationId}`),
    onSuccess: refresh,
  });
}

export function useAcceptInvitation(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async () => (await api.post<BoardResponse>(`/api/invitations/${encodeURIComponent(token)}/accept`)).board,
    onSuccess: () => qc.invalidateQueries({ queryKey: ['boards'] }),
  });
}
