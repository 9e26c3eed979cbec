import { PageHeader } from '../../components/ui/page-header';
import { AssignmentList } from '../../features/assignments/components/assignment-list';
import { RoleGate } from '../../features/auth/components/role-gate';
import { useSessionUser } from '../../features/auth/hooks/use-session-user';

export function MyAssignmentsPage() {
  const user = useSessionUser();
  return (
    <RoleGate roles={['appraiser']}>
      <title>My assignments · Compline</title>
      <div className="flex flex-col gap-6">
        <PageHeader eyebrow={user.organisationName} title="My assignments" description="The firm’s assignments, yours first: subject, client, where each stands and when it is due." />
        <AssignmentList appraiserUserId={user.id} />
      </div>
    </RoleGate>
  );
}
