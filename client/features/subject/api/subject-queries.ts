import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { subjectSchema, type subjectUpdate } from '@contracts/assignments';
import { apiRequest } from '../../../lib/api-client';
import type { NeighbourhoodBoundaries } from '../lib/neighbourhood-at';

const subjectAnswer = z.object({ subject: subjectSchema });

export const subjectRequests = {
  save: (assignmentId: number, body: z.input<typeof subjectUpdate>) =>
    apiRequest(`/api/assignments/${assignmentId}/subject`, subjectAnswer, { method: 'PUT', body }).then((r) => r.subject),
};

/** The shipped neighbourhood boundaries (a static file of the basemap), read once per visit. */
export const basemapQueries = {
  neighbourhoods: () =>
    queryOptions({
      queryKey: ['basemap', 'neighbourhoods'] as const,
      queryFn: async ({ signal }): Promise<NeighbourhoodBoundaries> => {
        const response = await fetch('/basemap/neighbourhoods.geojson', { signal });
        if (!response.ok) throw new Error(`The neighbourhood boundaries could not be read (${response.status}).`);
        return (await response.json()) as NeighbourhoodBoundaries;
      },
      staleTime: Number.POSITIVE_INFINITY,
    }),
};
