import { Link, isRouteErrorResponse, useLocation, useRouteError } from 'react-router-dom';
import { Wordmark } from '../components/ui/brand-mark';
import { Button, buttonClasses } from '../components/ui/button';
import { isApiError } from '../lib/api-error';

interface Explanation {
  title: string;
  detail: string;
  reload: boolean;
}

function explain(error: unknown): Explanation {
  if (isRouteErrorResponse(error) && error.status === 404) {
    return { title: 'There is no page at this address', detail: 'The link may be mistyped or out of date.', reload: false };
  }
  if (isApiError(error)) return { title: 'This page could not be loaded', detail: error.message, reload: true };
  const message = error instanceof Error ? error.message : '';
  // After a new release the old page chunks are gone; a reload fetches the new ones.
  if (/dynamically imported module|Importing a module script failed|error loading dynamically imported module/i.test(message)) {
    return { title: 'Compline has been updated', detail: 'Reload the page to get the new version.', reload: true };
  }
  return {
    title: 'This page stopped on an error',
    detail: 'Nothing you saved is lost: changes are kept on the server as soon as they are accepted. Reload to try again.',
    reload: true,
  };
}

/** The route error element. At the root it fills the window; inside the shell (`inShell`) it
 * replaces only the page, so the header and navigation stay. */
export function RouteErrorPage({ inShell = false }: { inShell?: boolean }) {
  const error = useRouteError();
  const location = useLocation();
  const { title, detail, reload } = explain(error);
  if (!isRouteErrorResponse(error)) console.error(`Error on ${location.pathname}:`, error);

  const body = (
    <section aria-labelledby="route-error-title" className="max-w-xl">
      <p className="figures text-xs tracking-wide text-ink-faint uppercase">{location.pathname}</p>
      <h1 id="route-error-title" className="mt-2 text-2xl font-semibold">
        {title}
      </h1>
      <p className="mt-3 text-ink-soft">{detail}</p>
      <div className="mt-6 flex flex-wrap items-center gap-3">
        {reload && (
          <Button variant="primary" onClick={() => window.location.reload()}>
            Reload the page
          </Button>
        )}
        <Link to="/" className={buttonClasses(reload ? 'secondary' : 'primary')}>
          Go to your home page
        </Link>
      </div>
    </section>
  );

  if (inShell) return <div className="py-10">{body}</div>;
  return (
    <div className="flex min-h-dvh flex-col px-6 py-6 sm:px-10">
      <Wordmark />
      <main className="flex flex-1 items-center">{body}</main>
    </div>
  );
}
