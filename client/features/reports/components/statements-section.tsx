import type { ReactNode } from 'react';
import type { ReportSnapshot } from '@contracts/report';
import { formatMoment } from '../lib/report-format';

function Block({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-2">
      <h3 className="text-[0.9375rem] font-semibold text-ink">{title}</h3>
      {children}
    </div>
  );
}

function Statement({ text, none }: { text: string; none: string }) {
  return text.trim() ? <p className="text-[0.9375rem] leading-relaxed whitespace-pre-wrap text-ink">{text}</p> : <p className="text-[0.9375rem] text-ink-faint">{none}</p>;
}

/** The appraiser's reconciliation in their own words. */
export function ReconciliationNote({ snapshot }: { snapshot: ReportSnapshot }) {
  return (
    <blockquote className="report-card rounded-lg border-l-4 border-ink bg-paper-raised px-5 py-4">
      <Statement text={snapshot.reconciliationComment ?? ''} none="No reconciliation comment was written." />
      <footer className="mt-2 text-[0.8125rem] text-ink-soft">— {snapshot.signer.name}</footer>
    </blockquote>
  );
}

/** Assumptions, hypothetical conditions and the limiting conditions the value rests on. */
export function ConditionsSection({ snapshot }: { snapshot: ReportSnapshot }) {
  return (
    <div className="grid gap-6 md:grid-cols-2">
      <div className="flex flex-col gap-5">
        <Block title="Extraordinary assumptions">
          <Statement text={snapshot.extraordinaryAssumptions} none="None." />
        </Block>
        <Block title="Hypothetical conditions">
          <Statement text={snapshot.hypotheticalConditions} none="None." />
        </Block>
      </div>
      <Block title="Limiting conditions">
        <ol className="flex list-none flex-col gap-2">
          {snapshot.limitingConditions.map((text, i) => (
            <li key={i} className="flex gap-3 text-[0.9375rem] leading-relaxed text-ink">
              <span aria-hidden className="figures text-sm text-ink-faint">{String(i + 1).padStart(2, '0')}</span>
              <span>{text}</span>
            </li>
          ))}
        </ol>
      </Block>
    </div>
  );
}

/** The certification as confirmed at signing, with who signed, under which licence, and when. */
export function CertificationSection({ snapshot }: { snapshot: ReportSnapshot }) {
  return (
    <div className="report-card grid gap-6 rounded-lg border border-rule-strong bg-paper-raised px-5 py-5 lg:grid-cols-[minmax(0,1.6fr)_minmax(0,1fr)]">
      <ol className="flex flex-col gap-2.5">
        {snapshot.certification.map((text, i) => (
          <li key={i} className="flex gap-3 text-[0.9375rem] leading-relaxed text-ink">
            <span aria-hidden className="mt-0.5 text-teal">✓</span>
            <span>{text}</span>
          </li>
        ))}
      </ol>
      <div className="flex flex-col justify-end gap-1 border-t border-rule pt-4 lg:border-t-0 lg:border-l lg:pt-0 lg:pl-6">
        <p className="text-[0.75rem] font-medium tracking-wide text-ink-faint uppercase">Signed by</p>
        <p className="border-b border-ink pb-1 text-[1.375rem] font-semibold text-ink italic" data-testid="signer-name">
          {snapshot.signer.name}
        </p>
        <dl className="mt-2 grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-1 text-[0.875rem]">
          <dt className="text-ink-faint">Licence</dt>
          <dd className="figures text-ink">{snapshot.signer.licenceNumber}</dd>
          <dt className="text-ink-faint">Jurisdiction</dt>
          <dd className="text-ink">{snapshot.signer.jurisdiction}</dd>
          <dt className="text-ink-faint">Signed</dt>
          <dd className="figures text-ink">{formatMoment(snapshot.signedAt)}</dd>
          <dt className="text-ink-faint">Firm</dt>
          <dd className="text-ink">{snapshot.firmName}</dd>
        </dl>
      </div>
    </div>
  );
}
