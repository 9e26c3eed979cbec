import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { buttonClasses } from '../../../components/ui/button';
import { EmptyPanel, ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { orderQueries } from '../api/order-queries';
import { OrderCard } from './order-card';

/** The lender's orders and where each stands, newest first as the server sends them; a delivered
 * order links to its report by the id the server sends with it. */
export function OrderList() {
  const orders = useQuery(orderQueries.list());

  if (orders.isPending) return <LoadingPanel label="Loading your orders…" />;
  if (orders.isError) {
    return <ErrorPanel title="Your orders could not be loaded" error={orders.error} onRetry={() => void orders.refetch()} retrying={orders.isFetching} />;
  }
  if (orders.data.length === 0) {
    return (
      <EmptyPanel title="No orders yet">
        <p>Appraisals your organisation orders from the firm appear here, with where each one stands.</p>
        <Link to="/orders/new" className={buttonClasses('primary', 'md', 'mt-4')}>
          Order an appraisal
        </Link>
      </EmptyPanel>
    );
  }
  return (
    <ul aria-label="Your orders" className="flex flex-col gap-4">
      {orders.data.map((order) => (
        <li key={order.id}>
          <OrderCard order={order} viewer="client" />
        </li>
      ))}
    </ul>
  );
}
