import { PageHeader } from '../../components/ui/page-header';
import { RoleGate } from '../../features/auth/components/role-gate';
import { useSessionUser } from '../../features/auth/hooks/use-session-user';
import { InviteForm } from '../../features/team/components/invite-form';
import { TeamTable } from '../../features/team/components/team-table';

export function TeamPage() {
  const user = useSessionUser();
  return (
    <RoleGate roles={['admin']}>
      <title>Team · Compline</title>
      <div className="flex flex-col gap-6">
        <PageHeader eyebrow={user.organisationName} title="Team" description="Who may sign in, and in which role. Deactivating someone ends their sessions at once." />
        <div className="grid items-start gap-8 lg:grid-cols-[minmax(0,1fr)_20rem]">
          <TeamTable currentUserId={user.id} />
          <section aria-labelledby="invite-title" className="rounded-lg border border-rule bg-paper-raised px-5 py-5">
            <h2 id="invite-title" className="text-lg font-semibold">
              Invite someone
            </h2>
            <p className="mt-1 mb-4 text-sm text-ink-soft">They get an e-mail with a link, valid for 7 days, to choose a password.</p>
            <InviteForm />
          </section>
        </div>
      </div>
    </RoleGate>
  );
}
