import type { RequestHandler } from 'express';
import { env } from '../env';
import { AppError } from '../errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Refuses state-changing requests whose Origin is not this site (cross-site request forgery
 * defence in depth beside SameSite=Lax). A request without Origin is refused too: every browser
 * sends it on POST, and scripts can set it. Webhooks that authenticate by signature are exempt. */
export function originCheck(exemptPaths: readonly string[]): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method) || exemptPaths.includes(req.path)) return next();
    const origin = req.get('origin');
    const host = req.get('host');
    let ok = false;
    if (origin && host) {
      try {
        const originUrl = new URL(origin);
        ok = originUrl.host === host || (env.APP_ORIGIN !== undefined && originUrl.origin === new URL(env.APP_ORIGIN).origin);
      } catch {
        ok = false;
      }
    }
    next(ok ? undefined : new AppError(403, 'cross_origin_refused', 'This request did not come from Compline’s own pages and was refused.'));
  };
}
