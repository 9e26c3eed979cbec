import { useMutation } from '@tanstack/react-query';
import { workflowRequests, type TransitionInput } from '../api/workflow-queries';

/** Moves an assignment along the workflow. Success and refusal both call `onSettled`, so that the page
 * reloads what the status touches (the assignment, its grid, the timeline, the review queue): a
 * refusal often means the page's copy is out of date. */
export function useTransition(assignmentId: number, onSettled: () => Promise<unknown>) {
  return useMutation({
    mutationFn: (input: TransitionInput) => workflowRequests.transition(assignmentId, input),
    onSettled,
  });
}
