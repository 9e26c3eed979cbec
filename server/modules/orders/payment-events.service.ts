import { and, eq, ne, sql } from 'drizzle-orm';
import type Stripe from 'stripe';
import { db } from '../../../db/client';
import { orders, payments, webhookEvents } from '../../../db/schema/delivery';
import { enqueueMail } from '../../integrations/mail/outbox';
import { declineMessage, toMinorUnits } from '../../integrations/payments/payment-intents';
import { conflict } from '../../errors';
import { audit } from '../audit/audit.service';
import { formatMoney } from './order-view';
import { findOrder, findPaymentByIntent, lockOrder } from './orders.repo';

export type EventOutcome = 'duplicate' | 'ignored' | 'unknown_intent' | 'recorded' | 'no_change';

const HANDLED = new Set(['payment_intent.succeeded', 'payment_intent.payment_failed']);

/** Records a verified provider event, once. Everything happens in one transaction: the event id,
 * the payment, the order and the receipt e-mail commit together or not at all, so a failure lets
 * the provider's retry start afresh. A replayed event id changes nothing; a late failure never
 * undoes a success. */
export async function handlePaymentEvent(event: Stripe.Event, appOrigin: string): Promise<EventOutcome> {
  return db.transaction(async (tx) => {
    const [fresh] = await tx.insert(webhookEvents).values({ id: event.id, type: event.type }).onConflictDoNothing().returning({ id: webhookEvents.id });
    if (!fresh) return 'duplicate';
    if (!HANDLED.has(event.type)) return 'ignored';
    const intent = event.data.object as Stripe.PaymentIntent;
    const found = await findPaymentByIntent(tx, intent.id);
    if (!found) {
      // An intent of one of our orders whose attempt has not committed yet: refuse without recording
      // the event, so that the provider retries it. Anything else is not ours to record.
      const orderId = Number(intent.metadata?.orderId);
      if (Number.isSafeInteger(orderId) && orderId > 0 && orderId <= 2_147_483_647 && (await findOrder(tx, orderId))) {
        throw conflict('This payment is not on record yet; send the notification again shortly.', 'not_ready');
      }
      return 'unknown_intent';
    }
    // Order first, then payment: the same lock order as paying and accepting.
    await lockOrder(tx, found.orderId);
    const attempt = (await findPaymentByIntent(tx, intent.id))!;
    const order = (await findOrder(tx, found.orderId))!;

    if (event.type === 'payment_intent.payment_failed') {
      const message = declineMessage(intent.last_payment_error);
      const [changed] = await tx
        .update(payments)
        .set({ status: 'failed', failureMessage: message, updatedAt: sql`now()` })
        .where(and(eq(payments.id, attempt.id), ne(payments.status, 'succeeded')))
        .returning({ id: payments.id });
      if (!changed) return 'no_change';
      await audit(tx, { actorUserId: null, organisationId: order.firmOrganisationId, action: 'payment-failed', entityType: 'order', entityId: order.id, details: { eventId: event.id, providerIntentId: intent.id, message } });
      return 'recorded';
    }

    // Kept as paid whatever the amount (the provider took the money); a mismatch is logged and the
    // audit entry carries both figures for the office to check.
    const expectedMinor = toMinorUnits(attempt.amount, attempt.currency);
    if (intent.amount_received !== expectedMinor) console.warn(`payment ${intent.id}: received ${intent.amount_received}, expected ${expectedMinor}`);
    if (attempt.status !== 'succeeded') {
      await tx.update(payments).set({ status: 'succeeded', failureMessage: null, updatedAt: sql`now()` }).where(eq(payments.id, attempt.id));
    }
    const [moved] = await tx
      .update(orders)
      .set({ status: 'received', version: sql`${orders.version} + 1`, updatedAt: sql`now()` })
      .where(and(eq(orders.id, order.id), eq(orders.status, 'awaiting_payment')))
      .returning({ id: orders.id });
    await audit(tx, {
      actorUserId: null,
      organisationId: order.firmOrganisationId,
      action: 'payment-succeeded',
      entityType: 'order',
      entityId: order.id,
      details: { eventId: event.id, providerIntentId: intent.id, amountReceived: intent.amount_received, expectedMinor, orderStatus: moved ? 'received' : order.status },
    });
    if (!moved) return attempt.status === 'succeeded' ? 'no_change' : 'recorded';
    await enqueueMail(tx, {
      to: order.orderedByEmail,
      subject: `Payment received: ${order.subjectAddress}`,
      text:
        `Thank you. ${order.firmName} received your payment for order #${order.id}.\n\n` +
        `Fee: ${order.feeName}\nAmount: ${formatMoney(attempt.amount, attempt.currency)}\nSubject: ${order.subjectAddress}\n` +
        `Loan reference: ${order.loanReference}\nPayment reference: ${intent.id}\n\n` +
        `The firm will now accept the order and start the appraisal. Follow it here: ${appOrigin}/`,
    });
    return 'recorded';
  });
}
