import { useQuery, useQueryClient } from '@tanstack/react-query';
import type { FlaggedSale } from '@contracts/analysis';
import type { ReviewQuery } from '@contracts/review';
import { Badge } from '../../../components/ui/badge';
import { ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { countOf } from '../../../lib/count-of';
import { assignmentQueries } from '../../../features/assignments/api/assignment-queries';
import { useSessionUser } from '../../../features/auth/hooks/use-session-user';
import { gridQueries } from '../../../features/grid/api/grid-queries';
import { queryThreads } from '../../../features/queries/api/query-queries';
import { QueryThreads } from '../../../features/queries/components/query-threads';
import { RaiseQuery } from '../../../features/queries/components/raise-query';
import { queryStatusLabels, queryStatusTone } from '../../../features/queries/lib/message-words';
import { reviewQueries } from '../../../features/review/api/review-queries';
import { ExcludedSales } from '../../../features/review/components/excluded-sales';
import { FlaggedSalesPanel } from '../../../features/review/components/flagged-sales-panel';
import { SubjectFit } from '../../../features/review/components/subject-fit';
import { workflowQueries } from '../../../features/workflow/api/workflow-queries';
import { ReviewerDecision } from '../../../features/workflow/components/reviewer-decision';
import { StatusTimeline } from '../../../features/workflow/components/status-timeline';
import { refreshAssignmentCaches } from '../../../features/workflow/lib/refresh-assignment';
import type { StepProps } from './step-registry';

/** While the file is in review, the other person's answers arrive without a reload. */
const IN_REVIEW_POLL_MS = 20_000;

/** The review of a file: where it stands and its timeline, the flagged sales first, the queries on
 * them and their answers, the excluded sales, and the reviewer's decision. */
export function ReviewStep({ detail }: StepProps) {
  const { assignment } = detail;
  const user = useSessionUser();
  const queryClient = useQueryClient();
  const inReview = assignment.status === 'in_review';
  const poll = inReview ? IN_REVIEW_POLL_MS : false;
  const analysis = useQuery({ ...reviewQueries.analysis(assignment.id), staleTime: 0, refetchInterval: poll });
  const queries = useQuery({ ...queryThreads.list(assignment.id), staleTime: 0, refetchInterval: poll });

  const refresh = () =>
    refreshAssignmentCaches(queryClient, assignment.id, [assignmentQueries.all(), gridQueries.all(), reviewQueries.all(), workflowQueries.all(), queryThreads.all()]);
  const isReviewer = user.role === 'reviewer';
  const permissions = {
    role: user.role,
    canAnswer: user.role === 'appraiser' && assignment.status !== 'approved' && assignment.status !== 'signed',
    canDecide: isReviewer && inReview,
  };
  const unresolved = queries.data?.filter((q) => q.status !== 'resolved').length ?? 0;

  const actionFor = (sale: FlaggedSale) => {
    const existing = queries.data?.filter((q) => q.saleId === sale.saleId) ?? [];
    if (existing.length > 0) return <QueryLinks queries={existing} />;
    if (isReviewer && inReview) return <RaiseQuery assignmentId={assignment.id} saleId={sale.saleId} about={sale.address} onRaised={refresh} />;
    return <span className="text-[0.8125rem] text-ink-faint">No query on this sale</span>;
  };

  return (
    <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
      <div className="order-2 flex min-w-0 flex-col gap-6 lg:order-1">
        {analysis.isPending && <LoadingPanel label="Reading the market analysis…" />}
        {analysis.isError && <ErrorPanel title="The market analysis could not be loaded" error={analysis.error} onRetry={() => void analysis.refetch()} retrying={analysis.isFetching} />}
        {analysis.isSuccess && (
          <>
            <section aria-labelledby="fit-title" className="rounded-lg border border-rule bg-paper-raised px-5 py-4">
              <h3 id="fit-title" className="mb-3 text-base font-semibold">
                Fit of the subject’s neighbourhood
              </h3>
              <SubjectFit analysis={analysis.data} />
            </section>
            <section aria-labelledby="flagged-title" className="flex flex-col gap-3">
              <h3 id="flagged-title" className="text-lg font-semibold">
                Flagged sales
              </h3>
              <p className="-mt-1 max-w-3xl text-[0.9375rem] text-ink-soft">
                A flagged sale is a question, not a verdict: the appraiser keeps it with an explanation or excludes it with a reason from the facts of the sale.
              </p>
              <FlaggedSalesPanel analysis={analysis.data} renderAction={actionFor} />
              <ExcludedSales excluded={analysis.data.excluded} />
            </section>
          </>
        )}

        <section aria-labelledby="queries-title" className="flex flex-col gap-3">
          <div className="flex flex-wrap items-center justify-between gap-3">
            <h3 id="queries-title" className="text-lg font-semibold">
              Queries {queries.isSuccess && <span className="figures ml-1 text-base font-normal text-ink-soft">{countOf(unresolved, 'unresolved', 'unresolved')}</span>}
            </h3>
            {isReviewer && inReview && <RaiseQuery assignmentId={assignment.id} saleId={null} about={assignment.subjectAddress} onRaised={refresh} buttonLabel="Raise a general query" />}
          </div>
          {queries.isPending && <LoadingPanel label="Loading the queries…" />}
          {queries.isError && <ErrorPanel title="The queries could not be loaded" error={queries.error} onRetry={() => void queries.refetch()} retrying={queries.isFetching} />}
          {queries.isSuccess && <QueryThreads assignmentId={assignment.id} queries={queries.data} permissions={permissions} onSaleChanged={refresh} />}
        </section>
      </div>

      <aside className="order-1 flex flex-col gap-4 lg:order-2">
        <StatusTimeline assignmentId={assignment.id} status={assignment.status} />
        {isReviewer && inReview && queries.isSuccess && <ReviewerDecision assignment={assignment} unresolvedQueries={unresolved} onSettled={refresh} />}
      </aside>
    </div>
  );
}

function QueryLinks({ queries }: { queries: readonly ReviewQuery[] }) {
  return (
    <span className="flex flex-col items-start gap-1 md:items-end">
      {queries.map((query) => (
        <a key={query.id} href={`#query-${query.id}`} className="inline-flex items-center gap-2 text-sm text-ink underline decoration-rule-strong underline-offset-4 hover:decoration-ink">
          Query
          <Badge tone={queryStatusTone[query.status]}>{queryStatusLabels[query.status]}</Badge>
        </a>
      ))}
    </span>
  );
}
