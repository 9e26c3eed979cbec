import Stripe from 'stripe';
import { AppError, badRequest, conflict, serviceUnavailable, unprocessable } from '../../errors';
import { paymentsClient, webhookSecret } from './payments-client';

/** The few provider calls Compline makes, with the provider's errors turned into ours. */

/** Digits after the decimal point for a currency (2 for USD, 0 for JPY), as Intl knows them. */
export function minorUnitDigits(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
}

/** 525 USD → 52500 (cents): the provider counts in the currency's smallest unit. */
export function toMinorUnits(amount: number, currency: string): number {
  return Math.round(amount * 10 ** minorUnitDigits(currency));
}

const DECLINE_REASONS: Record<string, string> = {
  generic_decline: 'the card issuer gave no reason',
  insufficient_funds: 'there are not enough funds on the card',
  lost_card: 'the card was reported lost',
  stolen_card: 'the card was reported stolen',
  expired_card: 'the card has expired',
  incorrect_cvc: 'the security code is wrong',
  do_not_honor: 'the card issuer refused the charge',
};

/** "The card was declined: …" in words a loan officer understands, from the provider's error. */
export function declineMessage(error: { message?: string | null; code?: string | null; decline_code?: string | null } | null | undefined): string {
  const reason = (error?.decline_code && DECLINE_REASONS[error.decline_code]) || error?.message?.replace(/\.$/, '') || 'no reason was given';
  return `The card was declined: ${reason}. Try another card or contact the card issuer.`;
}

function unavailable(err: unknown): AppError {
  console.error('payments provider error:', (err as Error).message);
  return serviceUnavailable('The payment service did not answer. Nothing was charged; try again in a moment.');
}

export interface NewIntent {
  amount: number;
  currency: string;
  orderId: number;
  description: string;
}

export async function createPaymentIntent(input: NewIntent): Promise<{ id: string; amountMinor: number }> {
  const amountMinor = toMinorUnits(input.amount, input.currency);
  try {
    const intent = await paymentsClient().paymentIntents.create({
      amount: amountMinor,
      currency: input.currency.toLowerCase(),
      // Cards are confirmed here on the server, so no payment method that redirects the payer.
      automatic_payment_methods: { enabled: true, allow_redirects: 'never' },
      description: input.description,
      metadata: { orderId: String(input.orderId) },
    });
    return { id: intent.id, amountMinor };
  } catch (err) {
    if (err instanceof AppError) throw err;
    throw unavailable(err);
  }
}

export type ConfirmOutcome = { kind: 'accepted'; status: string } | { kind: 'declined'; message: string };

/** Confirms the intent with the card; a decline is an outcome, not an exception. */
export async function confirmPaymentIntent(intentId: string, paymentMethod: string): Promise<ConfirmOutcome> {
  try {
    const intent = await paymentsClient().paymentIntents.confirm(intentId, { payment_method: paymentMethod });
    if (intent.status === 'succeeded' || intent.status === 'processing') return { kind: 'accepted', status: intent.status };
    return { kind: 'declined', message: declineMessage(intent.last_payment_error ?? { message: `the payment needs a step Compline does not support (${intent.status})` }) };
  } catch (err) {
    if (err instanceof AppError) throw err;
    if (err instanceof Stripe.errors.StripeCardError) return { kind: 'declined', message: declineMessage(err) };
    if (err instanceof Stripe.errors.StripeInvalidRequestError) {
      if (err.code === 'payment_intent_unexpected_state') {
        throw conflict('This payment is already being processed. Reload the order to see where it stands.', 'payment_in_progress');
      }
      if (err.param === 'payment_method') throw unprocessable('That card could not be used. Enter the card again.', { paymentMethod: err.message });
    }
    throw unavailable(err);
  }
}

/** Checks the provider's signature over the raw request bytes; anything wrong is a 400. */
export function verifyWebhookEvent(rawBody: unknown, signatureHeader: string | undefined): Stripe.Event {
  if (!Buffer.isBuffer(rawBody)) throw badRequest('A payment notification must be a JSON body.');
  const secret = webhookSecret();
  try {
    return paymentsClient().webhooks.constructEvent(rawBody, signatureHeader ?? '', secret);
  } catch (err) {
    if (err instanceof Stripe.errors.StripeSignatureVerificationError) {
      throw new AppError(400, 'bad_signature', 'The payment notification’s signature did not verify; it was ignored.');
    }
    throw badRequest('The payment notification could not be read.');
  }
}
