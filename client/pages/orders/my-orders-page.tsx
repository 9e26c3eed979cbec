import { Link } from 'react-router-dom';
import { buttonClasses } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { RoleGate } from '../../features/auth/components/role-gate';
import { useSessionUser } from '../../features/auth/hooks/use-session-user';
import { OrderList } from '../../features/orders/components/order-list';

/** The lender's home: their organisation's orders with each one's timeline; a delivered order
 * links to its report. */
export function MyOrdersPage() {
  const user = useSessionUser();
  return (
    <RoleGate roles={['client']}>
      <title>My orders · Compline</title>
      <div className="flex flex-col gap-6">
        <PageHeader
          eyebrow={user.organisationName}
          title="My orders"
          description="The appraisals your organisation ordered, where each stands, and the reports delivered."
          actions={
            <Link to="/orders/new" className={buttonClasses('primary')}>
              Order an appraisal
            </Link>
          }
        />
        <OrderList />
      </div>
    </RoleGate>
  );
}
