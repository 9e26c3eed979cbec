import { useQuery } from '@tanstack/react-query';
import { orderStatusLabels, type Order } from '@contracts/orders';
import { Badge } from '../../../components/ui/badge';
import { EmptyPanel, ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatDate, formatIsoDate } from '../../../lib/format-date';
import { formatMoney } from '../../../lib/format-money';
import { orderQueries } from '../api/order-queries';

const statusTone: Record<Order['status'], 'pending' | 'neutral' | 'positive' | 'negative'> = {
  awaiting_payment: 'pending',
  received: 'neutral',
  accepted: 'positive',
  declined: 'negative',
};

/** The lender's orders and where each stands, newest first as the server sends them. */
export function OrderList() {
  const orders = useQuery(orderQueries.list());

  if (orders.isPending) return <LoadingPanel label="Loading your orders…" />;
  if (orders.isError) {
    return <ErrorPanel title="Your orders could not be loaded" error={orders.error} onRetry={() => void orders.refetch()} retrying={orders.isFetching} />;
  }
  if (orders.data.length === 0) {
    return <EmptyPanel title="No orders yet">Appraisals your organisation orders from the firm appear here.</EmptyPanel>;
  }
  return (
    <Table caption="Your orders">
      <thead>
        <tr>
          <Th>Subject</Th>
          <Th>Appraisal firm</Th>
          <Th>Status</Th>
          <Th className="text-right">Fee</Th>
          <Th className="text-right">Due</Th>
        </tr>
      </thead>
      <tbody>
        {orders.data.map((order) => (
          <tr key={order.id}>
            <Td>
              <p className="font-semibold">{order.subjectAddress}</p>
              <p className="text-[0.8125rem] text-ink-faint">
                Loan <span className="figures">{order.loanReference}</span> · ordered by {order.orderedByName} on{' '}
                <span className="figures">{formatDate(order.createdAt)}</span>
              </p>
            </Td>
            <Td className="text-ink-soft">{order.firmName}</Td>
            <Td>
              <Badge tone={statusTone[order.status]}>{orderStatusLabels[order.status]}</Badge>
              {order.declineReason && <p className="mt-1 max-w-56 text-[0.8125rem] text-ink-soft">{order.declineReason}</p>}
            </Td>
            <Td className="figures text-right text-sm whitespace-nowrap">{formatMoney(order.feeAmount, order.currency)}</Td>
            <Td className="figures text-right text-sm whitespace-nowrap">{formatIsoDate(order.dueDate)}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
