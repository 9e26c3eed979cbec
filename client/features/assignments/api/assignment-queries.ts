import { queryOptions } from '@tanstack/react-query';
import { assignmentDetailResponse, assignmentListResponse } from '@contracts/assignments';
import { apiRequest } from '../../../lib/api-client';

/** Query keys and fetchers of the assignments feature, general → specific: ['assignments'] clears
 * every list and record of the feature at once. */
export const assignmentQueries = {
  all: () => ['assignments'] as const,
  lists: () => [...assignmentQueries.all(), 'list'] as const,
  list: () =>
    queryOptions({
      queryKey: [...assignmentQueries.lists(), 'firm'] as const,
      queryFn: ({ signal }) => apiRequest('/api/assignments', assignmentListResponse, { signal }),
      select: (data) => data.assignments,
    }),
  details: () => [...assignmentQueries.all(), 'detail'] as const,
  detail: (id: number) =>
    queryOptions({
      queryKey: [...assignmentQueries.details(), id] as const,
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${id}`, assignmentDetailResponse, { signal }),
    }),
  /** What hangs off one assignment, keyed ['assignments', id, …]; other features build their
   * queryOptions on these keys so that one invalidation reaches them all. */
  scope: (id: number) => [...assignmentQueries.all(), id] as const,
  salesKey: (id: number) => [...assignmentQueries.scope(id), 'sales'] as const,
  analysisKey: (id: number) => [...assignmentQueries.scope(id), 'analysis'] as const,
};
