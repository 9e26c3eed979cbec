import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import {
  acceptRequest,
  declineRequest,
  feeListResponse,
  orderDetailResponse,
  orderInput,
  orderListResponse,
  payResponse,
} from '@contracts/orders';
import { teamResponse } from '@contracts/users';
import { apiRequest } from '../../../lib/api-client';

/** Query keys and fetchers of the orders feature, general → specific: ['orders'] clears them all. */
export const orderQueries = {
  all: () => ['orders'] as const,
  list: () =>
    queryOptions({
      queryKey: [...orderQueries.all(), 'list'] as const,
      queryFn: ({ signal }) => apiRequest('/api/orders', orderListResponse, { signal }),
      select: (data) => data.orders,
    }),
  detail: (id: number) =>
    queryOptions({
      queryKey: [...orderQueries.all(), 'detail', id] as const,
      queryFn: ({ signal }) => apiRequest(`/api/orders/${id}`, orderDetailResponse, { signal }),
    }),
  fees: () =>
    queryOptions({
      queryKey: [...orderQueries.all(), 'fees'] as const,
      queryFn: ({ signal }) => apiRequest('/api/fees', feeListResponse, { signal }),
      select: (data) => data.fees,
      staleTime: 5 * 60_000,
    }),
  /** The firm's active appraisers, for an admin who accepts an order on someone's behalf. */
  appraisers: () =>
    queryOptions({
      queryKey: [...orderQueries.all(), 'appraisers'] as const,
      queryFn: ({ signal }) => apiRequest('/api/users', teamResponse, { signal }),
      select: (data) => data.users.filter((u) => u.role === 'appraiser' && u.active),
      staleTime: 60_000,
    }),
};

export type PlaceOrderInput = z.input<typeof orderInput>;
export type AcceptInput = z.input<typeof acceptRequest>;
export type DeclineInput = z.input<typeof declineRequest>;

/** The test cards the local fake provider understands (see the payment step for why). */
export type TestCard = 'pm_card_visa' | 'pm_card_chargeDeclined';

export const orderRequests = {
  place: (body: PlaceOrderInput) => apiRequest('/api/orders', orderDetailResponse, { method: 'POST', body }),
  pay: (id: number, paymentMethod: TestCard) => apiRequest(`/api/orders/${id}/pay`, payResponse, { method: 'POST', body: { paymentMethod } }),
  accept: (id: number, body: AcceptInput) => apiRequest(`/api/orders/${id}/accept`, orderDetailResponse, { method: 'POST', body }),
  decline: (id: number, body: DeclineInput) => apiRequest(`/api/orders/${id}/decline`, orderDetailResponse, { method: 'POST', body }),
};
