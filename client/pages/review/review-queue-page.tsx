import { PageHeader } from '../../components/ui/page-header';
import { RoleGate } from '../../features/auth/components/role-gate';
import { useSessionUser } from '../../features/auth/hooks/use-session-user';
import { ReviewQueueList } from '../../features/review/components/review-queue-list';

export function ReviewQueuePage() {
  const user = useSessionUser();
  return (
    <RoleGate roles={['reviewer']}>
      <title>Review queue · Compline</title>
      <div className="flex flex-col gap-6">
        <PageHeader eyebrow={user.organisationName} title="Review queue" description="Assignments submitted for review. Open one to see its flagged sales first." />
        <ReviewQueueList />
      </div>
    </RoleGate>
  );
}
