import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { statusLabels, type Assignment } from '@contracts/assignments';
import { Badge } from '../../../components/ui/badge';
import { EmptyPanel, ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatIsoDate } from '../../../lib/format-date';
import { assignmentQueries } from '../api/assignment-queries';

const statusTone: Record<Assignment['status'], 'neutral' | 'pending' | 'positive' | 'negative'> = {
  in_progress: 'neutral',
  in_review: 'pending',
  revisions_requested: 'negative',
  approved: 'positive',
  signed: 'positive',
};

/** The person's own assignments first, then by due date (undated last). */
function byOwnerThenDue(appraiserUserId: number) {
  return (a: Assignment, b: Assignment) =>
    Number(b.appraiserUserId === appraiserUserId) - Number(a.appraiserUserId === appraiserUserId) ||
    (a.dueDate ?? '9999').localeCompare(b.dueDate ?? '9999') ||
    a.id - b.id;
}

/** The firm's assignments, the appraiser's own first, each a link into its workspace. */
export function AssignmentList({ appraiserUserId }: { appraiserUserId: number }) {
  const assignments = useQuery(assignmentQueries.list());

  if (assignments.isPending) return <LoadingPanel label="Loading assignments…" />;
  if (assignments.isError) {
    return <ErrorPanel title="Assignments could not be loaded" error={assignments.error} onRetry={() => void assignments.refetch()} retrying={assignments.isFetching} />;
  }
  if (assignments.data.length === 0) {
    return <EmptyPanel title="No assignments yet">An accepted order becomes an assignment and appears here.</EmptyPanel>;
  }
  const rows = [...assignments.data].sort(byOwnerThenDue(appraiserUserId));
  return (
    <Table caption="Assignments">
      <thead>
        <tr>
          <Th>Subject</Th>
          <Th>Client</Th>
          <Th>Appraiser</Th>
          <Th>Status</Th>
          <Th className="text-right">Effective</Th>
          <Th className="text-right">Due</Th>
        </tr>
      </thead>
      <tbody>
        {rows.map((assignment) => (
          <tr key={assignment.id} className="hover:bg-paper">
            <Td>
              <Link to={`/assignments/${assignment.id}`} className="font-semibold text-ink underline decoration-rule-strong underline-offset-4 hover:decoration-ink">
                {assignment.subjectAddress}
              </Link>
              {assignment.loanReference && <p className="figures mt-0.5 text-xs text-ink-faint">Loan {assignment.loanReference}</p>}
            </Td>
            <Td className="text-ink-soft">{assignment.clientOrganisationName}</Td>
            <Td className="text-ink-soft">{assignment.appraiserUserId === appraiserUserId ? 'You' : assignment.appraiserName}</Td>
            <Td>
              <Badge tone={statusTone[assignment.status]}>{statusLabels[assignment.status]}</Badge>
            </Td>
            <Td className="figures text-right text-sm whitespace-nowrap">{formatIsoDate(assignment.effectiveDate)}</Td>
            <Td className="figures text-right text-sm whitespace-nowrap">{assignment.dueDate ? formatIsoDate(assignment.dueDate) : '—'}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
