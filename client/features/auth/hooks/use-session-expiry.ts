import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { isApiError } from '../../../lib/api-error';
import { authQueries } from '../api/auth-queries';

/** When any request answers 401 (the session expired, or an admin deactivated the account), ask the
 * server again who is signed in; the shell then sends the visitor to sign in and back. */
export function useSessionExpiry() {
  const queryClient = useQueryClient();
  useEffect(() => {
    const meKey = authQueries.me().queryKey;
    const recheck = (error: unknown, key?: readonly unknown[]) => {
      if (!isApiError(error) || error.status !== 401) return;
      if (key && key.length === meKey.length && key.every((part, i) => part === meKey[i])) return;
      void queryClient.invalidateQueries({ queryKey: meKey });
    };
    const stopQueries = queryClient.getQueryCache().subscribe((event) => {
      if (event.type === 'updated' && event.action.type === 'error') recheck(event.action.error, event.query.queryKey);
    });
    const stopMutations = queryClient.getMutationCache().subscribe((event) => {
      if (event.type === 'updated' && event.action.type === 'error') recheck(event.action.error);
    });
    return () => {
      stopQueries();
      stopMutations();
    };
  }, [queryClient]);
}
