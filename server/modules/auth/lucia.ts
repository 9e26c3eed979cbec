import { Lucia, TimeSpan } from 'lucia';
import type { SessionUser } from '../../contracts/auth';
import { env } from '../../env';
import { SessionAdapter } from './session-adapter';

// Why lucia v3 although upstream announced its deprecation, and how we would leave it:
// docs/decisions/002-sessions-with-lucia.md
export const lucia = new Lucia(new SessionAdapter(), {
  sessionExpiresIn: new TimeSpan(env.SESSION_DAYS, 'd'),
  sessionCookie: {
    name: 'compline_session',
    expires: true,
    attributes: { sameSite: 'lax', secure: false, path: '/' },
  },
  getUserAttributes: (a) => ({
    email: a.email,
    name: a.name,
    role: a.role,
    active: a.active,
    organisationId: a.organisationId,
    organisationName: a.organisationName,
    organisationKind: a.organisationKind,
  }),
});

declare module 'lucia' {
  interface Register {
    Lucia: typeof lucia;
    UserId: number;
    /** What SessionAdapter.getSessionAndUser reads with the session: the signed-in user as
     * req.auth carries it, and whether the account is still active. */
    DatabaseUserAttributes: Omit<SessionUser, 'id'> & { active: boolean };
  }
}
