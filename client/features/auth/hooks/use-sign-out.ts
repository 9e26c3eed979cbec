import { useMutation } from '@tanstack/react-query';
import { isApiError } from '../../../lib/api-error';
import { authRequests } from '../api/auth-queries';

/** Ends the session on the server, then loads the sign-in page afresh so that nothing the previous
 * user saw stays in this tab's memory. A 401 means the session had already ended: same outcome. */
export function useSignOut() {
  const leave = () => window.location.assign('/sign-in');
  return useMutation({
    mutationFn: () => authRequests.signOut(),
    onSuccess: leave,
    onError: (error) => {
      if (isApiError(error) && error.status === 401) leave();
    },
  });
}
