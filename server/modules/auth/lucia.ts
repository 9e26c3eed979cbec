import { Lucia, TimeSpan } from 'lucia';
import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import { db } from '../../../db/client';
import { sessions } from '../../../db/schema/auth';
import { users } from '../../../db/schema/organisations';
import { env } from '../../env';

// Why lucia v3 although upstream announced its deprecation, and how we would leave it:
// docs/decisions/002-sessions-with-lucia.md
const adapter = new DrizzlePostgreSQLAdapter(db, sessions, users);

export const lucia = new Lucia(adapter, {
  sessionExpiresIn: new TimeSpan(env.SESSION_DAYS, 'd'),
  sessionCookie: {
    name: 'compline_session',
    expires: true,
    attributes: { sameSite: 'lax', secure: false, path: '/' },
  },
  getUserAttributes: (a) => ({ active: a.active }),
});

declare module 'lucia' {
  interface Register {
    Lucia: typeof lucia;
    UserId: number;
    DatabaseUserAttributes: { active: boolean };
  }
}
