import type { Request, RequestHandler, Response } from 'express';
import { Cookie } from 'lucia';
import { lucia } from './lucia';
import { loadSessionUser } from '../users/users.repo';

/** Sets the cookie with Secure when the request came over HTTPS (directly or via a trusted proxy). */
export function writeSessionCookie(req: Request, res: Response, cookie: Cookie): void {
  const secured = new Cookie(cookie.name, cookie.value, { ...cookie.attributes, secure: req.secure });
  res.append('Set-Cookie', secured.serialize());
}

/** Reads the session cookie, validates it against PostgreSQL, slides its expiry, and puts the
 * signed-in user on req.auth. Deactivated users lose their session here. */
export const sessionMiddleware: RequestHandler = async (req, res, next) => {
  try {
    const sessionId = lucia.readSessionCookie(req.headers.cookie ?? '');
    if (!sessionId) return next();
    const { session, user } = await lucia.validateSession(sessionId);
    if (!session || !user) {
      writeSessionCookie(req, res, lucia.createBlankSessionCookie());
      return next();
    }
    if (!user.active) {
      await lucia.invalidateUserSessions(user.id);
      writeSessionCookie(req, res, lucia.createBlankSessionCookie());
      return next();
    }
    if (session.fresh) writeSessionCookie(req, res, lucia.createSessionCookie(session.id));
    const sessionUser = await loadSessionUser(user.id);
    if (sessionUser) req.auth = { user: sessionUser, sessionId: session.id };
    next();
  } catch (err) {
    next(err);
  }
};
