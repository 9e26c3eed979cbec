import { useState, type ReactNode } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { statusLabels } from '@contracts/assignments';
import { Notice } from '../../../components/ui/notice';
import { useSessionUser } from '../../../features/auth/hooks/use-session-user';
import { FirmReconsiderations } from '../../../features/reconsiderations/components/firm-reconsiderations';
import { reconsiderationQueries } from '../../../features/reconsiderations/api/reconsideration-queries';
import { reportQueries } from '../../../features/reports/api/report-queries';
import { NewDraftForm } from '../../../features/reports/components/new-draft-form';
import { ReportVersions } from '../../../features/reports/components/report-versions';
import { SignPanel, type SignedVersion } from '../../../features/reports/components/sign-panel';
import type { StepProps } from './step-registry';

function Part({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3">
      <h3 id={id} className="text-[1.0625rem] font-semibold text-ink">
        {title}
      </h3>
      {children}
    </section>
  );
}

/** The last step: sign an approved assignment, read its signed versions, reopen it as a new draft,
 * and answer the client's requests for a reconsideration of value. */
export function ReportStep({ detail }: StepProps) {
  const user = useSessionUser();
  const queryClient = useQueryClient();
  const { assignment } = detail;
  const ownAppraiser = user.role === 'appraiser' && user.id === assignment.appraiserUserId;
  const [signed, setSigned] = useState<SignedVersion | null>(null);

  // Every cached query about this assignment (its detail and status, other steps) and both feature
  // families on this page are stale after a signature, a new draft or a revision.
  const refresh = async () => {
    await Promise.all([
      queryClient.invalidateQueries({ queryKey: reportQueries.all() }),
      queryClient.invalidateQueries({ queryKey: reconsiderationQueries.all() }),
      queryClient.invalidateQueries({ predicate: ({ queryKey }) => queryKey.includes(assignment.id) }),
    ]);
  };

  return (
    <div className="flex flex-col gap-8">
      {signed && (
        <Notice tone="success" title={`Version ${signed.versionNumber} signed and delivered`}>
          The client has been e-mailed. Fingerprint <span className="figures break-all">{signed.sha256}</span>.{' '}
          <Link to={`/reports/${signed.reportVersionId}`} className="font-semibold text-ink underline underline-offset-4">
            Read version {signed.versionNumber}
          </Link>
        </Notice>
      )}

      {assignment.status === 'approved' && ownAppraiser && (
        <SignPanel
          assignmentId={assignment.id}
          version={assignment.version}
          onSigned={async (version) => {
            setSigned(version);
            await refresh();
          }}
        />
      )}
      {assignment.status === 'approved' && !ownAppraiser && (
        <Notice title="Approved — waiting for the signature">Only {assignment.appraiserName}, the assignment’s appraiser, can sign it.</Notice>
      )}
      {(assignment.status === 'in_progress' || assignment.status === 'revisions_requested' || assignment.status === 'in_review') && (
        <Notice title={`${statusLabels[assignment.status]} — not ready to sign`}>
          The report can be signed once the reviewer approves the assignment. Signed versions, if any, stay readable below.
        </Notice>
      )}

      <Part id="versions-title" title="Signed versions">
        <ReportVersions assignmentId={assignment.id} areaUnit={assignment.areaUnit} />
        {assignment.status === 'signed' && ownAppraiser && (
          <NewDraftForm
            assignmentId={assignment.id}
            version={assignment.version}
            onOpened={async () => {
              setSigned(null);
              await refresh();
            }}
          />
        )}
      </Part>

      <Part id="reconsiderations-title" title="Requests for a reconsideration of value">
        <FirmReconsiderations assignmentId={assignment.id} currency={assignment.currency} areaUnit={assignment.areaUnit} canRespond={ownAppraiser} onRevised={refresh} />
      </Part>
    </div>
  );
}
