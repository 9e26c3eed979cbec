import { useEffect, useMemo } from 'react';
import { useMutation, useQuery } from '@tanstack/react-query';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { roleLabels, roles } from '@contracts/auth';
import { inviteRequest, type Organisation } from '@contracts/users';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { describeError } from '../../../lib/api-error';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { teamQueries, teamRequests } from '../api/team-queries';

/** Invites a person by e-mail: the server queues a message with a link to choose a password. */
export function InviteForm() {
  const organisations = useQuery(teamQueries.organisations());
  if (organisations.isPending) return <LoadingPanel label="Loading organisations…" />;
  if (organisations.isError) {
    return <ErrorPanel title="Organisations could not be loaded" error={organisations.error} onRetry={() => void organisations.refetch()} />;
  }
  return <InviteFormFields organisations={organisations.data} />;
}

function InviteFormFields({ organisations }: { organisations: Organisation[] }) {
  const fitting = (role: string) => organisations.filter((o) => o.kind === (role === 'client' ? 'lender' : 'firm'));
  const form = useForm({
    resolver: zodResolver(inviteRequest),
    defaultValues: { name: '', email: '', role: 'appraiser' as const, organisationId: fitting('appraiser')[0]?.id ?? 0 },
  });
  const { errors } = form.formState;
  const role = useWatch({ control: form.control, name: 'role' });
  const choices = useMemo(() => organisations.filter((o) => o.kind === (role === 'client' ? 'lender' : 'firm')), [organisations, role]);

  // A lender client must belong to a lender, everyone else to the firm: keep the pick valid.
  useEffect(() => {
    const current = form.getValues('organisationId');
    if (!choices.some((o) => o.id === current)) form.setValue('organisationId', choices[0]?.id ?? 0);
  }, [choices, form]);

  const invite = useMutation({ mutationFn: teamRequests.invite });
  const onSubmit = form.handleSubmit((values) =>
    invite.mutate(values, {
      onSuccess: () => form.reset({ ...form.getValues(), name: '', email: '' }),
      onError: (error) => applyServerFieldErrors(error, form.setError, ['name', 'email', 'role', 'organisationId']),
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {invite.isSuccess && (
        <Notice tone="success" title="Invitation sent">
          {invite.variables.name} gets an e-mail with a link to choose a password. It is listed in the Outbox.
        </Notice>
      )}
      {invite.isError && <Notice tone="error">{describeError(invite.error)}</Notice>}
      <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
      <TextField label="E-mail address" type="email" autoComplete="off" error={errors.email?.message} {...form.register('email')} />
      <SelectField label="Role" error={errors.role?.message} {...form.register('role')}>
        {roles.map((r) => (
          <option key={r} value={r}>
            {roleLabels[r]}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Organisation"
        hint={role === 'client' ? 'Lender clients belong to a lender.' : 'Staff belong to the appraisal firm.'}
        error={errors.organisationId?.message}
        {...form.register('organisationId', { valueAsNumber: true })}
      >
        {choices.map((o) => (
          <option key={o.id} value={o.id}>
            {o.name}
          </option>
        ))}
      </SelectField>
      <Button type="submit" variant="primary" busy={invite.isPending} busyLabel="Sending…" className="mt-1 self-start">
        Send invitation
      </Button>
    </form>
  );
}
