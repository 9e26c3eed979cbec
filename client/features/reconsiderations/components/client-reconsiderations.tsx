import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ErrorPanel } from '../../../components/ui/query-states';
import { formatDateTime } from '../../../lib/format-date';
import { reconsiderationQueries } from '../api/reconsideration-queries';
import { requestStatusTone, requestStatusWords } from '../lib/status-words';
import { ReconsiderationForm } from './reconsideration-form';

/** On a delivered report, for the lender's staff: their requests for a reconsideration of value
 * with the appraiser's answers, and the form to ask for one. */
export function ClientReconsiderations({ reportVersionId, unit }: { reportVersionId: number; unit: string }) {
  const requests = useQuery(reconsiderationQueries.ofReport(reportVersionId));
  const [asking, setAsking] = useState(false);
  const [sent, setSent] = useState(false);
  return (
    <section aria-labelledby="reconsideration-title" className="no-print flex flex-col gap-4 rounded-xl border border-rule-strong bg-paper-sunk/50 px-5 py-5">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="reconsideration-title" className="text-[1.125rem] font-semibold text-ink">
            Reconsideration of value
          </h2>
          <p className="max-w-2xl text-[0.9375rem] text-ink-soft">If you hold facts or sales the appraiser may not have weighed, ask for a reconsideration. The appraiser keeps the value with reasons or issues a revised, newly signed version.</p>
        </div>
        {!asking && (
          <Button
            onClick={() => {
              setAsking(true);
              setSent(false);
            }}
          >
            Ask for a reconsideration
          </Button>
        )}
      </div>
      {sent && <Notice tone="success" title="Request sent">The appraiser has been e-mailed; the answer will appear here.</Notice>}
      {asking && (
        <ReconsiderationForm
          reportVersionId={reportVersionId}
          unit={unit}
          onDone={(wasSent) => {
            setAsking(false);
            setSent(wasSent);
          }}
        />
      )}
      {requests.isError && <ErrorPanel title="Your earlier requests could not be loaded" error={requests.error} onRetry={() => void requests.refetch()} />}
      {requests.isSuccess && requests.data.length > 0 && (
        <ul className="flex flex-col gap-3" aria-label="Your requests">
          {requests.data.map((r) => (
            <li key={r.id} className="rounded-lg border border-rule bg-paper-raised px-4 py-3">
              <div className="flex flex-wrap items-center justify-between gap-2">
                <p className="text-[0.8125rem] text-ink-faint">
                  {r.requestedByName} · <span className="figures">{formatDateTime(r.createdAt)}</span> · {r.extraSales.length === 1 ? 'one extra sale' : `${r.extraSales.length} extra sales`}
                </p>
                <Badge tone={requestStatusTone[r.status]}>{requestStatusWords[r.status]}</Badge>
              </div>
              <p className="mt-1.5 text-[0.9375rem] whitespace-pre-wrap text-ink">{r.comment}</p>
              {r.response && (
                <p className="mt-2 border-l-2 border-ink pl-3 text-[0.9375rem] whitespace-pre-wrap text-ink-soft">
                  <span className="font-semibold text-ink">Answer{r.respondedAt ? `, ${formatDateTime(r.respondedAt)}` : ''}: </span>
                  {r.response}
                </p>
              )}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
