import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { sessions } from '../../db/schema/auth';
import { users } from '../../db/schema/organisations';
import { createUser, reloadUser } from '../factories/accounts';
import { browserAgent, expectErrorEnvelope, signedInAgent, startTestApi, stopTestApi, type TestApi } from '../setup/test-api';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

describe('PATCH /api/users/:id', () => {
  it('changes a role and bumps the version', async () => {
    const admin = await createUser({ role: 'admin' });
    const target = await createUser({ role: 'appraiser', organisation: admin.organisation });
    const agent = await signedInAgent(api, admin);
    const res = await agent.patch(`/api/users/${target.id}`).send({ version: target.version, role: 'reviewer' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: target.id, role: 'reviewer', active: true, version: target.version + 1 });
    expect(await reloadUser(target.id)).toMatchObject({ role: 'reviewer', version: target.version + 1 });
  });

  it('refuses a stale version with 409 stale_version and changes nothing', async () => {
    const admin = await createUser({ role: 'admin' });
    const target = await createUser({ role: 'appraiser', organisation: admin.organisation });
    const agent = await signedInAgent(api, admin);
    // Another admin's edit lands first.
    expect((await agent.patch(`/api/users/${target.id}`).send({ version: target.version, role: 'reviewer' })).status).toBe(200);
    const before = await reloadUser(target.id);

    const stale = await agent.patch(`/api/users/${target.id}`).send({ version: target.version, active: false, role: 'admin' });
    expect(stale.status).toBe(409);
    const error = expectErrorEnvelope(stale);
    expect(error.code).toBe('stale_version');
    expect(error.message).toMatch(/reload/i);
    expect(await reloadUser(target.id)).toEqual(before);
  });

  it('deactivating a user ends their session: their next request is 401', async () => {
    const admin = await createUser({ role: 'admin' });
    const target = await createUser({ role: 'reviewer', organisation: admin.organisation });
    const targetAgent = await signedInAgent(api, target);
    expect((await targetAgent.get('/api/auth/me')).status).toBe(200);

    const adminAgent = await signedInAgent(api, admin);
    const res = await adminAgent.patch(`/api/users/${target.id}`).send({ version: target.version, active: false });
    expect(res.status).toBe(200);
    expect(res.body.active).toBe(false);
    // Ended on the server at once, not only when the person next knocks.
    expect(await db.select().from(sessions).where(eq(sessions.userId, target.id))).toEqual([]);

    const next = await targetAgent.get('/api/auth/me');
    expect(next.status).toBe(401);
    expect(expectErrorEnvelope(next).code).toBe('unauthenticated');
    expect((await browserAgent(api).post('/api/auth/sign-in').send({ email: target.email, password: target.password })).status).toBe(401);
  });

  it('a session of an account deactivated behind the app’s back stops working too', async () => {
    const user = await createUser({ role: 'appraiser' });
    const agent = await signedInAgent(api, user);
    await db.update(users).set({ active: false }).where(eq(users.id, user.id));
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    expect(await db.select().from(sessions).where(eq(sessions.userId, user.id))).toEqual([]);
  });

  it('reactivating lets the person sign in again', async () => {
    const admin = await createUser({ role: 'admin' });
    const target = await createUser({ role: 'appraiser', organisation: admin.organisation, active: false });
    const agent = await signedInAgent(api, admin);
    expect((await agent.patch(`/api/users/${target.id}`).send({ version: target.version, active: true })).status).toBe(200);
    await expect(signedInAgent(api, target)).resolves.toBeDefined();
  });

  it('an admin cannot deactivate themself or give up their own admin role', async () => {
    const admin = await createUser({ role: 'admin' });
    const agent = await signedInAgent(api, admin);
    const deactivate = await agent.patch(`/api/users/${admin.id}`).send({ version: admin.version, active: false });
    expect(deactivate.status).toBe(422);
    expectErrorEnvelope(deactivate);
    const demote = await agent.patch(`/api/users/${admin.id}`).send({ version: admin.version, role: 'appraiser' });
    expect(demote.status).toBe(422);
    expect(await reloadUser(admin.id)).toMatchObject({ role: 'admin', active: true, version: admin.version });
    expect((await agent.get('/api/auth/me')).status).toBe(200);
  });

  it('refuses a role that does not fit the organisation with 422', async () => {
    const admin = await createUser({ role: 'admin' });
    const client = await createUser({ role: 'client' });
    const agent = await signedInAgent(api, admin);
    const res = await agent.patch(`/api/users/${client.id}`).send({ version: client.version, role: 'appraiser' });
    expect(res.status).toBe(422);
    expect(expectErrorEnvelope(res).fields?.organisationId).toEqual(expect.any(String));
    expect(await reloadUser(client.id)).toMatchObject({ role: 'client', version: client.version });
  });

  it('records each change on the audit trail with who made it', async () => {
    const admin = await createUser({ role: 'admin' });
    const target = await createUser({ role: 'appraiser', organisation: admin.organisation });
    const agent = await signedInAgent(api, admin);
    await agent.patch(`/api/users/${target.id}`).send({ version: target.version, role: 'reviewer' });
    const audit = await agent.get('/api/audit');
    expect(audit.body.events).toContainEqual(
      expect.objectContaining({
        action: 'user-updated',
        entityType: 'user',
        entityId: String(target.id),
        actorName: admin.name,
        details: { from: { role: 'appraiser', active: true }, to: { role: 'reviewer', active: true } },
      }),
    );
  });
});
