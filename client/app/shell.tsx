import { useQuery } from '@tanstack/react-query';
import { Navigate, Outlet, useLocation, useNavigation } from 'react-router-dom';
import { LoadingBar, PageLoading } from '../components/ui/loading';
import { ErrorPanel } from '../components/ui/query-states';
import { authQueries } from '../features/auth/api/auth-queries';
import { SessionUserContext } from '../features/auth/hooks/use-session-user';
import { useSessionExpiry } from '../features/auth/hooks/use-session-expiry';
import { signInPathFor } from '../features/auth/lib/next-path';
import { ShellHeader } from './shell-header';

/** The signed-in frame: asks the server who is signed in, sends a signed-out visitor to
 * /sign-in?next=…, and otherwise draws the header, the role's navigation and the page. */
export function Shell() {
  const me = useQuery(authQueries.me());
  const location = useLocation();
  const navigation = useNavigation();
  useSessionExpiry();

  if (me.isPending) return <PageLoading fullPage label="Opening Compline…" />;
  if (me.isError) {
    return (
      <main className="mx-auto flex min-h-dvh max-w-xl flex-col justify-center px-6">
        <ErrorPanel title="Compline could not check your session" error={me.error} onRetry={() => void me.refetch()} retrying={me.isFetching} />
      </main>
    );
  }
  if (!me.data) return <Navigate to={signInPathFor(location)} replace />;

  return (
    <SessionUserContext value={me.data}>
      <div className="flex min-h-dvh flex-col">
        <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-20 focus:rounded focus:bg-ink focus:px-3 focus:py-2 focus:text-paper">
          Skip to the page
        </a>
        <div className="fixed inset-x-0 top-0 z-10 h-0.5" aria-hidden>
          {navigation.state === 'loading' && <LoadingBar className="rounded-none bg-transparent" />}
        </div>
        <ShellHeader user={me.data} />
        <main id="main" className="mx-auto w-full max-w-[84rem] flex-1 px-6 py-8 lg:px-10">
          <Outlet />
        </main>
        <footer className="border-t border-rule">
          <p className="mx-auto max-w-[84rem] px-6 py-4 text-[0.8125rem] text-ink-faint lg:px-10">
            Compline supports the appraiser’s judgement; a value opinion is the signed work of the appraiser.
          </p>
        </footer>
      </div>
    </SessionUserContext>
  );
}
