import type { Router } from 'express';
import type { Response } from 'supertest';
import { apiRouters, rawBodyRouters } from '../../server/app';
import type { AccessRule } from '../../server/http/access';
import type { Role } from '../../server/contracts/auth';

/** Every API route, read back from the routers the app mounts (not from a hand-kept list), so that a
 * route added tomorrow shows up in the access matrix and the input fuzz without anyone listing it. */

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';
export const WRITE_METHODS: readonly HttpMethod[] = ['post', 'put', 'patch', 'delete'];

export interface ApiRoute {
  method: HttpMethod;
  /** As registered, e.g. /assignments/:id/sales/:saleId (mounted under /api). */
  path: string;
  /** The access rule its first handler carries; undefined means the route has no guard. */
  rule: AccessRule | undefined;
  /** Path parameter names in order. */
  params: string[];
  /** Mounted before the JSON body parser (reads its own raw body). */
  raw: boolean;
  /** "POST /assignments/:id/sales" — how tables and messages name it. */
  key: string;
}

interface RouteLayer {
  route?: { path: unknown; methods: Record<string, boolean>; stack: Array<{ handle: { accessRule?: AccessRule } }> };
  name?: string;
}

/** Layers that are not routes (router-level middleware) would run outside any declared rule. */
export interface UnroutedLayer {
  router: number;
  name: string;
}

/** Walks Express 5 router stacks: each layer with a `route` is one path, with one entry per method;
 * the first handler of the route's own stack is the guard that carries `accessRule`. */
export function walkRouters(groups: Array<[Router[], boolean]> = [[rawBodyRouters, true], [apiRouters, false]]): { routes: ApiRoute[]; unrouted: UnroutedLayer[] } {
  const routes: ApiRoute[] = [];
  const unrouted: UnroutedLayer[] = [];
  let routerIndex = 0;
  for (const [routers, raw] of groups) {
    for (const router of routers) {
      routerIndex++;
      for (const layer of (router as unknown as { stack: RouteLayer[] }).stack) {
        if (!layer.route) {
          unrouted.push({ router: routerIndex, name: layer.name ?? '(anonymous)' });
          continue;
        }
        const path = String(layer.route.path);
        const params = [...path.matchAll(/:(\w+)/g)].map((m) => m[1]);
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (!on || method === '_all') continue;
          const rule = layer.route.stack[0]?.handle?.accessRule;
          routes.push({ method: method as HttpMethod, path, rule, params, raw, key: `${method.toUpperCase()} ${path}` });
        }
      }
    }
  }
  return { routes, unrouted };
}

export function apiRouteTable(): ApiRoute[] {
  return walkRouters().routes;
}

export function describeRule(rule: AccessRule | undefined): string {
  if (!rule) return 'NONE';
  if (rule.kind === 'roles') return rule.roles.join(', ');
  return rule.kind;
}

/** Whether a signed-in user of this role passes the route's guard. */
export function roleMayCall(rule: AccessRule, role: Role): boolean {
  return rule.kind !== 'roles' || rule.roles.includes(role);
}

/** The path with each :param replaced (URL-encoded), prefixed with /api. Throws on a param the
 * caller gave no value for, so a new parameter name cannot slip through with "undefined". */
export function fillPath(route: Pick<ApiRoute, 'path'>, values: Record<string, string | number>): string {
  const filled = route.path.replace(/:(\w+)/g, (_m, name: string) => {
    const value = values[name];
    if (value === undefined) throw new Error(`no value for :${name} in ${route.path}`);
    return encodeURIComponent(String(value));
  });
  return `/api${filled}`;
}

/** What a path parameter stands for, from its name and the segment before it. */
export type ParamKind = 'assignment' | 'sale' | 'photo' | 'report' | 'order' | 'query' | 'reconsideration' | 'user' | 'size' | 'token' | 'sha256';

export function paramKind(path: string, param: string): ParamKind {
  if (param === 'saleId') return 'sale';
  if (param === 'photoId') return 'photo';
  if (param === 'size') return 'size';
  if (param === 'token') return 'token';
  if (param === 'sha256') return 'sha256';
  const collection = /^\/([\w-]+)\//.exec(path)?.[1];
  const byCollection: Record<string, ParamKind> = {
    assignments: 'assignment',
    photos: 'photo',
    reports: 'report',
    orders: 'order',
    queries: 'query',
    reconsiderations: 'reconsideration',
    users: 'user',
  };
  const kind = collection ? byCollection[collection] : undefined;
  if (!kind) throw new Error(`route-table: no idea what :${param} of ${path} stands for; teach paramKind`);
  return kind;
}

export type RecordIds = Record<Exclude<ParamKind, 'size' | 'token' | 'sha256'>, number> & { sha256: string };

/** Path values for a route from a set of record ids. */
export function pathValues(route: Pick<ApiRoute, 'path' | 'params'>, ids: RecordIds): Record<string, string | number> {
  const values: Record<string, string | number> = {};
  for (const param of route.params) {
    const kind = paramKind(route.path, param);
    if (kind === 'size') values[param] = 'thumb';
    else if (kind === 'token') values[param] = 'a'.repeat(43);
    else values[param] = ids[kind];
  }
  return values;
}

/** Checks the error envelope ({"error":{"code","message","fields?","details?"}}) with no trace of a
 * stack; returns a list of problems (empty when the response is fine). Unlike test-api's
 * expectErrorEnvelope it allows `details`, which a refused import carries. */
export function envelopeProblems(res: Response): string[] {
  const problems: string[] = [];
  if (!String(res.headers['content-type'] ?? '').includes('application/json')) problems.push('not JSON');
  const body = res.body as { error?: Record<string, unknown> } | undefined;
  if (!body || typeof body !== 'object' || Object.keys(body).join() !== 'error') problems.push('body is not {"error":…}');
  const error = body?.error ?? {};
  if (typeof error.code !== 'string' || error.code === '') problems.push('no error.code');
  if (typeof error.message !== 'string' || error.message === '') problems.push('no error.message');
  const extra = Object.keys(error).filter((k) => !['code', 'message', 'fields', 'details'].includes(k));
  if (extra.length) problems.push(`unexpected keys ${extra.join(', ')}`);
  if (STACK_TRACE.test(res.text ?? '')) problems.push('stack trace in the body');
  return problems;
}

/** A line of a stack trace, a node_modules path or a source file with a line number. */
export const STACK_TRACE = /(\\n|\n)\s*at\s|node_modules|\.[cm]?[jt]s:\d+|\/work\/|\/home\//;

/** A markdown table: one row per route, one column per caller. */
export function markdownTable(header: string[], rows: string[][]): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (cells: string[]) => `| ${cells.map((c, i) => c.padEnd(widths[i])).join(' | ')} |`;
  return [line(header), `|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`, ...rows.map(line)].join('\n');
}
