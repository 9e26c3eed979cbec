import { useState } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import type { Fee } from '@contracts/orders';
import { formatMoney } from '../../../lib/format-money';

/**
 * The fee as a choice of cards, one per fee of the chosen firm, each with what it covers and its
 * amount. A lender that orders from several firms first picks the firm.
 */
export function FeeChoice({ fees, field, selectedFeeId, error, onFirmChange }: {
  fees: readonly Fee[];
  field: UseFormRegisterReturn<'feeId'>;
  selectedFeeId: string;
  error?: string;
  onFirmChange: () => void;
}) {
  const firms = [...new Map(fees.map((fee) => [fee.firmOrganisationId, fee.firmName])).entries()];
  const selectedFirm = fees.find((fee) => String(fee.id) === selectedFeeId)?.firmOrganisationId;
  const [firmId, setFirmId] = useState<number | undefined>(selectedFirm ?? firms[0]?.[0]);
  const shown = fees.filter((fee) => fee.firmOrganisationId === firmId);

  return (
    <fieldset aria-describedby={error ? 'fee-error' : undefined} className="flex flex-col gap-3">
      <legend className="text-sm font-semibold text-ink">Appraisal and fee</legend>
      {firms.length > 1 && (
        <label className="flex flex-col gap-1.5 text-sm text-ink-soft">
          Appraisal firm
          <select
            value={firmId}
            onChange={(event) => {
              setFirmId(Number(event.target.value));
              onFirmChange();
            }}
            className="block h-10 w-full max-w-sm rounded-md border border-rule-strong bg-paper-raised px-3 text-[0.9375rem] text-ink focus:border-ink focus:ring-2 focus:ring-ink/15 focus:outline-none"
          >
            {firms.map(([id, name]) => (
              <option key={id} value={id}>
                {name}
              </option>
            ))}
          </select>
        </label>
      )}
      {firms.length === 1 && <p className="text-[0.9375rem] text-ink-soft">From {firms[0][1]}</p>}
      <div className="grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
        {shown.map((fee) => (
          <label
            key={fee.id}
            className="group relative flex cursor-pointer flex-col gap-1.5 rounded-lg border border-rule-strong bg-paper-raised px-4 py-3 transition-colors hover:border-ink-soft has-[:checked]:border-ink has-[:checked]:bg-paper has-[:checked]:shadow-[inset_0_0_0_1px_var(--color-ink)] has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-ink"
          >
            <span className="flex items-start justify-between gap-3">
              <span className="flex items-start gap-2.5">
                <input type="radio" value={String(fee.id)} className="mt-1 size-4 accent-[var(--color-ink)]" {...field} />
                <span className="text-[0.9375rem] leading-snug font-semibold text-ink">{fee.name}</span>
              </span>
              <span className="figures text-[0.9375rem] font-semibold whitespace-nowrap text-ink">{formatMoney(fee.amount, fee.currency)}</span>
            </span>
            <span className="pl-6.5 text-[0.8125rem] leading-snug text-ink-soft">{fee.description}</span>
          </label>
        ))}
      </div>
      {error && (
        <p id="fee-error" className="text-[0.8125rem] font-medium text-rust">
          {error}
        </p>
      )}
    </fieldset>
  );
}
