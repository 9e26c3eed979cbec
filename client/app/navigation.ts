import type { Role } from '@contracts/auth';

export interface NavItem {
  label: string;
  to: string;
}

/** What each role finds in the header. The server refuses the rest anyway; this only keeps the
 * header to the work a person actually does. */
export const navigationByRole: Record<Role, readonly NavItem[]> = {
  appraiser: [
    { label: 'My assignments', to: '/' },
    { label: 'Orders', to: '/orders' },
  ],
  reviewer: [{ label: 'Review queue', to: '/' }],
  client: [{ label: 'My orders', to: '/' }],
  admin: [
    { label: 'Team', to: '/' },
    { label: 'Orders', to: '/orders' },
    { label: 'Outbox', to: '/outbox' },
    { label: 'Audit trail', to: '/audit' },
  ],
};
