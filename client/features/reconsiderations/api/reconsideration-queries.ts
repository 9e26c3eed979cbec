import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { reconsiderationRequest, reconsiderationResponseRequest, reconsiderationSchema } from '@contracts/reconsiderations';
import { apiRequest } from '../../../lib/api-client';

/** GET answers of both lists: the server sends { reconsiderations: [...] }. */
const listResponse = z.object({ reconsiderations: z.array(reconsiderationSchema) });
const filed = z.object({ id: z.number().int() });
const ok = z.object({ ok: z.literal(true) });

/** Query keys and fetchers of the reconsiderations feature, general → specific. */
export const reconsiderationQueries = {
  all: () => ['reconsiderations'] as const,
  /** The requests filed on one signed version (a client sees their own organisation's). */
  ofReport: (reportVersionId: number) =>
    queryOptions({
      queryKey: [...reconsiderationQueries.all(), 'report', reportVersionId] as const,
      queryFn: ({ signal }) => apiRequest(`/api/reports/${reportVersionId}/reconsiderations`, listResponse, { signal }),
      select: (data) => data.reconsiderations,
    }),
  /** Every request on an assignment, with the effect of the extra sales on the fit (firm view). */
  ofAssignment: (assignmentId: number) =>
    queryOptions({
      queryKey: [...reconsiderationQueries.all(), 'assignment', assignmentId] as const,
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${assignmentId}/reconsiderations`, listResponse, { signal }),
      select: (data) => data.reconsiderations,
    }),
};

export type ReconsiderationInput = z.input<typeof reconsiderationRequest>;
export type ReconsiderationAnswer = z.input<typeof reconsiderationResponseRequest>;

export const reconsiderationRequests = {
  file: (reportVersionId: number, body: ReconsiderationInput) => apiRequest(`/api/reports/${reportVersionId}/reconsiderations`, filed, { method: 'POST', body }),
  respond: (id: number, body: ReconsiderationAnswer) => apiRequest(`/api/reconsiderations/${id}/respond`, ok, { method: 'POST', body }),
};
