import { useQuery } from '@tanstack/react-query';
import { Navigate, useSearchParams } from 'react-router-dom';
import { authQueries } from '../../features/auth/api/auth-queries';
import { AuthPanel } from '../../features/auth/components/auth-panel';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { safeNextPath } from '../../features/auth/lib/next-path';

export function SignInPage() {
  const [params] = useSearchParams();
  const next = params.get('next');
  const me = useQuery(authQueries.me());
  // Someone already signed in goes straight on.
  if (me.data) return <Navigate to={safeNextPath(next)} replace />;

  return (
    <>
      <title>Sign in · Compline</title>
      <AuthPanel
        title="Sign in"
        description={next && safeNextPath(next) !== '/' ? 'Sign in to open the page you asked for.' : 'Use the e-mail address your office manager invited.'}
      >
        <SignInForm next={next} />
      </AuthPanel>
    </>
  );
}
