import { Link, NavLink } from 'react-router-dom';
import { roleLabels, type SessionUser } from '@contracts/auth';
import { Wordmark } from '../components/ui/brand-mark';
import { Button } from '../components/ui/button';
import { useSignOut } from '../features/auth/hooks/use-sign-out';
import { navigationByRole } from './navigation';

function initials(name: string): string {
  const parts = name.trim().split(/\s+/);
  return ((parts[0]?.[0] ?? '') + (parts.length > 1 ? (parts[parts.length - 1]?.[0] ?? '') : '')).toUpperCase();
}

export function ShellHeader({ user }: { user: SessionUser }) {
  const signOut = useSignOut();
  const items = navigationByRole[user.role];
  return (
    <header className="border-b border-rule bg-paper-raised/80">
      <div className="mx-auto flex max-w-[84rem] flex-wrap items-center gap-x-10 gap-y-0 px-6 lg:px-10">
        <Link to="/" aria-label="Compline, home" className="flex h-16 items-center rounded-sm">
          <Wordmark />
        </Link>

        <nav aria-label="Main" className="order-last -mx-1 flex w-full gap-1 overflow-x-auto lg:order-none lg:w-auto lg:self-stretch">
          {items.map((item) => (
            <NavLink
              key={item.to}
              to={item.to}
              end={item.to === '/'}
              className={({ isActive }) =>
                `flex h-12 items-center border-b-2 px-3 text-[0.9375rem] whitespace-nowrap transition-colors lg:h-auto ${
                  isActive ? 'border-ink font-semibold text-ink' : 'border-transparent text-ink-soft hover:border-rule-strong hover:text-ink'
                }`
              }
            >
              {item.label}
            </NavLink>
          ))}
        </nav>

        <div className="ml-auto flex items-center gap-4 py-3" data-testid="signed-in-user">
          <span aria-hidden className="hidden size-9 items-center justify-center rounded-full border border-rule-strong bg-paper text-[0.8125rem] font-semibold text-ink-soft sm:flex">
            {initials(user.name)}
          </span>
          <div className="min-w-0 text-right sm:text-left">
            <p className="truncate text-[0.9375rem] leading-tight font-semibold text-ink">{user.name}</p>
            <p className="truncate text-[0.8125rem] leading-tight text-ink-soft">
              {roleLabels[user.role]} <span className="text-ink-faint">·</span> {user.organisationName}
            </p>
          </div>
          <Button size="sm" onClick={() => signOut.mutate()} busy={signOut.isPending} busyLabel="Signing out…">
            Sign out
          </Button>
        </div>
      </div>
      {signOut.isError && (
        <p role="alert" className="border-t border-rust/30 bg-rust-wash px-6 py-2 text-center text-sm text-rust">
          Sign-out did not go through: {signOut.error.message}
        </p>
      )}
    </header>
  );
}
