import { queryOptions } from '@tanstack/react-query';
import type { OutboxMessageResponse, OutboxResponse } from '../../../shared/api';
import { api } from '../../lib/api-client';

export const outboxKeys = {
  list: ['outbox', 'list'] as const,
  message: (id: number) => ['outbox', 'message', id] as const,
};

/** Newest first, as the server sends them; refetched often because mail arrives while one waits. */
export const outboxQueryOptions = () =>
  queryOptions({
    queryKey: outboxKeys.list,
    queryFn: async () => (await api.get<OutboxResponse>('/api/admin/outbox')).messages,
    refetchInterval: 5_000,
  });

export const outboxMessageQueryOptions = (id: number) =>
  queryOptions({ queryKey: outboxKeys.message(id), queryFn: async () => (await api.get<OutboxMessageResponse>(`/api/admin/outbox/${id}`)).message });
