import { useMemo } from 'react';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { statusLabels } from '@contracts/assignments';
import { Notice } from '../../../components/ui/notice';
import { ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { isApiError } from '../../../lib/api-error';
import { assignmentQueries } from '../../../features/assignments/api/assignment-queries';
import { useSessionUser } from '../../../features/auth/hooks/use-session-user';
import { gridQueries } from '../../../features/grid/api/grid-queries';
import { GridWorkspace } from '../../../features/grid/components/grid-workspace';
import { makeFigures } from '../../../features/grid/lib/grid-figures';
import { reviewQueries } from '../../../features/review/api/review-queries';
import { workflowQueries } from '../../../features/workflow/api/workflow-queries';
import { SubmitForReview } from '../../../features/workflow/components/submit-for-review';
import { refreshAssignmentCaches } from '../../../features/workflow/lib/refresh-assignment';
import type { StepProps } from './step-registry';

/** The appraiser edits the grid while the file is theirs ("In progress" or "Revisions requested");
 * everyone else, and the appraiser at other times, reads it. */
export function AdjustmentsStep({ detail }: StepProps) {
  const { assignment } = detail;
  const user = useSessionUser();
  const queryClient = useQueryClient();
  const holdsFile = assignment.status === 'in_progress' || assignment.status === 'revisions_requested';
  const editable = user.role === 'appraiser' && holdsFile;
  // The grid depends on every other step (subject, sales marked, analysis): read it afresh on each visit.
  const grid = useQuery({ ...gridQueries.detail(assignment.id), staleTime: 0, refetchOnMount: 'always' });
  const sales = useQuery({ ...gridQueries.sales(assignment.id), staleTime: 0, refetchOnMount: 'always' });
  const figures = useMemo(() => makeFigures(assignment.currency, assignment.areaUnit), [assignment.currency, assignment.areaUnit]);

  const refresh = () =>
    refreshAssignmentCaches(queryClient, assignment.id, [assignmentQueries.all(), gridQueries.all(), reviewQueries.all(), workflowQueries.all()]);
  const onRefused = (error: unknown) => {
    // The file moved on (submitted from another tab, returned, approved): show where it stands now.
    if (isApiError(error) && error.code === 'not_editable') void refresh();
  };

  if (grid.isPending || sales.isPending) return <LoadingPanel label="Building the adjustment grid…" />;
  if (grid.isError) return <ErrorPanel title="The adjustment grid could not be loaded" error={grid.error} onRetry={() => void grid.refetch()} retrying={grid.isFetching} />;
  if (sales.isError) return <ErrorPanel title="The sales could not be loaded" error={sales.error} onRetry={() => void sales.refetch()} retrying={sales.isFetching} />;

  return (
    <div className="flex flex-col gap-5">
      {!editable && (
        <Notice title="Read-only">
          {user.role === 'appraiser'
            ? `The file is “${statusLabels[assignment.status]}”: the grid cannot change now.${assignment.status === 'in_review' ? ' Answer the reviewer’s queries on the Review step.' : ''}`
            : `You are reading the appraiser’s grid. The file is “${statusLabels[assignment.status]}”.`}
        </Notice>
      )}
      {assignment.status === 'revisions_requested' && editable && (
        <Notice tone="warning" title="Revisions requested">
          The reviewer returned the file. Their note is on the Review step; revise the grid and submit again.
        </Notice>
      )}
      <GridWorkspace
        assignmentId={assignment.id}
        effectiveDate={assignment.effectiveDate}
        grid={grid.data}
        sales={sales.data}
        figures={figures}
        editable={editable}
        onRefused={onRefused}
        submission={editable ? <SubmitForReview assignment={assignment} missing={grid.data.missing} onSettled={refresh} /> : null}
      />
    </div>
  );
}
