import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { PageLoading } from '../components/ui/loading';
import { RouteErrorPage } from './route-error-page';

/*
 * Every page is loaded on demand so that the entry chunk holds only React, the router, the query
 * client and this table. Heavy libraries (the map, the charts) live in the chunks of the pages that
 * use them and are never pulled into the entry.
 */
const routes: RouteObject[] = [
  {
    id: 'root',
    errorElement: <RouteErrorPage />,
    hydrateFallbackElement: <PageLoading fullPage />,
    children: [
      {
        // The public fingerprint check: open to anyone, signed in or not, in a frame of its own.
        path: 'verify/:sha256?',
        lazy: () => import('../pages/verify/verify-page').then((m) => ({ Component: m.VerifyPage })),
      },
      {
        // Pages a signed-out visitor may open.
        lazy: () => import('./public-layout').then((m) => ({ Component: m.PublicLayout })),
        children: [
          { path: 'sign-in', lazy: () => import('../pages/auth/sign-in-page').then((m) => ({ Component: m.SignInPage })) },
          {
            path: 'forgot-password',
            lazy: () => import('../pages/auth/forgot-password-page').then((m) => ({ Component: m.ForgotPasswordPage })),
          },
          {
            path: 'reset-password',
            lazy: () => import('../pages/auth/reset-password-page').then((m) => ({ Component: m.ResetPasswordPage })),
          },
          { path: 'invitation', lazy: () => import('../pages/auth/invitation-page').then((m) => ({ Component: m.InvitationPage })) },
        ],
      },
      {
        // Everything else needs a session: the shell sends a signed-out visitor to /sign-in?next=….
        lazy: () => import('./shell').then((m) => ({ Component: m.Shell })),
        children: [
          {
            // An error in one page keeps the header and navigation on screen.
            errorElement: <RouteErrorPage inShell />,
            children: [
              { index: true, lazy: () => import('../pages/home/home-page').then((m) => ({ Component: m.HomePage })) },
              { path: 'outbox', lazy: () => import('../pages/admin/outbox-page').then((m) => ({ Component: m.OutboxPage })) },
              { path: 'audit', lazy: () => import('../pages/admin/audit-trail-page').then((m) => ({ Component: m.AuditTrailPage })) },
              { path: 'orders', lazy: () => import('../pages/orders/orders-page').then((m) => ({ Component: m.OrdersPage })) },
              { path: 'orders/new', lazy: () => import('../pages/orders/new-order-page').then((m) => ({ Component: m.NewOrderPage })) },
              { path: 'orders/:id', lazy: () => import('../pages/orders/order-page').then((m) => ({ Component: m.OrderPage })) },
              { path: 'reports/:id', lazy: () => import('../pages/reports/report-page').then((m) => ({ Component: m.ReportPage })) },
              {
                path: 'assignments/:id/:step?',
                lazy: () =>
                  import('../pages/assignments/assignment-workspace-page').then((m) => ({ Component: m.AssignmentWorkspacePage })),
              },
              { path: '*', lazy: () => import('../pages/errors/not-found-page').then((m) => ({ Component: m.NotFoundPage })) },
            ],
          },
        ],
      },
    ],
  },
];

export function createAppRouter() {
  return createBrowserRouter(routes);
}
