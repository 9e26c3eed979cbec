import type { QueryClient, QueryKey } from '@tanstack/react-query';

/**
 * After a change that ripples through an assignment (a status change, a sale excluded or kept),
 * reloads the families of queries the page names (each feature's `all()` key) and any other cached
 * query about this assignment, such as another step's analysis or sales list, whose key holds its id.
 */
export function refreshAssignmentCaches(queryClient: QueryClient, assignmentId: number, families: readonly QueryKey[]): Promise<unknown> {
  return Promise.all([
    ...families.map((queryKey) => queryClient.invalidateQueries({ queryKey })),
    queryClient.invalidateQueries({ predicate: (query) => query.queryKey.includes(assignmentId) }),
  ]);
}
