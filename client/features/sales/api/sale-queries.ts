import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { analysisWireResponse } from '@contracts/analysis';
import { saleCreate, saleListResponse, saleSchema, saleUpdate } from '@contracts/sales';
import { apiRequest } from '../../../lib/api-client';
import { assignmentQueries } from '../../assignments/api/assignment-queries';

/** Query keys and fetchers of the comp set, under the assignment's own key:
 * ['assignments', id, 'sales'] and ['assignments', id, 'analysis']. */
export const saleQueries = {
  list: (assignmentId: number) =>
    queryOptions({
      queryKey: assignmentQueries.salesKey(assignmentId),
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${assignmentId}/sales`, saleListResponse, { signal }),
    }),
  /** The per-neighbourhood fits: residuals colour the map, flags fill the table. */
  analysis: (assignmentId: number) =>
    queryOptions({
      queryKey: assignmentQueries.analysisKey(assignmentId),
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${assignmentId}/analysis`, analysisWireResponse, { signal }),
    }),
};

/** The comp set as a CSV file (the server neutralises formula-like text), for a download link. */
export const salesCsvUrl = (assignmentId: number) => `/api/assignments/${assignmentId}/sales.csv`;

export type SaleCreateInput = z.input<typeof saleCreate>;
export type SaleUpdateInput = z.input<typeof saleUpdate>;
const saleAnswer = z.object({ sale: saleSchema });

export const saleRequests = {
  create: (assignmentId: number, body: SaleCreateInput) =>
    apiRequest(`/api/assignments/${assignmentId}/sales`, saleAnswer, { method: 'POST', body }).then((r) => r.sale),
  update: (assignmentId: number, saleId: number, body: SaleUpdateInput) =>
    apiRequest(`/api/assignments/${assignmentId}/sales/${saleId}`, saleAnswer, { method: 'PATCH', body }).then((r) => r.sale),
  remove: (assignmentId: number, saleId: number, version: number) =>
    apiRequest(`/api/assignments/${assignmentId}/sales/${saleId}?version=${version}`, null, { method: 'DELETE' }),
};
