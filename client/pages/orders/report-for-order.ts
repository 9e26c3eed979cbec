import { useQuery } from '@tanstack/react-query';
import type { Order } from '@contracts/orders';
import { useSessionUser } from '../../features/auth/hooks/use-session-user';
import { isReportDelivered } from '../../features/orders/lib/order-words';
import type { ReportLink } from '../../features/orders/components/order-timeline';
import { reportQueries } from '../../features/reports/api/report-queries';

/**
 * Finds the delivered report of an order for a lender's staff. The order view does not carry the
 * report's id for a client, so the report is looked up among the organisation's signed versions by
 * subject address and client, signed after the order was placed (the newest version wins).
 */
export function useReportForOrder(): (order: Order) => ReportLink | null {
  const user = useSessionUser();
  const reports = useQuery({ ...reportQueries.list(), enabled: user.role === 'client' });
  return (order) => {
    if (!isReportDelivered(order) || !reports.data) return null;
    const match = reports.data
      .filter((r) => r.subjectAddress === order.subjectAddress && r.clientName === order.clientOrganisationName && r.signedAt.getTime() >= order.createdAt.getTime())
      .sort((a, b) => b.versionNumber - a.versionNumber)[0];
    return match ? { href: `/reports/${match.id}`, label: `Read the report (version ${match.versionNumber})` } : null;
  };
}
