import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createUser, uniqueEmail } from '../factories/accounts';
import { bareRequest, expectErrorEnvelope, sessionCookie, startTestApi, stopTestApi, uniqueClientIp, type TestApi } from '../setup/test-api';

// The default limit (SIGN_IN_MAX_FAILURES, 5) is what production runs with; scripts/test.sh does
// not change it. Each test uses its own client address so that only its own failures count.
const MAX_FAILURES_PER_EMAIL = 5;
const MAX_FAILURES_PER_ADDRESS = 50;

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

function signIn(clientIp: string, email: string, password: string) {
  return bareRequest(api).post('/api/auth/sign-in').set('Origin', api.origin).set('X-Forwarded-For', clientIp).send({ email, password });
}

describe('sign-in throttling', () => {
  it('after five failed sign-ins the sixth is 429, and then even the right password is refused', async () => {
    const user = await createUser({ role: 'appraiser' });
    const ip = uniqueClientIp();
    for (let attempt = 1; attempt <= MAX_FAILURES_PER_EMAIL; attempt++) {
      const res = await signIn(ip, user.email, `wrong-password-${attempt}`);
      expect(res.status, `attempt ${attempt}`).toBe(401);
    }
    const sixth = await signIn(ip, user.email, 'wrong-password-6');
    expect(sixth.status).toBe(429);
    const error = expectErrorEnvelope(sixth);
    expect(error.code).toBe('too_many_requests');
    expect(error.message).toMatch(/wait|reset/i);

    const right = await signIn(ip, user.email, user.password);
    expect(right.status).toBe(429);
    expect(sessionCookie(right)).toBeUndefined();
  });

  it('counts failures per e-mail address across client addresses', async () => {
    const user = await createUser({ role: 'reviewer' });
    for (let attempt = 1; attempt <= MAX_FAILURES_PER_EMAIL; attempt++) {
      expect((await signIn(uniqueClientIp(), user.email, 'wrong-password-x')).status).toBe(401);
    }
    expect((await signIn(uniqueClientIp(), user.email, user.password)).status).toBe(429);
  });

  it('does not lock out another account signing in from the same address', async () => {
    const victim = await createUser({ role: 'appraiser' });
    const colleague = await createUser({ role: 'appraiser' });
    const ip = uniqueClientIp();
    for (let attempt = 0; attempt <= MAX_FAILURES_PER_EMAIL; attempt++) await signIn(ip, victim.email, 'wrong-password-y');
    expect((await signIn(ip, victim.email, victim.password)).status).toBe(429);
    expect((await signIn(ip, colleague.email, colleague.password)).status).toBe(204);
  });

  it('a successful sign-in clears the failure count of that e-mail address', async () => {
    const user = await createUser({ role: 'appraiser' });
    const ip = uniqueClientIp();
    for (let attempt = 1; attempt < MAX_FAILURES_PER_EMAIL; attempt++) expect((await signIn(ip, user.email, 'wrong-1')).status).toBe(401);
    expect((await signIn(ip, user.email, user.password)).status).toBe(204);
    for (let attempt = 1; attempt < MAX_FAILURES_PER_EMAIL; attempt++) expect((await signIn(ip, user.email, 'wrong-2')).status).toBe(401);
    expect((await signIn(ip, user.email, user.password)).status).toBe(204);
  });

  it('throttles one client address that tries many different e-mail addresses', async () => {
    const user = await createUser({ role: 'appraiser' });
    const ip = uniqueClientIp();
    for (let attempt = 1; attempt <= MAX_FAILURES_PER_ADDRESS; attempt++) {
      const res = await signIn(ip, uniqueEmail('spray'), 'guessed-password');
      expect(res.status, `attempt ${attempt}`).toBe(401);
    }
    expect((await signIn(ip, user.email, user.password)).status).toBe(429);
    // The same account from elsewhere is fine: the address is throttled, not the person.
    expect((await signIn(uniqueClientIp(), user.email, user.password)).status).toBe(204);
  }, 120_000); // fifty password hashes: slow on a busy machine
});
