import { and, asc, eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { assignments, subjects } from '../../db/schema/assignments';
import { fees, orders, payments, webhookEvents } from '../../db/schema/delivery';
import { statusChanges } from '../../db/schema/review';
import { configurePayments } from '../../server/integrations/payments/payments-client';
import { startFakePaymentsApi, type FakePaymentsApi } from '../../server/integrations/payments/fake-payments-api';
import { createOrganisation, createUser, uniqueSuffix, type TestOrganisation, type TestUser } from './accounts';
import type { TestApi } from '../setup/test-api';

/** Fees, orders and payments for the ordering journey, written straight through Drizzle, and the
 * local fake payments API wired to a test's app. Addresses are invented (the demo town of Port
 * Ellery, which does not exist). */

/** Starts the fake provider, points the app's SDK at it and its webhooks at the test's app. Short
 * retry waits keep a test that provokes a failed delivery quick. */
export async function startPayments(api: TestApi): Promise<FakePaymentsApi> {
  const fake = await startFakePaymentsApi({ webhookUrl: `${api.origin}/api/payments/webhook`, retryDelaysMs: [50, 100] });
  configurePayments({ apiUrl: fake.url, secretKey: fake.secretKey, webhookSecret: fake.webhookSecret });
  return fake;
}

/** A calendar day `days` after today, in the server's time zone. */
export function dayFromToday(days: number): string {
  const day = new Date();
  day.setDate(day.getDate() + days);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${day.getFullYear()}-${pad(day.getMonth() + 1)}-${pad(day.getDate())}`;
}

export type TestFee = typeof fees.$inferSelect;

export async function createFee(firm: TestOrganisation, overrides: Partial<typeof fees.$inferInsert> = {}): Promise<TestFee> {
  const [row] = await db
    .insert(fees)
    .values({ firmOrganisationId: firm.id, name: `Test fee ${uniqueSuffix()}`, description: 'Single-family, full inspection (test fee)', amount: 525, currency: 'USD', ...overrides })
    .returning();
  return row;
}

export interface OrderingParties {
  firm: TestOrganisation;
  admin: TestUser;
  appraiser: TestUser;
  reviewer: TestUser;
  fee: TestFee;
  lender: TestOrganisation;
  client: TestUser;
}

/** A firm (admin, appraiser, reviewer, one fee) and a lender with one client, all new. */
export async function createOrderingParties(): Promise<OrderingParties> {
  const firm = await createOrganisation('firm');
  const lender = await createOrganisation('lender');
  const [admin, appraiser, reviewer, client] = await Promise.all([
    createUser({ role: 'admin', organisation: firm }),
    createUser({ role: 'appraiser', organisation: firm }),
    createUser({ role: 'reviewer', organisation: firm }),
    createUser({ role: 'client', organisation: lender }),
  ]);
  return { firm, admin, appraiser, reviewer, fee: await createFee(firm), lender, client };
}

/** What the order form sends. */
export function orderFormInput(feeId: number, overrides: Record<string, unknown> = {}) {
  return {
    subjectAddress: `${uniqueSuffix().split('-')[0]} Chandlery Walk, Port Ellery`,
    intendedUse: 'Mortgage lending decision for a purchase loan (first lien)',
    loanReference: `HM-${uniqueSuffix()}`,
    dueDate: dayFromToday(21),
    feeId,
    ...overrides,
  };
}

export type OrderStatus = typeof orders.$inferSelect.status;

/** An order row written directly; a 'received' order also gets its succeeded payment. */
export async function createOrderRow(parties: Pick<OrderingParties, 'firm' | 'lender' | 'client' | 'fee'>, status: OrderStatus = 'received') {
  const input = orderFormInput(parties.fee.id);
  const [row] = await db
    .insert(orders)
    .values({
      ...input,
      clientOrganisationId: parties.lender.id,
      firmOrganisationId: parties.firm.id,
      orderedBy: parties.client.id,
      feeAmount: parties.fee.amount,
      currency: parties.fee.currency,
      status,
    })
    .returning();
  await db.insert(payments).values({
    orderId: row.id,
    providerIntentId: `pi_factory_${uniqueSuffix()}`,
    amount: parties.fee.amount,
    currency: parties.fee.currency,
    status: status === 'awaiting_payment' ? 'pending' : 'succeeded',
  });
  return row;
}

export async function orderRow(id: number) {
  const [row] = await db.select().from(orders).where(eq(orders.id, id));
  return row;
}

export async function paymentRows(orderId: number) {
  return db.select().from(payments).where(eq(payments.orderId, orderId)).orderBy(asc(payments.id));
}

export async function webhookEventRow(id: string) {
  const [row] = await db.select().from(webhookEvents).where(eq(webhookEvents.id, id));
  return row;
}

export async function assignmentWithSubject(id: number) {
  const [assignment] = await db.select().from(assignments).where(eq(assignments.id, id));
  const [subject] = await db.select().from(subjects).where(eq(subjects.assignmentId, id));
  const changes = await db.select().from(statusChanges).where(and(eq(statusChanges.assignmentId, id))).orderBy(asc(statusChanges.id));
  return { assignment, subject, changes };
}
