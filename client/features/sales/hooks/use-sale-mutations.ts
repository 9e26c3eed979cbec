import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Sale, saleListResponse } from '@contracts/sales';
import type { z } from 'zod';
import { invalidateAssignmentSales } from '../../../lib/assignment-cache';
import { saleQueries, saleRequests, type SaleCreateInput, type SaleUpdateInput } from '../api/sale-queries';

type SaleList = z.infer<typeof saleListResponse>;

/** Adds, changes and (softly) deletes the sales of one assignment; every success refreshes the
 * list, the analysis, the assignment and the grid. A 409 reaches the caller untouched. */
export function useSaleMutations(assignmentId: number) {
  const queryClient = useQueryClient();
  const listKey = saleQueries.list(assignmentId).queryKey;

  // The answer is the sale as saved: put it in the list at once so the row and marker do not flicker.
  const replaceInList = (sale: Sale) =>
    queryClient.setQueryData<SaleList>(listKey, (list) => (list ? { ...list, sales: list.sales.map((s) => (s.id === sale.id ? sale : s)) } : list));
  // The list, the analysis fitted on it, the assignment (revision, count) and the grid.
  const refresh = () => invalidateAssignmentSales(queryClient, assignmentId);

  const create = useMutation({
    mutationFn: (body: SaleCreateInput) => saleRequests.create(assignmentId, body),
    onSettled: refresh,
  });
  const update = useMutation({
    mutationFn: ({ saleId, body }: { saleId: number; body: SaleUpdateInput }) => saleRequests.update(assignmentId, saleId, body),
    onSuccess: replaceInList,
    onSettled: refresh,
  });
  const remove = useMutation({
    mutationFn: ({ saleId, version }: { saleId: number; version: number }) => saleRequests.remove(assignmentId, saleId, version),
    onSettled: refresh,
  });
  return { create, update, remove };
}
