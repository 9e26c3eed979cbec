import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { analysisWireResponse } from '@contracts/analysis';
import { assignmentSchema } from '@contracts/assignments';
import { saleListResponse } from '@contracts/sales';
import { apiRequest } from '../../../lib/api-client';
import { assignmentQueries } from '../../assignments/api/assignment-queries';

/** The market analysis and what it needs to name its sales, on the assignment's own keys so that
 * any change to the assignment's data (which invalidates ['assignments', id]) refits it. */
export const analysisQueries = {
  analysis: (assignmentId: number) =>
    queryOptions({
      queryKey: assignmentQueries.analysisKey(assignmentId),
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${assignmentId}/analysis`, analysisWireResponse, { signal }),
    }),
  /** The sales list, read here only for addresses and recorded prices (a key of its own under the
   * sales key, so that the comparables step's list is never overwritten by this one). */
  saleNames: (assignmentId: number) =>
    queryOptions({
      queryKey: [...assignmentQueries.salesKey(assignmentId), 'names'] as const,
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${assignmentId}/sales`, saleListResponse, { signal }),
      select: (data) => data.sales,
    }),
};

const assignmentResponse = z.object({ assignment: assignmentSchema });

export const analysisRequests = {
  /** Turns time-adjusted prices on or off; a stale `version` is refused with 409. */
  setTimeAdjustment: (assignmentId: number, timeAdjustment: boolean, version: number) =>
    apiRequest(`/api/assignments/${assignmentId}`, assignmentResponse, { method: 'PATCH', body: { timeAdjustment, version } }),
};
