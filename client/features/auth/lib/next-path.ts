/** Where to go after signing in: only a path on this site, never another origin (`//evil`,
 * `https://…`) and never back to the sign-in page itself. */
export function safeNextPath(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return '/';
  if (next === '/sign-in' || next.startsWith('/sign-in?')) return '/';
  return next;
}

/** The sign-in address that brings the visitor back to where they were. */
export function signInPathFor(location: { pathname: string; search: string; hash?: string }): string {
  const here = `${location.pathname}${location.search}${location.hash ?? ''}`;
  return here === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(here)}`;
}
