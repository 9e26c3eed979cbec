import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { mkdtemp, mkdir, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import supertest from 'supertest';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { db } from '../../db/client';
import { sessions } from '../../db/schema/auth';
import { createApp } from '../../server/app';
import { env } from '../../server/env';
import { errorHandler } from '../../server/middleware/error-handler';
import { UPLOADS_PER_WINDOW } from '../../server/middleware/upload-rate-limit';
import { createUser } from '../factories/accounts';
import { createFirmWithAssignment, photoRows } from '../factories/assignments';
import { plainJpeg } from '../factories/images';
import { linkIn, onlyMailTo } from '../setup/mailbox';
import { envelopeProblems, STACK_TRACE } from '../setup/route-table';
import { bareRequest, browserAgent, sessionCookie, signedInAgent, startTestApi, stopTestApi, uniqueClientIp, type TestApi } from '../setup/test-api';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

function cspDirectives(header: string | undefined): Map<string, string[]> {
  return new Map((header ?? '').split(';').map((d) => d.trim().split(/\s+/)).filter((p) => p[0]).map(([name, ...values]) => [name, values]));
}

function expectSecurityHeaders(res: supertest.Response, what: string) {
  const h = res.headers;
  expect(h['x-content-type-options'], what).toBe('nosniff');
  expect(h['x-frame-options'], what).toBeDefined();
  expect(h['referrer-policy'], what).toBe('no-referrer');
  expect(h['strict-transport-security'], what).toMatch(/max-age=\d+/);
  expect(h['cross-origin-opener-policy'], what).toBe('same-origin');
  expect(h['x-powered-by'], what).toBeUndefined();
  const csp = h['content-security-policy'] as string | undefined;
  expect(csp, what).toContain("worker-src 'self' blob:");
  const d = cspDirectives(csp);
  expect(d.get('default-src'), what).toEqual(["'self'"]);
  expect(d.get('script-src'), what).toEqual(["'self'"]);
  expect(d.get('object-src'), what).toEqual(["'none'"]);
  expect(d.get('frame-ancestors'), what).toEqual(["'none'"]);
  expect(d.get('connect-src'), what).toEqual(["'self'"]);
}

describe('security headers', () => {
  it('every API answer carries helmet’s headers and a CSP that allows our blob: worker and nothing inline', async () => {
    expectSecurityHeaders(await bareRequest(api).get('/api/health'), 'GET /api/health');
    expectSecurityHeaders(await bareRequest(api).get('/api/users'), '401 answer');
    expectSecurityHeaders(await bareRequest(api).get('/api/no-such-route'), '404 answer');
  });

  it('the app page and its assets are served under the same policy', async () => {
    const clientDir = await mkdtemp(path.join(os.tmpdir(), 'compline-client-'));
    await mkdir(path.join(clientDir, 'assets'));
    await writeFile(path.join(clientDir, 'index.html'), '<!doctype html><script type="module" src="/assets/app.js"></script>');
    await writeFile(path.join(clientDir, 'assets', 'app.js'), 'new Worker(URL.createObjectURL(new Blob([""])));');
    const server = http.createServer(createApp({ clientDir }));
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    try {
      const origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
      const page = await supertest(origin).get('/assignments/7/comparables');
      expect(page.status).toBe(200);
      expect(page.text).toContain('/assets/app.js');
      expectSecurityHeaders(page, 'deep link to the app');
      const asset = await supertest(origin).get('/assets/app.js');
      expect(asset.status).toBe(200);
      expect(asset.headers['content-type']).toMatch(/javascript/);
      expectSecurityHeaders(asset, 'asset');
    } finally {
      await new Promise((r) => server.close(r));
      await rm(clientDir, { recursive: true, force: true });
    }
  });
});

describe('error bodies', () => {
  it('no error answer carries a stack trace, a source path or a module path', async () => {
    const admin = await createUser({ role: 'admin' });
    const agent = await signedInAgent(api, admin);
    const answers = [
      await bareRequest(api).get('/api/assignments'),
      await (await signedInAgent(api, await createUser({ role: 'client' }))).get('/api/users'),
      await agent.get('/api/no-such-route'),
      await agent.patch('/api/users/not-a-number').send({}),
      await agent.post('/api/users/invitations').set('Content-Type', 'application/json').send('{"email": '),
      await agent.post('/api/users/invitations').set('Content-Type', 'application/json').send(`{"name":"${'x'.repeat(1_100_000)}"}`),
      await bareRequest(api).post('/api/users/invitations').send({}),
    ];
    expect(answers.map((r) => r.status)).toEqual([401, 403, 404, 400, 400, 413, 403]);
    for (const res of answers) expect(envelopeProblems(res), res.text.slice(0, 200)).toEqual([]);
  });

  it('an unexpected error is a logged 500 whose body says nothing of the error', async () => {
    const logged = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      const app = express();
      app.get('/boom', () => {
        throw new TypeError(`Cannot read properties of undefined (reading 'x') at ${path.resolve('server/secret-module.ts')}:12:7`);
      });
      app.use(errorHandler);
      const res = await supertest(app).get('/boom');
      expect(res.status).toBe(500);
      expect(res.body).toEqual({ error: { code: 'internal', message: expect.any(String) } });
      expect(res.text).not.toMatch(STACK_TRACE);
      expect(res.text).not.toContain('secret-module');
      expect(res.text).not.toContain('TypeError');
      expect(logged).toHaveBeenCalledOnce();
    } finally {
      logged.mockRestore();
    }
  });
});

describe('the session cookie', () => {
  it('is HttpOnly, SameSite=Lax, path /, expires within SESSION_DAYS, and Secure behind an HTTPS proxy', async () => {
    const user = await createUser({ role: 'appraiser' });
    const signIn = (proto?: string) => {
      const req = bareRequest(api).post('/api/auth/sign-in').set('Origin', api.origin).set('X-Forwarded-For', uniqueClientIp());
      if (proto) req.set('X-Forwarded-Proto', proto);
      return req.send({ email: user.email, password: user.password });
    };
    const plain = sessionCookie(await signIn())!;
    expect(plain.attributes).toHaveProperty('httponly');
    expect(plain.attributes.samesite?.toLowerCase()).toBe('lax');
    expect(plain.attributes.path).toBe('/');
    expect(plain.attributes).not.toHaveProperty('domain');
    // Max-Age, or Expires where a server sets that instead: a bounded session either way.
    const lifetimeSeconds = 'max-age' in plain.attributes ? Number(plain.attributes['max-age']) : (Date.parse(plain.attributes.expires) - Date.now()) / 1000;
    expect(lifetimeSeconds).toBeGreaterThan(0);
    expect(lifetimeSeconds).toBeLessThanOrEqual(env.SESSION_DAYS * 86_400 + 60);
    const secured = sessionCookie(await signIn('https'))!;
    expect(secured.attributes).toHaveProperty('secure');
    expect(secured.attributes).toHaveProperty('httponly');
  });
});

describe('rate limits', () => {
  it('sign-in: the sixth failure for an address is 429', async () => {
    const user = await createUser({ role: 'reviewer' });
    const agent = browserAgent(api);
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await agent.post('/api/auth/sign-in').send({ email: user.email, password: `wrong-${i}` })).status);
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
  });

  it('password reset: the fourth request for one address within the hour is 429', async () => {
    const user = await createUser({ role: 'appraiser' });
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await browserAgent(api).post('/api/auth/password-reset').send({ email: user.email })).status);
    expect(statuses).toEqual([202, 202, 202, 429]);
  });

  it(`uploads: the ${UPLOADS_PER_WINDOW + 1}st upload of a user in ten minutes is 429, refused before the file is stored`, { timeout: 60_000 }, async () => {
    const { appraiser, assignment, firm } = await createFirmWithAssignment();
    const agent = await signedInAgent(api, appraiser);
    for (let i = 0; i < UPLOADS_PER_WINDOW; i++) {
      const res = await agent.post(`/api/assignments/${assignment.id}/photos`).field('saleId', '');
      expect(res.status, `upload ${i + 1}`).toBe(400);
    }
    const refused = await agent.post(`/api/assignments/${assignment.id}/photos`).attach('files', await plainJpeg(), 'one-too-many.jpg');
    expect(refused.status).toBe(429);
    expect(envelopeProblems(refused)).toEqual([]);
    expect(refused.headers['retry-after']).toBe('600');
    expect(await photoRows(assignment.id)).toEqual([]);
    const csv = await agent.post(`/api/assignments/${assignment.id}/sales/import/preview`).attach('file', Buffer.from('Address\r\n1 Quay Row\r\n'), 'sales.csv');
    expect(csv.status).toBe(429);
    // The limit is the user's, not the firm's.
    const colleague = await signedInAgent(api, await createUser({ role: 'appraiser', organisation: firm }));
    expect((await colleague.post(`/api/assignments/${assignment.id}/photos`).attach('files', await plainJpeg(), 'fine.jpg')).status).toBe(201);
  });
});

describe('request bodies', () => {
  it('a JSON body over 1 MB is 413 with the JSON envelope, on the JSON routes and the webhook alike', async () => {
    const big = JSON.stringify({ email: 'someone@factory.example', padding: 'p'.repeat(1_100_000) });
    for (const url of ['/api/auth/sign-in', '/api/payments/webhook']) {
      const res = await bareRequest(api).post(url).set('Origin', api.origin).set('Content-Type', 'application/json').send(big);
      expect(res.status, url).toBe(413);
      expect(envelopeProblems(res), url).toEqual([]);
      expect(res.body.error.code, url).toBe('payload_too_large');
    }
  });
});

describe('sessions end when they must', () => {
  it('a password change ends every open session of the account', async () => {
    const user = await createUser({ role: 'appraiser' });
    const [first, second] = [await signedInAgent(api, user), await signedInAgent(api, user)];
    expect((await first.get('/api/auth/me')).status).toBe(200);
    expect((await browserAgent(api).post('/api/auth/password-reset').send({ email: user.email })).status).toBe(202);
    const { token } = linkIn((await onlyMailTo(user.email)).textBody);
    expect((await browserAgent(api).post('/api/auth/password-reset/confirm').send({ token, password: 'a-new-long-password' })).status).toBe(204);
    expect((await first.get('/api/auth/me')).status).toBe(401);
    expect((await second.get('/api/auth/me')).status).toBe(401);
    expect(await db.select().from(sessions).where(eq(sessions.userId, user.id))).toEqual([]);
  });

  it('deactivation ends every open session of the account at once', async () => {
    const admin = await createUser({ role: 'admin' });
    const target = await createUser({ role: 'reviewer', organisation: admin.organisation });
    const targetAgent = await signedInAgent(api, target);
    expect((await targetAgent.get('/api/auth/me')).status).toBe(200);
    const res = await (await signedInAgent(api, admin)).patch(`/api/users/${target.id}`).send({ version: target.version, active: false });
    expect(res.status).toBe(200);
    expect((await targetAgent.get('/api/auth/me')).status).toBe(401);
    expect(await db.select().from(sessions).where(eq(sessions.userId, target.id))).toEqual([]);
  });
});
