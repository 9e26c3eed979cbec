import type { GridResponse } from '@contracts/grid';
import { checkLabels } from '../lib/grid-labels';

/** The soft checks a reviewer would raise about the grid, each with its reason. None of them blocks
 * submission: they are questions to answer in the reconciliation comment. */
export function GridChecks({ checks }: { checks: GridResponse['checks'] }) {
  return (
    <section aria-labelledby="checks-title" className="rounded-lg border border-rule bg-paper-raised">
      <header className="flex flex-wrap items-baseline justify-between gap-2 border-b border-rule px-5 py-3">
        <h3 id="checks-title" className="text-base font-semibold">
          Checks
        </h3>
        <p className="text-[0.8125rem] text-ink-faint">Soft warnings: answer them in the reconciliation comment; none blocks submission.</p>
      </header>
      {checks.length === 0 ? (
        <p className="px-5 py-4 text-[0.9375rem] text-ink-soft">No checks raised: enough sales, recent and near, bracketing the subject, inside the limits.</p>
      ) : (
        <ul className="divide-y divide-rule" aria-label="Checks raised">
          {checks.map((check, index) => (
            <li key={`${check.code}-${check.saleId ?? 'all'}-${index}`} className="grid gap-x-4 gap-y-0.5 px-5 py-2.5 sm:grid-cols-[12rem_minmax(0,1fr)]">
              <span className="flex items-center gap-2 text-sm font-semibold text-ink">
                {check.code === 'flagged-sale' ? (
                  <span aria-hidden className="inline-block size-3 shrink-0 rounded-full border-2 border-flag-ring" />
                ) : (
                  <span aria-hidden className="inline-flex size-4 shrink-0 items-center justify-center rounded-full border border-rust/60 text-[0.625rem] font-bold text-rust">
                    ?
                  </span>
                )}
                {checkLabels[check.code] ?? check.code}
              </span>
              <span className="text-[0.9375rem] leading-relaxed text-ink-soft">{check.message}</span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
