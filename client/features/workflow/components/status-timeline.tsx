import { useQuery } from '@tanstack/react-query';
import { statusLabels, type AssignmentStatus } from '@contracts/assignments';
import { Badge } from '../../../components/ui/badge';
import { ErrorPanel } from '../../../components/ui/query-states';
import { formatDateTime } from '../../../lib/format-date';
import { workflowQueries } from '../api/workflow-queries';
import { changeWords, statusMeaning, statusTone } from '../lib/status-words';

/** Where the assignment stands, in words, and every status change with who made it and when. */
export function StatusTimeline({ assignmentId, status }: { assignmentId: number; status: AssignmentStatus }) {
  const timeline = useQuery({ ...workflowQueries.timeline(assignmentId), staleTime: 0 });
  return (
    <section aria-labelledby="status-title" className="flex flex-col gap-4 rounded-lg border border-rule bg-paper-raised px-5 py-4">
      <div>
        <h3 id="status-title" className="text-sm font-semibold tracking-wide text-ink-soft uppercase">
          Status
        </h3>
        <p className="mt-2" data-testid="assignment-status">
          <Badge tone={statusTone[status]}>{statusLabels[status]}</Badge>
        </p>
        <p className="mt-2 text-[0.9375rem] leading-relaxed text-ink-soft">{statusMeaning[status]}</p>
      </div>
      <div>
        <h4 className="text-sm font-semibold text-ink">Timeline</h4>
        {timeline.isPending && <p className="mt-2 text-sm text-ink-faint">Loading the timeline…</p>}
        {timeline.isError && <ErrorPanel title="The timeline could not be loaded" error={timeline.error} onRetry={() => void timeline.refetch()} />}
        {timeline.isSuccess && timeline.data.length === 0 && <p className="mt-2 text-sm text-ink-faint">No status change yet: the file has been in progress since it was opened.</p>}
        {timeline.isSuccess && timeline.data.length > 0 && (
          <ol className="mt-3 flex flex-col" aria-label="Status timeline">
            {timeline.data.map((change, index) => (
              <li key={change.id} className="relative flex gap-3 pb-4 last:pb-0">
                {index < timeline.data.length - 1 && <span aria-hidden className="absolute top-3 bottom-0 left-[5px] w-px bg-rule-strong" />}
                <span aria-hidden className={`mt-1.5 size-[11px] shrink-0 rounded-full border-2 ${index === timeline.data.length - 1 ? 'border-ink bg-ink' : 'border-rule-strong bg-paper-raised'}`} />
                <div className="min-w-0">
                  <p className="text-[0.9375rem] font-semibold text-ink">{changeWords(change.fromStatus, change.toStatus)}</p>
                  <p className="text-[0.8125rem] text-ink-faint">
                    {change.byName} · <span className="figures">{formatDateTime(change.at)}</span>
                  </p>
                  {change.note && <p className="mt-1 border-l-2 border-rule-strong pl-2.5 text-[0.875rem] leading-relaxed whitespace-pre-wrap text-ink-soft">{change.note}</p>}
                </div>
              </li>
            ))}
          </ol>
        )}
      </div>
    </section>
  );
}
