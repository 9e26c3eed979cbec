import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import type { Reconsideration } from '@contracts/reconsiderations';
import { Badge } from '../../../components/ui/badge';
import { ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { formatDateTime, formatIsoDate } from '../../../lib/format-date';
import { reconsiderationQueries } from '../api/reconsideration-queries';
import { effectFormat, type EffectFormat } from '../lib/effect-format';
import { extraSaleSummary, requestStatusTone, requestStatusWords } from '../lib/status-words';
import { EffectTable } from './effect-table';
import { RespondForm } from './respond-form';

function ExtraSales({ sales, format }: { sales: Reconsideration['extraSales']; format: EffectFormat }) {
  if (sales.length === 0) return <p className="text-[0.875rem] text-ink-faint">No extra sales came with this request.</p>;
  return (
    <ul className="flex flex-col text-[0.875rem]" aria-label="Extra sales from the client">
      {sales.map((raw, i) => {
        const s = extraSaleSummary(raw);
        return (
          <li key={i} className="flex flex-wrap items-baseline gap-x-3 border-b border-dotted border-rule py-1">
            <span className="font-medium text-ink">{s.address}</span>
            <span className="text-[0.8125rem] text-ink-faint">{s.neighbourhood ?? ''}</span>
            <span className="figures ml-auto text-ink-soft">
              {format.money(s.salePrice)} · {format.area(s.floorArea)} · {s.saleDate ? formatIsoDate(s.saleDate) : '—'}
            </span>
          </li>
        );
      })}
    </ul>
  );
}

/** The requests for a reconsideration on an assignment, with how the client's sales would move
 * the subject's fit, and — for the assignment's appraiser — the form to answer each open one. */
export function FirmReconsiderations({ assignmentId, currency, areaUnit, canRespond, onRevised }: {
  assignmentId: number;
  currency: string;
  areaUnit: 'sqft' | 'sqm';
  canRespond: boolean;
  onRevised: () => void | Promise<void>;
}) {
  const requests = useQuery(reconsiderationQueries.ofAssignment(assignmentId));
  const format = effectFormat(currency, areaUnit);
  if (requests.isPending) return <LoadingPanel label="Loading the requests for reconsideration…" />;
  if (requests.isError) return <ErrorPanel title="The requests for reconsideration could not be loaded" error={requests.error} onRetry={() => void requests.refetch()} />;
  if (requests.data.length === 0) return <p className="text-[0.9375rem] text-ink-faint">The client has not asked for a reconsideration of value.</p>;
  return (
    <ul className="flex flex-col gap-4" aria-label="Requests for reconsideration">
      {requests.data.map((r) => (
        <li key={r.id} className="flex flex-col gap-3 rounded-lg border border-rule-strong bg-paper-raised px-5 py-4">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <p className="text-[0.875rem] text-ink-soft">
              <span className="font-semibold text-ink">{r.requestedByName}</span> · <span className="figures">{formatDateTime(r.createdAt)}</span> · on{' '}
              <Link to={`/reports/${r.reportVersionId}`} className="underline underline-offset-4 hover:text-ink">
                the signed version
              </Link>
            </p>
            <Badge tone={requestStatusTone[r.status]}>{requestStatusWords[r.status]}</Badge>
          </div>
          <p className="text-[0.9375rem] leading-relaxed whitespace-pre-wrap text-ink">{r.comment}</p>
          <div className="grid gap-4 lg:grid-cols-2">
            <ExtraSales sales={r.extraSales} format={format} />
            {r.effect ? <EffectTable effect={r.effect} format={format} /> : <p className="text-[0.875rem] text-ink-faint">The subject’s neighbourhood has no fit to compare.</p>}
          </div>
          {r.response && (
            <p className="border-l-2 border-ink pl-3 text-[0.9375rem] whitespace-pre-wrap text-ink-soft">
              <span className="font-semibold text-ink">Answered{r.respondedAt ? ` ${formatDateTime(r.respondedAt)}` : ''}: </span>
              {r.response}
            </p>
          )}
          {r.status === 'open' && canRespond && (
            <div className="border-t border-rule pt-3">
              <RespondForm request={r} onAnswered={(decision) => (decision === 'revise' ? onRevised() : undefined)} />
            </div>
          )}
        </li>
      ))}
    </ul>
  );
}
