import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { reportPdfUrl, reportQueries } from '../api/report-queries';
import { formatMoment, reportFormat } from '../lib/report-format';

/** Every signed version of an assignment, newest first, each with its page, its PDF and the first
 * characters of its fingerprint. */
export function ReportVersions({ assignmentId, areaUnit }: { assignmentId: number; areaUnit: 'sqft' | 'sqm' }) {
  const versions = useQuery(reportQueries.ofAssignment(assignmentId));
  if (versions.isPending) return <LoadingPanel label="Loading the signed versions…" />;
  if (versions.isError) return <ErrorPanel title="The signed versions could not be loaded" error={versions.error} onRetry={() => void versions.refetch()} />;
  if (versions.data.length === 0) return <p className="text-[0.9375rem] text-ink-faint">No version has been signed yet.</p>;
  return (
    <ol className="flex flex-col divide-y divide-rule rounded-lg border border-rule bg-paper-raised" aria-label="Signed versions">
      {versions.data.map((v, i) => {
        const format = reportFormat(v.currency, areaUnit);
        return (
          <li key={v.id} className="flex flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
            <span className="figures flex size-9 shrink-0 items-center justify-center rounded-full border-2 border-ink text-sm font-semibold text-ink">v{v.versionNumber}</span>
            <div className="min-w-0 flex-1">
              <Link to={`/reports/${v.id}`} className="font-semibold text-ink underline-offset-4 hover:underline">
                Version {v.versionNumber}
                {i === 0 ? ' (latest)' : ''}
              </Link>
              <p className="text-[0.8125rem] text-ink-soft">
                Signed by {v.signerName}, <span className="figures">{formatMoment(v.signedAt)}</span> · fingerprint <span className="figures">{v.sha256.slice(0, 12)}…</span>
              </p>
            </div>
            <span className="figures text-[1rem] font-semibold text-ink">{format.money(v.opinionOfValue)}</span>
            <a href={reportPdfUrl(v.id)} download className="text-[0.875rem] font-medium text-ink-soft underline underline-offset-4 hover:text-ink">
              PDF
            </a>
          </li>
        );
      })}
    </ol>
  );
}
