import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import express from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { allow } from '../../server/http/access';
import type { Role } from '../../server/contracts/auth';
import { buildAccessWorld, CALLERS, type AccessWorld, type Caller, type CallerName } from '../setup/access-world';
import { describeRule, envelopeProblems, fillPath, markdownTable, paramKind, pathValues, roleMayCall, walkRouters, WRITE_METHODS, type ApiRoute, type RecordIds } from '../setup/route-table';
import { sampleRequests, sendRequest, type SampleRequest } from '../setup/sample-requests';
import { signedInAgent, startTestApi, stopTestApi, type TestApi } from '../setup/test-api';

// Every API route, read back from the routers, called by every kind of caller. The rules a route
// declares (its guard's accessRule) are what the statuses are checked against.

const { routes, unrouted } = walkRouters();
const FIRM_ROLES: readonly Role[] = ['appraiser', 'reviewer', 'admin'];
const ROLE_SHORT: Record<Role, string> = { appraiser: 'appr', reviewer: 'rev', admin: 'adm', client: 'cli' };
/** Ids that name a record of one firm or lender (not a user, a token or a fingerprint). */
const SCOPED_KINDS = new Set(['assignment', 'sale', 'photo', 'report', 'order', 'query', 'reconsideration']);
/** GET routes whose owner does not get 200 with the ids the world gives, and why. */
const GET_EXCEPTIONS: Record<string, string> = { 'GET /invitations/:token': 'a made-up invitation token is a 400' };

let api: TestApi;
let world: AccessWorld;
let samples: Record<string, SampleRequest>;
beforeAll(async () => {
  api = await startTestApi();
  world = await buildAccessWorld(api);
  samples = await sampleRequests({ organisationId: world.firmA.id, feeId: 1 });
}, 240_000);
afterAll(async () => {
  await world?.payments.close();
  await stopTestApi(api);
});

interface Cell {
  status: number;
  problems: string[];
}

const scoped = (route: ApiRoute) => route.params.some((p) => SCOPED_KINDS.has(paramKind(route.path, p)));
const ownIds = (route: ApiRoute): RecordIds => (route.key === 'DELETE /photos/:id' ? { ...world.own, photo: world.disposablePhotoId } : world.own);

/** What a caller may expect from a route, from its declared rule; null when any status will do. */
function ruleProblem(route: ApiRoute, caller: Caller, status: number): string | null {
  const rule = route.rule!;
  if (status >= 500) return `server error ${status}`;
  if (!caller.role) {
    if (rule.kind === 'public') return status === 401 || status === 403 ? `public route refused an anonymous caller (${status})` : null;
    return status === 401 ? null : `expected 401 for an anonymous caller, got ${status}`;
  }
  if (roleMayCall(rule, caller.role)) return status === 401 || status === 403 ? `the rule lets a ${caller.role} in, got ${status}` : null;
  return status === 403 ? null : `the rule keeps a ${caller.role} out (403), got ${status}`;
}

async function callAs(route: ApiRoute, caller: Caller): Promise<Cell> {
  const foreignClient = caller.name === 'other-lender client';
  // The other lender's client aims at lender A's records with a well-formed body, so that only
  // "not yours" can stop it; everyone else sends an empty JSON body.
  const sample = foreignClient && route.params.length ? samples[route.key] : undefined;
  // Signing out would end the caller's session for every later route: use a second session.
  const agent = route.key === 'POST /auth/sign-out' && caller.user ? await signedInAgent(api, caller.user) : caller.agent;
  const url = fillPath(route, pathValues(route, ownIds(route)));
  const res = await sendRequest(agent, route, url, sample, sample ? undefined : {});
  const problems: string[] = [];
  const ruleIssue = ruleProblem(route, caller, res.status);
  if (ruleIssue) problems.push(ruleIssue);
  if (res.status >= 400) problems.push(...envelopeProblems(res));
  const owner = caller.role && !foreignClient && roleMayCall(route.rule!, caller.role);
  if (owner && route.method === 'get' && route.params.length && !GET_EXCEPTIONS[route.key] && res.status !== 200) {
    problems.push(`its own record should read 200, got ${res.status}`);
  }
  if (foreignClient && caller.role && roleMayCall(route.rule!, caller.role) && scoped(route) && res.status !== 404) {
    problems.push(`another lender's record should be 404, got ${res.status}`);
  }
  return { status: res.status, problems };
}

/** Firm A's staff call a firm route with firm B's ids (and a well-formed body): 404 every time. */
async function foreignFirmCalls(route: ApiRoute): Promise<Array<{ role: Role; cell: Cell }>> {
  if (!scoped(route)) return [];
  const out: Array<{ role: Role; cell: Cell }> = [];
  for (const role of FIRM_ROLES) {
    if (!roleMayCall(route.rule!, role)) continue;
    const res = await sendRequest(world.callers[role].agent, route, fillPath(route, pathValues(route, world.foreign)), samples[route.key]);
    const problems = res.status === 404 ? envelopeProblems(res) : [`firm B's record should be 404 for firm A's ${role}, got ${res.status}`];
    out.push({ role, cell: { status: res.status, problems } });
  }
  return out;
}

describe('the route table read from the routers', () => {
  it('finds every API route, and each starts with a guard that declares who may call it', () => {
    expect(routes.length).toBeGreaterThanOrEqual(50);
    expect(routes.filter((r) => !r.rule).map((r) => r.key)).toEqual([]);
    expect(unrouted).toEqual([]);
    expect(routes.map((r) => r.key)).toContain('GET /assignments/:id/sales.csv');
  });

  it('would catch a route added without a guard, and router-level middleware', () => {
    const router = express.Router();
    router.get('/guarded', allow('admin'), (_req, res) => res.end());
    router.post('/forgotten', (_req, res) => res.end());
    router.use((_req, _res, next) => next());
    const walked = walkRouters([[[router], false]]);
    expect(walked.routes.filter((r) => !r.rule).map((r) => r.key)).toEqual(['POST /forgotten']);
    expect(walked.unrouted).toHaveLength(1);
  });

  it('has a well-formed sample request for every write route', () => {
    const missing = routes.filter((r) => WRITE_METHODS.includes(r.method) && !samples[r.key]).map((r) => r.key);
    expect(missing).toEqual([]);
  });
});

describe('the access matrix', () => {
  it('answers every caller as the route’s rule says; other organisations’ records are 404', { timeout: 240_000 }, async () => {
    const matrix = new Map<string, Record<CallerName, Cell> & { foreign: Array<{ role: Role; cell: Cell }> }>();
    for (const route of routes) {
      const row = {} as Record<CallerName, Cell>;
      for (const name of CALLERS) row[name] = await callAs(route, world.callers[name]);
      matrix.set(route.key, { ...row, foreign: await foreignFirmCalls(route) });
    }

    const failures: string[] = [];
    const rows: string[][] = [];
    for (const route of routes) {
      const row = matrix.get(route.key)!;
      const cells = CALLERS.map((name) => {
        for (const p of row[name].problems) failures.push(`${route.key} as ${name}: ${p}`);
        return `${row[name].status}${row[name].problems.length ? ' ✗' : ''}`;
      });
      for (const f of row.foreign) for (const p of f.cell.problems) failures.push(`${route.key} as firm A ${f.role} with firm B ids: ${p}`);
      const foreign = row.foreign.length ? row.foreign.map((f) => `${ROLE_SHORT[f.role]}:${f.cell.status}${f.cell.problems.length ? '✗' : ''}`).join(' ') : '—';
      rows.push([route.key, describeRule(route.rule), ...cells, foreign]);
    }
    const table = markdownTable(['route', 'rule', ...CALLERS, 'firm A staff → firm B ids'], rows);
    const foreignCalls = [...matrix.values()].reduce((n, r) => n + r.foreign.length, 0);
    const summary = `${routes.length} routes × ${CALLERS.length} callers = ${routes.length * CALLERS.length} calls, plus ${foreignCalls} calls with another firm's ids. ✗ marks a cell against the rule.`;
    console.log(`\nAccess matrix (status per route and caller)\n${summary}\n${table}\n`);
    await mkdir(path.resolve('test-output'), { recursive: true });
    await writeFile(
      path.resolve('test-output/access-matrix.md'),
      `# Access matrix\n\nGenerated by tests/api/access-matrix.api.test.ts from the routers themselves.\n${summary}\nIn the last column appr/rev/adm are the firm roles the rule lets in (appraiser, reviewer, admin), calling with firm B's ids.\n\n${table}\n`,
    );
    expect(failures).toEqual([]);
  });
});

describe('spot checks that the matrix relies on', () => {
  it('the other lender’s client reads its own report (its 404s are about ownership, not a broken id)', async () => {
    const res = await world.callers['other-lender client'].agent.get(`/api/reports/${world.foreign.report}`);
    expect(res.status).toBe(200);
    expect(res.body.sha256).toBe(world.foreign.sha256);
  });

  it('lender A’s client gets the frozen report photo as a JPEG', async () => {
    const res = await world.callers.client.agent.get(`/api/reports/${world.own.report}/photos/${world.own.photo}/thumb`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toContain('image/jpeg');
  });
});
