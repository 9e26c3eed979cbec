import { useQuery } from '@tanstack/react-query';
import type { Role } from '@contracts/auth';
import type { Order } from '@contracts/orders';
import { EmptyPanel, ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { countOf } from '../../../lib/count-of';
import { orderQueries } from '../api/order-queries';
import { OrderCard } from './order-card';
import { OrderDecision } from './order-decision';

const groups: ReadonlyArray<{ key: string; title: string; empty: string; pick: (o: Order) => boolean }> = [
  { key: 'decide', title: 'Paid, waiting for a decision', empty: 'No paid order is waiting for the firm.', pick: (o) => o.status === 'received' },
  { key: 'unpaid', title: 'Awaiting the client’s payment', empty: 'Every order placed has been paid.', pick: (o) => o.status === 'awaiting_payment' },
  { key: 'decided', title: 'Accepted and declined', empty: 'No order has been decided yet.', pick: (o) => o.status === 'accepted' || o.status === 'declined' },
];

/** The orders placed with the firm, the ones that need a decision first. */
export function FirmOrderList({ role }: { role: Role }) {
  const orders = useQuery(orderQueries.list());
  if (orders.isPending) return <LoadingPanel label="Loading the firm’s orders…" />;
  if (orders.isError) return <ErrorPanel title="The orders could not be loaded" error={orders.error} onRetry={() => void orders.refetch()} retrying={orders.isFetching} />;
  if (orders.data.length === 0) return <EmptyPanel title="No orders yet">Orders that lenders place with the firm appear here once placed.</EmptyPanel>;

  return (
    <div className="flex flex-col gap-10">
      {groups.map((group) => {
        const members = orders.data.filter(group.pick);
        return (
          <section key={group.key} aria-labelledby={`orders-${group.key}`} className="flex flex-col gap-4">
            <h2 id={`orders-${group.key}`} className="flex items-baseline gap-3 text-lg font-semibold text-ink">
              {group.title}
              <span className="figures text-sm font-normal text-ink-faint">{countOf(members.length, 'order')}</span>
            </h2>
            {members.length === 0 ? (
              <p className="text-[0.9375rem] text-ink-faint">{group.empty}</p>
            ) : (
              <ul className="flex flex-col gap-4">
                {members.map((order) => (
                  <li key={order.id}>
                    <OrderCard order={order} viewer="firm">
                      <OrderDecision order={order} role={role} />
                    </OrderCard>
                  </li>
                ))}
              </ul>
            )}
          </section>
        );
      })}
    </div>
  );
}
