import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { invitations } from '../../db/schema/auth';
import type { Role } from '../../server/contracts/auth';
import { createOrganisation, createUser, reloadUser, uniqueEmail } from '../factories/accounts';
import { mailTo } from '../setup/mailbox';
import { bareRequest, expectErrorEnvelope, signedInAgent, startTestApi, stopTestApi, type Agent, type TestApi } from '../setup/test-api';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

async function invitationsFor(email: string) {
  return db.select().from(invitations).where(eq(invitations.email, email));
}

/** The admin-only endpoints, each as a request a given agent makes. */
function adminOnlyRequests(firmId: number, targetUserId: number) {
  return [
    { name: 'GET /api/users', send: (agent: Agent) => agent.get('/api/users') },
    {
      name: 'POST /api/users/invitations',
      send: (agent: Agent) =>
        agent.post('/api/users/invitations').send({ email: uniqueEmail('invitee'), name: 'Invited Person', role: 'appraiser', organisationId: firmId }),
    },
    { name: 'PATCH /api/users/:id', send: (agent: Agent) => agent.patch(`/api/users/${targetUserId}`).send({ version: 1, active: false }) },
    { name: 'GET /api/outbox', send: (agent: Agent) => agent.get('/api/outbox') },
    { name: 'GET /api/audit', send: (agent: Agent) => agent.get('/api/audit') },
  ];
}

describe.each<Role>(['appraiser', 'reviewer', 'client'])('a signed-in %s', (role) => {
  it('is refused every admin-only endpoint with 403, and nothing changes', async () => {
    const firm = await createOrganisation('firm');
    const target = await createUser({ role: 'appraiser', organisation: firm });
    const agent = await signedInAgent(api, await createUser({ role }));
    for (const request of adminOnlyRequests(firm.id, target.id)) {
      const res = await request.send(agent);
      expect(res.status, request.name).toBe(403);
      expect(expectErrorEnvelope(res).code, request.name).toBe('forbidden');
      expect(Object.keys(res.body), request.name).toEqual(['error']);
    }
    const after = await reloadUser(target.id);
    expect({ active: after.active, version: after.version }).toEqual({ active: true, version: 1 });
  });

  it('cannot invite: no invitation row and no e-mail appear', async () => {
    const firm = await createOrganisation('firm');
    const agent = await signedInAgent(api, await createUser({ role }));
    const email = uniqueEmail('refused-invitee');
    const res = await agent.post('/api/users/invitations').send({ email, name: 'Never Invited', role: 'appraiser', organisationId: firm.id });
    expect(res.status).toBe(403);
    expect(await invitationsFor(email)).toEqual([]);
    expect(await mailTo(email)).toEqual([]);
  });
});

describe('organisation list', () => {
  it.each<Role>(['appraiser', 'reviewer', 'admin'])('a %s may list organisations', async (role) => {
    const lender = await createOrganisation('lender');
    const agent = await signedInAgent(api, await createUser({ role }));
    const res = await agent.get('/api/organisations');
    expect(res.status).toBe(200);
    expect(res.body.organisations).toContainEqual(expect.objectContaining({ id: lender.id, name: lender.name, kind: 'lender' }));
  });

  it('a client may not list organisations (it would name the other lenders)', async () => {
    const otherLender = await createOrganisation('lender');
    const agent = await signedInAgent(api, await createUser({ role: 'client' }));
    const res = await agent.get('/api/organisations');
    expect(res.status).toBe(403);
    expect(res.text).not.toContain(otherLender.name);
  });
});

describe('an admin', () => {
  it('may read the team, the outbox and the audit trail', async () => {
    const admin = await createUser({ role: 'admin' });
    const colleague = await createUser({ role: 'reviewer', organisation: admin.organisation });
    const agent = await signedInAgent(api, admin);

    const team = await agent.get('/api/users');
    expect(team.status).toBe(200);
    const listed = team.body.users.find((u: { id: number }) => u.id === colleague.id);
    expect(listed).toMatchObject({ email: colleague.email, role: 'reviewer', active: true, version: 1, organisationName: admin.organisation.name });
    expect(team.text).not.toContain('scrypt');

    const outbox = await agent.get('/api/outbox');
    expect(outbox.status).toBe(200);
    expect(Array.isArray(outbox.body.messages)).toBe(true);

    const audit = await agent.get('/api/audit');
    expect(audit.status).toBe(200);
    // The admin's own sign-in is on the trail, with their name.
    expect(audit.body.events).toContainEqual(
      expect.objectContaining({ action: 'sign-in', entityType: 'user', entityId: String(admin.id), actorName: admin.name }),
    );
  });
});

describe('anonymous requests', () => {
  it.each([
    ['GET', '/api/users'],
    ['GET', '/api/outbox'],
    ['GET', '/api/audit'],
    ['GET', '/api/organisations'],
    ['GET', '/api/auth/me'],
    ['POST', '/api/users/invitations'],
    ['PATCH', '/api/users/1'],
    ['POST', '/api/auth/sign-out'],
  ])('%s %s is 401', async (method, path) => {
    const req = bareRequest(api);
    const res =
      method === 'GET'
        ? await req.get(path)
        : await (method === 'POST' ? req.post(path) : req.patch(path)).set('Origin', api.origin).send({ version: 1 });
    expect(res.status).toBe(401);
    expect(expectErrorEnvelope(res).code).toBe('unauthenticated');
  });
});

describe('cross-site requests', () => {
  it('refuses a POST from another origin with 403 cross_origin_refused, even with a valid session', async () => {
    const admin = await createUser({ role: 'admin' });
    const agent = await signedInAgent(api, admin);
    const email = uniqueEmail('csrf-invitee');
    const res = await agent
      .post('/api/users/invitations')
      .set('Origin', 'http://evil.example')
      .send({ email, name: 'Forged Invite', role: 'admin', organisationId: admin.organisation.id });
    expect(res.status).toBe(403);
    expect(expectErrorEnvelope(res).code).toBe('cross_origin_refused');
    expect(await invitationsFor(email)).toEqual([]);
    // The same request from the site itself goes through, so the refusal was about the origin.
    const same = await agent
      .post('/api/users/invitations')
      .send({ email, name: 'Real Invite', role: 'appraiser', organisationId: admin.organisation.id });
    expect(same.status).toBe(201);
  });

  it('refuses a state-changing request without an Origin header', async () => {
    const user = await createUser({ role: 'appraiser' });
    const res = await bareRequest(api).post('/api/auth/sign-in').send({ email: user.email, password: user.password });
    expect(res.status).toBe(403);
    expect(expectErrorEnvelope(res).code).toBe('cross_origin_refused');
    expect(res.headers['set-cookie']).toBeUndefined();
  });

  it.each(['null', 'not a url', 'https://127.0.0.1.evil.example'])('refuses Origin %j', async (origin) => {
    const res = await bareRequest(api).post('/api/auth/password-reset').set('Origin', origin).send({ email: uniqueEmail('x') });
    expect(res.status).toBe(403);
    expect(expectErrorEnvelope(res).code).toBe('cross_origin_refused');
  });

  it('refuses a PATCH and a sign-out from another origin too', async () => {
    const admin = await createUser({ role: 'admin' });
    const target = await createUser({ role: 'appraiser', organisation: admin.organisation });
    const agent = await signedInAgent(api, admin);
    const patch = await agent.patch(`/api/users/${target.id}`).set('Origin', 'http://evil.example').send({ version: 1, active: false });
    expect(patch.status).toBe(403);
    expect((await reloadUser(target.id)).active).toBe(true);
    const out = await agent.post('/api/auth/sign-out').set('Origin', 'http://evil.example');
    expect(out.status).toBe(403);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
  });
});

describe('health', () => {
  it('GET /api/health answers 200 with the database up, without signing in', async () => {
    const res = await bareRequest(api).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: 'ok' });
  });
});

describe('lender isolation (until lender data exists)', () => {
  it("a client of one lender cannot see another lender's people", async () => {
    const lenderA = await createOrganisation('lender');
    const lenderB = await createOrganisation('lender');
    const clientA = await createUser({ role: 'client', organisation: lenderA });
    const clientB = await createUser({ role: 'client', organisation: lenderB });
    const agent = await signedInAgent(api, clientA);

    const team = await agent.get('/api/users');
    expect(team.status).toBe(403);
    expect(team.text).not.toContain(clientB.email);

    const me = await agent.get('/api/auth/me');
    expect(me.body.user).toMatchObject({ id: clientA.id, organisationId: lenderA.id, organisationKind: 'lender' });
  });
});
