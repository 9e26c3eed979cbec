import { and, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db, type DbOrTx } from '../../../db/client';
import { orders } from '../../../db/schema/delivery';
import type { SessionUser } from '../../contracts/auth';
import { todayIso, type acceptRequest, type declineRequest } from '../../contracts/orders';
import { conflict, notFound, staleVersion, unprocessable } from '../../errors';
import { enqueueMail } from '../../integrations/mail/outbox';
import { audit } from '../audit/audit.service';
import { insertAssignment } from '../assignments/assignments.service';
import { recordStatusChange } from '../review/status-changes';
import { findActiveAppraiser, lockOrder, type OrderRow } from './orders.repo';
import { getOrder, loadOrderFor } from './orders.service';

/** The firm's answer to a paid order: accept it (it becomes an assignment) or decline it. */

async function loadForDecision(tx: DbOrTx, user: SessionUser, id: number, version: number, allowed: readonly OrderRow['status'][]) {
  if (!(await lockOrder(tx, id))) throw notFound('That order');
  const order = await loadOrderFor(tx, user, id);
  if (!allowed.includes(order.status)) {
    if (order.status === 'awaiting_payment') throw conflict('Only a paid order can be accepted; this one is still awaiting payment.', 'not_paid');
    throw conflict(`This order was already ${order.status}.`, 'already_decided');
  }
  if (order.version !== version) throw staleVersion('This order');
  return order;
}

async function pickAppraiser(tx: DbOrTx, user: SessionUser, requested: number | undefined) {
  if (user.role === 'appraiser') {
    if (requested !== undefined && requested !== user.id) {
      throw unprocessable('An appraiser accepts an order for themselves; ask an admin to assign it to a colleague.', { appraiserUserId: 'Leave this out or pick yourself.' });
    }
    return { id: user.id, email: user.email, name: user.name };
  }
  if (requested === undefined) throw unprocessable('Pick the appraiser who will hold the assignment.', { appraiserUserId: 'Required.' });
  const appraiser = await findActiveAppraiser(tx, user.organisationId, requested);
  if (!appraiser) throw unprocessable('Pick an active appraiser of the firm.', { appraiserUserId: 'Not an active appraiser of the firm.' });
  return appraiser;
}

export async function acceptOrder(user: SessionUser, id: number, input: z.infer<typeof acceptRequest>, appOrigin: string) {
  await db.transaction(async (tx) => {
    const order = await loadForDecision(tx, user, id, input.version, ['received']);
    const appraiser = await pickAppraiser(tx, user, input.appraiserUserId);
    const values = {
      firmOrganisationId: order.firmOrganisationId,
      clientOrganisationId: order.clientOrganisationId,
      appraiserUserId: appraiser.id,
      subjectAddress: order.subjectAddress,
      intendedUse: order.intendedUse,
      loanReference: order.loanReference,
      effectiveDate: todayIso(),
      dueDate: order.dueDate,
      currency: order.currency,
    };
    const assignmentId = await insertAssignment(tx, user, values, { ...values, fromOrderId: order.id });
    await recordStatusChange(tx, assignmentId, null, 'in_progress', user, `Accepted from order #${order.id}`);
    const [updated] = await tx
      .update(orders)
      .set({ status: 'accepted', assignmentId, version: sql`${orders.version} + 1`, updatedAt: sql`now()` })
      .where(and(eq(orders.id, id), eq(orders.version, input.version)))
      .returning({ id: orders.id });
    if (!updated) throw staleVersion('This order');
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'order-accepted', entityType: 'order', entityId: id, details: { assignmentId, appraiserUserId: appraiser.id } });
    await enqueueMail(tx, {
      to: order.orderedByEmail,
      subject: `Order accepted: ${order.subjectAddress}`,
      text:
        `${order.firmName} accepted your order #${order.id} for ${order.subjectAddress} (loan ${order.loanReference}).\n` +
        `Appraiser: ${appraiser.name}. Due: ${order.dueDate}.\n\nFollow it here: ${appOrigin}/`,
    });
    if (appraiser.id !== user.id) {
      await enqueueMail(tx, {
        to: appraiser.email,
        subject: `New assignment: ${order.subjectAddress}`,
        text: `${user.name} accepted order #${order.id} from ${order.clientOrganisationName} and assigned it to you. Due: ${order.dueDate}.\n\nOpen it: ${appOrigin}/assignments/${assignmentId}`,
      });
    }
  });
  return getOrder(user, id);
}

export async function declineOrder(user: SessionUser, id: number, input: z.infer<typeof declineRequest>, appOrigin: string) {
  await db.transaction(async (tx) => {
    const order = await loadForDecision(tx, user, id, input.version, ['awaiting_payment', 'received']);
    const [updated] = await tx
      .update(orders)
      .set({ status: 'declined', declineReason: input.reason, version: sql`${orders.version} + 1`, updatedAt: sql`now()` })
      .where(and(eq(orders.id, id), eq(orders.version, input.version)))
      .returning({ id: orders.id });
    if (!updated) throw staleVersion('This order');
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'order-declined', entityType: 'order', entityId: id, details: { reason: input.reason, wasPaid: order.status === 'received' } });
    // No refund flow in Compline: a paid fee is refunded by the firm through the provider's dashboard.
    const refund = order.status === 'received' ? `\n\nThe fee you paid will be refunded by ${order.firmName} directly; Compline does not refund it automatically.` : '';
    await enqueueMail(tx, {
      to: order.orderedByEmail,
      subject: `Order declined: ${order.subjectAddress}`,
      text: `${order.firmName} declined your order #${order.id} for ${order.subjectAddress} (loan ${order.loanReference}).\n\nReason: ${input.reason}${refund}\n\nYour orders: ${appOrigin}/`,
    });
  });
  return getOrder(user, id);
}
