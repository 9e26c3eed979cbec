import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { authQueries, authRequests, type SignInInput } from '../api/auth-queries';
import { safeNextPath } from '../lib/next-path';

/** Signs in, forgets anything cached for a previous session, loads the new user, then goes to
 * `next` (a path on this site) or home. */
export function useSignIn(next: string | null) {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: (input: SignInInput) => authRequests.signIn(input),
    onSuccess: async () => {
      queryClient.removeQueries();
      await queryClient.fetchQuery(authQueries.me());
      await navigate(safeNextPath(next), { replace: true });
    },
  });
}
