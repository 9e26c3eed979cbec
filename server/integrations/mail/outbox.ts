import { asc, eq, inArray, sql } from 'drizzle-orm';
import { db, type DbOrTx } from '../../../db/client';
import { outboxMessages } from '../../../db/schema/mail';
import type { MailTransport } from './transport';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

/** Queue an e-mail in the caller's transaction; the dispatcher sends it after the commit. */
export async function enqueueMail(tx: DbOrTx, mail: OutgoingMail): Promise<void> {
  await tx.insert(outboxMessages).values({ toAddress: mail.to, subject: mail.subject, textBody: mail.text });
  scheduleDispatch();
}

const MAX_ATTEMPTS = 8;
/** Backoff after the n-th failed attempt: 5 s, 10 s, 20 s … capped at 10 minutes. */
export function backoffSeconds(attempts: number): number {
  return Math.min(600, 5 * 2 ** Math.max(0, attempts - 1));
}

let transport: MailTransport | null = null;
let running: Promise<number> | null = null;
let timer: NodeJS.Timeout | null = null;

export function setMailTransport(t: MailTransport | null): void {
  transport = t;
}

function scheduleDispatch(): void {
  if (!transport || timer) return;
  timer = setTimeout(() => {
    timer = null;
    void dispatchPending().catch((err) => console.error('mail dispatch failed:', err.message));
  }, 50);
  timer.unref();
}

/** Send every due message once; returns how many were sent. Safe to call concurrently. */
export function dispatchPending(): Promise<number> {
  running ??= sendDue().finally(() => (running = null));
  return running;
}

async function sendDue(): Promise<number> {
  if (!transport) return 0;
  // Claim due rows with a short lease, skipping rows another instance holds: with several app
  // instances each message is still sent by one of them.
  const claimed = await db.execute<{ id: number }>(sql`
    update ${outboxMessages} set next_attempt_at = now() + interval '2 minutes'
    where id in (
      select id from ${outboxMessages}
      where status = 'queued' and next_attempt_at <= now()
      order by id limit 100
      for update skip locked)
    returning id`);
  if (claimed.rows.length === 0) return 0;
  const due = await db
    .select()
    .from(outboxMessages)
    .where(inArray(outboxMessages.id, claimed.rows.map((r) => r.id)))
    .orderBy(asc(outboxMessages.id));
  let sent = 0;
  for (const message of due) {
    try {
      await transport.send({ to: message.toAddress, subject: message.subject, text: message.textBody });
      await db
        .update(outboxMessages)
        .set({ status: 'sent', sentAt: sql`now()`, attempts: message.attempts + 1, lastError: null })
        .where(eq(outboxMessages.id, message.id));
      sent++;
    } catch (err) {
      const attempts = message.attempts + 1;
      await db
        .update(outboxMessages)
        .set({
          attempts,
          lastError: (err as Error).message.slice(0, 500),
          status: attempts >= MAX_ATTEMPTS ? 'failed' : 'queued',
          nextAttemptAt: sql`now() + make_interval(secs => ${backoffSeconds(attempts)})`,
        })
        .where(eq(outboxMessages.id, message.id));
    }
  }
  return sent;
}

/** Start the periodic retry loop (server process only, not in tests that import createApp). */
export function startMailDispatcher(intervalMs = 5000): () => void {
  const handle = setInterval(() => void dispatchPending().catch(() => undefined), intervalMs);
  handle.unref();
  return () => clearInterval(handle);
}
