import { and, eq, ne, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../../../db/client';
import { payments } from '../../../db/schema/delivery';
import type { SessionUser } from '../../contracts/auth';
import type { payRequest } from '../../contracts/orders';
import { AppError, conflict, notFound } from '../../errors';
import { confirmPaymentIntent, createPaymentIntent } from '../../integrations/payments/payment-intents';
import { audit } from '../audit/audit.service';
import { latestPayment, lockOrder } from './orders.repo';
import { loadOrderFor } from './orders.service';

/** Confirms the order's PaymentIntent with the client's card. A decline answers 402 and leaves the
 * order unpaid; an accepted card answers "processing": the provider's webhook records the payment
 * (payment-events.service.ts), so that the record never depends on this request finishing. */
export async function payOrder(user: SessionUser, id: number, input: z.infer<typeof payRequest>) {
  // First commit the attempt to pay, so that the webhook that follows the confirmation finds it.
  const attempt = await db.transaction(async (tx) => {
    // The lock keeps two payment attempts on one order from racing each other.
    if (!(await lockOrder(tx, id))) throw notFound('That order');
    const order = await loadOrderFor(tx, user, id);
    if (order.status !== 'awaiting_payment') {
      throw conflict(order.status === 'declined' ? 'This order was declined; it cannot be paid.' : 'This order is already paid.', 'not_payable');
    }
    const latest = await latestPayment(tx, id);
    if (latest?.status === 'succeeded') throw conflict('This order is already paid.', 'not_payable');
    if (latest?.status === 'pending') return latest;
    // A declined attempt keeps its record; the next card gets a PaymentIntent of its own.
    const intent = await createPaymentIntent({
      amount: order.feeAmount,
      currency: order.currency,
      orderId: order.id,
      description: `${order.feeName}: ${order.subjectAddress} (order #${order.id})`,
    });
    const [created] = await tx.insert(payments).values({ orderId: id, providerIntentId: intent.id, amount: order.feeAmount, currency: order.currency }).returning();
    return created;
  });

  const result = await confirmPaymentIntent(attempt.providerIntentId, input.paymentMethod);
  await db.transaction(async (tx) => {
    if (result.kind === 'declined') {
      await tx
        .update(payments)
        .set({ status: 'failed', failureMessage: result.message, updatedAt: sql`now()` })
        .where(and(eq(payments.id, attempt.id), ne(payments.status, 'succeeded')));
    }
    await audit(tx, {
      actorUserId: user.id,
      organisationId: user.organisationId,
      action: result.kind === 'declined' ? 'payment-declined' : 'payment-submitted',
      entityType: 'order',
      entityId: id,
      details: { providerIntentId: attempt.providerIntentId, ...(result.kind === 'declined' ? { message: result.message } : { status: result.status }) },
    });
  });
  if (result.kind === 'declined') throw new AppError(402, 'card_declined', result.message);
  return { status: 'processing' as const };
}
