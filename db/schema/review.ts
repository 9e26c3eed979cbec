import { pgTable, integer, text, timestamp, pgEnum, doublePrecision, jsonb, index, boolean } from 'drizzle-orm/pg-core';
import { organisations, users } from './organisations';
import { assignments, assignmentStatus, sales } from './assignments';

export interface LineItem {
  feature: 'bathrooms' | 'garage' | 'view' | 'condition' | 'lot' | 'quality' | 'other';
  amount: number;
  note: string;
}

/** The appraiser's grid choices per assignment (one row): floor-area rate, rounding, reconciliation. */
export const gridSettings = pgTable('grid_settings', {
  assignmentId: integer('assignment_id').primaryKey().references(() => assignments.id),
  /** null: use the neighbourhood fit's slope. */
  typedRate: doublePrecision('typed_rate'),
  rateJustification: text('rate_justification'),
  rateIncrement: doublePrecision('rate_increment').notNull().default(1),
  valueIncrement: doublePrecision('value_increment').notNull().default(1000),
  reconciliationComment: text('reconciliation_comment'),
  version: integer('version').notNull().default(1),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});

/** Line items and the weight override of one grid sale. */
export const gridEntries = pgTable('grid_entries', {
  saleId: integer('sale_id').primaryKey().references(() => sales.id),
  assignmentId: integer('assignment_id').notNull().references(() => assignments.id),
  lineItems: jsonb('line_items').$type<LineItem[]>().notNull().default([]),
  /** null: the default weight (1/gross %, normalised). */
  weightPct: doublePrecision('weight_pct'),
  version: integer('version').notNull().default(1),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});

/** Per-firm thresholds for the soft checks beside the grid. */
export const firmSettings = pgTable('firm_settings', {
  organisationId: integer('organisation_id').primaryKey().references(() => organisations.id),
  netLimitPct: doublePrecision('net_limit_pct').notNull().default(15),
  grossLimitPct: doublePrecision('gross_limit_pct').notNull().default(25),
  maxSaleAgeMonths: integer('max_sale_age_months').notNull().default(12),
  maxDistanceKm: doublePrecision('max_distance_km').notNull().default(1.609344),
  checkBracketing: boolean('check_bracketing').notNull().default(true),
  version: integer('version').notNull().default(1),
});

export const queryStatus = pgEnum('query_status', ['open', 'answered', 'resolved']);
export const queryMessageKind = pgEnum('query_message_kind', ['question', 'comment', 'kept', 'excluded', 'resolved', 'reopened']);

/** A reviewer's question on a sale (or on the assignment as a whole when saleId is null). */
export const reviewQueries = pgTable(
  'review_queries',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    assignmentId: integer('assignment_id').notNull().references(() => assignments.id),
    saleId: integer('sale_id').references(() => sales.id),
    raisedBy: integer('raised_by').notNull().references(() => users.id),
    status: queryStatus('status').notNull().default('open'),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('review_queries_assignment_idx').on(t.assignmentId, t.status)],
);

export const queryMessages = pgTable(
  'query_messages',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    queryId: integer('query_id').notNull().references(() => reviewQueries.id),
    authorId: integer('author_id').notNull().references(() => users.id),
    kind: queryMessageKind('kind').notNull(),
    body: text('body').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('query_messages_query_idx').on(t.queryId)],
);

/** The assignment's status timeline. */
export const statusChanges = pgTable(
  'status_changes',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    assignmentId: integer('assignment_id').notNull().references(() => assignments.id),
    fromStatus: assignmentStatus('from_status'),
    toStatus: assignmentStatus('to_status').notNull(),
    byUserId: integer('by_user_id').notNull().references(() => users.id),
    note: text('note'),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('status_changes_assignment_idx').on(t.assignmentId)],
);
