import { lazy, Suspense } from 'react';
import type { ReportSnapshot } from '@contracts/report';
import { LoadingPanel } from '../../../components/ui/query-states';
import { subjectGroup, subjectTrend } from '@contracts/report-facts';
import type { ReportFormat } from '../lib/report-format';

const ReportCharts = lazy(() => import('./report-charts'));

function Row({ term, value, words = false }: { term: string; value: string; words?: boolean }) {
  return (
    <div className="flex items-baseline justify-between gap-4 border-b border-dotted border-rule py-1.5">
      <dt className="text-[0.875rem] text-ink-soft">{term}</dt>
      <dd className={`text-right text-[0.875rem] text-ink ${words ? '' : 'figures'}`}>{value}</dd>
    </div>
  );
}

/** The market evidence: the two charts (lazily loaded) and the fit's figures in full. */
export function EvidenceSection({ snapshot, format }: { snapshot: ReportSnapshot; format: ReportFormat }) {
  const group = subjectGroup(snapshot);
  const trend = subjectTrend(snapshot);
  const fit = group?.fit ?? null;
  const warnings = [...(group?.warnings ?? []), ...snapshot.analysis.warnings];
  return (
    <div className="flex flex-col gap-5">
      <Suspense fallback={<LoadingPanel label="Drawing the charts…" />}>
        <ReportCharts snapshot={snapshot} group={group} trend={trend} format={format} />
      </Suspense>
      <div className="grid gap-x-10 gap-y-4 md:grid-cols-2">
        <dl aria-label="Figures of the neighbourhood fit">
          <Row term="Sales in the fit (n)" value={format.count(group?.n)} />
          <Row term="Slope (price per unit of floor area)" value={format.perArea(fit?.slope)} />
          <Row term="95% confidence interval of the slope" value={fit ? `${format.money(fit.slopeInterval[0])} to ${format.money(fit.slopeInterval[1])}` : '—'} />
          <Row term="Correlation r" value={format.decimal(fit?.r, 3)} />
          <Row term="R² / adjusted R²" value={fit ? `${format.decimal(fit.rSquared, 3)} / ${format.decimal(fit.adjustedRSquared, 3)}` : '—'} />
          <Row term="Residual standard error s" value={format.money(fit?.residualStdError)} />
        </dl>
        <dl aria-label="Figures of the time trend and the rate">
          <Row term="Market trend per month" value={format.signedPercent(trend?.monthlyRate ?? null, 2)} />
          <Row words term="Time adjustment" value={snapshot.analysis.timeAdjustment ? 'applied to every sale' : 'not applied'} />
          <Row term="Floor-area rate used" value={format.perArea(snapshot.grid.rate.value)} />
          <Row words term="Correlation gate" value={group?.gate ? (group.gate.passes ? 'met' : 'not met') : '—'} />
          <Row term="Sales analysed, all neighbourhoods" value={format.count(snapshot.sales.length)} />
          <Row term="Sales excluded" value={format.count(snapshot.analysis.excluded.length)} />
        </dl>
      </div>
      {snapshot.grid.rate.source === 'typed' && snapshot.grid.settings.rateJustification && (
        <div className="rounded-md border-l-4 border-ink-soft bg-paper-sunk/60 px-4 py-3">
          <p className="text-sm font-semibold text-ink">Why the appraiser typed the floor-area rate</p>
          <p className="mt-1 text-[0.9375rem] leading-relaxed text-ink-soft">{snapshot.grid.settings.rateJustification}</p>
        </div>
      )}
      {warnings.length > 0 && (
        <ul className="flex flex-col gap-1 text-[0.875rem] text-ink-soft">
          {warnings.map((w) => (
            <li key={w} className="flex gap-2">
              <span aria-hidden className="text-ink-faint">▲</span>
              {w}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
