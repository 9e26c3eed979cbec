import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { sessions } from '../../db/schema/auth';
import { createUser, uniqueEmail } from '../factories/accounts';
import {
  bareRequest,
  browserAgent,
  expectErrorEnvelope,
  sessionCookie,
  signedInAgent,
  startTestApi,
  stopTestApi,
  uniqueClientIp,
  type TestApi,
} from '../setup/test-api';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

function signIn(body: unknown, headers: Record<string, string> = {}) {
  const req = bareRequest(api).post('/api/auth/sign-in').set('Origin', api.origin).set('X-Forwarded-For', uniqueClientIp());
  for (const [name, value] of Object.entries(headers)) req.set(name, value);
  return req.send(body as object);
}

function me(cookieValue: string) {
  return bareRequest(api).get('/api/auth/me').set('Cookie', `compline_session=${cookieValue}`);
}

describe('sign-in', () => {
  it('answers 204 with an HttpOnly, SameSite=Lax session cookie that is not Secure over plain HTTP', async () => {
    const user = await createUser({ role: 'appraiser' });
    const res = await signIn({ email: user.email, password: user.password });
    expect(res.status).toBe(204);
    const cookie = sessionCookie(res);
    expect(cookie).toBeDefined();
    expect(cookie!.value.length).toBeGreaterThan(20);
    expect(cookie!.attributes).toHaveProperty('httponly');
    expect(cookie!.attributes.samesite?.toLowerCase()).toBe('lax');
    expect(cookie!.attributes.path).toBe('/');
    expect(cookie!.attributes).not.toHaveProperty('secure');
  });

  it('marks the cookie Secure when a loopback proxy says the request came over HTTPS', async () => {
    const user = await createUser({ role: 'reviewer' });
    const res = await signIn({ email: user.email, password: user.password }, { 'X-Forwarded-Proto': 'https' });
    expect(res.status).toBe(204);
    const cookie = sessionCookie(res);
    expect(cookie!.attributes).toHaveProperty('secure');
    expect(cookie!.attributes).toHaveProperty('httponly');
  });

  it('accepts the e-mail address in any letter case and with spaces around it', async () => {
    const user = await createUser({ role: 'appraiser' });
    const res = await signIn({ email: `  ${user.email.toUpperCase()} `, password: user.password });
    expect(res.status).toBe(204);
  });

  it('then GET /api/auth/me returns the signed-in user and their organisation, without secrets', async () => {
    const user = await createUser({ role: 'client' });
    const agent = await signedInAgent(api, user);
    const res = await agent.get('/api/auth/me');
    expect(res.status).toBe(200);
    expect(res.body.user).toEqual({
      id: user.id,
      email: user.email,
      name: user.name,
      role: 'client',
      organisationId: user.organisation.id,
      organisationName: user.organisation.name,
      organisationKind: 'lender',
    });
    expect(res.text).not.toContain('scrypt');
  });

  it('refuses a wrong password with 401 wrong_credentials and a message a person can act on', async () => {
    const user = await createUser({ role: 'appraiser' });
    const res = await signIn({ email: user.email, password: `${user.password}-not` });
    expect(res.status).toBe(401);
    const error = expectErrorEnvelope(res);
    expect(error.code).toBe('wrong_credentials');
    expect(error.message).toMatch(/e-mail|password/i);
    expect(sessionCookie(res)).toBeUndefined();
  });

  it('answers an unknown e-mail address exactly like a wrong password', async () => {
    const user = await createUser({ role: 'appraiser' });
    const wrongPassword = await signIn({ email: user.email, password: 'not-the-password' });
    const unknownEmail = await signIn({ email: uniqueEmail('nobody'), password: 'not-the-password' });
    expect(unknownEmail.status).toBe(401);
    expect(unknownEmail.body).toEqual(wrongPassword.body);
  });

  it('refuses a deactivated account even with the right password', async () => {
    const user = await createUser({ role: 'appraiser', active: false });
    const res = await signIn({ email: user.email, password: user.password });
    expect(res.status).toBe(401);
    expect(expectErrorEnvelope(res).code).toBe('wrong_credentials');
  });
});

describe('sessions', () => {
  it('rotates the session id at sign-in: the old cookie stops working', async () => {
    const user = await createUser({ role: 'appraiser' });
    const agent = browserAgent(api);
    const first = await agent.post('/api/auth/sign-in').send({ email: user.email, password: user.password });
    const oldId = sessionCookie(first)!.value;
    // The agent sends the old cookie with this second sign-in.
    const second = await agent.post('/api/auth/sign-in').send({ email: user.email, password: user.password });
    expect(second.status).toBe(204);
    const newId = sessionCookie(second)!.value;
    expect(newId).not.toBe(oldId);
    expect((await me(oldId)).status).toBe(401);
    expect((await me(newId)).status).toBe(200);
    const left = await db.select().from(sessions).where(eq(sessions.userId, user.id));
    expect(left.map((s) => s.id)).toEqual([newId]);
  });

  it('sign-out ends the session on the server and clears the cookie', async () => {
    const user = await createUser({ role: 'reviewer' });
    const agent = browserAgent(api);
    const signedIn = await agent.post('/api/auth/sign-in').send({ email: user.email, password: user.password });
    const sessionId = sessionCookie(signedIn)!.value;
    const out = await agent.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    const cleared = sessionCookie(out);
    expect(cleared?.value).toBe('');
    expect(cleared?.attributes['max-age']).toBe('0');
    expect((await me(sessionId)).status).toBe(401);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    expect(await db.select().from(sessions).where(eq(sessions.id, sessionId))).toEqual([]);
  });

  it('treats a made-up session cookie as signed out', async () => {
    const res = await me('made-up-session-id-that-was-never-issued');
    expect(res.status).toBe(401);
    expect(expectErrorEnvelope(res).code).toBe('unauthenticated');
  });
});

describe('error responses', () => {
  it('validation errors are 400 with a message per field', async () => {
    const res = await signIn({ email: 'not-an-address', password: '' });
    expect(res.status).toBe(400);
    const error = expectErrorEnvelope(res);
    expect(error.code).toBe('validation_failed');
    expect(error.fields?.email).toEqual(expect.any(String));
    expect(error.fields?.password).toEqual(expect.any(String));
  });

  it('a missing body is a validation error, not a crash', async () => {
    const res = await bareRequest(api).post('/api/auth/sign-in').set('Origin', api.origin);
    expect(res.status).toBe(400);
    expect(expectErrorEnvelope(res).code).toBe('validation_failed');
  });

  it('malformed JSON is 400 with a JSON error', async () => {
    const res = await bareRequest(api)
      .post('/api/auth/sign-in')
      .set('Origin', api.origin)
      .set('Content-Type', 'application/json')
      .send('{"email": "someone@factory.example", ');
    expect(res.status).toBe(400);
    expect(expectErrorEnvelope(res).code).toBe('malformed_json');
  });

  it('an unknown API route is a 404 JSON error, for GET and POST alike', async () => {
    const get = await bareRequest(api).get('/api/no-such-route');
    expect(get.status).toBe(404);
    expect(expectErrorEnvelope(get).code).toBe('not_found');
    const post = await bareRequest(api).post('/api/no-such-route').set('Origin', api.origin).send({});
    expect(post.status).toBe(404);
    expect(expectErrorEnvelope(post).code).toBe('not_found');
  });

  it('anonymous GET /api/users is 401, not the list', async () => {
    const res = await bareRequest(api).get('/api/users');
    expect(res.status).toBe(401);
    expect(expectErrorEnvelope(res).code).toBe('unauthenticated');
    expect(res.body).not.toHaveProperty('users');
  });

  it('an invalid id in a path is 400, not a 500', async () => {
    const admin = await createUser({ role: 'admin' });
    const agent = await signedInAgent(api, admin);
    const res = await agent.patch('/api/users/not-a-number').send({ version: 1, active: false });
    expect(res.status).toBe(400);
    expect(expectErrorEnvelope(res).code).toBe('validation_failed');
    const missing = await agent.patch('/api/users/2147483000').send({ version: 1, active: false });
    expect(missing.status).toBe(404);
    expect(expectErrorEnvelope(missing).code).toBe('not_found');
  });
});
