import type { ReactNode } from 'react';
import type { z } from 'zod';
import type { verifyResponse } from '@contracts/report';
import { Button } from '../../../components/ui/button';
import { describeError } from '../../../lib/api-error';
import { formatDay, formatMoment, groupedFingerprint, reportFormat } from '../lib/report-format';

type Found = NonNullable<z.output<typeof verifyResponse>['report']>;

interface Props {
  state: 'found' | 'unknown' | 'malformed' | 'error';
  fingerprint: string;
  report?: Found | null;
  error?: unknown;
  onRetry?: () => void;
}

/** The answer of a fingerprint check, with the facts of the signed version when there is one. */
export function VerifyResult(props: Props) {
  const frame = (tone: string, mark: string, title: string, children: ReactNode) => (
    <section aria-live="polite" className={`flex flex-col gap-4 rounded-xl border-2 px-6 py-5 ${tone}`} data-testid="verify-result" data-state={props.state}>
      <div className="flex items-start gap-4">
        <span aria-hidden className="flex size-10 shrink-0 items-center justify-center rounded-full border-2 border-current text-lg font-bold">
          {mark}
        </span>
        <div className="min-w-0">
          <h2 className="text-[1.25rem] font-semibold text-ink">{title}</h2>
          <p className="figures mt-1 text-[0.8125rem] break-all text-ink-soft">{groupedFingerprint(props.fingerprint)}</p>
        </div>
      </div>
      {children}
    </section>
  );

  if (props.state === 'malformed') {
    return frame('border-rust/50 bg-rust-wash text-rust', '!', 'That is not a fingerprint', <p className="text-[0.9375rem] text-ink-soft">A fingerprint is 64 characters, 0–9 and a–f. Check the link or paste it below.</p>);
  }
  if (props.state === 'error') {
    return frame(
      'border-rule-strong bg-paper-raised text-ink-soft',
      '?',
      'The check could not be made',
      <div className="flex flex-col items-start gap-3">
        <p className="text-[0.9375rem] text-ink-soft">{describeError(props.error)}</p>
        <Button size="sm" onClick={() => props.onRetry?.()}>
          Try again
        </Button>
      </div>,
    );
  }
  if (props.state === 'unknown' || !props.report) {
    return frame(
      'border-rust/50 bg-rust-wash text-rust',
      '×',
      'No signed report has this fingerprint',
      <p className="text-[0.9375rem] text-ink-soft">The copy you hold may have been altered, or the fingerprint mistyped. Ask the appraisal firm for the report as signed.</p>,
    );
  }
  const r = props.report;
  const format = reportFormat(r.currency, 'sqft');
  return frame(
    'border-teal/50 bg-teal-wash text-teal',
    '✓',
    'Signed — this fingerprint matches a report',
    <dl className="grid gap-x-8 gap-y-3 rounded-lg bg-paper-raised px-5 py-4 sm:grid-cols-2">
      {(
        [
          ['Subject address', r.subjectAddress],
          ['Version', `Version ${r.versionNumber}`],
          ['Signed by', r.signerName],
          ['Signed on', formatMoment(r.signedAt)],
          ['Opinion of value', format.money(r.opinionOfValue)],
          ['Effective date', formatDay(r.effectiveDate)],
        ] as const
      ).map(([term, value]) => (
        <div key={term}>
          <dt className="text-[0.75rem] font-medium tracking-wide text-ink-faint uppercase">{term}</dt>
          <dd className="mt-0.5 text-[1rem] font-semibold text-ink" data-testid={`verify-${term.toLowerCase().replace(/\s+/g, '-')}`}>
            {value}
          </dd>
        </div>
      ))}
    </dl>,
  );
}
