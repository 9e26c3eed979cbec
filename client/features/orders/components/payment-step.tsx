import { useState } from 'react';
import type { Order } from '@contracts/orders';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ProgressBar } from '../../../components/ui/progress-bar';
import { describeError } from '../../../lib/api-error';
import { formatMoney } from '../../../lib/format-money';
import type { TestCard } from '../api/order-queries';
import { useOrderPayment } from '../hooks/use-order-payment';

/*
 * In development and in the tests the payment provider is a local fake that understands the
 * provider's test payment methods only, so the card form is a choice between two of them. In
 * production this is where the provider's hosted card fields are mounted: the card number goes from
 * the browser to the provider, which hands back a payment-method token, and only that token is sent
 * to our server (POST /api/orders/:id/pay). Raw card numbers never reach Compline's server.
 */
const testCards: ReadonlyArray<{ value: TestCard; label: string; hint: string }> = [
  { value: 'pm_card_visa', label: 'Test card — approved', hint: 'The provider accepts the charge.' },
  { value: 'pm_card_chargeDeclined', label: 'Test card — declined', hint: 'The provider refuses the charge; the order stays unpaid.' },
];

/** Step two of an order: pay the fee. A decline shows the provider's words and keeps the order
 * unpaid; an accepted card waits until the provider's confirmation shows the order paid. */
export function PaymentStep({ order }: { order: Order }) {
  const { pay, phase, slow, failureMessage } = useOrderPayment(order.id);
  const [card, setCard] = useState<TestCard>('pm_card_visa');
  const amount = formatMoney(order.feeAmount, order.currency);

  if (phase === 'paid') {
    return (
      <Notice tone="success" title="Paid — the order is with the firm">
        {amount} was charged for {order.feeName.toLowerCase()}. {order.firmName} has been told and will accept or decline it; you will get an e-mail either way.
      </Notice>
    );
  }

  const busy = pay.isPending || phase === 'confirming';
  return (
    <form
      aria-label="Payment"
      className="flex flex-col gap-5"
      onSubmit={(event) => {
        event.preventDefault();
        pay.mutate(card);
      }}
    >
      {pay.isError && (
        <Notice tone="error" title="The payment did not go through">
          {describeError(pay.error)} The order is still unpaid.
        </Notice>
      )}
      {failureMessage && (
        <Notice tone="error" title="The provider declined the payment">
          {failureMessage} The order is still unpaid.
        </Notice>
      )}
      <fieldset className="flex flex-col gap-2.5" disabled={busy}>
        <legend className="mb-1 text-sm font-semibold text-ink">Card</legend>
        <p className="mb-1 text-[0.875rem] text-ink-soft">This server uses the payment provider’s local test double: choose one of its test cards. No real card is charged.</p>
        {testCards.map((choice) => (
          <label
            key={choice.value}
            className="flex cursor-pointer items-start gap-3 rounded-lg border border-rule-strong bg-paper-raised px-4 py-3 hover:border-ink-soft has-[:checked]:border-ink has-[:checked]:shadow-[inset_0_0_0_1px_var(--color-ink)]"
          >
            <input type="radio" name="card" value={choice.value} checked={card === choice.value} onChange={() => setCard(choice.value)} className="mt-1 size-4 accent-[var(--color-ink)]" />
            <span>
              <span className="block font-semibold text-ink">{choice.label}</span>
              <span className="block text-[0.8125rem] text-ink-soft">{choice.hint}</span>
            </span>
            <span aria-hidden className="figures ml-auto self-center rounded border border-rule px-2 py-0.5 text-[0.6875rem] tracking-wider text-ink-faint uppercase">
              test
            </span>
          </label>
        ))}
      </fieldset>
      {phase === 'confirming' && (
        <ProgressBar value={null} label="Waiting for the provider to confirm the payment…" detail={slow ? 'taking longer than usual' : undefined} />
      )}
      {slow && phase === 'confirming' && (
        <Notice tone="warning">The provider has not confirmed yet. You may leave this page: the order shows as paid once the confirmation arrives.</Notice>
      )}
      <div className="flex flex-wrap items-center gap-4 border-t border-rule pt-5">
        <Button type="submit" variant="primary" busy={busy} busyLabel={pay.isPending ? 'Sending to the provider…' : 'Confirming…'}>
          Pay {amount}
        </Button>
        <p className="text-[0.875rem] text-ink-soft">{order.feeName}</p>
      </div>
    </form>
  );
}
