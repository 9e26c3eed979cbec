import { useState } from 'react';
import type { Analysis } from '@contracts/analysis';
import { fitSnapshot, formatRSquared, type FitSnapshot } from '../lib/review-figures';

/** The fit of the subject's neighbourhood in two figures (R² and n). When the analysis changes while
 * the page is open (a sale excluded or kept), it says how they moved. */
export function SubjectFit({ analysis }: { analysis: Analysis }) {
  const group = analysis.groups.find((g) => g.neighbourhood === analysis.subjectGroup && !g.pooled);
  const now = fitSnapshot(group);
  const [seen, setSeen] = useState({ revision: analysis.dataRevision, snapshot: now });
  const [change, setChange] = useState<{ before: FitSnapshot; after: FitSnapshot } | null>(null);
  if (analysis.dataRevision !== seen.revision) {
    if (seen.snapshot && now) setChange({ before: seen.snapshot, after: now });
    setSeen({ revision: analysis.dataRevision, snapshot: now });
  }

  if (!group || !now) {
    return <p className="text-[0.9375rem] text-ink-soft">The subject’s neighbourhood has no fit yet: place the subject and add its sales.</p>;
  }
  const gate = group.gate;
  return (
    <div className="flex flex-col gap-3">
      <dl className="flex flex-wrap gap-x-8 gap-y-2">
        <div>
          <dt className="text-xs font-semibold tracking-wide text-ink-faint uppercase">R², {now.neighbourhood}</dt>
          <dd className="figures text-2xl font-semibold text-ink" data-testid="subject-r-squared">
            {formatRSquared(now.rSquared, change?.before.rSquared)}
          </dd>
        </div>
        <div>
          <dt className="text-xs font-semibold tracking-wide text-ink-faint uppercase">Sales in the fit</dt>
          <dd className="figures text-2xl font-semibold text-ink">{now.n}</dd>
        </div>
        <div>
          <dt className="text-xs font-semibold tracking-wide text-ink-faint uppercase">Correlation gate</dt>
          <dd className="mt-1 text-[0.9375rem] text-ink">{gate ? (gate.passes ? 'Met' : 'Not met') : '—'}</dd>
        </div>
      </dl>
      {change && (
        <p role="status" className="rounded-md border border-teal/35 bg-teal-wash px-3 py-2 text-[0.9375rem] text-ink" data-testid="fit-change">
          After the latest change the {change.after.neighbourhood} fit has R²{' '}
          <span className="figures font-semibold">{formatRSquared(change.after.rSquared, change.before.rSquared)}</span> (was{' '}
          <span className="figures">{formatRSquared(change.before.rSquared, change.after.rSquared)}</span>) from{' '}
          <span className="figures">{change.after.n}</span> sales (was <span className="figures">{change.before.n}</span>).
        </p>
      )}
      {gate && !gate.passes && <p className="text-[0.875rem] leading-relaxed text-ink-soft">{gate.message}</p>}
    </div>
  );
}
