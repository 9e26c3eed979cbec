import { queryOptions } from '@tanstack/react-query';
import { configResponse } from '@contracts/config';
import { apiRequest } from '../../../lib/api-client';

/** This installation's settings the map needs (a self-hosted style, when MAP_STYLE_URL is set). */
export const configQueries = {
  all: ['config'] as const,
  installation: () => queryOptions({ queryKey: [...configQueries.all, 'installation'], queryFn: ({ signal }) => apiRequest('/api/config', configResponse, { signal }), staleTime: Infinity }),
};
