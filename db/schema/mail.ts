import { pgTable, integer, text, timestamp, pgEnum, index } from 'drizzle-orm/pg-core';

export const mailStatus = pgEnum('mail_status', ['queued', 'sent', 'failed']);

/** Every e-mail is written here first (in the same transaction as the change that causes it) and
 * sent by the dispatcher with retries and backoff, so an SMTP outage loses nothing. */
export const outboxMessages = pgTable(
  'outbox_messages',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    textBody: text('text_body').notNull(),
    status: mailStatus('status').notNull().default('queued'),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
    lastError: text('last_error'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp('sent_at', { withTimezone: true }),
  },
  (t) => [index('outbox_pending_idx').on(t.status, t.nextAttemptAt)],
);
