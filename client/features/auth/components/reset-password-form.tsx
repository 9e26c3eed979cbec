import { useMutation } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { Button, buttonClasses } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { describeError, isApiError } from '../../../lib/api-error';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { authRequests } from '../api/auth-queries';
import { newPasswordForm } from '../lib/new-password-form';

export function ResetPasswordForm({ token }: { token: string }) {
  const form = useForm({ resolver: zodResolver(newPasswordForm), defaultValues: { password: '', confirm: '' } });
  const { errors } = form.formState;
  const confirm = useMutation({ mutationFn: authRequests.confirmPasswordReset });
  const onSubmit = form.handleSubmit(({ password }) =>
    confirm.mutate({ token, password }, { onError: (error) => applyServerFieldErrors(error, form.setError, ['password']) }),
  );

  if (confirm.isSuccess) {
    return (
      <div className="flex flex-col gap-6">
        <Notice tone="success" title="Your password is changed">
          Every session of your account was signed out. Sign in with the new password.
        </Notice>
        <Link to="/sign-in" className={buttonClasses('primary', 'md', 'self-start')}>
          Sign in
        </Link>
      </div>
    );
  }

  const linkExpired = isApiError(confirm.error) && Boolean(confirm.error.fields?.token);
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {confirm.isError && (
        <Notice
          tone="error"
          actions={
            linkExpired && (
              <Link to="/forgot-password" className={buttonClasses('secondary', 'sm')}>
                Ask for a new link
              </Link>
            )
          }
        >
          {describeError(confirm.error)}
        </Notice>
      )}
      <TextField label="New password" type="password" autoComplete="new-password" autoFocus hint="At least 10 characters." error={errors.password?.message} {...form.register('password')} />
      <TextField label="The new password again" type="password" autoComplete="new-password" error={errors.confirm?.message} {...form.register('confirm')} />
      <Button type="submit" variant="primary" busy={confirm.isPending} busyLabel="Saving…" className="mt-1 self-start">
        Save the new password
      </Button>
    </form>
  );
}
