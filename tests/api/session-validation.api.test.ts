// The session path every signed-in request takes: one statement reads the session, its user and the
// organisation; expiry, the sliding refresh and deactivation behave as lucia's own rules say.
import pg from 'pg';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '../../db/client';
import { sessions } from '../../db/schema/auth';
import { organisations, users } from '../../db/schema/organisations';
import { env } from '../../server/env';
import { createUser, uniqueSuffix, type TestUser } from '../factories/accounts';
import { bareRequest, sessionCookie, signInSessionId, startTestApi, stopTestApi, type TestApi } from '../setup/test-api';

let api: TestApi;
const DAY_MS = 24 * 60 * 60 * 1000;

beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

const signInAs = (user: TestUser): Promise<string> => signInSessionId(api, user);

const me = (sessionId: string) => bareRequest(api).get('/api/auth/me').set('Cookie', `compline_session=${sessionId}`);

async function expiresAt(sessionId: string): Promise<Date | undefined> {
  const [row] = await db.select({ expiresAt: sessions.expiresAt }).from(sessions).where(eq(sessions.id, sessionId));
  return row?.expiresAt;
}

describe('session validation', () => {
  it('sends one SQL statement for a signed-in GET /api/auth/me and returns the user with the organisation', async () => {
    const user = await createUser({ role: 'reviewer' });
    const sessionId = await signInAs(user);
    const originalQuery = pg.Client.prototype.query;
    const statements: string[] = [];
    pg.Client.prototype.query = function (this: pg.Client, ...args: unknown[]) {
      const first = args[0] as string | { text?: string };
      statements.push(typeof first === 'string' ? first : (first?.text ?? '?'));
      return (originalQuery as (...a: unknown[]) => unknown).apply(this, args);
    } as typeof originalQuery;
    let res;
    try {
      res = await me(sessionId);
    } finally {
      pg.Client.prototype.query = originalQuery;
    }
    expect(res.status, res.text).toBe(200);
    expect(statements, statements.join('\n')).toHaveLength(1);
    expect(res.body).toEqual({
      user: {
        id: user.id,
        email: user.email,
        name: user.name,
        role: 'reviewer',
        organisationId: user.organisation.id,
        organisationName: user.organisation.name,
        organisationKind: 'firm',
      },
    });
  });

  it('reads the user and organisation afresh on every request: a renamed organisation shows at once', async () => {
    const user = await createUser({ role: 'appraiser' });
    const sessionId = await signInAs(user);
    expect((await me(sessionId)).body.user.organisationName).toBe(user.organisation.name);
    const renamed = `Renamed Valuation Firm ${uniqueSuffix()}`;
    await db.update(organisations).set({ name: renamed }).where(eq(organisations.id, user.organisation.id));
    await db.update(users).set({ role: 'reviewer' }).where(eq(users.id, user.id));
    const after = await me(sessionId);
    expect(after.body.user.organisationName).toBe(renamed);
    expect(after.body.user.role).toBe('reviewer');
  });

  it('does not touch the cookie or the expiry while the session is in the first half of its lifetime', async () => {
    const user = await createUser({ role: 'appraiser' });
    const sessionId = await signInAs(user);
    const before = await expiresAt(sessionId);
    const res = await me(sessionId);
    expect(res.status).toBe(200);
    expect(sessionCookie(res)).toBeUndefined();
    expect(await expiresAt(sessionId)).toEqual(before);
  });

  it('slides a session in the second half of its lifetime: a new expiry in the database and a cookie with the same id', async () => {
    const user = await createUser({ role: 'appraiser' });
    const sessionId = await signInAs(user);
    await db.update(sessions).set({ expiresAt: sql`now() + interval '1 day'` }).where(eq(sessions.id, sessionId));
    const res = await me(sessionId);
    expect(res.status).toBe(200);
    const cookie = sessionCookie(res);
    expect(cookie?.value).toBe(sessionId);
    const renewed = await expiresAt(sessionId);
    const fullLifetime = Date.now() + env.SESSION_DAYS * DAY_MS;
    expect(Math.abs(renewed!.getTime() - fullLifetime)).toBeLessThan(60_000);
    expect(Number(cookie!.attributes['max-age'])).toBe(env.SESSION_DAYS * 24 * 60 * 60);
  });

  it('refuses an expired session with 401, a blank cookie, and deletes it', async () => {
    const user = await createUser({ role: 'appraiser' });
    const sessionId = await signInAs(user);
    await db.update(sessions).set({ expiresAt: sql`now() - interval '1 minute'` }).where(eq(sessions.id, sessionId));
    const res = await me(sessionId);
    expect(res.status).toBe(401);
    expect(sessionCookie(res)?.value).toBe('');
    expect(sessionCookie(res)?.attributes['max-age']).toBe('0');
    expect(await expiresAt(sessionId)).toBeUndefined();
  });

  it('answers an unknown session id with a blank cookie', async () => {
    const res = await me('never-issued-session-id-xyz');
    expect(res.status).toBe(401);
    expect(sessionCookie(res)?.value).toBe('');
  });

  it('ends every session of a deactivated account, with a blank cookie', async () => {
    const user = await createUser({ role: 'appraiser' });
    const first = await signInAs(user);
    const second = await signInAs(user);
    await db.update(users).set({ active: false }).where(eq(users.id, user.id));
    const res = await me(first);
    expect(res.status).toBe(401);
    expect(sessionCookie(res)?.value).toBe('');
    expect(await db.select().from(sessions).where(eq(sessions.userId, user.id))).toEqual([]);
    expect((await me(second)).status).toBe(401);
  });
});
