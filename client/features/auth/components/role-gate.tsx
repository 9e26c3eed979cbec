import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { roleLabels, type Role } from '@contracts/auth';
import { buttonClasses } from '../../../components/ui/button';
import { useSessionUser } from '../hooks/use-session-user';

/** Shows its children only to the roles given. The server refuses the same people anyway; this
 * only spares them a page of errors. */
export function RoleGate({ roles, children }: { roles: readonly Role[]; children: ReactNode }) {
  const user = useSessionUser();
  if (roles.includes(user.role)) return children;
  return (
    <section className="max-w-xl py-10">
      <h1 className="text-2xl font-semibold">This page is not part of your work</h1>
      <p className="mt-3 text-ink-soft">
        It is open to {roles.map((role) => roleLabels[role].toLowerCase()).join(' and ')}s. You are signed in as{' '}
        {roleLabels[user.role].toLowerCase()}.
      </p>
      <Link to="/" className={buttonClasses('primary', 'md', 'mt-6')}>
        Go to your home page
      </Link>
    </section>
  );
}
