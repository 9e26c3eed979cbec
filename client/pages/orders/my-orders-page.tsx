import { PageHeader } from '../../components/ui/page-header';
import { RoleGate } from '../../features/auth/components/role-gate';
import { useSessionUser } from '../../features/auth/hooks/use-session-user';
import { OrderList } from '../../features/orders/components/order-list';

export function MyOrdersPage() {
  const user = useSessionUser();
  return (
    <RoleGate roles={['client']}>
      <title>My orders · Compline</title>
      <div className="flex flex-col gap-6">
        <PageHeader eyebrow={user.organisationName} title="My orders" description="The appraisals your organisation ordered, where each stands, and the reports delivered." />
        <OrderList />
      </div>
    </RoleGate>
  );
}
