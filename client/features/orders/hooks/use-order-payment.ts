import { useEffect, useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { orderQueries, orderRequests, type TestCard } from '../api/order-queries';

/** How often the order is asked again while the provider confirms, and when to say it is slow. */
const POLL_MS = 1_000;
const SLOW_AFTER_MS = 20_000;

export type PaymentPhase = 'idle' | 'confirming' | 'paid' | 'failed-later';

/**
 * Paying an order. The server answers 402 at once when the card is declined (the order stays
 * unpaid); otherwise 202 "processing": the payment is recorded when the provider's signed webhook
 * arrives, so the order is asked again every second until it shows paid (or a failed attempt).
 */
export function useOrderPayment(orderId: number) {
  const queryClient = useQueryClient();
  const [confirmingSince, setConfirmingSince] = useState<number | null>(null);
  /** Attempts that had already failed before this payment: only a new failure counts. */
  const [failedBefore, setFailedBefore] = useState<ReadonlySet<number>>(new Set());
  const [slow, setSlow] = useState(false);
  const detail = useQuery({
    ...orderQueries.detail(orderId),
    refetchInterval: (query) => (confirmingSince !== null && query.state.data?.order.status === 'awaiting_payment' ? POLL_MS : false),
  });

  const pay = useMutation({
    mutationFn: (card: TestCard) => orderRequests.pay(orderId, card),
    onMutate: () => {
      const attempts = queryClient.getQueryData(orderQueries.detail(orderId).queryKey)?.payments ?? [];
      setFailedBefore(new Set(attempts.filter((p) => p.status === 'failed').map((p) => p.id)));
      setConfirmingSince(null);
      setSlow(false);
    },
    onSuccess: () => setConfirmingSince(Date.now()),
    // A declined card leaves a failed attempt on the order's timeline: show it.
    onError: () => void queryClient.invalidateQueries({ queryKey: orderQueries.detail(orderId).queryKey }),
  });

  const order = detail.data?.order;
  const latest = detail.data?.payments.at(-1);
  const confirming = confirmingSince !== null;
  let phase: PaymentPhase = 'idle';
  if (order && order.status !== 'awaiting_payment') phase = 'paid';
  else if (confirming && latest?.status === 'failed' && !failedBefore.has(latest.id)) phase = 'failed-later';
  else if (confirming) phase = 'confirming';

  useEffect(() => {
    if (phase !== 'confirming') return;
    const timer = window.setTimeout(() => setSlow(true), SLOW_AFTER_MS);
    return () => window.clearTimeout(timer);
  }, [phase]);

  // Once paid, every list that shows this order is out of date.
  useEffect(() => {
    if (phase === 'paid' && confirming) void queryClient.invalidateQueries({ queryKey: orderQueries.list().queryKey });
  }, [phase, confirming, queryClient]);

  return { detail, pay, phase, slow, failureMessage: phase === 'failed-later' ? latest?.failureMessage ?? 'The card was declined.' : null };
}
