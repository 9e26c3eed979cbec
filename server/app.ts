import express, { Router } from 'express';
import helmet from 'helmet';
import path from 'node:path';
import { existsSync } from 'node:fs';
import { errorHandler } from './middleware/error-handler';
import { originCheck } from './middleware/origin-check';
import { textCheck } from './middleware/text-check';
import { notFound } from './errors';
import { sessionMiddleware } from './modules/auth/session.middleware';
import { authRouter } from './modules/auth/auth.router';
import { usersRouter } from './modules/users/users.router';
import { adminRouter } from './modules/admin/admin.router';
import { healthRouter } from './modules/health.router';
import { configRouter } from './modules/config.router';
import { env } from './env';
import { assignmentsRouter } from './modules/assignments/assignments.router';
import { salesRouter } from './modules/sales/sales.router';
import { salesImportRouter } from './modules/sales-import/sales-import.router';
import { photosRouter } from './modules/photos/photos.router';
import { analysisRouter } from './modules/analysis/analysis.router';
import { gridRouter } from './modules/grid/grid.router';
import { reviewRouter } from './modules/review/review.router';
import { reportsRouter } from './modules/reports/reports.router';
import { reconsiderationsRouter } from './modules/reconsiderations/reconsiderations.router';
import { ordersRouter } from './modules/orders/orders.router';
import { PAYMENTS_WEBHOOK_PATH, paymentsWebhookRouter } from './modules/orders/payments-webhook.router';

/** Every API router, in one list: the access-matrix test walks these (and rawBodyRouters below). */
export const apiRouters: Router[] = [healthRouter, configRouter, authRouter, usersRouter, adminRouter, assignmentsRouter, salesRouter, salesImportRouter, photosRouter, analysisRouter, gridRouter, reviewRouter, ordersRouter, reportsRouter, reconsiderationsRouter];

/** Routers that read their own raw body (signed webhooks): mounted before the JSON parser. */
export const rawBodyRouters: Router[] = [paymentsWebhookRouter];

const WEBHOOK_PATHS: string[] = [PAYMENTS_WEBHOOK_PATH];

function mapStyleOrigins(): string[] {
  return env.MAP_STYLE_URL ? [new URL(env.MAP_STYLE_URL).origin] : [];
}

/** Builds the app without listening: tests import this. */
export function createApp(options: { clientDir?: string } = {}) {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          workerSrc: ["'self'", 'blob:'],
          childSrc: ["'self'", 'blob:'],
          imgSrc: ["'self'", 'data:', 'blob:', ...mapStyleOrigins()],
          styleSrc: ["'self'", "'unsafe-inline'"],
          fontSrc: ["'self'", 'data:'],
          // A self-hosted map style (MAP_STYLE_URL) loads its tiles, glyphs and sprites from its own origin.
          connectSrc: ["'self'", ...mapStyleOrigins()],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: null,
        },
      },
    }),
  );

  const api = Router();
  for (const router of rawBodyRouters) api.use(router);
  api.use(express.json({ limit: '1mb' }));
  api.use(originCheck(WEBHOOK_PATHS));
  api.use(sessionMiddleware);
  api.use(textCheck);
  for (const router of apiRouters) api.use(router);
  api.use((req, _res, next) => next(notFound(`The API route ${req.method} ${req.path}`)));
  api.use(errorHandler);
  app.use('/api', api);

  const clientDir = options.clientDir ?? path.resolve('dist/client');
  if (existsSync(clientDir)) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.use('/assets', express.static(path.join(clientDir, 'assets'), { immutable: true, maxAge: '1y' }));
    // Deep links such as /assignments/1 load the app; the client router takes it from there.
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(clientDir, 'index.html')));
  }
  app.use(errorHandler);
  return app;
}
