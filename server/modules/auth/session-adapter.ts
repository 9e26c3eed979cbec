import { eq, sql } from 'drizzle-orm';
import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import type { DatabaseSession, DatabaseUser } from 'lucia';
import { db } from '../../../db/client';
import { sessions } from '../../../db/schema/auth';
import { organisations, users } from '../../../db/schema/organisations';

/** Every request with a cookie runs this: the session, its user and the user's organisation in one
 * statement, prepared once per pooled connection under a fixed name (PostgreSQL keeps the plan and
 * Drizzle builds the SQL text only once). */
const sessionAndUser = db
  .select({
    sessionId: sessions.id,
    userId: sessions.userId,
    expiresAt: sessions.expiresAt,
    email: users.email,
    name: users.name,
    role: users.role,
    active: users.active,
    organisationId: users.organisationId,
    organisationName: organisations.name,
    organisationKind: organisations.kind,
  })
  .from(sessions)
  .innerJoin(users, eq(users.id, sessions.userId))
  .innerJoin(organisations, eq(organisations.id, users.organisationId))
  .where(eq(sessions.id, sql.placeholder('sessionId')))
  .prepare('compline_session_and_user');

/** lucia's Drizzle adapter, except that validating a session reads the signed-in user's
 * organisation along with it: the user's attributes are everything req.auth needs, so the session
 * middleware sends one query per request instead of two. Writes (create, refresh, delete) are the
 * Drizzle adapter's own. */
export class SessionAdapter extends DrizzlePostgreSQLAdapter {
  constructor() {
    super(db, sessions, users);
  }

  override async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const [row] = await sessionAndUser.execute({ sessionId });
    if (!row) return [null, null];
    const session: DatabaseSession = { id: row.sessionId, userId: row.userId, expiresAt: row.expiresAt, attributes: {} };
    const user: DatabaseUser = {
      id: row.userId,
      attributes: {
        email: row.email,
        name: row.name,
        role: row.role,
        active: row.active,
        organisationId: row.organisationId,
        organisationName: row.organisationName,
        organisationKind: row.organisationKind,
      },
    };
    return [session, user];
  }
}
