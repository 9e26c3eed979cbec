import { desc, eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { outboxMessages } from '../../db/schema/mail';

/** Reads the outbox table: in tests no mail transport is set, so queued messages stay there. */
export async function mailTo(address: string) {
  return db
    .select()
    .from(outboxMessages)
    .where(eq(outboxMessages.toAddress, address.toLowerCase()))
    .orderBy(desc(outboxMessages.id));
}

/** The one message sent to an address; fails when there is none or more than one. */
export async function onlyMailTo(address: string) {
  const messages = await mailTo(address);
  if (messages.length !== 1) throw new Error(`expected one e-mail to ${address}, found ${messages.length}`);
  return messages[0];
}

/** The link in a message's text and the token in its query string. */
export function linkIn(text: string): { url: URL; token: string } {
  const match = text.match(/https?:\/\/\S+/);
  if (!match) throw new Error(`no link in the e-mail: ${text}`);
  const url = new URL(match[0]);
  const token = url.searchParams.get('token');
  if (!token) throw new Error(`the link has no token=: ${match[0]}`);
  return { url, token };
}
