import type { payments } from '../../../db/schema/delivery';
import type { SessionUser } from '../../contracts/auth';
import type { AssignmentStatus } from '../../contracts/assignments';
import type { Order, OrderReport, TimelineEntry } from '../../contracts/orders';
import type { OrderRow } from './orders.repo';

/** How an order is shown: its fields and a timeline built from what the database already holds
 * (the order, its payment attempts, and — once accepted — the assignment's status in coarse words). */

type PaymentRow = typeof payments.$inferSelect;
export interface AssignmentProgress {
  id: number;
  status: AssignmentStatus;
  changedAt: Date | null;
}

/** What a lender may know about work in progress: where it stands, never its data. */
export const coarseAssignmentStatus: Record<AssignmentStatus, string> = {
  in_progress: 'Appraisal under way',
  revisions_requested: 'Appraisal under way',
  in_review: 'In quality review',
  approved: 'In quality review',
  signed: 'Report delivered',
};

export function orderTimeline(order: OrderRow, attempts: readonly PaymentRow[], progress: AssignmentProgress | undefined): TimelineEntry[] {
  const entries: TimelineEntry[] = [{ kind: 'placed', label: `Ordered by ${order.orderedByName}`, at: order.createdAt, note: null }];
  for (const attempt of attempts) {
    if (attempt.status === 'failed') entries.push({ kind: 'payment_failed', label: 'Payment failed', at: attempt.updatedAt, note: attempt.failureMessage });
    if (attempt.status === 'succeeded') entries.push({ kind: 'paid', label: 'Fee paid', at: attempt.updatedAt, note: null });
  }
  // Accepted and declined are final: the row's last change is the decision.
  if (order.status === 'accepted') entries.push({ kind: 'accepted', label: 'Accepted by the firm', at: order.updatedAt, note: null });
  if (order.status === 'declined') entries.push({ kind: 'declined', label: 'Declined by the firm', at: order.updatedAt, note: order.declineReason });
  if (order.status === 'accepted' && progress) {
    entries.push({ kind: 'assignment', label: coarseAssignmentStatus[progress.status], at: progress.changedAt, note: null });
  }
  return entries;
}

/** `reports`: the signed versions of the order's assignment the user may read, newest first. */
export function orderView(user: SessionUser, order: OrderRow, attempts: readonly PaymentRow[], progress: AssignmentProgress | undefined, reports: readonly OrderReport[]): Order {
  const { orderedBy: _by, orderedByEmail: _email, ...fields } = order;
  return {
    ...fields,
    assignmentId: user.role === 'client' ? null : order.assignmentId,
    reports: reports.map(({ id, versionNumber, signedAt }) => ({ id, versionNumber, signedAt })),
    timeline: orderTimeline(order, attempts, progress),
  };
}

export function paymentView(attempt: PaymentRow) {
  return {
    id: attempt.id,
    status: attempt.status,
    amount: attempt.amount,
    currency: attempt.currency,
    failureMessage: attempt.failureMessage,
    createdAt: attempt.createdAt,
  };
}

export function formatMoney(amount: number, currency: string): string {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(amount);
}
