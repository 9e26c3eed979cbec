import { useMutation, useQueryClient } from '@tanstack/react-query';
import { teamQueries, teamRequests, type MemberUpdate } from '../api/team-queries';

/** Changes a member's role or active flag, sending the version the admin saw. A stale version
 * comes back as 409; the caller shows the server's message and offers a reload. */
export function useUpdateMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: number; change: MemberUpdate }) => teamRequests.update(id, change),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamQueries.members().queryKey }),
  });
}
