import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { orderStatusLabels, type Order } from '@contracts/orders';
import { Badge } from '../../../components/ui/badge';
import { formatIsoDate } from '../../../lib/format-date';
import { formatMoney } from '../../../lib/format-money';
import { isReportDelivered, orderStatusTone, REPORT_DELIVERED } from '../lib/order-words';
import { OrderTimeline } from './order-timeline';

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-[0.75rem] font-medium tracking-wide text-ink-faint uppercase">{term}</dt>
      <dd className="mt-0.5 text-[0.9375rem] text-ink">{children}</dd>
    </div>
  );
}

/** One order on a ruled card: what was ordered, from or by whom, and its timeline. */
export function OrderCard({
  order,
  viewer,
  linkTitle = true,
  children,
}: {
  order: Order;
  viewer: 'client' | 'firm';
  /** The address links to the order's own page (off on that page itself). */
  linkTitle?: boolean;
  /** Actions under the timeline (pay, accept, decline). */
  children?: ReactNode;
}) {
  const title = linkTitle ? (
    <Link to={`/orders/${order.id}`} className="underline-offset-4 hover:underline">
      {order.subjectAddress}
    </Link>
  ) : (
    order.subjectAddress
  );
  return (
    <article aria-label={`Order ${order.id}: ${order.subjectAddress}`} className="rounded-lg border border-rule bg-paper-raised">
      <header className="flex flex-wrap items-start justify-between gap-x-6 gap-y-2 border-b border-rule px-5 pt-4 pb-3">
        <div className="min-w-0">
          <p className="figures text-[0.75rem] tracking-wide text-ink-faint uppercase">Order {order.id}</p>
          <h3 className="text-[1.0625rem] leading-snug font-semibold text-ink">{title}</h3>
        </div>
        <Badge tone={orderStatusTone[order.status]}>{isReportDelivered(order) ? REPORT_DELIVERED : orderStatusLabels[order.status]}</Badge>
      </header>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-3 px-5 py-4 md:grid-cols-4">
        <Fact term={viewer === 'client' ? 'Appraisal firm' : 'Client'}>{viewer === 'client' ? order.firmName : order.clientOrganisationName}</Fact>
        <Fact term="Loan reference">
          <span className="figures">{order.loanReference}</span>
        </Fact>
        <Fact term="Fee">
          <span className="figures">{formatMoney(order.feeAmount, order.currency)}</span>
          <span className="block text-[0.8125rem] text-ink-soft">{order.feeName}</span>
        </Fact>
        <Fact term="Due">
          <span className="figures">{formatIsoDate(order.dueDate)}</span>
        </Fact>
        <div className="col-span-2 md:col-span-4">
          <Fact term="Intended use">{order.intendedUse}</Fact>
        </div>
      </dl>
      <div className="border-t border-dashed border-rule px-5 py-4">
        <OrderTimeline order={order} viewer={viewer} payHref={linkTitle ? `/orders/${order.id}` : undefined} />
      </div>
      {children && <div className="border-t border-rule bg-paper-sunk/40 px-5 py-4">{children}</div>}
    </article>
  );
}
