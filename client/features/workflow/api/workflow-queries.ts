import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { assignmentStatuses } from '@contracts/assignments';
import { timelineResponse, type WorkflowAction } from '@contracts/review';
import { apiRequest } from '../../../lib/api-client';

/** The answer of POST /api/assignments/:id/transitions (not in @contracts/review). */
const transitionResponse = z.object({ status: z.enum(assignmentStatuses), version: z.number().int() });

/** Query keys and fetchers of the workflow feature, general → specific. */
export const workflowQueries = {
  all: () => ['workflow'] as const,
  timeline: (assignmentId: number) =>
    queryOptions({
      queryKey: [...workflowQueries.all(), 'timeline', assignmentId] as const,
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${assignmentId}/timeline`, timelineResponse, { signal }),
      select: (data) => data.changes,
    }),
};

export interface TransitionInput {
  action: WorkflowAction;
  /** The assignment's version as the page read it. */
  version: number;
  note?: string;
}

export const workflowRequests = {
  transition: (assignmentId: number, body: TransitionInput) =>
    apiRequest(`/api/assignments/${assignmentId}/transitions`, transitionResponse, { method: 'POST', body }),
};
