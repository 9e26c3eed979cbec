import Stripe from 'stripe';
import { env } from '../../env';
import { serviceUnavailable } from '../../errors';

/** Where the payments SDK talks to and which secrets it uses. Read from the environment at start-up;
 * the server (when it starts the local fake) and tests replace it with configurePayments(). */
export interface PaymentsConfig {
  secretKey?: string;
  webhookSecret?: string;
  /** e.g. http://127.0.0.1:4242 — host, port and protocol are taken from it. Unset: the provider's own API. */
  apiUrl?: string;
}

let config: PaymentsConfig = {
  secretKey: env.PAYMENTS_SECRET_KEY,
  webhookSecret: env.PAYMENTS_WEBHOOK_SECRET,
  apiUrl: env.PAYMENTS_API_URL,
};
let client: Stripe | null = null;

export function configurePayments(next: PaymentsConfig): void {
  config = { ...config, ...next };
  client = null;
}

export function paymentsConfig(): Readonly<PaymentsConfig> {
  return config;
}

function addressOf(apiUrl: string | undefined): Pick<Stripe.StripeConfig, 'host' | 'port' | 'protocol'> {
  if (!apiUrl) return {};
  const url = new URL(apiUrl);
  const protocol = url.protocol === 'http:' ? 'http' : 'https';
  return { host: url.hostname, port: url.port || (protocol === 'http' ? 80 : 443), protocol };
}

/** The official SDK, built once per configuration. */
export function paymentsClient(): Stripe {
  if (!config.secretKey) {
    throw serviceUnavailable('Card payments are not set up on this server (PAYMENTS_SECRET_KEY is missing). Nothing was charged.');
  }
  client ??= new Stripe(config.secretKey, {
    ...addressOf(config.apiUrl),
    telemetry: false,
    maxNetworkRetries: 2,
    timeout: 20_000,
  });
  return client;
}

export function webhookSecret(): string {
  if (!config.webhookSecret) {
    throw serviceUnavailable('Payment notifications cannot be verified: PAYMENTS_WEBHOOK_SECRET is missing.');
  }
  return config.webhookSecret;
}
