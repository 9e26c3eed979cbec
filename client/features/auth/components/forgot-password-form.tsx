import { useMutation } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { passwordResetRequest } from '@contracts/auth';
import { Button, buttonClasses } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { describeError } from '../../../lib/api-error';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { authRequests } from '../api/auth-queries';

export function ForgotPasswordForm() {
  const form = useForm({ resolver: zodResolver(passwordResetRequest), defaultValues: { email: '' } });
  const request = useMutation({ mutationFn: authRequests.requestPasswordReset });
  const onSubmit = form.handleSubmit((values) =>
    request.mutate(values, { onError: (error) => applyServerFieldErrors(error, form.setError, ['email']) }),
  );

  if (request.isSuccess) {
    return (
      <div className="flex flex-col gap-6">
        {/* The server answers the same whether or not the address has an account. */}
        <Notice tone="success" title="Check your e-mail">
          {request.data.message}
        </Notice>
        <Link to="/sign-in" className={buttonClasses('secondary', 'md', 'self-start')}>
          Back to sign in
        </Link>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {request.isError && <Notice tone="error">{describeError(request.error)}</Notice>}
      <TextField label="E-mail address" type="email" autoComplete="username" inputMode="email" autoFocus error={form.formState.errors.email?.message} {...form.register('email')} />
      <div className="mt-1 flex flex-wrap items-center justify-between gap-4">
        <Button type="submit" variant="primary" busy={request.isPending} busyLabel="Sending…">
          Send the reset link
        </Button>
        <Link to="/sign-in" className="text-sm font-medium text-ink-soft underline decoration-rule-strong underline-offset-4 hover:text-ink">
          Back to sign in
        </Link>
      </div>
    </form>
  );
}
