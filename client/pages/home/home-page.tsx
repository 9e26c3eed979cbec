import { lazy, Suspense } from 'react';
import type { Role } from '@contracts/auth';
import { PageLoading } from '../../components/ui/loading';
import { useSessionUser } from '../../features/auth/hooks/use-session-user';

/** Each role's home, loaded only for the role that needs it. */
const homes: Record<Role, ReturnType<typeof lazy>> = {
  appraiser: lazy(() => import('../assignments/my-assignments-page').then((m) => ({ default: m.MyAssignmentsPage }))),
  reviewer: lazy(() => import('../review/review-queue-page').then((m) => ({ default: m.ReviewQueuePage }))),
  client: lazy(() => import('../orders/my-orders-page').then((m) => ({ default: m.MyOrdersPage }))),
  admin: lazy(() => import('../admin/team-page').then((m) => ({ default: m.TeamPage }))),
};

export function HomePage() {
  const { role } = useSessionUser();
  const Home = homes[role];
  return (
    <Suspense fallback={<PageLoading />}>
      <Home />
    </Suspense>
  );
}
