import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pool } from '../../db/client';
import { createUser } from '../factories/accounts';
import { buildAccessWorld, type AccessWorld } from '../setup/access-world';
import { envelopeProblems, fillPath, paramKind, pathValues, roleMayCall, walkRouters, WRITE_METHODS, type ApiRoute, type RecordIds } from '../setup/route-table';
import { sampleRequests, type SampleRequest } from '../setup/sample-requests';
import { startTestApi, stopTestApi, type Agent, type TestApi } from '../setup/test-api';

// Random and hostile JSON thrown at every write route the routers declare, by a caller the route
// lets in, at records that exist: never a 500, always the error envelope, nothing written when the
// request is refused. Path parameters that are not ids are 400s.

const RUNS_PER_ROUTE = 20;
const writeRoutes = walkRouters().routes.filter((r) => WRITE_METHODS.includes(r.method));
const paramRoutes = walkRouters().routes.filter((r) => r.params.length > 0);
/** Tables whose row counts must not move when a request is refused. */
const KEY_TABLES = ['assignments', 'subjects', 'sales', 'photos', 'sales_imports', 'orders', 'payments', 'report_versions', 'reconsiderations', 'review_queries', 'query_messages', 'status_changes', 'grid_settings', 'grid_entries', 'users', 'invitations', 'password_resets', 'audit_events', 'outbox_messages'];

let api: TestApi;
let world: AccessWorld;
let samples: Record<string, SampleRequest>;
let ids: RecordIds;
const uploadAgents = new Map<string, Agent>();
let requestsSent = 0;
let criticalSent = 0;

beforeAll(async () => {
  api = await startTestApi();
  world = await buildAccessWorld(api);
  samples = await sampleRequests({ organisationId: world.firmA.id, feeId: 1 });
  // PATCH /users/:id aims at a bystander, so that a lucky body cannot deactivate a caller.
  ids = { ...world.own, user: (await createUser({ role: 'appraiser', organisation: world.firmA })).id };
}, 240_000);
afterAll(async () => {
  console.log(`bad-input: ${requestsSent} hostile requests (${criticalSent} of them fixed critical values) sent to ${writeRoutes.length} write routes and ${paramRoutes.length} routes with path parameters`);
  await world?.payments.close();
  await stopTestApi(api);
});

async function rowCounts(): Promise<Record<string, number>> {
  const { rows } = await pool.query(`select ${KEY_TABLES.map((t) => `(select count(*)::int from ${t}) as ${t}`).join(', ')}`);
  return rows[0] as Record<string, number>;
}

/** A caller the route's rule lets in. Upload routes get a user of their own: uploads are rate
 * limited per user, and the fuzz should reach the handler, not the limiter. */
async function agentFor(route: ApiRoute): Promise<Agent> {
  const rule = route.rule!;
  if (rule.kind !== 'roles') return world.callers.anonymous.agent;
  if (samples[route.key]?.files) {
    if (!uploadAgents.has(route.key)) uploadAgents.set(route.key, (await world.freshAgent('appraiser')).agent);
    return uploadAgents.get(route.key)!;
  }
  const role = (['appraiser', 'reviewer', 'admin', 'client'] as const).find((r) => roleMayCall(rule, r))!;
  return world.callers[role].agent;
}

// Values no form would send. Strings beginning \u0001 are markers that become raw JSON text.
const HUGE = '\u0001HUGE';
const DEEP = '\u0001DEEP';
const hostileText = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom('', ' ', 'NaN', 'Infinity', '-Infinity', '1e400', '-0', '0x1F', '١٢٣', '\u0000', 'a\u0000b', '\ud800', '🏠🏠🏠', '\u202Eevil', '<script>alert(1)</script>', "'; drop table sales; --", '../../etc/passwd', "=cmd|' /C calc'!A0", '2026-02-30', '9999-12-31', '-2147483649', '__proto__', 'null', 'true') },
  fc.string({ unit: 'binary', maxLength: 60 }),
  fc.integer({ min: 5_000, max: 400_000 }).map((n) => 'ẞ'.repeat(n)),
);
const hostileNumber = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom(-1, 0, -0, 0.5, 2_147_483_648, 2 ** 53 + 2, -2_147_483_649, Number.MAX_VALUE, -Number.MAX_VALUE, 5e-324, 1e21) },
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.integer(),
);
const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 3, arbitrary: hostileText },
  { weight: 3, arbitrary: hostileNumber },
  fc.constantFrom(true, false, null, [], {}, HUGE, DEEP, [null], { __proto__: null }),
  fc.array(hostileNumber, { maxLength: 5 }),
  fc.dictionary(fc.string({ maxLength: 8 }), hostileNumber, { maxKeys: 4 }),
);
const pollutingKeys = fc.subarray(['__proto__', 'constructor', 'prototype', 'isAdmin', 'role', 'organisationId', 'id', 'deletedAt'], { maxLength: 3 });

/** Values that broke servers before: past the 32-bit integer columns, a NUL in text, a number JSON
 * cannot hold, a lone surrogate, a huge string, deep nesting. Each sample field gets each of them. */
const CRITICAL: unknown[] = [2_147_483_648, -2_147_483_649, 'a\u0000b', HUGE, '\ud800', 'x'.repeat(200_000), [[[[[[[[1]]]]]]]]];

function bodyText(sample: Record<string, unknown>, replaced: Record<string, unknown>, extraKeys: string[] = [], extraValue: unknown = null): string {
  const parts = Object.keys(sample).map((k) => `${JSON.stringify(k)}:${JSON.stringify(k in replaced ? replaced[k] : sample[k]) ?? 'null'}`);
  for (const k of extraKeys) parts.push(`${JSON.stringify(k)}:${k === '__proto__' || k === 'constructor' ? '{"polluted":true,"prototype":{"polluted":true}}' : (JSON.stringify(extraValue) ?? 'null')}`);
  return markersToJson(`{${parts.join(',')}}`);
}

function markersToJson(text: string): string {
  return text.replaceAll(JSON.stringify(HUGE), '1e400').replaceAll(JSON.stringify(DEEP), `${'['.repeat(5000)}${']'.repeat(5000)}`);
}

/** Every sample field replaced by every critical value, one at a time: run before the random ones. */
function criticalBodies(sample: Record<string, unknown>): Array<[string]> {
  return Object.keys(sample).flatMap((k) => CRITICAL.map((v): [string] => [bodyText(sample, { [k]: v })]));
}

/** A body as JSON text: the route's sample with one or more fields replaced and hostile keys added,
 * or a hostile value (or broken JSON) in place of the whole body. */
function hostileBody(sample: Record<string, unknown>): fc.Arbitrary<string> {
  const keys = Object.keys(sample);
  const oneField = fc.record({ key: fc.constantFrom(...keys), value: hostileValue, extra: pollutingKeys }).map(({ key, value, extra }) => bodyText(sample, { [key]: value }, extra, value));
  const someFields = fc
    .record({ replace: fc.subarray(keys), values: fc.array(hostileValue, { minLength: keys.length, maxLength: keys.length }), extra: pollutingKeys, extraValue: hostileValue })
    .map(({ replace, values, extra, extraValue }) => bodyText(sample, Object.fromEntries(replace.map((k) => [k, values[keys.indexOf(k)]])), extra, extraValue));
  const whole = fc.oneof(
    hostileValue.map((v) => markersToJson(JSON.stringify(v) ?? 'null')),
    fc.integer({ min: 100, max: 20_000 }).map((depth) => `${'{"a":'.repeat(depth)}1${'}'.repeat(depth)}`),
    fc.integer({ min: 100, max: 20_000 }).map((depth) => `${'['.repeat(depth)}${']'.repeat(depth)}`),
    fc.constantFrom('{', '{"a":1,}', "{'a':1}", '\u0000', '{"a":1}{"b":2}', 'undefined'),
  );
  return fc.oneof({ weight: 4, arbitrary: oneField }, { weight: 2, arbitrary: someFields }, { weight: 1, arbitrary: whole });
}

function routeIds(route: ApiRoute): RecordIds {
  return route.key === 'DELETE /photos/:id' ? { ...ids, photo: world.disposablePhotoId } : ids;
}

/** Sends one request and returns what is wrong with the answer (empty when it is fine). */
async function checkedRequest(agent: Agent, route: ApiRoute, url: string, bodyText: string | undefined, query?: Record<string, string>): Promise<string[]> {
  const before = await rowCounts();
  let req = agent[route.method](url);
  if (query) req = req.query(query);
  if (bodyText !== undefined) req = req.set('Content-Type', 'application/json').send(bodyText);
  const res = await req;
  requestsSent++;
  if (res.status >= 500) return [`${res.status}: ${res.text.slice(0, 300)}`];
  if (res.status < 400) return [];
  const problems = envelopeProblems(res);
  const after = await rowCounts();
  const moved = KEY_TABLES.filter((t) => after[t] !== before[t]);
  if (moved.length) problems.push(`refused with ${res.status} but rows changed in ${moved.join(', ')}`);
  return problems.map((p) => `${res.status}: ${p}`);
}

describe('hostile JSON bodies at every write route', () => {
  it('covers every write route the routers declare', () => {
    expect(writeRoutes.length).toBeGreaterThanOrEqual(35);
    expect(writeRoutes.filter((r) => !samples[r.key]).map((r) => r.key)).toEqual([]);
  });

  it.each(writeRoutes.map((r) => [r.key, r] as const))('%s: never a 500, always the envelope, nothing written on refusal', async (_key, route) => {
    const agent = await agentFor(route);
    const url = fillPath(route, pathValues(route, routeIds(route)));
    const sample = samples[route.key];
    const base = sample.body && Object.keys(sample.body).length ? sample.body : { version: 1 };
    const examples = criticalBodies(base);
    criticalSent += examples.length;
    await fc.assert(
      fc.asyncProperty(hostileBody(base), async (text) => {
        const problems = await checkedRequest(agent, route, url, text, sample.query);
        expect(problems, text.slice(0, 200)).toEqual([]);
      }),
      { numRuns: RUNS_PER_ROUTE + examples.length, examples, seed: 20_261_201, endOnFailure: true },
    );
    // The server runs in this process: a polluted prototype would show here.
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(Object.prototype).not.toHaveProperty('isAdmin');
  }, 120_000);
});

/** Values that are not what a parameter of that kind names; each must be a 400. */
function junkFor(kind: ReturnType<typeof paramKind>): string[] {
  if (kind === 'size') return ['huge', 'THUMB', 'thumb.jpg', '%2E%2E%2Fdisplay', '%00'];
  if (kind === 'token') return ['short', 'x'.repeat(300)];
  if (kind === 'sha256') return ['abc', 'g'.repeat(64), 'a'.repeat(65), '%00'.repeat(64)];
  return ['abc', '-1', '0', '1.5', '99999999999', '2147483648', 'NaN', 'Infinity', '1e400', '%20', '%00', '__proto__', 'constructor', '١٢', '1;drop'];
}

describe('path parameters that are not ids', () => {
  it.each(paramRoutes.map((r) => [r.key, r] as const))('%s answers 400, never 500', async (_key, route) => {
    const agent = await agentFor(route);
    const problems: string[] = [];
    for (const param of route.params) {
      for (const junk of junkFor(paramKind(route.path, param))) {
        const values = pathValues(route, routeIds(route));
        // The junk goes into the URL as written (already percent-encoded where it needs to be).
        const url = `/api${route.path.replace(/:(\w+)/g, (_m, name: string) => (name === param ? junk : encodeURIComponent(String(values[name]))))}`;
        const sample = samples[route.key];
        const before = await rowCounts();
        const res = await (route.method === 'get' ? agent.get(url) : agent[route.method](url).send(sample?.body ?? {}));
        requestsSent++;
        if (res.status !== 400) problems.push(`:${param} = ${junk} → ${res.status} ${res.text.slice(0, 120)}`);
        else problems.push(...envelopeProblems(res).map((p) => `:${param} = ${junk} → ${p}`));
        const after = await rowCounts();
        if (KEY_TABLES.some((t) => after[t] !== before[t])) problems.push(`:${param} = ${junk} changed rows`);
      }
    }
    expect(problems).toEqual([]);
  }, 60_000);
});
