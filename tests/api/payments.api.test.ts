import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { db } from '../../db/client';
import { payments } from '../../db/schema/delivery';
import type { FakePaymentsApi } from '../../server/integrations/payments/fake-payments-api';
import { paymentsClient } from '../../server/integrations/payments/payments-client';
import { createOrderingParties, orderFormInput, orderRow, paymentRows, startPayments, webhookEventRow } from '../factories/orders';
import { mailTo } from '../setup/mailbox';
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

/** A new lender client with an order placed through the API, awaiting payment. */
async function placedOrder() {
  const parties = await createOrderingParties();
  const agent = await signedInAgent(api, parties.client);
  const res = await agent.post('/api/orders').send(orderFormInput(parties.fee.id));
  expect(res.status).toBe(201);
  const orderId: number = res.body.order.id;
  const [payment] = await paymentRows(orderId);
  return { ...parties, agent, orderId, intentId: payment.providerIntentId };
}

async function receipts(email: string) {
  return (await mailTo(email)).filter((m) => m.subject.startsWith('Payment received'));
}

function eventFor(type: string, intentId: string) {
  const event = fake.events().find((e) => e.type === type && (JSON.parse(e.payload) as Stripe.Event & { data: { object: { id: string } } }).data.object.id === intentId);
  if (!event) throw new Error(`no ${type} event for ${intentId}`);
  return event;
}

describe('the payments webhook', () => {
  it('records a paid order once even when the same signed event is replayed', async () => {
    const { agent, orderId, intentId, client } = await placedOrder();
    const pay = await agent.post(`/api/orders/${orderId}/pay`).send({ paymentMethod: 'pm_card_visa' });
    expect(pay.status).toBe(202);
    expect(pay.body).toEqual({ status: 'processing' });
    await fake.settled();

    const succeeded = eventFor('payment_intent.succeeded', intentId);
    const replays = await Promise.all([fake.redeliver(succeeded.id), fake.redeliver(succeeded.id), fake.redeliver(succeeded.id)]);
    for (const replay of replays) {
      expect(replay.status).toBe(200);
      expect(JSON.parse(replay.body)).toEqual({ received: true, outcome: 'duplicate' });
    }

    const attempts = await paymentRows(orderId);
    expect(attempts.map((p) => p.status)).toEqual(['succeeded']);
    const order = await orderRow(orderId);
    expect(order).toMatchObject({ status: 'received', version: 2 });
    expect(await webhookEventRow(succeeded.id)).toMatchObject({ type: 'payment_intent.succeeded' });
    const sent = await receipts(client.email);
    expect(sent).toHaveLength(1);
    expect(sent[0].textBody).toContain('$525.00');
    expect(sent[0].textBody).toContain(intentId);
  });

  it('refuses a notification with a bad or missing signature with 400 and records nothing', async () => {
    const { orderId, intentId, client } = await placedOrder();
    const event = fake.makeEvent('payment_intent.succeeded', intentId, { status: 'succeeded', amount_received: 52_500 });

    const forged = await fake.deliverRaw(event.payload, { signWith: 'whsec_not_the_real_secret' });
    expect(forged.status).toBe(400);
    expect(JSON.parse(forged.body).error.code).toBe('bad_signature');
    const unsigned = await fake.deliverRaw(event.payload, { signature: null });
    expect(unsigned.status).toBe(400);
    // A valid signature over other bytes does not cover a changed body.
    const header = Stripe.webhooks.generateTestHeaderString({ payload: event.payload, secret: fake.webhookSecret });
    const tampered = await fake.deliverRaw(event.payload.replace('52500', '1'), { signature: header });
    expect(tampered.status).toBe(400);

    expect(await webhookEventRow(event.id)).toBeUndefined();
    expect(await orderRow(orderId)).toMatchObject({ status: 'awaiting_payment', version: 1 });
    expect((await paymentRows(orderId)).map((p) => p.status)).toEqual(['pending']);
    expect(await receipts(client.email)).toEqual([]);

    // The same bytes, properly signed, are accepted: the refusals were about the signature.
    const genuine = await fake.deliverRaw(event.payload);
    expect(genuine.status).toBe(200);
    expect((await orderRow(orderId)).status).toBe('received');
  });

  it('leaves the order unpaid with a clear message when the card is declined', async () => {
    const { agent, orderId, client } = await placedOrder();
    const res = await agent.post(`/api/orders/${orderId}/pay`).send({ paymentMethod: 'pm_card_chargeDeclined' });
    expect(res.status).toBe(402);
    const error = expectErrorEnvelope(res);
    expect(error.code).toBe('card_declined');
    expect(error.message).toMatch(/^The card was declined: \S/);
    await fake.settled();

    expect(await orderRow(orderId)).toMatchObject({ status: 'awaiting_payment', version: 1 });
    const [attempt] = await paymentRows(orderId);
    expect(attempt).toMatchObject({ status: 'failed', failureMessage: error.message });
    expect(await receipts(client.email)).toEqual([]);
    const detail = await agent.get(`/api/orders/${orderId}`);
    expect(detail.body.order.timeline).toContainEqual(expect.objectContaining({ kind: 'payment_failed', note: error.message }));

    // Another card then pays it, through a new PaymentIntent; the declined attempt stays on record.
    const retry = await agent.post(`/api/orders/${orderId}/pay`).send({ paymentMethod: 'pm_card_visa' });
    expect(retry.status).toBe(202);
    await fake.settled();
    expect((await paymentRows(orderId)).map((p) => p.status)).toEqual(['failed', 'succeeded']);
    expect((await orderRow(orderId)).status).toBe('received');
  });

  it('keeps an order paid when a failure notice arrives after the success', async () => {
    const { agent, orderId, intentId, client } = await placedOrder();
    expect((await agent.post(`/api/orders/${orderId}/pay`).send({ paymentMethod: 'pm_card_visa' })).status).toBe(202);
    await fake.settled();
    expect((await orderRow(orderId)).status).toBe('received');

    const late = fake.makeEvent('payment_intent.payment_failed', intentId, {
      status: 'requires_payment_method',
      last_payment_error: { type: 'card_error', code: 'card_declined', decline_code: 'generic_decline', message: 'Your card was declined.' },
    });
    const delivery = await fake.redeliver(late.id);
    expect(delivery.status).toBe(200);
    expect(JSON.parse(delivery.body).outcome).toBe('no_change');

    expect(await orderRow(orderId)).toMatchObject({ status: 'received', version: 2 });
    const [attempt] = await paymentRows(orderId);
    expect(attempt).toMatchObject({ status: 'succeeded', failureMessage: null });
    expect(await receipts(client.email)).toHaveLength(1);
  });

  it('refuses to charge an order twice', async () => {
    const { agent, orderId } = await placedOrder();
    expect((await agent.post(`/api/orders/${orderId}/pay`).send({ paymentMethod: 'pm_card_visa' })).status).toBe(202);
    await fake.settled();
    const again = await agent.post(`/api/orders/${orderId}/pay`).send({ paymentMethod: 'pm_card_visa' });
    expect(again.status).toBe(409);
    expect(expectErrorEnvelope(again).code).toBe('not_payable');
    expect(await paymentRows(orderId)).toHaveLength(1);
  });

  it('asks for a retry, recording nothing, when the payment of one of our orders is not on record yet', async () => {
    const { orderId } = await placedOrder();
    // An intent for the order that Compline has not written down (as if its transaction were still open).
    const intent = await paymentsClient().paymentIntents.create({ amount: 52_500, currency: 'usd', metadata: { orderId: String(orderId) } });
    const event = fake.makeEvent('payment_intent.succeeded', intent.id, { status: 'succeeded', amount_received: 52_500 });
    const early = await fake.deliverRaw(event.payload);
    expect(early.status).toBe(409);
    expect(await webhookEventRow(event.id)).toBeUndefined();
    expect((await orderRow(orderId)).status).toBe('awaiting_payment');

    await db.insert(payments).values({ orderId, providerIntentId: intent.id, amount: 525, currency: 'USD' });
    const retried = await fake.redeliver(event.id);
    expect(retried.status).toBe(200);
    expect((await orderRow(orderId)).status).toBe('received');
  });
});
