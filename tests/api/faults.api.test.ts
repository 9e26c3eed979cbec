// Fault drills that really happen: the database is stopped and started, the server process gets
// SIGTERM and SIGKILL, the SMTP server is away. No mocks.
import { execFileSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import supertest from 'supertest';
import { and, eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { sales } from '../../db/schema/assignments';
import { outboxMessages } from '../../db/schema/mail';
import { enqueueMail, dispatchPending, setMailTransport } from '../../server/integrations/mail/outbox';
import { smtpTransport } from '../../server/integrations/mail/transport';
import { startFakeSmtpServer } from '../../server/integrations/mail/fake-smtp-server';
import { createFirmWithAssignment, createSale } from '../factories/assignments';
import { cleanSaleRows, csvFile, mappingFor, standardHeaders } from '../factories/csv';
import { signedInAgent, startTestApi, stopTestApi, type TestApi } from '../setup/test-api';
import { startChildServer } from '../setup/child-server';

/** pg_ctl on the throwaway test cluster (scripts/test.sh exports where it is); as the postgres
 * user when the tests run as root, as PostgreSQL requires. */
function pgCtl(action: 'stop' | 'start') {
  const args = [
    '-D', process.env.TEST_PGDATA!, '-w', '-t', '30',
    ...(action === 'stop'
      ? ['-m', 'fast', 'stop']
      : ['-l', `${process.env.TEST_PGDATA}/server.log`, '-o', `-c listen_addresses=127.0.0.1 -p ${process.env.TEST_PGPORT} -c unix_socket_directories='' -c max_connections=200 -c fsync=off -c synchronous_commit=off`, 'start']),
  ];
  const pgCtlPath = `${process.env.TEST_PGBIN}/pg_ctl`;
  if (process.getuid?.() === 0) execFileSync('runuser', ['-u', 'postgres', '--', pgCtlPath, ...args]);
  else execFileSync(pgCtlPath, args);
}

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

describe('the database stops in the middle of use', () => {
  it('answers 503 while it is down and recovers in the same process once it is back', async () => {
    const { appraiser, assignment } = await createFirmWithAssignment();
    const agent = await signedInAgent(api, appraiser);
    expect((await agent.get(`/api/assignments/${assignment.id}`)).status).toBe(200);
    pgCtl('stop');
    try {
      const health = await supertest(api.server).get('/api/health');
      expect(health.status).toBe(503);
      expect(health.body).toEqual({ status: 'degraded', database: 'unavailable' });
      const call = await agent.get(`/api/assignments/${assignment.id}`);
      expect(call.status).toBe(503);
      expect(call.body.error.code).toBe('database_unavailable');
    } finally {
      pgCtl('start');
    }
    expect((await supertest(api.server).get('/api/health')).body).toEqual({ status: 'ok', database: 'ok' });
    expect((await agent.get(`/api/assignments/${assignment.id}`)).status).toBe(200);
  });
});

async function importRequest(origin: string, cookie: string, assignmentId: number, rows: number) {
  return supertest(origin)
    .post(`/api/assignments/${assignmentId}/sales/import`)
    .set('Origin', origin)
    .set('Cookie', cookie)
    .field('mapping', JSON.stringify(mappingFor(standardHeaders)))
    .field('skipInvalid', 'false')
    .attach('file', csvFile(cleanSaleRows(rows)), { filename: 'drill.csv', contentType: 'text/csv' });
}

async function signInCookie(origin: string, user: { email: string; password: string }) {
  const res = await supertest(origin).post('/api/auth/sign-in').set('Origin', origin).send({ email: user.email, password: user.password });
  expect(res.status).toBe(204);
  return res.headers['set-cookie'][0].split(';')[0];
}

describe('the server process is signalled', () => {
  it('SIGTERM: the import in flight finishes, new connections are refused, the process exits 0', async () => {
    const { appraiser, assignment } = await createFirmWithAssignment();
    const server = await startChildServer();
    const cookie = await signInCookie(server.origin, appraiser);
    // Large enough to be still running when the signal arrives (3,000 rows could finish first on a
    // quiet machine, and the drill would then test nothing).
    const rows = 20_000;
    let answered = false;
    const inFlight = importRequest(server.origin, cookie, assignment.id, rows).then((r) => ((answered = true), r));
    await new Promise((r) => setTimeout(r, 300));
    expect(answered).toBe(false);
    server.process.kill('SIGTERM');
    const res = await inFlight;
    expect(res.status).toBe(201);
    expect(res.body.imported).toBe(rows);
    // The signal was handled (the log line travels by pipe, so give it a moment to arrive).
    for (let waited = 0; !server.output().includes('SIGTERM received') && waited < 5_000; waited += 50) await new Promise((r) => setTimeout(r, 50));
    expect(server.output()).toContain('SIGTERM received');
    // A new request is refused: the connection is refused, or (on a kept-alive socket) 503.
    const after = await supertest(server.origin).get('/api/health').timeout(2000).then((r) => r.status, () => 'refused');
    expect(['refused', 503]).toContain(after);
    expect(await server.exited).toBe(0);
  }, 120_000);

  it('SIGKILL during a CSV import: after a restart the import is there whole or not at all', async () => {
    const { appraiser, assignment } = await createFirmWithAssignment();
    const rows = 20_000;
    const first = await startChildServer();
    const cookie = await signInCookie(first.origin, appraiser);
    const doomed = importRequest(first.origin, cookie, assignment.id, rows).catch((err: Error) => err);
    await new Promise((r) => setTimeout(r, 2500));
    first.process.kill('SIGKILL');
    await doomed;
    await first.exited;
    const second = await startChildServer();
    try {
      expect((await supertest(second.origin).get('/api/health')).status).toBe(200);
      const live = await db.select({ id: sales.id }).from(sales).where(eq(sales.assignmentId, assignment.id));
      expect([0, rows]).toContain(live.length);
    } finally {
      second.process.kill('SIGTERM');
      await second.exited;
    }
  }, 180_000);
});

describe('the SMTP server is down', () => {
  it('keeps e-mail queued with a retry time, and sends it once the server is back', async () => {
    const probe = await startFakeSmtpServer();
    const port = Number(new URL(probe.url).port);
    await probe.close();
    setMailTransport(smtpTransport(`smtp://127.0.0.1:${port}?ignoreTLS=true`, 'Compline <drill@compline.invalid>'));
    const to = `outage-${Date.now()}@drill.example`;
    await enqueueMail(db, { to, subject: 'Drill', text: 'Sent once SMTP is back.' });
    await dispatchPending();
    let [row] = await db.select().from(outboxMessages).where(eq(outboxMessages.toAddress, to));
    expect(row.status).toBe('queued');
    expect(row.attempts).toBe(1);
    expect(row.lastError).toBeTruthy();
    expect(row.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());

    const back = await startFakeSmtpServer(port);
    try {
      await db.update(outboxMessages).set({ nextAttemptAt: new Date() }).where(eq(outboxMessages.id, row.id));
      await dispatchPending();
      [row] = await db.select().from(outboxMessages).where(and(eq(outboxMessages.toAddress, to)));
      expect(row.status).toBe('sent');
      expect(back.messages.some((m) => m.to.includes(to))).toBe(true);
    } finally {
      setMailTransport(null);
      await back.close();
    }
  });
});

describe('two people edit the same sale', () => {
  it('the second save gets 409 and the first edit is kept', async () => {
    const { appraiser, assignment, firm } = await createFirmWithAssignment();
    const { createUser } = await import('../factories/accounts');
    const colleague = await createUser({ role: 'appraiser', organisation: firm });
    const sale = await createSale(assignment.id);
    const [a, b] = [await signedInAgent(api, appraiser), await signedInAgent(api, colleague)];
    const first = await a.patch(`/api/assignments/${assignment.id}/sales/${sale.id}`).send({ version: sale.version, salePrice: 401_000 });
    const second = await b.patch(`/api/assignments/${assignment.id}/sales/${sale.id}`).send({ version: sale.version, salePrice: 399_000 });
    expect(first.status).toBe(200);
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('stale_version');
    const [stored] = await db.select().from(sales).where(eq(sales.id, sale.id));
    expect(stored.salePrice).toBe(401_000);
  });
});
