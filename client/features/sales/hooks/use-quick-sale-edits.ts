import { useCallback, useState } from 'react';
import { describeError, isApiError } from '../../../lib/api-error';
import type { CompRow } from '../lib/comp-rows';
import { useSaleMutations } from './use-sale-mutations';

/**
 * One-gesture edits that need no form: the "In grid" switch and dragging a marker. Each sends the
 * sale's version; on a conflict the list is reloaded (by the mutation) and the person is told to
 * look again, since their gesture was made on data that has since changed.
 */
export function useQuickSaleEdits(assignmentId: number) {
  const { update } = useSaleMutations(assignmentId);
  const [pendingIds, setPendingIds] = useState<ReadonlySet<number>>(new Set());
  const [problem, setProblem] = useState<string | null>(null);

  const send = useCallback(
    (saleId: number, body: Parameters<typeof update.mutate>[0]['body']) => {
      setProblem(null);
      setPendingIds((ids) => new Set(ids).add(saleId));
      update.mutate(
        { saleId, body },
        {
          onError: (error) =>
            setProblem(
              isApiError(error) && error.code === 'stale_version'
                ? 'That sale was changed by someone else a moment ago. The list now shows their version; make your change again if it still applies.'
                : describeError(error),
            ),
          onSettled: () =>
            setPendingIds((ids) => {
              const next = new Set(ids);
              next.delete(saleId);
              return next;
            }),
        },
      );
    },
    // update.mutate is stable across renders.
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [assignmentId],
  );

  const toggleGrid = useCallback((row: CompRow) => send(row.sale.id, { inGrid: !row.sale.inGrid, version: row.sale.version }), [send]);
  const moveSale = useCallback((row: CompRow, at: { lon: number; lat: number }) => send(row.sale.id, { lon: at.lon, lat: at.lat, version: row.sale.version }), [send]);
  return { toggleGrid, moveSale, pendingIds, problem, dismissProblem: () => setProblem(null) };
}
