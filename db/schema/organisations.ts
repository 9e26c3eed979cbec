import { pgTable, integer, text, timestamp, pgEnum, boolean, uniqueIndex, index } from 'drizzle-orm/pg-core';

export const organisationKind = pgEnum('organisation_kind', ['firm', 'lender']);
export const userRole = pgEnum('user_role', ['appraiser', 'reviewer', 'client', 'admin']);

/** The appraisal firm and its lender clients. */
export const organisations = pgTable(
  'organisations',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    name: text('name').notNull(),
    kind: organisationKind('kind').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('organisations_name_unique').on(t.name)],
);

export const users = pgTable(
  'users',
  {
    // "by default" rather than "always": lucia's adapter types want an insertable id.
    id: integer('id').primaryKey().generatedByDefaultAsIdentity(),
    email: text('email').notNull(),
    name: text('name').notNull(),
    role: userRole('role').notNull(),
    organisationId: integer('organisation_id').notNull().references(() => organisations.id),
    passwordHash: text('password_hash'),
    active: boolean('active').notNull().default(true),
    licenceNumber: text('licence_number'),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('users_email_unique').on(t.email), index('users_organisation_idx').on(t.organisationId)],
);
