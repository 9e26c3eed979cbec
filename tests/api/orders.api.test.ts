import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { count, eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { assignments } from '../../db/schema/assignments';
import { fees, orders } from '../../db/schema/delivery';
import { orderDetailResponse, orderListResponse } from '../../server/contracts/orders';
import { organisations } from '../../db/schema/organisations';
import { DEMO_FIRM } from '../../db/seed/demo-accounts';
import { seedDemoFees } from '../../db/seed/seed-fees';
import type { FakePaymentsApi } from '../../server/integrations/payments/fake-payments-api';
import { createOrganisation, createUser } from '../factories/accounts';
import { createAssignment } from '../factories/assignments';
import { createSignedReport } from '../factories/signed-report';
import { takeAction } from '../factories/workflow';
import {
  assignmentWithSubject, createFee, createOrderingParties, createOrderRow, dayFromToday, orderFormInput, orderRow, paymentRows, startPayments,
  type OrderingParties,
} from '../factories/orders';
import { mailTo, onlyMailTo } from '../setup/mailbox';
import { expectErrorEnvelope, signedInAgent, startTestApi, stopTestApi, type TestApi } from '../setup/test-api';

let api: TestApi;
let fake: FakePaymentsApi;
beforeAll(async () => {
  api = await startTestApi();
  fake = await startPayments(api);
});
afterAll(async () => {
  await fake?.close();
  await stopTestApi(api);
});

async function ordersOfLender(lenderId: number) {
  const [row] = await db.select({ n: count() }).from(orders).where(eq(orders.clientOrganisationId, lenderId));
  return row.n;
}

async function assignmentsOfLender(lenderId: number) {
  const [row] = await db.select({ n: count() }).from(assignments).where(eq(assignments.clientOrganisationId, lenderId));
  return row.n;
}

/** An order placed and paid through the API (the webhook has recorded the payment). */
async function paidOrder(parties: OrderingParties) {
  const client = await signedInAgent(api, parties.client);
  const placed = await client.post('/api/orders').send(orderFormInput(parties.fee.id));
  expect(placed.status).toBe(201);
  expect((await client.post(`/api/orders/${placed.body.order.id}/pay`).send({ paymentMethod: 'pm_card_visa' })).status).toBe(202);
  await fake.settled();
  return { client, order: await orderRow(placed.body.order.id) };
}

describe('fees', () => {
  it('seeds the demo firm’s fee list once, however often the seed runs', async () => {
    const [firm] = await db.select().from(organisations).where(eq(organisations.name, DEMO_FIRM));
    await seedDemoFees(db);
    const list = await db.select().from(fees).where(eq(fees.firmOrganisationId, firm.id));
    expect(list.filter((f) => f.name === 'Single-family, full interior and exterior')).toEqual([expect.objectContaining({ amount: 525, currency: 'USD' })]);
    expect(list.map((f) => f.name)).toEqual(expect.arrayContaining(['Single-family, exterior only', 'Condominium unit']));
    expect(list).toHaveLength(3);
  });

  it('shows a client every firm’s fees and the firm’s staff their own', async () => {
    const parties = await createOrderingParties();
    const otherFee = await createFee((await createOrderingParties()).firm, { amount: 610 });
    const asClient = await (await signedInAgent(api, parties.client)).get('/api/fees');
    expect(asClient.status).toBe(200);
    expect(asClient.body.fees).toContainEqual(expect.objectContaining({ id: parties.fee.id, firmName: parties.firm.name, amount: 525, currency: 'USD' }));
    expect(asClient.body.fees).toContainEqual(expect.objectContaining({ id: otherFee.id }));
    const asAdmin = await (await signedInAgent(api, parties.admin)).get('/api/fees');
    expect(asAdmin.body.fees.map((f: { id: number }) => f.id)).toEqual([parties.fee.id]);
  });
});

describe('placing an order', () => {
  it('creates an order awaiting payment with the fee copied, e-mails the firm and opens a PaymentIntent', async () => {
    const parties = await createOrderingParties();
    const agent = await signedInAgent(api, parties.client);
    const input = orderFormInput(parties.fee.id, { subjectAddress: '3 Saltpan Row, Port Ellery' });
    const res = await agent.post('/api/orders').send(input);
    expect(res.status).toBe(201);
    expect(res.body.order).toMatchObject({
      subjectAddress: '3 Saltpan Row, Port Ellery',
      loanReference: input.loanReference,
      dueDate: input.dueDate,
      status: 'awaiting_payment',
      feeAmount: 525,
      currency: 'USD',
      clientOrganisationId: parties.lender.id,
      firmOrganisationId: parties.firm.id,
      version: 1,
    });
    expect(res.body.order.timeline.map((t: { kind: string }) => t.kind)).toEqual(['placed']);

    const [payment] = await paymentRows(res.body.order.id);
    expect(payment).toMatchObject({ status: 'pending', amount: 525, currency: 'USD' });
    const intent = fake.intent(payment.providerIntentId);
    expect(intent).toMatchObject({ amount: 52_500, currency: 'usd', metadata: { orderId: String(res.body.order.id) } });

    expect((await onlyMailTo(parties.admin.email)).subject).toBe('New order: 3 Saltpan Row, Port Ellery');
    expect((await onlyMailTo(parties.appraiser.email)).textBody).toContain(input.loanReference);
    expect(await mailTo(parties.reviewer.email)).toEqual([]);
  });

  it('refuses a due date in the past and an unknown fee, storing nothing', async () => {
    const parties = await createOrderingParties();
    const agent = await signedInAgent(api, parties.client);
    const past = await agent.post('/api/orders').send(orderFormInput(parties.fee.id, { dueDate: dayFromToday(-1) }));
    expect(past.status).toBe(400);
    expect(expectErrorEnvelope(past).fields?.dueDate).toMatch(/past/);
    const unknownFee = await agent.post('/api/orders').send(orderFormInput(2_000_000_000));
    expect(unknownFee.status).toBe(422);
    expect(expectErrorEnvelope(unknownFee).fields?.feeId).toEqual(expect.any(String));
    expect(await ordersOfLender(parties.lender.id)).toBe(0);
    expect(await mailTo(parties.admin.email)).toEqual([]);
  });
});

describe('who sees an order', () => {
  it('shows a client only its own organisation’s orders', async () => {
    const parties = await createOrderingParties();
    const colleague = await createUser({ role: 'client', organisation: parties.lender });
    const outsider = await signedInAgent(api, await createUser({ role: 'client' }));
    const placed = await (await signedInAgent(api, parties.client)).post('/api/orders').send(orderFormInput(parties.fee.id));
    const id: number = placed.body.order.id;

    const colleagueList = await (await signedInAgent(api, colleague)).get('/api/orders');
    expect(colleagueList.body.orders.map((o: { id: number }) => o.id)).toContain(id);
    const outsiderList = await outsider.get('/api/orders');
    expect(outsiderList.status).toBe(200);
    expect(outsiderList.body.orders.map((o: { id: number }) => o.id)).not.toContain(id);
    expect((await outsider.get(`/api/orders/${id}`)).status).toBe(404);
    const pay = await outsider.post(`/api/orders/${id}/pay`).send({ paymentMethod: 'pm_card_visa' });
    expect(pay.status).toBe(404);
    expect((await orderRow(id)).status).toBe('awaiting_payment');

    const firmList = await (await signedInAgent(api, parties.admin)).get('/api/orders');
    expect(firmList.body.orders.map((o: { id: number }) => o.id)).toEqual([id]);
    const otherFirmAdmin = await signedInAgent(api, await createUser({ role: 'admin' }));
    expect((await otherFirmAdmin.get(`/api/orders/${id}`)).status).toBe(404);
  });

  it('refuses a reviewer every order endpoint with 403, and a client the firm’s decisions', async () => {
    const parties = await createOrderingParties();
    const order = await createOrderRow(parties, 'received');
    const reviewer = await signedInAgent(api, parties.reviewer);
    for (const res of [
      await reviewer.get('/api/orders'),
      await reviewer.get(`/api/orders/${order.id}`),
      await reviewer.post(`/api/orders/${order.id}/accept`).send({ version: 1 }),
      await reviewer.post(`/api/orders/${order.id}/decline`).send({ version: 1, reason: 'Not ours to decide.' }),
      await reviewer.post('/api/orders').send(orderFormInput(parties.fee.id)),
    ]) {
      expect(res.status).toBe(403);
      expect(expectErrorEnvelope(res).code).toBe('forbidden');
    }
    const client = await signedInAgent(api, parties.client);
    expect((await client.post(`/api/orders/${order.id}/accept`).send({ version: 1 })).status).toBe(403);
    expect(await orderRow(order.id)).toMatchObject({ status: 'received', version: 1 });
  });
});

describe('the firm’s answer', () => {
  it('accepts a paid order: the assignment exists with the client organisation, and the client is told', async () => {
    const parties = await createOrderingParties();
    const { client, order } = await paidOrder(parties);
    expect(order).toMatchObject({ status: 'received', version: 2 });
    const appraiser = await signedInAgent(api, parties.appraiser);
    const res = await appraiser.post(`/api/orders/${order.id}/accept`).send({ version: 2 });
    expect(res.status).toBe(200);
    expect(res.body.order).toMatchObject({ status: 'accepted', version: 3, assignmentId: expect.any(Number) });

    const { assignment, subject, changes } = await assignmentWithSubject(res.body.order.assignmentId);
    expect(assignment).toMatchObject({
      firmOrganisationId: parties.firm.id,
      clientOrganisationId: parties.lender.id,
      appraiserUserId: parties.appraiser.id,
      subjectAddress: order.subjectAddress,
      intendedUse: order.intendedUse,
      loanReference: order.loanReference,
      dueDate: order.dueDate,
      effectiveDate: dayFromToday(0),
      status: 'in_progress',
    });
    expect(subject).toMatchObject({ assignmentId: assignment.id, floorArea: null });
    expect(changes).toEqual([expect.objectContaining({ fromStatus: null, toStatus: 'in_progress', byUserId: parties.appraiser.id })]);
    expect((await appraiser.get(`/api/assignments/${assignment.id}`)).status).toBe(200);
    expect((await mailTo(parties.client.email)).map((m) => m.subject)).toContain(`Order accepted: ${order.subjectAddress}`);

    const seen = await client.get(`/api/orders/${order.id}`);
    expect(seen.body.order.assignmentId).toBeNull();
    expect(seen.body.order.timeline.map((t: { kind: string }) => t.kind)).toEqual(['placed', 'paid', 'accepted', 'assignment']);
    expect(seen.body.order.timeline[3].label).toBe('Appraisal under way');
  });

  it('lets an admin accept for an active appraiser of the firm, and no one else', async () => {
    const parties = await createOrderingParties();
    const order = await createOrderRow(parties, 'received');
    const admin = await signedInAgent(api, parties.admin);
    const missing = await admin.post(`/api/orders/${order.id}/accept`).send({ version: 1 });
    expect(missing.status).toBe(422);
    const reviewerPicked = await admin.post(`/api/orders/${order.id}/accept`).send({ version: 1, appraiserUserId: parties.reviewer.id });
    expect(expectErrorEnvelope(reviewerPicked).fields?.appraiserUserId).toEqual(expect.any(String));
    const outsider = await createUser({ role: 'appraiser' });
    expect((await admin.post(`/api/orders/${order.id}/accept`).send({ version: 1, appraiserUserId: outsider.id })).status).toBe(422);
    expect(await assignmentsOfLender(parties.lender.id)).toBe(0);

    const res = await admin.post(`/api/orders/${order.id}/accept`).send({ version: 1, appraiserUserId: parties.appraiser.id });
    expect(res.status).toBe(200);
    expect((await assignmentWithSubject(res.body.order.assignmentId)).assignment.appraiserUserId).toBe(parties.appraiser.id);
    expect((await onlyMailTo(parties.appraiser.email)).subject).toBe(`New assignment: ${order.subjectAddress}`);
  });

  it('refuses to accept an unpaid order (409) and creates nothing', async () => {
    const parties = await createOrderingParties();
    const order = await createOrderRow(parties, 'awaiting_payment');
    const res = await (await signedInAgent(api, parties.appraiser)).post(`/api/orders/${order.id}/accept`).send({ version: 1 });
    expect(res.status).toBe(409);
    expect(expectErrorEnvelope(res).code).toBe('not_paid');
    expect(await orderRow(order.id)).toMatchObject({ status: 'awaiting_payment', assignmentId: null, version: 1 });
    expect(await assignmentsOfLender(parties.lender.id)).toBe(0);
  });

  it('refuses a stale version with 409 stale_version', async () => {
    const parties = await createOrderingParties();
    const order = await createOrderRow(parties, 'received');
    const res = await (await signedInAgent(api, parties.appraiser)).post(`/api/orders/${order.id}/accept`).send({ version: 7 });
    expect(res.status).toBe(409);
    expect(expectErrorEnvelope(res).code).toBe('stale_version');
    expect(await assignmentsOfLender(parties.lender.id)).toBe(0);
  });

  it('declines with a reason and e-mails the client, after which the order can be neither accepted nor paid', async () => {
    const parties = await createOrderingParties();
    const order = await createOrderRow(parties, 'received');
    const appraiser = await signedInAgent(api, parties.appraiser);
    expect((await appraiser.post(`/api/orders/${order.id}/decline`).send({ version: 1 })).status).toBe(400);
    const res = await appraiser.post(`/api/orders/${order.id}/decline`).send({ version: 1, reason: 'The subject lies outside our licensed area.' });
    expect(res.status).toBe(200);
    expect(res.body.order).toMatchObject({ status: 'declined', declineReason: 'The subject lies outside our licensed area.', version: 2 });
    const mail = await onlyMailTo(parties.client.email);
    expect(mail.subject).toBe(`Order declined: ${order.subjectAddress}`);
    expect(mail.textBody).toContain('The subject lies outside our licensed area.');
    expect(mail.textBody).toMatch(/refund/);

    expect((await appraiser.post(`/api/orders/${order.id}/accept`).send({ version: 2 })).status).toBe(409);
    const client = await signedInAgent(api, parties.client);
    expect((await client.post(`/api/orders/${order.id}/pay`).send({ paymentMethod: 'pm_card_visa' })).status).toBe(409);
    const seen = await client.get('/api/orders');
    const listed = seen.body.orders.find((o: { id: number }) => o.id === order.id);
    expect(listed.timeline).toContainEqual(expect.objectContaining({ kind: 'declined', note: 'The subject lies outside our licensed area.' }));
  });
});

describe('the report of an order', () => {
  /** An accepted order of the signed report's lender, pointing at the signed assignment. */
  async function orderFor(signed: Awaited<ReturnType<typeof createSignedReport>>) {
    const fee = await createFee(signed.firm);
    const order = await createOrderRow({ firm: signed.firm, lender: signed.client.organisation, client: signed.client, fee }, 'accepted');
    const [assignment] = await db.select().from(assignments).where(eq(assignments.id, signed.assignmentId));
    await db.update(orders).set({ assignmentId: signed.assignmentId, subjectAddress: assignment.subjectAddress }).where(eq(orders.id, order.id));
    return { ...order, subjectAddress: assignment.subjectAddress };
  }
  const reportsIn = (body: unknown) => orderDetailResponse.parse(body).order.reports.map((r) => [r.id, r.versionNumber]);
  const assignmentVersion = async (id: number) => (await db.select({ v: assignments.version }).from(assignments).where(eq(assignments.id, id)))[0].v;

  it('names the signed versions of its assignment by id, newest first, to the lender and to the firm', async () => {
    const signed = await createSignedReport(api);
    const order = await orderFor(signed);
    const client = await signedInAgent(api, signed.client);

    const first = await client.get(`/api/orders/${order.id}`);
    expect(first.status).toBe(200);
    expect(reportsIn(first.body)).toEqual([[signed.reportVersionId, 1]]);
    expect(first.body.order.assignmentId).toBeNull();
    // The id opens that very report for the lender.
    const report = await client.get(`/api/reports/${first.body.order.reports[0].id}`);
    expect(report.status).toBe(200);
    expect(report.body.snapshot.assignment.id).toBe(signed.assignmentId);
    const listed = orderListResponse.parse((await client.get('/api/orders')).body).orders.find((o) => o.id === order.id);
    expect(listed?.reports.map((r) => r.id)).toEqual([signed.reportVersionId]);

    // A new draft, approved and signed again, is version 2: it comes first.
    const appraiser = signed.appraiserAgent;
    const draft = await appraiser.post(`/api/assignments/${signed.assignmentId}/new-draft`).send({ version: await assignmentVersion(signed.assignmentId), reason: 'Lot size corrected.' });
    expect(draft.status).toBe(200);
    await db.update(assignments).set({ status: 'approved' }).where(eq(assignments.id, signed.assignmentId));
    const second = await takeAction(appraiser, signed.assignmentId, 'sign', await assignmentVersion(signed.assignmentId));
    expect(second.status).toBe(201);
    const both = [[second.body.reportVersionId, 2], [signed.reportVersionId, 1]];
    expect(reportsIn((await client.get(`/api/orders/${order.id}`)).body)).toEqual(both);
    expect(reportsIn((await appraiser.get(`/api/orders/${order.id}`)).body)).toEqual(both);
  });

  it('names no report for another order at the same address, nor before signing', async () => {
    const signed = await createSignedReport(api);
    const order = await orderFor(signed);
    // The lender orders the same house again; that work is accepted but not signed.
    const fee = await createFee(signed.firm);
    const again = await createOrderRow({ firm: signed.firm, lender: signed.client.organisation, client: signed.client, fee }, 'accepted');
    const unsigned = await createAssignment({ appraiser: signed.appraiser, status: 'in_progress' });
    await db.update(assignments).set({ clientOrganisationId: signed.client.organisation.id, subjectAddress: order.subjectAddress }).where(eq(assignments.id, unsigned.id));
    await db.update(orders).set({ assignmentId: unsigned.id, subjectAddress: order.subjectAddress }).where(eq(orders.id, again.id));

    const client = await signedInAgent(api, signed.client);
    expect(reportsIn((await client.get(`/api/orders/${again.id}`)).body)).toEqual([]);
    expect(reportsIn((await client.get(`/api/orders/${order.id}`)).body)).toEqual([[signed.reportVersionId, 1]]);
  });

  it('names no report to a lender the assignment is no longer for, while the firm still sees it', async () => {
    const signed = await createSignedReport(api);
    const order = await orderFor(signed);
    const otherLender = await createOrganisation('lender');
    await db.update(assignments).set({ clientOrganisationId: otherLender.id }).where(eq(assignments.id, signed.assignmentId));
    const client = await signedInAgent(api, signed.client);
    expect(reportsIn((await client.get(`/api/orders/${order.id}`)).body)).toEqual([]);
    expect((await client.get(`/api/reports/${signed.reportVersionId}`)).status).toBe(404);
    expect(reportsIn((await signed.appraiserAgent.get(`/api/orders/${order.id}`)).body)).toEqual([[signed.reportVersionId, 1]]);
  });
});
