import type { Request } from 'express';
import { env } from '../env';

/** The origin links in e-mails point at: APP_ORIGIN when set, else the one the request came to. */
export function appOrigin(req: Request): string {
  return env.APP_ORIGIN ?? `${req.protocol}://${req.get('host')}`;
}

export function clientIp(req: Request): string {
  return req.ip ?? req.socket.remoteAddress ?? 'unknown';
}
