import express, { type NextFunction, type Request, type Response } from 'express';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { randomBytes } from 'node:crypto';
import { WebhookSender, type DeliveryResult, type RawDeliveryOptions } from './fake-webhook-sender';

/** A local stand-in for the payment provider's API, for development and tests. It implements only
 * what Compline's SDK calls make (create, retrieve and confirm a PaymentIntent), answers in the
 * provider's JSON shapes and error bodies, and sends signed webhooks for the outcome. */

/** Test payment methods, named as the provider's test mode names them. */
export const TEST_CARDS = { succeeds: 'pm_card_visa', declined: 'pm_card_chargeDeclined' } as const;
const DECLINES: Record<string, { code: string; decline_code: string; message: string } | null> = {
  [TEST_CARDS.succeeds]: null,
  [TEST_CARDS.declined]: { code: 'card_declined', decline_code: 'generic_decline', message: 'Your card was declined.' },
};

export type FakeIntentStatus = 'requires_payment_method' | 'requires_confirmation' | 'succeeded';
export interface FakeIntent {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  status: FakeIntentStatus;
  description: string | null;
  metadata: Record<string, string>;
  payment_method: string | null;
  payment_method_types: string[];
  automatic_payment_methods: { enabled: boolean; allow_redirects: string } | null;
  last_payment_error: Record<string, unknown> | null;
  client_secret: string;
  capture_method: 'automatic';
  confirmation_method: 'automatic';
  created: number;
  livemode: false;
}
export type FakeEventType = 'payment_intent.succeeded' | 'payment_intent.payment_failed';
export interface FakeEvent {
  id: string;
  type: FakeEventType;
  /** The exact JSON text delivered (a redelivery sends the same bytes, freshly signed). */
  payload: string;
}

export interface FakePaymentsOptions {
  secretKey?: string;
  webhookSecret?: string;
  webhookUrl?: string | null;
  /** Waits before the 2nd, 3rd … delivery attempt of an event. */
  retryDelaysMs?: number[];
}

export interface FakePaymentsApi {
  /** http://127.0.0.1:<port> — give it to configurePayments({ apiUrl }). */
  url: string;
  secretKey: string;
  webhookSecret: string;
  setWebhookUrl(url: string | null): void;
  intent(id: string): FakeIntent | undefined;
  events(): readonly FakeEvent[];
  /** Records a new event about an intent (as it stands, with `patch` applied) without sending it. */
  makeEvent(type: FakeEventType, intentId: string, patch?: Partial<FakeIntent>): FakeEvent;
  /** Sends a recorded event (again), with retries, as the provider's "resend" does. */
  redeliver(eventId: string): Promise<DeliveryResult>;
  /** Sends these exact bytes once, validly signed unless options say otherwise. */
  deliverRaw(payload: string, options?: RawDeliveryOptions): Promise<DeliveryResult>;
  /** Resolves when every webhook delivery started so far has finished. */
  settled(): Promise<void>;
  close(): Promise<void>;
}

const token = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`;
const now = () => Math.floor(Date.now() / 1000);

function apiError(res: Response, status: number, error: Record<string, unknown>) {
  res.status(status).json({ error: { type: 'invalid_request_error', ...error } });
}

export async function startFakePaymentsApi(options: FakePaymentsOptions = {}): Promise<FakePaymentsApi> {
  const secretKey = options.secretKey ?? token('sk_test_fake');
  const webhookSecret = options.webhookSecret ?? token('whsec_fake');
  const sender = new WebhookSender(webhookSecret, options.webhookUrl ?? null, options.retryDelaysMs ?? [250, 1_000, 4_000]);
  const intents = new Map<string, FakeIntent>();
  const events: FakeEvent[] = [];
  const idempotent = new Map<string, { status: number; body: unknown }>();

  function makeEvent(type: FakeEventType, intentId: string, patch: Partial<FakeIntent> = {}): FakeEvent {
    const intent = intents.get(intentId);
    if (!intent) throw new Error(`fake payments: no intent ${intentId}`);
    const id = token('evt');
    const body = {
      id,
      object: 'event',
      api_version: null,
      created: now(),
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type,
      data: { object: { ...structuredClone(intent), ...patch } },
    };
    const event: FakeEvent = { id, type, payload: JSON.stringify(body, null, 2) };
    events.push(event);
    return event;
  }

  const redeliver = (eventId: string) => {
    const event = events.find((e) => e.id === eventId);
    if (!event) return Promise.reject(new Error(`fake payments: no event ${eventId}`));
    return sender.deliver(event.payload);
  };

  const app = express();
  app.disable('x-powered-by');
  app.use(express.urlencoded({ extended: true, limit: '100kb' }));

  app.use('/v1', (req: Request, res: Response, next: NextFunction) => {
    const auth = req.get('authorization') ?? '';
    if (auth !== `Bearer ${secretKey}`) {
      return apiError(res, 401, { message: `Invalid API Key provided: ${auth.replace(/^Bearer\s+/, '').slice(0, 8)}****` });
    }
    // A retried POST with the same Idempotency-Key gets the first answer again, as from the provider.
    const key = req.method === 'POST' ? req.get('idempotency-key') : undefined;
    if (key) {
      const seen = idempotent.get(`${req.path} ${key}`);
      if (seen) return res.status(seen.status).set('idempotent-replayed', 'true').json(seen.body);
      const json = res.json.bind(res);
      res.json = (body: unknown) => {
        idempotent.set(`${req.path} ${key}`, { status: res.statusCode, body });
        return json(body);
      };
    }
    next();
  });

  app.post('/v1/payment_intents', (req, res) => {
    const body = (req.body ?? {}) as Record<string, unknown>;
    const amount = Number(body.amount);
    if (!/^\d+$/.test(String(body.amount ?? '')) || amount < 1) {
      return apiError(res, 400, { code: 'parameter_missing', param: 'amount', message: 'Missing required param: amount (a positive integer in the smallest currency unit).' });
    }
    if (typeof body.currency !== 'string' || !/^[a-z]{3}$/.test(body.currency)) {
      return apiError(res, 400, { code: 'parameter_invalid_string', param: 'currency', message: 'Invalid currency: use a lower-case three-letter ISO code.' });
    }
    const types = Array.isArray(body.payment_method_types) ? body.payment_method_types.map(String) : ['card'];
    if (types.some((t) => t !== 'card')) {
      return apiError(res, 400, { code: 'payment_method_type_invalid', param: 'payment_method_types', message: 'The local fake supports card payments only.' });
    }
    const automatic = body.automatic_payment_methods as Record<string, string> | undefined;
    const metadata = body.metadata && typeof body.metadata === 'object' ? (body.metadata as Record<string, unknown>) : {};
    const paymentMethod = typeof body.payment_method === 'string' ? body.payment_method : null;
    const id = token('pi');
    const intent: FakeIntent = {
      id,
      object: 'payment_intent',
      amount,
      amount_received: 0,
      currency: body.currency,
      status: paymentMethod ? 'requires_confirmation' : 'requires_payment_method',
      description: typeof body.description === 'string' ? body.description : null,
      metadata: Object.fromEntries(Object.entries(metadata).map(([k, v]) => [k, String(v)])),
      payment_method: paymentMethod,
      payment_method_types: types,
      automatic_payment_methods: automatic ? { enabled: automatic.enabled === 'true', allow_redirects: automatic.allow_redirects ?? 'always' } : null,
      last_payment_error: null,
      client_secret: `${id}_secret_${randomBytes(8).toString('hex')}`,
      capture_method: 'automatic',
      confirmation_method: 'automatic',
      created: now(),
      livemode: false,
    };
    intents.set(id, intent);
    res.json(intent);
  });

  const missingIntent = (res: Response, id: string) =>
    apiError(res, 404, { code: 'resource_missing', param: 'intent', message: `No such payment_intent: '${id}'` });

  app.get('/v1/payment_intents/:id', (req, res) => {
    const intent = intents.get(req.params.id);
    if (!intent) return missingIntent(res, req.params.id);
    res.json(intent);
  });

  app.post('/v1/payment_intents/:id/confirm', (req, res) => {
    const intent = intents.get(req.params.id);
    if (!intent) return missingIntent(res, req.params.id);
    if (intent.status === 'succeeded') {
      return apiError(res, 400, { code: 'payment_intent_unexpected_state', message: 'This PaymentIntent’s status is succeeded, so it cannot be confirmed.', payment_intent: intent });
    }
    const body = (req.body ?? {}) as Record<string, unknown>;
    const paymentMethod = typeof body.payment_method === 'string' ? body.payment_method : intent.payment_method;
    if (!paymentMethod) {
      return apiError(res, 400, { code: 'payment_intent_unexpected_state', message: 'You cannot confirm this PaymentIntent because it’s missing a payment method.' });
    }
    if (!(paymentMethod in DECLINES)) {
      return apiError(res, 400, { code: 'resource_missing', param: 'payment_method', message: `No such PaymentMethod: '${paymentMethod}'` });
    }
    intent.payment_method = paymentMethod;
    const decline = DECLINES[paymentMethod];
    if (decline) {
      intent.status = 'requires_payment_method';
      intent.last_payment_error = { type: 'card_error', ...decline, payment_method: { id: paymentMethod, object: 'payment_method', type: 'card' } };
      res.status(402).json({ error: { ...intent.last_payment_error, payment_intent: intent } });
      void sender.deliver(makeEvent('payment_intent.payment_failed', intent.id).payload);
      return;
    }
    intent.status = 'succeeded';
    intent.amount_received = intent.amount;
    intent.last_payment_error = null;
    res.json(intent);
    void sender.deliver(makeEvent('payment_intent.succeeded', intent.id).payload);
  });

  app.use((req, res) => {
    apiError(res, 404, { message: `Unrecognized request URL (${req.method}: ${req.path}). The local fake implements payment intents only.` });
  });

  const server = http.createServer(app);
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const { port } = server.address() as AddressInfo;

  return {
    url: `http://127.0.0.1:${port}`,
    secretKey,
    webhookSecret,
    setWebhookUrl: (url) => {
      sender.url = url;
    },
    intent: (id) => intents.get(id),
    events: () => events,
    makeEvent,
    redeliver,
    deliverRaw: (payload, rawOptions) => sender.deliver(payload, { retry: false, ...rawOptions }),
    settled: () => sender.settled(),
    close: async () => {
      await sender.settled();
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await closed;
    },
  };
}
