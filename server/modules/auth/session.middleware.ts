import type { Request, RequestHandler, Response } from 'express';
import { Cookie } from 'lucia';
import { lucia } from './lucia';

/** Sets the cookie with Secure when the request came over HTTPS (directly or via a trusted proxy). */
export function writeSessionCookie(req: Request, res: Response, cookie: Cookie): void {
  const secured = new Cookie(cookie.name, cookie.value, { ...cookie.attributes, secure: req.secure });
  res.append('Set-Cookie', secured.serialize());
}

/** Reads the session cookie, validates it against PostgreSQL (one query: the session with its user
 * and organisation, see session-adapter.ts), slides its expiry, and puts the signed-in user on
 * req.auth. Deactivated users lose their session here. */
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
    req.auth = {
      user: {
        id: user.id,
        email: user.email,
        name: user.name,
        role: user.role,
        organisationId: user.organisationId,
        organisationName: user.organisationName,
        organisationKind: user.organisationKind,
      },
      sessionId: session.id,
    };
    next();
  } catch (err) {
    next(err);
  }
};
