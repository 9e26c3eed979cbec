import type { QueryClient } from '@tanstack/react-query';

/**
 * Marks every cached query about one assignment's sales as stale, whichever feature owns it: keys
 * that carry the assignment's id and either belong to the assignments family (its detail carries
 * the data revision and the sale count) or mention sales, or the analysis and grid built from them.
 * Features do not import each other's query factories, so the match is on the key's words; the
 * photo and import features call this after they change sales (cover, photo count, new rows).
 */
export function invalidateAssignmentSales(queryClient: QueryClient, assignmentId: number): Promise<void> {
  return queryClient.invalidateQueries({
    predicate: ({ queryKey }) =>
      queryKey.includes(assignmentId) &&
      (queryKey[0] === 'assignments' || queryKey.some((part) => typeof part === 'string' && /sales|analysis|grid/.test(part))),
  });
}
