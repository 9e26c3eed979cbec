import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { reconsiderationFiledResponse, reconsiderationListResponse, reconsiderationRequest, reconsiderationResponseRequest } from '@contracts/reconsiderations';
import { okResponse } from '@contracts/review';
import { apiRequest } from '../../../lib/api-client';

/** GET answers of both lists: the server sends { reconsiderations: [...] }. */

/** Query keys and fetchers of the reconsiderations feature, general → specific. */
export const reconsiderationQueries = {
  all: () => ['reconsiderations'] as const,
  /** The requests filed on one signed version (a client sees their own organisation's). */
  ofReport: (reportVersionId: number) =>
    queryOptions({
      queryKey: [...reconsiderationQueries.all(), 'report', reportVersionId] as const,
      queryFn: ({ signal }) => apiRequest(`/api/reports/${reportVersionId}/reconsiderations`, reconsiderationListResponse, { signal }),
      select: (data) => data.reconsiderations,
    }),
  /** Every request on an assignment, with the effect of the extra sales on the fit (firm view). */
  ofAssignment: (assignmentId: number) =>
    queryOptions({
      queryKey: [...reconsiderationQueries.all(), 'assignment', assignmentId] as const,
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${assignmentId}/reconsiderations`, reconsiderationListResponse, { signal }),
      select: (data) => data.reconsiderations,
    }),
};

export type ReconsiderationInput = z.input<typeof reconsiderationRequest>;
export type ReconsiderationAnswer = z.input<typeof reconsiderationResponseRequest>;

export const reconsiderationRequests = {
  file: (reportVersionId: number, body: ReconsiderationInput) => apiRequest(`/api/reports/${reportVersionId}/reconsiderations`, reconsiderationFiledResponse, { method: 'POST', body }),
  respond: (id: number, body: ReconsiderationAnswer) => apiRequest(`/api/reconsiderations/${id}/respond`, okResponse, { method: 'POST', body }),
};
