import { useNavigate } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';
import { RoleGate } from '../../features/auth/components/role-gate';
import { useSessionUser } from '../../features/auth/hooks/use-session-user';
import { OrderForm } from '../../features/orders/components/order-form';
import { OrderSteps } from './order-steps';

/** /orders/new: a lender's staff order an appraisal; the payment step follows on the order's page. */
export function NewOrderPage() {
  const user = useSessionUser();
  const navigate = useNavigate();
  return (
    <RoleGate roles={['client']}>
      <title>Order an appraisal · Compline</title>
      <div className="flex max-w-5xl flex-col gap-6">
        <PageHeader eyebrow={user.organisationName} title="Order an appraisal" description="Say what is to be appraised and for what, then pay the firm’s fee. The firm accepts or declines the paid order." />
        <OrderSteps current={1} />
        <OrderForm onPlaced={(order) => navigate(`/orders/${order.id}`)} />
      </div>
    </RoleGate>
  );
}
