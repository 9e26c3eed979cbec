import { queryOptions } from '@tanstack/react-query';
import { orderListResponse } from '@contracts/orders';
import { apiRequest } from '../../../lib/api-client';

/** Query keys and fetchers of the orders feature, general → specific. */
export const orderQueries = {
  all: () => ['orders'] as const,
  list: () =>
    queryOptions({
      queryKey: [...orderQueries.all(), 'list'] as const,
      queryFn: ({ signal }) => apiRequest('/api/orders', orderListResponse, { signal }),
      select: (data) => data.orders,
    }),
};
