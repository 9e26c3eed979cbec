import { pgTable, integer, text, timestamp, pgEnum, doublePrecision, jsonb, index, date, uniqueIndex } from 'drizzle-orm/pg-core';
import { organisations, users } from './organisations';
import { assignments } from './assignments';

/** The firm's fee list: what a client can order, at what price. */
export const fees = pgTable('fees', {
  id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
  firmOrganisationId: integer('firm_organisation_id').notNull().references(() => organisations.id),
  name: text('name').notNull(),
  description: text('description').notNull(),
  amount: doublePrecision('amount').notNull(),
  currency: text('currency').notNull().default('USD'),
});

export const orderStatus = pgEnum('order_status', ['awaiting_payment', 'received', 'accepted', 'declined']);

/** A lender client's order for an appraisal. It becomes an assignment when the firm accepts it. */
export const orders = pgTable(
  'orders',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    clientOrganisationId: integer('client_organisation_id').notNull().references(() => organisations.id),
    firmOrganisationId: integer('firm_organisation_id').notNull().references(() => organisations.id),
    orderedBy: integer('ordered_by').notNull().references(() => users.id),
    subjectAddress: text('subject_address').notNull(),
    intendedUse: text('intended_use').notNull(),
    loanReference: text('loan_reference').notNull(),
    dueDate: date('due_date', { mode: 'string' }).notNull(),
    feeId: integer('fee_id').notNull().references(() => fees.id),
    feeAmount: doublePrecision('fee_amount').notNull(),
    currency: text('currency').notNull(),
    status: orderStatus('status').notNull().default('awaiting_payment'),
    declineReason: text('decline_reason'),
    assignmentId: integer('assignment_id').references(() => assignments.id),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('orders_client_idx').on(t.clientOrganisationId), index('orders_firm_idx').on(t.firmOrganisationId)],
);

export const paymentStatus = pgEnum('payment_status', ['pending', 'succeeded', 'failed']);

/** One payment attempt through the payment provider (its PaymentIntent). */
export const payments = pgTable(
  'payments',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    orderId: integer('order_id').notNull().references(() => orders.id),
    providerIntentId: text('provider_intent_id').notNull(),
    amount: doublePrecision('amount').notNull(),
    currency: text('currency').notNull(),
    status: paymentStatus('status').notNull().default('pending'),
    failureMessage: text('failure_message'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('payments_intent_unique').on(t.providerIntentId), index('payments_order_idx').on(t.orderId)],
);

/** Webhook events already handled: a replayed event id changes nothing. */
export const webhookEvents = pgTable('webhook_events', {
  id: text('id').primaryKey(),
  type: text('type').notNull(),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
});

export interface ReportSnapshot {
  [key: string]: unknown;
}

/** A signed, frozen report: every input and result as JSON with its SHA-256. A database trigger
 * (migration 0004) refuses every UPDATE and DELETE: versions are never altered. */
export const reportVersions = pgTable(
  'report_versions',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    assignmentId: integer('assignment_id').notNull().references(() => assignments.id),
    versionNumber: integer('version_number').notNull(),
    snapshot: jsonb('snapshot').$type<ReportSnapshot>().notNull(),
    /** The canonical JSON text the fingerprint was taken over (kept verbatim). */
    canonicalJson: text('canonical_json').notNull(),
    sha256: text('sha256').notNull(),
    signedBy: integer('signed_by').notNull().references(() => users.id),
    signedAt: timestamp('signed_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('report_versions_number_unique').on(t.assignmentId, t.versionNumber), index('report_versions_sha_idx').on(t.sha256)],
);

export const reconsiderationStatus = pgEnum('reconsideration_status', ['open', 'value_kept', 'new_version']);

/** A client's request to reconsider the value of a delivered report, with up to five extra sales. */
export const reconsiderations = pgTable('reconsiderations', {
  id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
  reportVersionId: integer('report_version_id').notNull().references(() => reportVersions.id),
  assignmentId: integer('assignment_id').notNull().references(() => assignments.id),
  requestedBy: integer('requested_by').notNull().references(() => users.id),
  comment: text('comment').notNull(),
  extraSales: jsonb('extra_sales').$type<Record<string, unknown>[]>().notNull(),
  status: reconsiderationStatus('status').notNull().default('open'),
  response: text('response'),
  respondedBy: integer('responded_by').references(() => users.id),
  version: integer('version').notNull().default(1),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  respondedAt: timestamp('responded_at', { withTimezone: true }),
});
