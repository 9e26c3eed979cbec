import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { AssignmentDetail } from '@contracts/assignments';
import { saleQueries } from '../api/sale-queries';
import { buildCompRows } from '../lib/comp-rows';

/** The assignment's sales and analysis, joined into the rows the table and the map show. The
 * analysis may lag or fail without hiding the sales: rows simply carry no residual until it comes. */
export function useCompSet({ assignment, subject }: AssignmentDetail) {
  const sales = useQuery(saleQueries.list(assignment.id));
  const analysis = useQuery(saleQueries.analysis(assignment.id));
  const subjectLocation = subject.lon != null && subject.lat != null ? { lon: subject.lon, lat: subject.lat } : null;
  const rows = useMemo(
    () =>
      sales.data
        ? buildCompRows({ sales: sales.data.sales, analysis: analysis.data, subjectLocation, effectiveDate: assignment.effectiveDate, areaUnit: assignment.areaUnit })
        : [],
    // subjectLocation is rebuilt each render; its two numbers are the real inputs.
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [sales.data, analysis.data, subjectLocation?.lon, subjectLocation?.lat, assignment.effectiveDate, assignment.areaUnit],
  );
  const hasFit = Boolean(analysis.data?.groups.some((g) => g.fit !== null));
  return { sales, analysis, rows, hasFit, subjectLocation };
}
