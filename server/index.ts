import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { env } from './env';
import { db, pool } from '../db/client';
import { applyMigrations } from '../db/migrate';
import { createApp } from './app';
import { startFakeSmtpServer } from './integrations/mail/fake-smtp-server';
import { smtpTransport } from './integrations/mail/transport';
import { dispatchPending, setMailTransport, startMailDispatcher } from './integrations/mail/outbox';
import { configurePayments } from './integrations/payments/payments-client';
import { startFakePaymentsApi, type FakePaymentsApi } from './integrations/payments/fake-payments-api';

async function main() {
  await applyMigrations(db);

  let smtpUrl = env.SMTP_URL;
  let closeFakeSmtp: (() => Promise<void>) | undefined;
  if (!smtpUrl) {
    const fake = await startFakeSmtpServer();
    smtpUrl = fake.url;
    closeFakeSmtp = fake.close;
    console.log(`Compline: no SMTP_URL set, e-mail goes to the in-process fake SMTP server (${smtpUrl}); read it on the Outbox page.`);
  }
  const transport = smtpTransport(smtpUrl, env.MAIL_FROM);
  setMailTransport(transport);
  const stopDispatcher = startMailDispatcher();
  void dispatchPending().catch(() => undefined);

  // Without a provider key, card payments go to the local fake API (test cards only), which sends its
  // signed webhooks back to this server once it listens.
  let fakePayments: FakePaymentsApi | undefined;
  if (!env.PAYMENTS_SECRET_KEY) {
    fakePayments = await startFakePaymentsApi();
    configurePayments({ apiUrl: fakePayments.url, secretKey: fakePayments.secretKey, webhookSecret: fakePayments.webhookSecret });
    console.log(`Compline: no PAYMENTS_SECRET_KEY set, card payments go to the local fake payments API (${fakePayments.url}); test cards pm_card_visa and pm_card_chargeDeclined.`);
  }

  let shuttingDown = false;
  const app = createApp();
  // Once shutdown begins, a request that still arrives (on a kept-alive connection) is refused with
  // 503 and the connection closed; requests already in flight finish.
  const server = http.createServer((req, res) => {
    if (!shuttingDown) return app(req, res);
    res.writeHead(503, { 'Content-Type': 'application/json', Connection: 'close' });
    res.end(JSON.stringify({ error: { code: 'shutting_down', message: 'Compline is restarting. Try again in a moment.' } }));
  });
  server.listen(env.PORT, '0.0.0.0', () => {
    const { port } = server.address() as AddressInfo;
    console.log(`Compline is listening on http://127.0.0.1:${port}`);
    fakePayments?.setWebhookUrl(`http://127.0.0.1:${port}/api/payments/webhook`);
  });

  const shutdown = (signal: string) => {
    if (shuttingDown) return;
    shuttingDown = true;
    console.log(`Compline: ${signal} received, finishing requests in flight…`);
    stopDispatcher();
    server.close(async () => {
      transport.close();
      await closeFakeSmtp?.();
      await fakePayments?.close();
      await pool.end();
      console.log('Compline: stopped.');
      process.exit(0);
    });
    server.closeIdleConnections();
    // Connections that were busy when the signal came are closed as soon as they go idle.
    setInterval(() => server.closeIdleConnections(), 100).unref();
    setTimeout(() => process.exit(1), 15_000).unref();
  };
  process.on('SIGTERM', () => shutdown('SIGTERM'));
  process.on('SIGINT', () => shutdown('SIGINT'));
}

main().catch((err) => {
  console.error('Compline failed to start:', err);
  process.exit(1);
});
