import { pgTable, bigint, integer, text, timestamp, jsonb, index } from 'drizzle-orm/pg-core';
import { organisations, users } from './organisations';

/** Append-only record of every change: who, when, what. */
export const auditEvents = pgTable(
  'audit_events',
  {
    id: bigint('id', { mode: 'number' }).primaryKey().generatedAlwaysAsIdentity(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    actorUserId: integer('actor_user_id').references(() => users.id),
    organisationId: integer('organisation_id').references(() => organisations.id),
    action: text('action').notNull(),
    entityType: text('entity_type').notNull(),
    entityId: text('entity_id').notNull(),
    details: jsonb('details').$type<Record<string, unknown>>().notNull().default({}),
  },
  (t) => [index('audit_entity_idx').on(t.entityType, t.entityId), index('audit_at_idx').on(t.at)],
);
