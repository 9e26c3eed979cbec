import express, { Router } from 'express';
import { anyone } from '../../http/access';
import { appOrigin } from '../../http/app-origin';
import { verifyWebhookEvent } from '../../integrations/payments/payment-intents';
import { handlePaymentEvent } from './payment-events.service';

export const PAYMENTS_WEBHOOK_PATH = '/payments/webhook';

/** The payment provider's notifications. Mounted before the JSON body parser: the signature is
 * checked over the raw bytes, and only a verified event is read. The signature is the
 * authentication, so no session and no Origin are needed. */
export const paymentsWebhookRouter = Router();

paymentsWebhookRouter.post(PAYMENTS_WEBHOOK_PATH, anyone, express.raw({ type: 'application/json', limit: '1mb' }), async (req, res) => {
  const event = verifyWebhookEvent(req.body, req.get('stripe-signature'));
  const outcome = await handlePaymentEvent(event, appOrigin(req));
  res.json({ received: true, outcome });
});
