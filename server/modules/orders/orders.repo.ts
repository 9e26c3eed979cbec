import { and, asc, desc, eq, inArray, max, or, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { DbOrTx } from '../../../db/client';
import { assignments } from '../../../db/schema/assignments';
import { fees, orders, payments, reportVersions } from '../../../db/schema/delivery';
import { organisations, users } from '../../../db/schema/organisations';
import { statusChanges } from '../../../db/schema/review';

const clientOrg = alias(organisations, 'client_org');
const firmOrg = alias(organisations, 'firm_org');

const feeColumns = {
  id: fees.id,
  firmOrganisationId: fees.firmOrganisationId,
  firmName: organisations.name,
  name: fees.name,
  description: fees.description,
  amount: fees.amount,
  currency: fees.currency,
};

/** Every firm's fee list (what a lender may order), or one firm's. */
export async function listFees(tx: DbOrTx, firmOrganisationId?: number) {
  return tx
    .select(feeColumns)
    .from(fees)
    .innerJoin(organisations, eq(organisations.id, fees.firmOrganisationId))
    .where(firmOrganisationId === undefined ? undefined : eq(fees.firmOrganisationId, firmOrganisationId))
    .orderBy(asc(organisations.name), asc(fees.amount), asc(fees.id));
}

export async function findFee(tx: DbOrTx, id: number) {
  const [row] = await tx.select(feeColumns).from(fees).innerJoin(organisations, eq(organisations.id, fees.firmOrganisationId)).where(eq(fees.id, id));
  return row;
}

const orderColumns = {
  id: orders.id,
  clientOrganisationId: orders.clientOrganisationId,
  clientOrganisationName: clientOrg.name,
  firmOrganisationId: orders.firmOrganisationId,
  firmName: firmOrg.name,
  orderedBy: orders.orderedBy,
  orderedByName: users.name,
  orderedByEmail: users.email,
  subjectAddress: orders.subjectAddress,
  intendedUse: orders.intendedUse,
  loanReference: orders.loanReference,
  dueDate: orders.dueDate,
  feeId: orders.feeId,
  feeName: fees.name,
  feeAmount: orders.feeAmount,
  currency: orders.currency,
  status: orders.status,
  declineReason: orders.declineReason,
  assignmentId: orders.assignmentId,
  version: orders.version,
  createdAt: orders.createdAt,
  updatedAt: orders.updatedAt,
};
export type OrderRow = Awaited<ReturnType<typeof findOrder>> & {};

function selectOrders(tx: DbOrTx, where: SQL | undefined) {
  return tx
    .select(orderColumns)
    .from(orders)
    .innerJoin(clientOrg, eq(clientOrg.id, orders.clientOrganisationId))
    .innerJoin(firmOrg, eq(firmOrg.id, orders.firmOrganisationId))
    .innerJoin(users, eq(users.id, orders.orderedBy))
    .innerJoin(fees, eq(fees.id, orders.feeId))
    .where(where);
}

export async function findOrder(tx: DbOrTx, id: number) {
  const [row] = await selectOrders(tx, eq(orders.id, id));
  return row;
}

/** Takes the order's row lock for the rest of the transaction (order first, then its payments,
 * everywhere, so that two transactions never wait on each other in a circle). */
export async function lockOrder(tx: DbOrTx, id: number): Promise<boolean> {
  const [row] = await tx.select({ id: orders.id }).from(orders).where(eq(orders.id, id)).for('update');
  return row !== undefined;
}

/** The orders an organisation placed (a lender) or received (a firm), newest first. */
export async function listOrdersOf(tx: DbOrTx, side: 'client' | 'firm', organisationId: number) {
  const column = side === 'client' ? orders.clientOrganisationId : orders.firmOrganisationId;
  return selectOrders(tx, eq(column, organisationId)).orderBy(desc(orders.createdAt), desc(orders.id));
}

export async function paymentsOf(tx: DbOrTx, orderIds: number[]) {
  if (orderIds.length === 0) return [];
  return tx.select().from(payments).where(inArray(payments.orderId, orderIds)).orderBy(asc(payments.id));
}

export async function latestPayment(tx: DbOrTx, orderId: number) {
  const [row] = await tx.select().from(payments).where(eq(payments.orderId, orderId)).orderBy(desc(payments.id)).limit(1);
  return row;
}

export async function findPaymentByIntent(tx: DbOrTx, providerIntentId: string) {
  const [row] = await tx.select().from(payments).where(eq(payments.providerIntentId, providerIntentId));
  return row;
}

/** Status (and when it last changed) of the assignments orders became: coarse facts only. */
export async function assignmentProgress(tx: DbOrTx, assignmentIds: number[]) {
  if (assignmentIds.length === 0) return [];
  return tx
    .select({ id: assignments.id, status: assignments.status, changedAt: max(statusChanges.at) })
    .from(assignments)
    .leftJoin(statusChanges, eq(statusChanges.assignmentId, assignments.id))
    .where(inArray(assignments.id, assignmentIds))
    .groupBy(assignments.id, assignments.status);
}

/** The signed report versions of these assignments that an organisation may read — as the lender
 * the assignment is for, or as the firm that holds it — newest first. */
export async function signedReportsOf(tx: DbOrTx, assignmentIds: number[], reader: { side: 'client' | 'firm'; organisationId: number }) {
  if (assignmentIds.length === 0) return [];
  const readerColumn = reader.side === 'client' ? assignments.clientOrganisationId : assignments.firmOrganisationId;
  return tx
    .select({ id: reportVersions.id, assignmentId: reportVersions.assignmentId, versionNumber: reportVersions.versionNumber, signedAt: reportVersions.signedAt })
    .from(reportVersions)
    .innerJoin(assignments, eq(assignments.id, reportVersions.assignmentId))
    .where(and(inArray(reportVersions.assignmentId, assignmentIds), eq(readerColumn, reader.organisationId)))
    .orderBy(desc(reportVersions.versionNumber));
}

/** The firm's active admins and appraisers: who hears about a new order. */
export async function orderDesk(tx: DbOrTx, firmOrganisationId: number) {
  return tx
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(and(eq(users.organisationId, firmOrganisationId), eq(users.active, true), or(eq(users.role, 'admin'), eq(users.role, 'appraiser'))))
    .orderBy(asc(users.id));
}

export async function findActiveAppraiser(tx: DbOrTx, firmOrganisationId: number, userId: number) {
  const [row] = await tx
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(and(eq(users.id, userId), eq(users.organisationId, firmOrganisationId), eq(users.role, 'appraiser'), eq(users.active, true)));
  return row;
}
