import { useQuery } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';
import { ErrorPanel, LoadingPanel } from '../../components/ui/query-states';
import { RoleGate } from '../../features/auth/components/role-gate';
import { useSessionUser } from '../../features/auth/hooks/use-session-user';
import { orderQueries } from '../../features/orders/api/order-queries';
import { OrderCard } from '../../features/orders/components/order-card';
import { OrderDecision } from '../../features/orders/components/order-decision';
import { PaymentStep } from '../../features/orders/components/payment-step';
import { NotFoundPage } from '../errors/not-found-page';
import { OrderSteps } from './order-steps';

function parseOrderId(raw: string | undefined): number | null {
  if (!raw || !/^[1-9]\d{0,9}$/.test(raw)) return null;
  const id = Number(raw);
  return id <= 2_147_483_647 ? id : null;
}

/** /orders/:id — one order. The client pays it here (step two of ordering) and follows it; the
 * firm's admins and appraisers accept or decline it. */
export function OrderPage() {
  const id = parseOrderId(useParams().id);
  if (id === null) return <NotFoundPage what="There is no order at this address" />;
  return (
    <RoleGate roles={['client', 'appraiser', 'admin']}>
      <OrderDetail id={id} />
    </RoleGate>
  );
}

function OrderDetail({ id }: { id: number }) {
  const user = useSessionUser();
  const detail = useQuery(orderQueries.detail(id));
  const back = (
    <Link to={user.role === 'client' ? '/' : '/orders'} className="text-[0.875rem] text-ink-soft underline-offset-4 hover:text-ink hover:underline">
      ← {user.role === 'client' ? 'My orders' : 'Orders'}
    </Link>
  );
  if (detail.isPending) return <LoadingPanel label={`Opening order ${id}…`} />;
  if (detail.isError) {
    return (
      <div className="flex flex-col gap-4">
        {back}
        <ErrorPanel title={`Order ${id} could not be opened`} error={detail.error} onRetry={() => void detail.refetch()} retrying={detail.isFetching} />
      </div>
    );
  }
  const { order } = detail.data;
  const client = user.role === 'client';
  const paying = client && order.status === 'awaiting_payment';
  return (
    <div className="flex max-w-5xl flex-col gap-6">
      <title>{`Order ${order.id} · ${order.subjectAddress} · Compline`}</title>
      {back}
      <PageHeader
        eyebrow={<span className="figures">Order {order.id}</span>}
        title={paying ? 'Pay the fee' : order.subjectAddress}
        description={paying ? `The order for ${order.subjectAddress} is placed. Pay the fee to send it to ${order.firmName}.` : undefined}
      />
      {client && (order.status === 'awaiting_payment' || order.status === 'received') && <OrderSteps current={2} />}
      {client && order.status !== 'declined' && order.status !== 'accepted' && (
        <section aria-label="Payment" className="rounded-xl border border-rule-strong bg-paper-raised px-5 py-5">
          <PaymentStep order={order} />
        </section>
      )}
      <OrderCard order={order} viewer={client ? 'client' : 'firm'} linkTitle={false}>
        {!client && <OrderDecision order={order} role={user.role} />}
      </OrderCard>
    </div>
  );
}
