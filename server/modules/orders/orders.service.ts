import { z } from 'zod';
import { db, type DbOrTx } from '../../../db/client';
import { orders, payments } from '../../../db/schema/delivery';
import type { SessionUser } from '../../contracts/auth';
import type { orderInput } from '../../contracts/orders';
import { forbidden, notFound, unprocessable } from '../../errors';
import { enqueueMail } from '../../integrations/mail/outbox';
import { createPaymentIntent } from '../../integrations/payments/payment-intents';
import { audit } from '../audit/audit.service';
import { formatMoney, orderView, paymentView, type AssignmentProgress } from './order-view';
import { assignmentProgress, findFee, findOrder, listFees, listOrdersOf, orderDesk, paymentsOf, signedReportsOf, type OrderRow } from './orders.repo';

/** A lender's staff see their organisation's orders; the firm's admins and appraisers see the orders
 * placed with the firm. Anyone else gets "not found", so that other organisations' ids reveal nothing. */
export function maySee(user: SessionUser, order: Pick<OrderRow, 'clientOrganisationId' | 'firmOrganisationId'>): boolean {
  if (user.role === 'client') return user.organisationKind === 'lender' && order.clientOrganisationId === user.organisationId;
  if (user.role === 'admin' || user.role === 'appraiser') return user.organisationKind === 'firm' && order.firmOrganisationId === user.organisationId;
  return false;
}

export async function loadOrderFor(tx: DbOrTx, user: SessionUser, id: number): Promise<OrderRow> {
  const order = await findOrder(tx, id);
  if (!order || !maySee(user, order)) throw notFound('That order');
  return order;
}

/** A lender may order from any firm's list; the firm's own staff see their list. */
export async function feesFor(user: SessionUser) {
  return listFees(db, user.organisationKind === 'firm' ? user.organisationId : undefined);
}

export async function placeOrder(user: SessionUser, input: z.infer<typeof orderInput>, appOrigin: string) {
  if (user.organisationKind !== 'lender') throw forbidden('Only a lender’s staff can order appraisals.');
  const fee = await findFee(db, input.feeId);
  if (!fee) throw unprocessable('Pick a fee from the list.', { feeId: 'Not on any fee list.' });
  // One transaction around the provider call: if the PaymentIntent cannot be created, no order, no
  // e-mail and no payment row remain. (An intent created just before a failed commit is never
  // confirmed, so it charges nothing.)
  const orderId = await db.transaction(async (tx) => {
    const [order] = await tx
      .insert(orders)
      .values({
        ...input,
        clientOrganisationId: user.organisationId,
        firmOrganisationId: fee.firmOrganisationId,
        orderedBy: user.id,
        feeAmount: fee.amount,
        currency: fee.currency,
      })
      .returning({ id: orders.id });
    const price = formatMoney(fee.amount, fee.currency);
    for (const person of await orderDesk(tx, fee.firmOrganisationId)) {
      await enqueueMail(tx, {
        to: person.email,
        subject: `New order: ${input.subjectAddress}`,
        text:
          `${user.name} of ${user.organisationName} ordered an appraisal (order #${order.id}).\n\n` +
          `Subject: ${input.subjectAddress}\nIntended use: ${input.intendedUse}\nLoan reference: ${input.loanReference}\n` +
          `Due: ${input.dueDate}\nFee: ${fee.name}, ${price}\n\n` +
          `It can be accepted once the fee is paid: ${appOrigin}/orders`,
      });
    }
    const intent = await createPaymentIntent({
      amount: fee.amount,
      currency: fee.currency,
      orderId: order.id,
      description: `${fee.name}: ${input.subjectAddress} (order #${order.id})`,
    });
    await tx.insert(payments).values({ orderId: order.id, providerIntentId: intent.id, amount: fee.amount, currency: fee.currency });
    await audit(tx, {
      actorUserId: user.id,
      organisationId: user.organisationId,
      action: 'order-placed',
      entityType: 'order',
      entityId: order.id,
      details: { ...input, feeAmount: fee.amount, currency: fee.currency, providerIntentId: intent.id },
    });
    return order.id;
  });
  return getOrder(user, orderId);
}

async function withTimelines(tx: DbOrTx, user: SessionUser, rows: OrderRow[]) {
  const attempts = await paymentsOf(tx, rows.map((o) => o.id));
  const assignmentIds = rows.flatMap((o) => (o.assignmentId ? [o.assignmentId] : []));
  const progress = (await assignmentProgress(tx, assignmentIds)) as AssignmentProgress[];
  const reports = await signedReportsOf(tx, assignmentIds, { side: user.role === 'client' ? 'client' : 'firm', organisationId: user.organisationId });
  return rows.map((order) =>
    orderView(
      user,
      order,
      attempts.filter((p) => p.orderId === order.id),
      progress.find((a) => a.id === order.assignmentId),
      reports.filter((r) => r.assignmentId === order.assignmentId),
    ),
  );
}

export async function listOrdersFor(user: SessionUser) {
  const rows = await listOrdersOf(db, user.role === 'client' ? 'client' : 'firm', user.organisationId);
  return withTimelines(db, user, rows);
}

export async function getOrder(user: SessionUser, id: number) {
  const order = await loadOrderFor(db, user, id);
  const [view] = await withTimelines(db, user, [order]);
  const attempts = await paymentsOf(db, [id]);
  return { order: view, payments: attempts.map(paymentView) };
}
