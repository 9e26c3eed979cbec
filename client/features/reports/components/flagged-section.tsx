import type { ReportSnapshot } from '@contracts/report';
import { handledSales, type HandledSale, type Outcome } from '@contracts/report-facts';
import { formatMoment, type ReportFormat } from '../lib/report-format';
import { pointFlagWord } from '@contracts/analysis';

const outcomeStyle: Record<Outcome, { label: string; tone: string; fallback: string }> = {
  kept: { label: 'Kept, with explanation', tone: 'border-teal/40 bg-teal-wash text-teal', fallback: 'Kept in the analysis; no explanation was written.' },
  excluded: { label: 'Excluded, with reason', tone: 'border-rust/40 bg-rust-wash text-rust', fallback: 'Excluded; no reason was recorded.' },
  resolved: { label: 'Query resolved', tone: 'border-rule-strong bg-paper-sunk text-ink-soft', fallback: 'The query was resolved without a written answer.' },
  awaiting: { label: 'Queried, unanswered', tone: 'border-rule-strong bg-paper-sunk text-ink-soft', fallback: 'Queried; no answer was recorded before signing.' },
  'not-queried': { label: 'Not queried', tone: 'border-rule bg-paper text-ink-faint', fallback: 'No query was raised; the sale stays in the analysis as recorded.' },
};

function Outcome({ sale }: { sale: HandledSale }) {
  const style = outcomeStyle[sale.outcome];
  return <span className={`inline-flex self-start rounded-full border px-2.5 py-0.5 text-xs font-semibold whitespace-nowrap ${style.tone}`}>{style.label}</span>;
}

function FlagChips({ flags }: { flags: readonly string[] }) {
  return (
    <span className="flex flex-wrap gap-1">
      {flags.map((f) => (
        <span key={f} className="rounded-full border border-flag-ring/60 px-2 py-px text-[0.6875rem] font-semibold text-flag-ring">
          {pointFlagWord(f)}
        </span>
      ))}
    </span>
  );
}

function SaleCase({ sale, format }: { sale: HandledSale; format: ReportFormat }) {
  const text = sale.outcomeText?.trim() || outcomeStyle[sale.outcome].fallback;
  return (
    <li className="report-card grid gap-3 rounded-lg border border-rule bg-paper-raised px-4 py-3 md:grid-cols-[minmax(0,1fr)_minmax(0,1.3fr)]" data-testid="handled-sale">
      <div className="flex gap-3">
        {sale.outcome === 'excluded' ? (
          <span aria-hidden className="mt-px w-3.5 shrink-0 text-center text-[1.0625rem] leading-none font-bold text-rust">
            ×
          </span>
        ) : (
          <span aria-hidden className="mt-1 size-3.5 shrink-0 rounded-full border-2 border-flag-ring" />
        )}
        <div className="min-w-0">
          <h4 className={`font-semibold text-ink ${sale.outcome === 'excluded' ? 'line-through decoration-rust/70' : ''}`}>{sale.address}</h4>
          <p className="text-[0.8125rem] text-ink-soft">
            {sale.neighbourhood ?? '—'}
            {sale.inGrid ? ' · in the grid' : ''}
            {sale.residualPct !== null ? ` · ${format.signedPercent(sale.residualPct, 0)} off the line` : ''}
          </p>
          {sale.flags.length > 0 && <div className="mt-1.5"><FlagChips flags={sale.flags} /></div>}
          {sale.why && <p className="mt-1.5 text-[0.8125rem] leading-snug text-ink-soft">{sale.why}</p>}
        </div>
      </div>
      <div className="flex flex-col gap-1.5 md:border-l md:border-dashed md:border-rule md:pl-4">
        <Outcome sale={sale} />
        <p className="text-[0.9375rem] leading-relaxed text-ink">{text}</p>
        {sale.thread.length > 0 && (
          <p className="text-[0.75rem] text-ink-faint">
            Review thread: {sale.thread.length} {sale.thread.length === 1 ? 'message' : 'messages'}, last by {sale.thread.at(-1)!.who} on {formatMoment(sale.thread.at(-1)!.at)}
          </p>
        )}
      </div>
    </li>
  );
}

/**
 * The sales the fit singled out, and what the review did with each: kept with the appraiser's
 * explanation, excluded with the reason, or never queried. The subject's neighbourhood comes in
 * full; flagged sales of the other neighbourhoods (outside the subject's fit) in a short list.
 */
export function FlaggedSection({ snapshot, format }: { snapshot: ReportSnapshot; format: ReportFormat }) {
  const all = handledSales(snapshot);
  const near = all.filter((s) => s.neighbourhood === snapshot.analysis.subjectGroup || s.outcome === 'excluded' || s.inGrid);
  const elsewhere = all.filter((s) => !near.includes(s));
  if (all.length === 0) return <p className="text-ink-soft">No sale was flagged by the fit and none was excluded.</p>;
  return (
    <div className="flex flex-col gap-5">
      <ul className="flex flex-col gap-3" aria-label="Flagged and excluded sales of the subject’s neighbourhood">
        {near.map((sale) => (
          <SaleCase key={sale.saleId} sale={sale} format={format} />
        ))}
      </ul>
      {elsewhere.length > 0 && (
        <div>
          <h4 className="text-sm font-semibold text-ink">Flagged in the other neighbourhoods’ fits</h4>
          <p className="text-[0.8125rem] text-ink-soft">These sales do not enter the subject’s fit; they are listed so that nothing flagged goes unmentioned.</p>
          <ul className="mt-2 grid gap-x-6 gap-y-1.5 text-[0.875rem] sm:grid-cols-2 xl:grid-cols-3">
            {elsewhere.map((sale) => (
              <li key={sale.saleId} className="flex flex-wrap items-baseline gap-x-2 border-b border-dotted border-rule py-1">
                <span className="font-medium text-ink">{sale.address}</span>
                <span className="text-[0.75rem] text-ink-faint">{sale.neighbourhood}</span>
                <span className="ml-auto text-[0.75rem] text-flag-ring">{sale.flags.map((f) => pointFlagWord(f)).join(', ')}</span>
                <span className="w-full text-[0.75rem] text-ink-soft">{outcomeStyle[sale.outcome].label}</span>
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
