import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { reportListResponse, reportResponse, signRequest, signResponse, verifyResponse } from '@contracts/report';
import { okResponse } from '@contracts/review';
import { apiRequest } from '../../../lib/api-client';
import { basemapLayer } from '../lib/map-projection';

/** Query keys and fetchers of the reports feature, general → specific: ['reports'] clears them all. */
export const reportQueries = {
  all: () => ['reports'] as const,
  lists: () => [...reportQueries.all(), 'list'] as const,
  /** Every signed version the user may read (a client: their organisation's). */
  list: () =>
    queryOptions({
      queryKey: [...reportQueries.lists(), 'all'] as const,
      queryFn: ({ signal }) => apiRequest('/api/reports', reportListResponse, { signal }),
      select: (data) => data.reports,
    }),
  /** The signed versions of one assignment, newest first. */
  ofAssignment: (assignmentId: number) =>
    queryOptions({
      queryKey: [...reportQueries.lists(), 'assignment', assignmentId] as const,
      queryFn: ({ signal }) => apiRequest(`/api/reports?assignmentId=${assignmentId}`, reportListResponse, { signal }),
      select: (data) => [...data.reports].sort((a, b) => b.versionNumber - a.versionNumber),
    }),
  detail: (id: number) =>
    queryOptions({
      queryKey: [...reportQueries.all(), 'detail', id] as const,
      queryFn: ({ signal }) => apiRequest(`/api/reports/${id}`, reportResponse, { signal }),
      // A signed version never changes; only `laterVersions` can grow.
      staleTime: 60_000,
    }),
  /** A layer of the demo town's basemap, shipped as a static file (no map tiles needed). */
  basemap: (layer: 'neighbourhoods' | 'coast' | 'streets' | 'parks') =>
    queryOptions({
      queryKey: [...reportQueries.all(), 'basemap', layer] as const,
      queryFn: ({ signal }) => apiRequest(`/basemap/${layer}.geojson`, basemapLayer, { signal }),
      staleTime: Infinity,
    }),
  verify: (sha256: string) =>
    queryOptions({
      queryKey: [...reportQueries.all(), 'verify', sha256.toLowerCase()] as const,
      queryFn: ({ signal }) => apiRequest(`/api/verify/${sha256}`, verifyResponse, { signal }),
    }),
};


export type SignInput = z.input<typeof signRequest>;

export const reportRequests = {
  sign: (assignmentId: number, body: SignInput) => apiRequest(`/api/assignments/${assignmentId}/sign`, signResponse, { method: 'POST', body }),
  newDraft: (assignmentId: number, body: { version: number; reason: string }) =>
    apiRequest(`/api/assignments/${assignmentId}/new-draft`, okResponse, { method: 'POST', body }),
};

export const reportPdfUrl = (id: number) => `/api/reports/${id}/pdf`;
export const reportPhotoUrl = (id: number, photoId: number, size: 'thumb' | 'display') => `/api/reports/${id}/photos/${photoId}/${size}`;
export const verifyPath = (sha256: string) => `/verify/${sha256}`;
