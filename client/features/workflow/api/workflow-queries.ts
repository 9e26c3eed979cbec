import { queryOptions } from '@tanstack/react-query';
import { timelineResponse, transitionResponse, type WorkflowAction } from '@contracts/review';
import { apiRequest } from '../../../lib/api-client';

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
