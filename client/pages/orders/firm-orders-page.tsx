import { PageHeader } from '../../components/ui/page-header';
import { RoleGate } from '../../features/auth/components/role-gate';
import { useSessionUser } from '../../features/auth/hooks/use-session-user';
import { FirmOrderList } from '../../features/orders/components/firm-order-list';

/** The firm's orders: admins and appraisers accept a paid order (it becomes an assignment) or
 * decline it with a reason the client reads. */
export function FirmOrdersPage() {
  const user = useSessionUser();
  return (
    <RoleGate roles={['admin', 'appraiser']}>
      <title>Orders · Compline</title>
      <div className="flex flex-col gap-6">
        <PageHeader
          eyebrow={user.organisationName}
          title="Orders"
          description={
            user.role === 'admin'
              ? 'Orders lenders placed with the firm. Accept a paid order and pick the appraiser who will hold it, or decline it with a reason.'
              : 'Orders lenders placed with the firm. Accept a paid order to take it on yourself, or decline it with a reason.'
          }
        />
        <FirmOrderList role={user.role} />
      </div>
    </RoleGate>
  );
}
