import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { invitations } from '../../db/schema/auth';
import { createOrganisation, createUser, uniqueEmail, usersWithEmail, type TestUser } from '../factories/accounts';
import { linkIn, mailTo, onlyMailTo } from '../setup/mailbox';
import { browserAgent, expectErrorEnvelope, signedInAgent, startTestApi, stopTestApi, type TestApi } from '../setup/test-api';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

/** An admin invites someone; returns the token from the e-mailed link. */
async function invite(admin: TestUser, invitee: { email: string; name: string; role: string; organisationId: number }) {
  const agent = await signedInAgent(api, admin);
  const res = await agent.post('/api/users/invitations').send(invitee);
  expect(res.status, res.text).toBe(201);
  const mail = await onlyMailTo(invitee.email);
  return { res, mail, ...linkIn(mail.textBody) };
}

describe('inviting a user', () => {
  it('queues an e-mail to the invitee with a single-use link carrying token=', async () => {
    const admin = await createUser({ role: 'admin' });
    const email = uniqueEmail('new-appraiser');
    const { res, mail, url, token } = await invite(admin, { email, name: 'Corin Vale', role: 'appraiser', organisationId: admin.organisation.id });
    expect(res.body).toEqual({ id: expect.any(Number) });
    expect(mail.status).toBe('queued');
    expect(mail.subject).toContain(admin.name);
    expect(mail.textBody).toContain(admin.organisation.name);
    expect(url.pathname).toBe('/invitation');
    expect(url.origin).toBe(api.origin);
    expect(token.length).toBeGreaterThanOrEqual(32);
    // The database keeps only a hash of the token, never the token itself.
    const [row] = await db.select().from(invitations).where(eq(invitations.id, res.body.id));
    expect(row.tokenHash).not.toContain(token);
    expect(row.invitedBy).toBe(admin.id);
  });

  it('lets the invitee preview, accept with a password, and be signed in at once', async () => {
    const admin = await createUser({ role: 'admin' });
    const lender = await createOrganisation('lender');
    const email = uniqueEmail('new-client');
    const { token } = await invite(admin, { email, name: 'Pell Ardent', role: 'client', organisationId: lender.id });

    const invitee = browserAgent(api);
    const preview = await invitee.get(`/api/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toEqual({ email, name: 'Pell Ardent', role: 'client', organisationName: lender.name });

    const accepted = await invitee.post('/api/invitations/accept').send({ token, password: 'a-new-long-password' });
    expect(accepted.status).toBe(204);
    const me = await invitee.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ email, name: 'Pell Ardent', role: 'client', organisationId: lender.id, organisationKind: 'lender' });

    // The chosen password works for a later sign-in.
    await expect(signedInAgent(api, { email, password: 'a-new-long-password' })).resolves.toBeDefined();
  });

  it('refuses to use the same invitation twice', async () => {
    const admin = await createUser({ role: 'admin' });
    const email = uniqueEmail('once');
    const { token } = await invite(admin, { email, name: 'Wren Tallis', role: 'reviewer', organisationId: admin.organisation.id });
    expect((await browserAgent(api).post('/api/invitations/accept').send({ token, password: 'first-password-ok' })).status).toBe(204);

    const again = await browserAgent(api).post('/api/invitations/accept').send({ token, password: 'second-password-try' });
    expect(again.status).toBe(400);
    expect(expectErrorEnvelope(again).fields?.token).toEqual(expect.any(String));
    expect((await browserAgent(api).get(`/api/invitations/${token}`)).status).toBe(400);
    const accounts = await usersWithEmail(email);
    expect(accounts).toHaveLength(1);
    // The second password did not overwrite the first.
    const second = await browserAgent(api).post('/api/auth/sign-in').send({ email, password: 'second-password-try' });
    expect(second.status).toBe(401);
  });

  it('refuses a made-up token', async () => {
    const res = await browserAgent(api).post('/api/invitations/accept').send({ token: 'x'.repeat(43), password: 'some-long-password' });
    expect(res.status).toBe(400);
    expectErrorEnvelope(res);
  });

  it('refuses a password shorter than ten characters and keeps the invitation open', async () => {
    const admin = await createUser({ role: 'admin' });
    const email = uniqueEmail('short');
    const { token } = await invite(admin, { email, name: 'Ash Morrow', role: 'appraiser', organisationId: admin.organisation.id });
    const res = await browserAgent(api).post('/api/invitations/accept').send({ token, password: 'short' });
    expect(res.status).toBe(400);
    expect(expectErrorEnvelope(res).fields?.password).toEqual(expect.any(String));
    expect((await browserAgent(api).get(`/api/invitations/${token}`)).status).toBe(200);
  });

  it.each([
    ['a client into the appraisal firm', 'client', 'firm'],
    ['an appraiser into a lender', 'appraiser', 'lender'],
  ] as const)('refuses %s with 422, queueing nothing', async (_label, role, kind) => {
    const admin = await createUser({ role: 'admin' });
    const organisation = kind === 'firm' ? admin.organisation : await createOrganisation('lender');
    const agent = await signedInAgent(api, admin);
    const email = uniqueEmail('misfit');
    const res = await agent.post('/api/users/invitations').send({ email, name: 'Misplaced Person', role, organisationId: organisation.id });
    expect(res.status).toBe(422);
    expect(expectErrorEnvelope(res).fields?.organisationId).toEqual(expect.any(String));
    expect(await mailTo(email)).toEqual([]);
    expect(await db.select().from(invitations).where(eq(invitations.email, email))).toEqual([]);
  });

  it('refuses to invite an address that already has an account', async () => {
    const admin = await createUser({ role: 'admin' });
    const existing = await createUser({ role: 'appraiser', organisation: admin.organisation });
    const agent = await signedInAgent(api, admin);
    const res = await agent
      .post('/api/users/invitations')
      .send({ email: existing.email.toUpperCase(), name: 'Duplicate', role: 'reviewer', organisationId: admin.organisation.id });
    expect(res.status).toBe(422);
    expect(expectErrorEnvelope(res).fields?.email).toEqual(expect.any(String));
    expect(await mailTo(existing.email)).toEqual([]);
  });

  it('refuses an organisation that does not exist and an invitation without a name', async () => {
    const admin = await createUser({ role: 'admin' });
    const agent = await signedInAgent(api, admin);
    const noOrg = await agent.post('/api/users/invitations').send({ email: uniqueEmail('a'), name: 'Nobody', role: 'appraiser', organisationId: 2147483000 });
    expect(noOrg.status).toBe(400);
    expect(expectErrorEnvelope(noOrg).fields?.organisationId).toEqual(expect.any(String));
    const noName = await agent.post('/api/users/invitations').send({ email: uniqueEmail('b'), name: '  ', role: 'appraiser', organisationId: admin.organisation.id });
    expect(noName.status).toBe(400);
    expect(expectErrorEnvelope(noName).fields?.name).toEqual(expect.any(String));
  });
});
