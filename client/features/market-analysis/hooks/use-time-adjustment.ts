import { useMutation, useQueryClient } from '@tanstack/react-query';
import { isApiError } from '../../../lib/api-error';
import { assignmentQueries } from '../../assignments/api/assignment-queries';
import { analysisRequests } from '../api/analysis-queries';

/** What the switch tells the person after a refused change, in words. */
export function timeAdjustmentRefusal(error: unknown): string {
  if (isApiError(error) && error.code === 'stale_version') {
    return 'Someone changed this assignment while you had it open, so your switch was not saved. The page now shows the assignment as it is; switch again if you still want to.';
  }
  return isApiError(error) ? error.message : 'The change did not go through. Try again.';
}

/** Switches time-adjusted prices on or off with the assignment's version. Either way (saved or
 * refused with 409) the assignment and its analysis are fetched again, so the page shows what the
 * server holds. */
export function useTimeAdjustment(assignmentId: number, version: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (on: boolean) => analysisRequests.setTimeAdjustment(assignmentId, on, version),
    onSettled: (_data, error) => {
      if (error && !(isApiError(error) && error.status === 409)) return;
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: assignmentQueries.detail(assignmentId).queryKey }),
        queryClient.invalidateQueries({ queryKey: assignmentQueries.scope(assignmentId) }),
      ]);
    },
  });
}
