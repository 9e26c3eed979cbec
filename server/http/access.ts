import type { RequestHandler } from 'express';
import type { Role } from '../contracts/auth';
import { forbidden, unauthenticated } from '../errors';

/** Who may call a route, declared once at the route itself. Every API route starts with one of
 * these guards; the access-matrix test reads them back from the router and fails on a route
 * without one. */
export type AccessRule = { kind: 'public' } | { kind: 'signed-in' } | { kind: 'roles'; roles: readonly Role[] };

export type Guard = RequestHandler & { accessRule: AccessRule };

function guard(accessRule: AccessRule, handler: RequestHandler): Guard {
  return Object.assign(handler, { accessRule });
}

export const anyone: Guard = guard({ kind: 'public' }, (_req, _res, next) => next());

export const signedIn: Guard = guard({ kind: 'signed-in' }, (req, _res, next) => {
  next(req.auth ? undefined : unauthenticated());
});

export function allow(...roles: Role[]): Guard {
  return guard({ kind: 'roles', roles }, (req, _res, next) => {
    if (!req.auth) return next(unauthenticated());
    if (!roles.includes(req.auth.user.role)) return next(forbidden());
    next();
  });
}
