import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createUser, uniqueEmail } from '../factories/accounts';
import { linkIn, mailTo, onlyMailTo } from '../setup/mailbox';
import { browserAgent, expectErrorEnvelope, signedInAgent, startTestApi, stopTestApi, uniqueClientIp, type TestApi } from '../setup/test-api';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

function requestReset(email: string, clientIp = uniqueClientIp()) {
  return browserAgent(api, clientIp).post('/api/auth/password-reset').send({ email });
}

function confirmReset(token: string, password: string) {
  return browserAgent(api).post('/api/auth/password-reset/confirm').send({ token, password });
}

function signIn(email: string, password: string) {
  return browserAgent(api).post('/api/auth/sign-in').send({ email, password });
}

describe('password reset', () => {
  it('answers 202 for a known address and queues one e-mail with a reset link', async () => {
    const user = await createUser({ role: 'appraiser' });
    const res = await requestReset(user.email);
    expect(res.status).toBe(202);
    const mail = await onlyMailTo(user.email);
    const { url, token } = linkIn(mail.textBody);
    expect(url.pathname).toBe('/reset-password');
    expect(token.length).toBeGreaterThanOrEqual(32);
  });

  it('answers an unknown address exactly the same way and queues nothing for it', async () => {
    const known = await createUser({ role: 'appraiser' });
    const unknownEmail = uniqueEmail('nobody');
    const forKnown = await requestReset(known.email);
    const forUnknown = await requestReset(unknownEmail);
    expect(forUnknown.status).toBe(202);
    expect(forUnknown.body).toEqual(forKnown.body);
    expect(await mailTo(unknownEmail)).toEqual([]);
  });

  it('queues nothing for a deactivated account', async () => {
    const user = await createUser({ role: 'reviewer', active: false });
    expect((await requestReset(user.email)).status).toBe(202);
    expect(await mailTo(user.email)).toEqual([]);
  });

  it('the link sets a new password; the old one then fails and the new one works', async () => {
    const user = await createUser({ role: 'reviewer' });
    await requestReset(user.email);
    const { token } = linkIn((await onlyMailTo(user.email)).textBody);

    const confirmed = await confirmReset(token, 'a-brand-new-password');
    expect(confirmed.status).toBe(204);
    const old = await signIn(user.email, user.password);
    expect(old.status).toBe(401);
    expect(expectErrorEnvelope(old).code).toBe('wrong_credentials');
    expect((await signIn(user.email, 'a-brand-new-password')).status).toBe(204);
  });

  it('ends every session the account had open', async () => {
    const user = await createUser({ role: 'appraiser' });
    const laptop = await signedInAgent(api, user);
    const tablet = await signedInAgent(api, user);
    expect((await laptop.get('/api/auth/me')).status).toBe(200);

    await requestReset(user.email);
    const { token } = linkIn((await onlyMailTo(user.email)).textBody);
    expect((await confirmReset(token, 'another-new-password')).status).toBe(204);

    expect((await laptop.get('/api/auth/me')).status).toBe(401);
    expect((await tablet.get('/api/auth/me')).status).toBe(401);
  });

  it('the link works once only', async () => {
    const user = await createUser({ role: 'appraiser' });
    await requestReset(user.email);
    const { token } = linkIn((await onlyMailTo(user.email)).textBody);
    expect((await confirmReset(token, 'first-new-password')).status).toBe(204);

    const again = await confirmReset(token, 'second-new-password');
    expect(again.status).toBe(400);
    expect(expectErrorEnvelope(again).fields?.token).toEqual(expect.any(String));
    expect((await signIn(user.email, 'second-new-password')).status).toBe(401);
    expect((await signIn(user.email, 'first-new-password')).status).toBe(204);
  });

  it('refuses a made-up token and a too-short password, changing nothing', async () => {
    const user = await createUser({ role: 'appraiser' });
    const madeUp = await confirmReset('y'.repeat(43), 'long-enough-password');
    expect(madeUp.status).toBe(400);
    expectErrorEnvelope(madeUp);

    await requestReset(user.email);
    const { token } = linkIn((await onlyMailTo(user.email)).textBody);
    const short = await confirmReset(token, 'short');
    expect(short.status).toBe(400);
    expect(expectErrorEnvelope(short).fields?.password).toEqual(expect.any(String));
    expect((await signIn(user.email, user.password)).status).toBe(204);
    // The refused attempt did not use up the link.
    expect((await confirmReset(token, 'long-enough-password')).status).toBe(204);
  });

  it('a wrong e-mail format is 400 with a field message', async () => {
    const res = await requestReset('not-an-address');
    expect(res.status).toBe(400);
    expect(expectErrorEnvelope(res).fields?.email).toEqual(expect.any(String));
  });

  it('limits requests per address so a mailbox cannot be flooded', async () => {
    const user = await createUser({ role: 'appraiser' });
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await requestReset(user.email)).status);
    expect(statuses).toEqual([202, 202, 202, 429]);
    expect(await mailTo(user.email)).toHaveLength(3);
  });
});
