import { Link, useLocation } from 'react-router-dom';
import { buttonClasses } from '../../components/ui/button';

/** Shown inside the shell for an address that leads nowhere. */
export function NotFoundPage({ what }: { what?: string }) {
  const location = useLocation();
  return (
    <section className="max-w-xl py-10">
      <title>Not found · Compline</title>
      <p className="figures text-xs tracking-wide text-ink-faint uppercase">404 · {location.pathname}</p>
      <h1 className="mt-2 text-2xl font-semibold">{what ?? 'There is no page at this address'}</h1>
      <p className="mt-3 text-ink-soft">The link may be mistyped or out of date. Your home page lists the work open to you.</p>
      <Link to="/" className={buttonClasses('primary', 'md', 'mt-6')}>
        Go to your home page
      </Link>
    </section>
  );
}
