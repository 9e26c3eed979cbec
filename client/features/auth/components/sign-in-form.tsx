import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'react-router-dom';
import { signInRequest } from '@contracts/auth';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { describeError } from '../../../lib/api-error';
import { useSignIn } from '../hooks/use-sign-in';

export function SignInForm({ next }: { next: string | null }) {
  const form = useForm({ resolver: zodResolver(signInRequest), defaultValues: { email: '', password: '' } });
  const { errors } = form.formState;
  const signIn = useSignIn(next);

  const onSubmit = form.handleSubmit((values) =>
    signIn.mutate(values, {
      onError: () => {
        form.resetField('password');
        form.setFocus('password');
      },
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {signIn.isError && <Notice tone="error">{describeError(signIn.error)}</Notice>}
      <TextField label="E-mail address" type="email" autoComplete="username" inputMode="email" autoFocus error={errors.email?.message} {...form.register('email')} />
      <TextField label="Password" type="password" autoComplete="current-password" error={errors.password?.message} {...form.register('password')} />
      <div className="mt-1 flex flex-wrap items-center justify-between gap-4">
        <Button type="submit" variant="primary" busy={signIn.isPending} busyLabel="Signing in…" className="min-w-32">
          Sign in
        </Button>
        <Link to="/forgot-password" className="text-sm font-medium text-ink-soft underline decoration-rule-strong underline-offset-4 hover:text-ink hover:decoration-ink">
          Forgot your password?
        </Link>
      </div>
    </form>
  );
}
