import type { ReactNode } from 'react';
import type { ReportSnapshot } from '@contracts/report';
import { subjectGroup } from '@contracts/report-facts';
import { formatDay, type ReportFormat } from '../lib/report-format';
import { ValueScale } from './value-scale';

function Figure({ term, value, note, testId, symbol = false }: { term: string; value: ReactNode; note?: ReactNode; testId?: string; symbol?: boolean }) {
  return (
    <div className="min-w-0 border-t border-rule pt-2.5">
      {/* Statistical symbols (n, R²) keep their case. */}
      <dt className={`text-[0.75rem] font-medium tracking-wide text-ink-faint ${symbol ? 'figures' : 'uppercase'}`}>{term}</dt>
      <dd className="figures mt-0.5 text-[1.0625rem] text-ink" data-testid={testId}>
        {value}
      </dd>
      {note && <dd className="mt-0.5 text-[0.8125rem] leading-snug text-ink-soft">{note}</dd>}
    </div>
  );
}

/** The opening of the report: the opinion of value and its date, and beside it the evidence in
 * figures — the regression's estimate at the subject with its 95% prediction interval, R², n — and
 * the grid's indicated value, all on one price scale. */
export function ValueSummary({ snapshot, format }: { snapshot: ReportSnapshot; format: ReportFormat }) {
  const group = subjectGroup(snapshot);
  const fit = group?.fit ?? null;
  const prediction = group?.prediction ?? null;
  const { grid } = snapshot;
  return (
    <section aria-labelledby="opinion-title" className="report-card grid gap-x-10 gap-y-6 rounded-xl border border-rule-strong bg-paper-raised px-6 py-6 lg:grid-cols-[minmax(0,0.9fr)_minmax(0,1.1fr)] lg:px-8">
      <div className="flex flex-col gap-5">
        <div>
          <h2 id="opinion-title" className="text-[0.8125rem] font-semibold tracking-[0.08em] text-ink-soft uppercase">
            Opinion of market value
          </h2>
          <p className="figures mt-2 text-[2.75rem] leading-none font-semibold tracking-[-0.02em] text-ink sm:text-[3.25rem]" data-testid="opinion-of-value">
            {format.money(snapshot.opinionOfValue)}
          </p>
          <p className="mt-3 text-[1.0625rem] text-ink">
            as of <span className="font-semibold">{formatDay(snapshot.assignment.effectiveDate)}</span>
            <span className="text-ink-soft"> (effective date)</span>
          </p>
        </div>
        <p className="max-w-md text-[0.875rem] leading-relaxed text-ink-soft">
          The appraiser’s opinion, reconciled from the adjusted prices of {grid.rows.length === 1 ? 'one comparable sale' : `${grid.rows.length} comparable sales`} and rounded to the nearest{' '}
          {format.money(grid.settings.valueIncrement)}. The regression figures beside it are evidence for it, not a substitute.
        </p>
      </div>
      <div className="flex flex-col gap-4">
        <dl className="grid grid-cols-2 gap-x-6 gap-y-4 sm:grid-cols-3">
          <Figure
            term="Regression estimate"
            value={format.money(prediction?.estimate)}
            note={prediction ? `at ${format.area(prediction.x0)} in ${group?.neighbourhood ?? 'the neighbourhood'}` : 'No estimate: the fit could not give one.'}
            testId="regression-estimate"
          />
          <Figure
            term="95% prediction interval"
            value={prediction ? `${format.money(prediction.lower)} – ${format.money(prediction.upper)}` : '—'}
            note={prediction?.extrapolated ? 'The subject’s floor area lies outside the sales’ range: the interval is an extrapolation.' : 'for one house of the subject’s floor area'}
          />
          <Figure symbol term="R²" value={format.decimal(fit?.rSquared, 3)} note={fit ? `r = ${format.decimal(fit.r, 3)}` : group?.refusal?.message} testId="r-squared" />
          <Figure symbol term="n" value={format.count(group?.n)} note="sales in the neighbourhood fit" testId="sales-n" />
          <Figure term="Indicated value" value={format.money(grid.indicatedValue)} note="weighted mean of the adjusted prices" />
          <Figure
            term="Floor-area rate"
            value={format.perArea(grid.rate.value)}
            note={grid.rate.source === 'typed' ? 'typed by the appraiser (see the justification below)' : grid.rate.source === 'fit' ? 'from the fitted slope' : 'none'}
          />
        </dl>
      </div>
      <div className="border-t border-rule pt-4 lg:col-span-2">
        <ValueScale opinion={snapshot.opinionOfValue} interval={prediction} adjustedRange={grid.adjustedRange} format={format} />
      </div>
    </section>
  );
}
