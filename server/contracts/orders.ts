import { z } from 'zod';
import { isoDate } from './assignments';

/** Today's calendar day where the server runs (YYYY-MM-DD). */
export function todayIso(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

const text = (max: number, label: string) => z.string().trim().min(1, `Enter the ${label}.`).max(max);

export const feeSchema = z.object({
  id: z.number().int(),
  firmOrganisationId: z.number().int(),
  firmName: z.string(),
  name: z.string(),
  description: z.string(),
  amount: z.number(),
  currency: z.string(),
});
export type Fee = z.infer<typeof feeSchema>;
export const feeListResponse = z.object({ fees: z.array(feeSchema) });

export const orderStatuses = ['awaiting_payment', 'received', 'accepted', 'declined'] as const;
export type OrderStatus = (typeof orderStatuses)[number];
export const orderStatusLabels: Record<OrderStatus, string> = {
  awaiting_payment: 'Awaiting payment',
  received: 'Paid — waiting for the firm',
  accepted: 'Accepted',
  declined: 'Declined',
};

export const orderInput = z.object({
  subjectAddress: text(200, 'subject address'),
  intendedUse: text(300, 'intended use'),
  loanReference: text(80, 'loan reference'),
  dueDate: isoDate.refine((day) => day >= todayIso(), 'The due date cannot be in the past.'),
  feeId: z.number().int().positive(),
});

/** A payment method token from the payment provider's card form (test cards: pm_card_visa …). */
export const payRequest = z.object({
  paymentMethod: z.string().trim().regex(/^pm_[A-Za-z0-9_]{1,120}$/, 'Not a payment method from the card form.'),
});

export const acceptRequest = z.object({
  version: z.number().int().positive(),
  /** Required when an admin accepts: the appraiser who will hold the assignment. */
  appraiserUserId: z.number().int().positive().optional(),
});

export const declineRequest = z.object({
  version: z.number().int().positive(),
  reason: z.string().trim().min(3, 'Say why the order is declined.').max(2000),
});

export const timelineKinds = ['placed', 'payment_failed', 'paid', 'accepted', 'declined', 'assignment'] as const;
export const timelineEntrySchema = z.object({
  kind: z.enum(timelineKinds),
  label: z.string(),
  at: z.coerce.date().nullable(),
  note: z.string().nullable(),
});
export type TimelineEntry = z.infer<typeof timelineEntrySchema>;

export const paymentSchema = z.object({
  id: z.number().int(),
  status: z.enum(['pending', 'succeeded', 'failed']),
  amount: z.number(),
  currency: z.string(),
  failureMessage: z.string().nullable(),
  createdAt: z.coerce.date(),
});

/** A signed report version of the assignment an order became, as the order view names it. */
export const orderReportSchema = z.object({
  id: z.number().int(),
  versionNumber: z.number().int(),
  signedAt: z.coerce.date(),
});
export type OrderReport = z.infer<typeof orderReportSchema>;

export const orderSchema = z.object({
  id: z.number().int(),
  clientOrganisationId: z.number().int(),
  clientOrganisationName: z.string(),
  firmOrganisationId: z.number().int(),
  firmName: z.string(),
  orderedByName: z.string(),
  subjectAddress: z.string(),
  intendedUse: z.string(),
  loanReference: z.string(),
  dueDate: z.string(),
  feeId: z.number().int(),
  feeName: z.string(),
  feeAmount: z.number(),
  currency: z.string(),
  status: z.enum(orderStatuses),
  declineReason: z.string().nullable(),
  /** Set for the firm's staff once accepted; always null for clients (they never open assignments). */
  assignmentId: z.number().int().nullable(),
  /** The signed report versions of that assignment the viewer may read, newest first (a client
   * reads them only while the assignment is still for their organisation); empty until signed. */
  reports: z.array(orderReportSchema),
  version: z.number().int(),
  createdAt: z.coerce.date(),
  updatedAt: z.coerce.date(),
  timeline: z.array(timelineEntrySchema),
});
export type Order = z.infer<typeof orderSchema>;

export const orderListResponse = z.object({ orders: z.array(orderSchema) });
export const orderResponse = z.object({ order: orderSchema });
export const orderDetailResponse = z.object({ order: orderSchema, payments: z.array(paymentSchema) });
export const payResponse = z.object({ status: z.literal('processing') });
