import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { ErrorPanel, LoadingPanel } from '../../components/ui/query-states';
import { useSessionUser } from '../../features/auth/hooks/use-session-user';
import { ClientReconsiderations } from '../../features/reconsiderations/components/client-reconsiderations';
import { reportQueries } from '../../features/reports/api/report-queries';
import { ReportView } from '../../features/reports/components/report-view';
import { unitSymbol } from '../../features/reports/lib/report-format';
import { NotFoundPage } from '../errors/not-found-page';

function parseReportId(raw: string | undefined): number | null {
  if (!raw || !/^[1-9]\d{0,9}$/.test(raw)) return null;
  const id = Number(raw);
  return id <= 2_147_483_647 ? id : null;
}

/** /reports/:id — a signed report version, for the client who ordered it and the firm's staff.
 * The client may ask for a reconsideration of value under it. */
export function ReportPage() {
  const id = parseReportId(useParams().id);
  if (id === null) return <NotFoundPage what="There is no report at this address" />;
  return <Report id={id} />;
}

function Report({ id }: { id: number }) {
  const user = useSessionUser();
  const report = useQuery(reportQueries.detail(id));
  if (report.isPending) return <LoadingPanel label={`Opening report ${id}…`} />;
  if (report.isError) {
    return (
      <div className="py-6">
        <title>{`Report ${id} · Compline`}</title>
        <ErrorPanel title={`Report ${id} could not be opened`} error={report.error} onRetry={() => void report.refetch()} retrying={report.isFetching} />
      </div>
    );
  }
  const { snapshot } = report.data;
  const firmStaff = user.role === 'appraiser' || user.role === 'reviewer';
  return (
    <div className="flex flex-col gap-8">
      <title>{`Report v${snapshot.versionNumber} · ${snapshot.assignment.subjectAddress} · Compline`}</title>
      <nav aria-label="Where this report belongs" className="no-print text-[0.875rem] text-ink-soft">
        {firmStaff ? (
          <Link to={`/assignments/${snapshot.assignment.id}/report`} className="underline-offset-4 hover:text-ink hover:underline">
            ← Assignment {snapshot.assignment.id}, report step
          </Link>
        ) : (
          <Link to={user.role === 'client' ? '/' : '/orders'} className="underline-offset-4 hover:text-ink hover:underline">
            ← {user.role === 'client' ? 'My orders' : 'Orders'}
          </Link>
        )}
      </nav>
      <ReportView report={report.data} />
      {user.role === 'client' && <ClientReconsiderations reportVersionId={id} unit={unitSymbol[snapshot.assignment.areaUnit]} />}
    </div>
  );
}
