import { queryOptions } from '@tanstack/react-query';
import { auditResponse, outboxResponse } from '@contracts/users';
import { apiRequest } from '../../../lib/api-client';

/** Query keys and fetchers of the office manager's records, general → specific. */
export const outboxQueries = {
  all: () => ['office-records'] as const,
  messages: () =>
    queryOptions({
      queryKey: [...outboxQueries.all(), 'outbox'] as const,
      queryFn: ({ signal }) => apiRequest('/api/outbox', outboxResponse, { signal }),
      select: (data) => data.messages,
      staleTime: 0,
      // While something is still queued, look again every few seconds.
      refetchInterval: (query) => (query.state.data?.messages.some((m) => m.status === 'queued') ? 5_000 : false),
    }),
  auditTrail: () =>
    queryOptions({
      queryKey: [...outboxQueries.all(), 'audit-trail'] as const,
      queryFn: ({ signal }) => apiRequest('/api/audit', auditResponse, { signal }),
      select: (data) => data.events,
      staleTime: 0,
    }),
};
