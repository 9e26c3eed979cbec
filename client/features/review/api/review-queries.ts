import { queryOptions } from '@tanstack/react-query';
import { analysisWireResponse } from '@contracts/analysis';
import { reviewQueueResponse } from '@contracts/review';
import { apiRequest } from '../../../lib/api-client';

/** Query keys and fetchers of the review feature, general → specific. */
export const reviewQueries = {
  all: () => ['review'] as const,
  queue: () =>
    queryOptions({
      queryKey: [...reviewQueries.all(), 'queue'] as const,
      queryFn: ({ signal }) => apiRequest('/api/review-queue', reviewQueueResponse, { signal }),
      select: (data) => data.items,
    }),
  /** The market analysis as the review step reads it: flagged sales, excluded sales, the fit. */
  analysis: (assignmentId: number) =>
    queryOptions({
      queryKey: [...reviewQueries.all(), 'analysis', assignmentId] as const,
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${assignmentId}/analysis`, analysisWireResponse, { signal }),
    }),
};
