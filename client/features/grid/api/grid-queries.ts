import { queryOptions } from '@tanstack/react-query';
import type { z } from 'zod';
import { gridEntryUpdate, gridResponse, gridSettingsUpdate } from '@contracts/grid';
import { saleListResponse } from '@contracts/sales';
import { apiRequest } from '../../../lib/api-client';

/** Query keys and fetchers of the adjustment grid, general → specific: ['grid'] clears every grid. */
export const gridQueries = {
  all: () => ['grid'] as const,
  detail: (assignmentId: number) =>
    queryOptions({
      queryKey: [...gridQueries.all(), assignmentId] as const,
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${assignmentId}/grid`, gridResponse, { signal }),
    }),
  /** The assignment's sales, for the facts beside each grid column (floor area, sale date). */
  sales: (assignmentId: number) =>
    queryOptions({
      queryKey: [...gridQueries.all(), assignmentId, 'sales'] as const,
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${assignmentId}/sales`, saleListResponse, { signal }),
      select: (data) => data.sales,
    }),
};

export type GridSettingsChange = z.input<typeof gridSettingsUpdate>;
export type GridEntryChange = z.input<typeof gridEntryUpdate>;

/** Each write answers with the whole recomputed grid. */
export const gridRequests = {
  updateSettings: (assignmentId: number, body: GridSettingsChange) =>
    apiRequest(`/api/assignments/${assignmentId}/grid/settings`, gridResponse, { method: 'PUT', body }),
  updateEntry: (assignmentId: number, saleId: number, body: GridEntryChange) =>
    apiRequest(`/api/assignments/${assignmentId}/grid/sales/${saleId}`, gridResponse, { method: 'PUT', body }),
};
