import Stripe from 'stripe';

/** Delivers the local fake's events the way the provider does: a JSON POST carrying a
 * Stripe-Signature header made with the SDK's own signing scheme, retried a few times while the
 * receiver does not answer 2xx. Used only by fake-payments-api.ts. */

export interface DeliveryResult {
  /** The receiver's last HTTP status, or 0 when it could not be reached. */
  status: number;
  body: string;
  attempts: number;
}

export interface RawDeliveryOptions {
  /** The Stripe-Signature header to send; null sends none. Default: a valid signature. */
  signature?: string | null;
  /** Sign with this secret instead of the configured one (to test a forged notification). */
  signWith?: string;
  /** Retry while the receiver does not answer 2xx (default true). */
  retry?: boolean;
}

export class WebhookSender {
  private readonly inFlight = new Set<Promise<unknown>>();

  constructor(
    private readonly secret: string,
    public url: string | null,
    private readonly retryDelaysMs: readonly number[],
  ) {}

  sign(payload: string, secret = this.secret): string {
    return Stripe.webhooks.generateTestHeaderString({ payload, secret });
  }

  /** Sends the payload once per attempt until a 2xx answer or the retries run out. */
  deliver(payload: string, options: RawDeliveryOptions = {}): Promise<DeliveryResult> {
    const run = this.send(payload, options);
    this.inFlight.add(run);
    void run.finally(() => this.inFlight.delete(run));
    return run;
  }

  /** Resolves when every delivery started so far (retries included) has finished. */
  async settled(): Promise<void> {
    while (this.inFlight.size) await Promise.allSettled([...this.inFlight]);
  }

  private async send(payload: string, options: RawDeliveryOptions): Promise<DeliveryResult> {
    const url = this.url;
    if (!url) return { status: 0, body: 'no webhook URL configured', attempts: 0 };
    let last: DeliveryResult = { status: 0, body: '', attempts: 0 };
    const delays = options.retry === false ? [0] : [0, ...this.retryDelaysMs];
    for (let attempt = 0; attempt < delays.length; attempt++) {
      if (delays[attempt] > 0) await new Promise((resolve) => setTimeout(resolve, delays[attempt]));
      const signature = options.signature === undefined ? this.sign(payload, options.signWith) : options.signature;
      const headers: Record<string, string> = { 'content-type': 'application/json; charset=utf-8', 'user-agent': 'Compline-FakePayments/1.0' };
      if (signature !== null) headers['stripe-signature'] = signature;
      try {
        const res = await fetch(url, { method: 'POST', headers, body: payload, signal: AbortSignal.timeout(10_000) });
        last = { status: res.status, body: await res.text(), attempts: attempt + 1 };
        if (res.ok) return last;
      } catch (err) {
        last = { status: 0, body: (err as Error).message, attempts: attempt + 1 };
      }
    }
    return last;
  }
}
