import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { okResponse, queryListResponse, reviewQuerySchema } from '@contracts/review';
import { apiRequest } from '../../../lib/api-client';

const raised = z.object({ query: reviewQuerySchema.pick({ id: true }).passthrough() });

/** Query keys and fetchers of the review queries (the threads on sales), general → specific. */
export const queryThreads = {
  all: () => ['queries'] as const,
  list: (assignmentId: number) =>
    queryOptions({
      queryKey: [...queryThreads.all(), assignmentId] as const,
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${assignmentId}/queries`, queryListResponse, { signal }),
      select: (data) => data.queries,
    }),
};

export type AnswerAction = 'keep' | 'exclude';

export const queryRequests = {
  raise: (assignmentId: number, body: { saleId: number | null; body: string }) =>
    apiRequest(`/api/assignments/${assignmentId}/queries`, raised, { method: 'POST', body }),
  comment: (queryId: number, body: string) => apiRequest(`/api/queries/${queryId}/messages`, okResponse, { method: 'POST', body: { body } }),
  answer: (queryId: number, body: { action: AnswerAction; explanation: string; version: number }) =>
    apiRequest(`/api/queries/${queryId}/answer`, okResponse, { method: 'POST', body }),
  resolve: (queryId: number, body: { version: number; body?: string }) => apiRequest(`/api/queries/${queryId}/resolve`, okResponse, { method: 'POST', body }),
  reopen: (queryId: number, body: { version: number; body?: string }) => apiRequest(`/api/queries/${queryId}/reopen`, okResponse, { method: 'POST', body }),
};
