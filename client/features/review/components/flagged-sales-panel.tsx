import type { ReactNode } from 'react';
import type { Analysis, FlaggedSale } from '@contracts/analysis';
import { pointFlagLabel } from '@contracts/analysis';
import { residualWords } from '../lib/review-figures';

interface FlaggedSalesPanelProps {
  analysis: Analysis;
  /** What stands beside a flagged sale: its query's state, or the reviewer's "Raise a query". */
  renderAction: (sale: FlaggedSale) => ReactNode;
}

function FlaggedRow({ sale, action }: { sale: FlaggedSale; action: ReactNode }) {
  const residual = residualWords(sale.residualPct);
  return (
    <li className="grid gap-x-5 gap-y-2 px-5 py-4 md:grid-cols-[minmax(0,1fr)_auto]" data-testid="flagged-sale">
      <div className="flex min-w-0 gap-3">
        <span aria-hidden className="mt-1 inline-block size-4 shrink-0 rounded-full border-[2.5px] border-flag-ring" />
        <div className="min-w-0">
          <p className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
            <span className="text-[1.0625rem] font-semibold text-ink">{sale.address}</span>
            {residual && <span className="figures text-sm text-ink-soft">{residual}</span>}
            {sale.inGrid && <span className="rounded-sm border border-ink/30 px-1.5 text-xs font-semibold text-ink">in the grid</span>}
          </p>
          <p className="mt-1 flex flex-wrap gap-1.5" aria-label="Flags">
            {sale.flags.map((flag) => (
              <span key={flag} className="rounded-full border border-flag-ring/40 px-2 py-px text-xs font-semibold text-flag-ring">
                {pointFlagLabel(flag)}
              </span>
            ))}
          </p>
          <p className="mt-1.5 max-w-3xl text-[0.9375rem] leading-relaxed text-ink-soft">{sale.reason}</p>
        </div>
      </div>
      {/* An opened form (the question being written) takes the row's full width under the reason. */}
      <div className="flex flex-col items-start gap-2 md:items-end md:pl-4 md:has-[form]:col-span-2 md:has-[form]:items-stretch md:has-[form]:pl-7">{action}</div>
    </li>
  );
}

/** The sales the fits flag, the subject's neighbourhood first: each one is a question for the
 * appraiser, not a verdict. Other neighbourhoods' flagged sales follow, folded. */
export function FlaggedSalesPanel({ analysis, renderAction }: FlaggedSalesPanelProps) {
  const groups = analysis.groups.filter((g) => !g.pooled);
  const subjectGroup = groups.find((g) => g.neighbourhood === analysis.subjectGroup);
  const elsewhere = groups.filter((g) => g !== subjectGroup && g.flagged.length > 0);
  const elsewhereCount = elsewhere.reduce((t, g) => t + g.flagged.length, 0);

  return (
    <div className="flex flex-col gap-4">
      <section aria-labelledby="flagged-subject-title" className="rounded-lg border border-rule bg-paper-raised">
        <header className="flex flex-wrap items-baseline justify-between gap-2 border-b border-rule px-5 py-3">
          <h4 id="flagged-subject-title" className="text-base font-semibold">
            {subjectGroup ? `Flagged in ${subjectGroup.neighbourhood}, the subject’s neighbourhood` : 'Flagged sales'}
          </h4>
          <p className="figures text-sm text-ink-soft">{subjectGroup ? `${subjectGroup.flagged.length} of ${subjectGroup.n} sales` : ''}</p>
        </header>
        {!subjectGroup && <p className="px-5 py-4 text-[0.9375rem] text-ink-soft">The subject’s neighbourhood has no fit yet, so nothing is flagged there.</p>}
        {subjectGroup && subjectGroup.flagged.length === 0 && <p className="px-5 py-4 text-[0.9375rem] text-ink-soft">The fit flags none of its sales.</p>}
        {subjectGroup && subjectGroup.flagged.length > 0 && (
          <ul className="divide-y divide-rule" aria-label={`Flagged sales in ${subjectGroup.neighbourhood}`}>
            {subjectGroup.flagged.map((sale) => (
              <FlaggedRow key={sale.saleId} sale={sale} action={renderAction(sale)} />
            ))}
          </ul>
        )}
      </section>

      {elsewhereCount > 0 && (
        <details className="group rounded-lg border border-rule bg-paper-raised">
          <summary className="flex cursor-pointer list-none items-center justify-between gap-2 px-5 py-3 text-[0.9375rem] font-semibold text-ink">
            Flagged in the other neighbourhoods
            <span className="figures text-sm font-normal text-ink-soft">
              {elsewhereCount} <span aria-hidden className="ml-1 inline-block transition-transform group-open:rotate-90">›</span>
            </span>
          </summary>
          {elsewhere.map((group) => (
            <div key={group.neighbourhood} className="border-t border-rule">
              <p className="bg-paper-sunk/50 px-5 py-1.5 text-xs font-semibold tracking-wide text-ink-soft uppercase">{group.neighbourhood}</p>
              <ul className="divide-y divide-rule">
                {group.flagged.map((sale) => (
                  <FlaggedRow key={sale.saleId} sale={sale} action={renderAction(sale)} />
                ))}
              </ul>
            </div>
          ))}
        </details>
      )}
    </div>
  );
}
