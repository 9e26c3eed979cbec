import type { Order, TimelineEntry } from '@contracts/orders';

export type OrderTone = 'pending' | 'neutral' | 'positive' | 'negative';

export const orderStatusTone: Record<Order['status'], OrderTone> = {
  awaiting_payment: 'pending',
  received: 'neutral',
  accepted: 'positive',
  declined: 'negative',
};

/** The coarse progress word the server sends once the report is signed (order-view.ts). */
export const REPORT_DELIVERED = 'Report delivered';

export function isReportDelivered(order: Order): boolean {
  return order.timeline.some((entry) => entry.kind === 'assignment' && entry.label === REPORT_DELIVERED);
}

/** The link from a delivered order to its newest signed report version, by the id the server
 * sends with the order; null until a version exists. */
export function reportLinkOf(order: Order): { href: string; label: string } | null {
  const newest = order.reports[0];
  return newest ? { href: `/reports/${newest.id}`, label: `Read the report (version ${newest.versionNumber})` } : null;
}

/** What happens next, in words, for the step the timeline has not reached yet (null: nothing). */
export function nextStepWords(order: Order, viewer: 'client' | 'firm'): string | null {
  switch (order.status) {
    case 'awaiting_payment':
      return viewer === 'client' ? 'Pay the fee to send the order to the firm' : 'Waiting for the client to pay the fee';
    case 'received':
      return viewer === 'client' ? `Waiting for ${order.firmName} to accept` : 'Accept or decline this order';
    case 'accepted':
      return isReportDelivered(order) ? null : 'Report to be signed and delivered';
    case 'declined':
      return null;
  }
}

export type EntryMark = 'done' | 'good' | 'bad' | 'progress';

export function entryMark(entry: TimelineEntry): EntryMark {
  switch (entry.kind) {
    case 'payment_failed':
    case 'declined':
      return 'bad';
    case 'paid':
    case 'accepted':
      return 'good';
    case 'assignment':
      return entry.label === REPORT_DELIVERED ? 'good' : 'progress';
    default:
      return 'done';
  }
}
