import { useSessionUser } from '../../features/auth/hooks/use-session-user';
import { FirmOrdersPage } from './firm-orders-page';
import { MyOrdersPage } from './my-orders-page';

/** /orders: a lender's staff see their own orders; the firm's staff see the orders placed with it
 * (the address the firm's "new order" e-mails link to). */
export function OrdersPage() {
  const { role } = useSessionUser();
  return role === 'client' ? <MyOrdersPage /> : <FirmOrdersPage />;
}
