import { hashKey, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useNavigate } from 'react-router-dom';
import { roleLabels } from '@contracts/auth';
import { Button, buttonClasses } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { LoadingPanel } from '../../../components/ui/query-states';
import { describeError } from '../../../lib/api-error';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { authQueries, authRequests } from '../api/auth-queries';
import { newPasswordForm } from '../lib/new-password-form';

/** Shows who invited the visitor and as what, then lets them choose a password; accepting signs
 * them in (the server sets the session cookie) and opens their home page. */
export function InvitationAcceptance({ token }: { token: string }) {
  const preview = useQuery(authQueries.invitation(token));
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const form = useForm({ resolver: zodResolver(newPasswordForm), defaultValues: { password: '', confirm: '' } });
  const { errors } = form.formState;
  const accept = useMutation({
    mutationFn: authRequests.acceptInvitation,
    onSuccess: async () => {
      // Forget whatever belonged to the signed-out visitor, except the invitation this page still
      // shows: removing it would refetch a token that is now used (400).
      const invitationKey = authQueries.invitation(token).queryKey;
      queryClient.removeQueries({ predicate: (query) => query.queryHash !== hashKey(invitationKey) });
      await queryClient.fetchQuery(authQueries.me());
      await navigate('/', { replace: true });
    },
  });

  if (preview.isPending) return <LoadingPanel label="Opening your invitation…" />;
  if (preview.isError) {
    return (
      <div className="flex flex-col gap-6">
        <Notice tone="error" title="This invitation cannot be used">
          {describeError(preview.error)}
        </Notice>
        <Link to="/sign-in" className={buttonClasses('secondary', 'md', 'self-start')}>
          Go to sign in
        </Link>
      </div>
    );
  }

  const invitation = preview.data;
  const onSubmit = form.handleSubmit(({ password }) =>
    accept.mutate({ token, password }, { onError: (error) => applyServerFieldErrors(error, form.setError, ['password']) }),
  );
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <dl className="grid grid-cols-[auto_1fr] gap-x-5 gap-y-2 rounded-md border border-rule bg-paper px-4 py-3 text-[0.9375rem]">
        <dt className="text-ink-faint">Name</dt>
        <dd className="font-medium">{invitation.name}</dd>
        <dt className="text-ink-faint">Role</dt>
        <dd className="font-medium">{roleLabels[invitation.role]}</dd>
        <dt className="text-ink-faint">Organisation</dt>
        <dd className="font-medium">{invitation.organisationName}</dd>
        <dt className="text-ink-faint">Sign-in e-mail</dt>
        <dd className="font-medium break-all">{invitation.email}</dd>
      </dl>
      {accept.isError && <Notice tone="error">{describeError(accept.error)}</Notice>}
      <TextField label="Choose a password" type="password" autoComplete="new-password" autoFocus hint="At least 10 characters." error={errors.password?.message} {...form.register('password')} />
      <TextField label="The password again" type="password" autoComplete="new-password" error={errors.confirm?.message} {...form.register('confirm')} />
      <Button type="submit" variant="primary" busy={accept.isPending} busyLabel="Opening your account…" className="mt-1 self-start">
        Accept and sign in
      </Button>
    </form>
  );
}
