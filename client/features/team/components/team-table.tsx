import { useQuery, useQueryClient } from '@tanstack/react-query';
import type { TeamMember } from '@contracts/users';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { EmptyPanel, ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { Table, Th } from '../../../components/ui/table';
import { describeError, isApiError } from '../../../lib/api-error';
import { countOf } from '../../../lib/count-of';
import { teamQueries } from '../api/team-queries';
import { useUpdateMember } from '../hooks/use-update-member';
import { MemberRow } from './member-row';

/** Members grouped by organisation, keeping the server's order (organisation, then name). */
function groupByOrganisation(members: TeamMember[]) {
  const groups: Array<{ name: string; kind: TeamMember['organisationKind']; people: TeamMember[] }> = [];
  for (const member of members) {
    const last = groups[groups.length - 1];
    if (last && last.name === member.organisationName) last.people.push(member);
    else groups.push({ name: member.organisationName, kind: member.organisationKind, people: [member] });
  }
  return groups;
}

/** Everyone with an account, with their role and whether they may sign in. Each change sends the
 * version the admin saw; if someone else changed the person first, the server's 409 message is
 * shown with a reload, and nothing is overwritten. */
export function TeamTable({ currentUserId }: { currentUserId: number }) {
  const members = useQuery(teamQueries.members());
  const update = useUpdateMember();
  const queryClient = useQueryClient();

  if (members.isPending) return <LoadingPanel label="Loading the team…" />;
  if (members.isError) {
    return <ErrorPanel title="The team could not be loaded" error={members.error} onRetry={() => void members.refetch()} retrying={members.isFetching} />;
  }
  if (members.data.length === 0) return <EmptyPanel title="No accounts yet">Invite the first member with the form.</EmptyPanel>;

  const stale = isApiError(update.error) && update.error.status === 409;
  const reload = async () => {
    await queryClient.invalidateQueries({ queryKey: teamQueries.members().queryKey });
    update.reset();
  };
  const activeCount = members.data.filter((member) => member.active).length;

  return (
    <div className="flex flex-col gap-4">
      {update.isError && (
        <Notice
          tone={stale ? 'warning' : 'error'}
          title={stale ? 'Someone else changed this person first' : 'The change was not saved'}
          actions={
            stale ? (
              <Button size="sm" onClick={() => void reload()}>
                Reload the team list
              </Button>
            ) : (
              <Button size="sm" variant="quiet" onClick={() => update.reset()}>
                Dismiss
              </Button>
            )
          }
        >
          {describeError(update.error)}
        </Notice>
      )}
      <Table caption="Team members">
        <thead>
          <tr>
            <Th>Member</Th>
            <Th>Role</Th>
            <Th>Status</Th>
            <Th>
              <span className="sr-only">Actions</span>
            </Th>
          </tr>
        </thead>
        {groupByOrganisation(members.data).map(({ name, kind, people }) => (
          <tbody key={name}>
            <tr>
              <th scope="colgroup" colSpan={4} className="border-b border-rule bg-paper px-4 pt-4 pb-2 text-left">
                <span className="text-sm font-semibold text-ink">{name}</span>
                <span className="ml-2 text-[0.8125rem] font-normal text-ink-faint">{kind === 'lender' ? 'Lender' : 'Appraisal firm'}</span>
              </th>
            </tr>
            {people.map((member) => (
              <MemberRow
                key={member.id}
                member={member}
                isSelf={member.id === currentUserId}
                busy={update.isPending && update.variables?.id === member.id}
                onChange={(change) => update.mutate({ id: member.id, change })}
              />
            ))}
          </tbody>
        ))}
      </Table>
      <p className="figures text-[0.8125rem] text-ink-faint">
        {countOf(members.data.length, 'account')} · {activeCount} active
      </p>
    </div>
  );
}
