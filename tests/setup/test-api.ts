import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { randomBytes } from 'node:crypto';
import supertest from 'supertest';
import type { Response } from 'supertest';
import { createApp } from '../../server/app';
import { pool } from '../../db/client';

/** One listening server per test file, so that every request goes to the same Host
 * (127.0.0.1:<port>) and the Origin header can match it, as a browser's would. */
export interface TestApi {
  server: http.Server;
  /** host:port as the server sees it in the Host header. */
  host: string;
  /** http://host:port — the same-site Origin. */
  origin: string;
}

export async function startTestApi(): Promise<TestApi> {
  const server = http.createServer(createApp());
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  const host = `127.0.0.1:${port}`;
  return { server, host, origin: `http://${host}` };
}

/** Closes the server and this file's database pool. */
export async function stopTestApi(api: TestApi | undefined): Promise<void> {
  if (api) await new Promise<void>((resolve) => api.server.close(() => resolve()));
  await pool.end();
}

export type Agent = ReturnType<typeof supertest.agent>;

/** A client address of its own (IPv6 documentation range) for a test, passed as X-Forwarded-For,
 * which the app honours from loopback proxies. The sign-in and reset throttles count per address,
 * so this keeps one test's failures from spilling into another's. */
export function uniqueClientIp(): string {
  const group = () => randomBytes(2).toString('hex');
  return `2001:db8:${group()}:${group()}::${group()}`;
}

/** A cookie-keeping agent whose every request carries the same-site Origin and its own client
 * address. */
export function browserAgent(api: TestApi, clientIp = uniqueClientIp()): Agent {
  const agent = supertest.agent(api.server);
  agent.set('Origin', api.origin);
  agent.set('X-Forwarded-For', clientIp);
  return agent;
}

export async function signedInAgent(api: TestApi, user: { email: string; password: string }, clientIp?: string): Promise<Agent> {
  const agent = browserAgent(api, clientIp);
  const res = await agent.post('/api/auth/sign-in').send({ email: user.email, password: user.password });
  if (res.status !== 204) {
    throw new Error(`signedInAgent: sign-in of ${user.email} answered ${res.status} ${res.text}`);
  }
  return agent;
}

/** A request without cookies or Origin unless the test adds them. */
export function bareRequest(api: TestApi) {
  return supertest(api.server);
}

export interface SetCookie {
  name: string;
  value: string;
  /** Attribute names in lower case, mapped to their value ('' for flags such as HttpOnly). */
  attributes: Record<string, string>;
}

/** Signs in with a bare request (its own client address, so no throttle is shared) and returns the
 * session id the compline_session cookie carries. */
export async function signInSessionId(api: TestApi, user: { email: string; password: string }): Promise<string> {
  const res = await bareRequest(api)
    .post('/api/auth/sign-in')
    .set('Origin', api.origin)
    .set('X-Forwarded-For', uniqueClientIp())
    .send({ email: user.email, password: user.password });
  const cookie = sessionCookie(res);
  if (res.status !== 204 || !cookie) throw new Error(`sign-in of ${user.email} answered ${res.status} ${res.text}`);
  return cookie.value;
}

/** The compline_session cookie a response sets, parsed, or undefined when it sets none. */
export function sessionCookie(res: Response): SetCookie | undefined {
  const header = res.headers['set-cookie'] as unknown;
  const lines = Array.isArray(header) ? (header as string[]) : typeof header === 'string' ? [header] : [];
  for (const line of lines) {
    const [pair, ...attributeParts] = line.split(';').map((part) => part.trim());
    const eq = pair.indexOf('=');
    const name = pair.slice(0, eq);
    if (name !== 'compline_session') continue;
    const attributes: Record<string, string> = {};
    for (const part of attributeParts) {
      const at = part.indexOf('=');
      if (at === -1) attributes[part.toLowerCase()] = '';
      else attributes[part.slice(0, at).toLowerCase()] = part.slice(at + 1);
    }
    return { name, value: pair.slice(eq + 1), attributes };
  }
  return undefined;
}

/** Checks the error envelope every API error must use and that nothing of a stack trace leaks. */
export function expectErrorEnvelope(res: Response): { code: string; message: string; fields?: Record<string, string> } {
  const problems: string[] = [];
  if (!String(res.headers['content-type'] ?? '').includes('application/json')) problems.push('not JSON');
  const body = res.body as { error?: { code?: unknown; message?: unknown; fields?: unknown } };
  if (!body || typeof body !== 'object' || Object.keys(body).join() !== 'error') problems.push('body is not {"error":…}');
  const error = body?.error ?? {};
  if (typeof error.code !== 'string' || error.code === '') problems.push('no error.code');
  if (typeof error.message !== 'string' || error.message === '') problems.push('no error.message');
  const extraKeys = Object.keys(error).filter((k) => !['code', 'message', 'fields'].includes(k));
  if (extraKeys.length) problems.push(`unexpected keys ${extraKeys.join(', ')}`);
  if (/(\\n|\n)\s*at\s|node_modules|\.[cm]?[jt]s:\d+/.test(res.text)) problems.push('stack trace in the body');
  if (problems.length) throw new Error(`bad error response ${res.status}: ${problems.join('; ')} — ${res.text}`);
  return error as { code: string; message: string; fields?: Record<string, string> };
}
