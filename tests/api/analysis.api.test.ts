import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { linearRegression } from 'simple-statistics';
import { db } from '../../db/client';
import { sales } from '../../db/schema/assignments';
import { DEMO_PASSWORD, demoUsers } from '../../db/seed/demo-accounts';
import { generatePortEllery } from '../../db/seed/port-ellery';
import { DEMO_SUBJECT_ADDRESS } from '../../db/seed/seed-assignment';
import { analysisWireResponse, type Analysis, type GroupAnalysis } from '../../server/contracts/analysis';
import { bumpDataRevision } from '../../server/modules/assignments/assignments.repo';
import { createUser, type TestUser } from '../factories/accounts';
import { D_PATTERN, E_PATTERN } from '../factories/analysis';
import { saleFormInput } from '../factories/assignments';
import { bareRequest, expectErrorEnvelope, signedInAgent, startTestApi, stopTestApi, type Agent, type TestApi } from '../setup/test-api';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

async function getAnalysis(agent: Agent, assignmentId: number): Promise<Analysis> {
  const res = await agent.get(`/api/assignments/${assignmentId}/analysis`);
  expect(res.status, res.text).toBe(200);
  return analysisWireResponse.parse(res.body);
}

function quarryHill(analysis: Analysis): GroupAnalysis {
  const group = analysis.groups.find((g) => g.neighbourhood === 'Quarry Hill');
  if (!group) throw new Error(`no Quarry Hill group: ${analysis.groups.map((g) => g.neighbourhood).join(', ')}`);
  return group;
}

async function saleIdsByAddress(agent: Agent, assignmentId: number): Promise<Map<string, { id: number; version: number }>> {
  const res = await agent.get(`/api/assignments/${assignmentId}/sales`);
  expect(res.status).toBe(200);
  return new Map((res.body.sales as Array<{ address: string; id: number; version: number }>).map((s) => [s.address, { id: s.id, version: s.version }]));
}

describe('the seeded demo assignment (read only)', () => {
  it('flags every planted anomaly in Quarry Hill with a reason, in a response that fits the contract', async () => {
    const demoAppraiser = demoUsers.find((u) => u.role === 'appraiser')!;
    const agent = await signedInAgent(api, { email: demoAppraiser.email, password: DEMO_PASSWORD });
    const list = await agent.get('/api/assignments');
    expect(list.status).toBe(200);
    const demo = (list.body.assignments as Array<{ id: number; subjectAddress: string }>).find((a) => a.subjectAddress === DEMO_SUBJECT_ADDRESS);
    expect(demo, 'the seeded demo assignment').toBeDefined();

    const analysis = await getAnalysis(agent, demo!.id);
    expect(analysis.subjectGroup).toBe('Quarry Hill');
    const flagged = quarryHill(analysis).flagged;
    const byAddress = await saleIdsByAddress(agent, demo!.id);
    const scenario = generatePortEllery();
    expect(scenario.plantedAnomalies).toHaveLength(4);
    for (const anomaly of scenario.plantedAnomalies) {
      const address = scenario.sales.find((s) => s.key === anomaly.saleKey)!.address;
      const saleId = byAddress.get(address)?.id;
      expect(saleId, `${anomaly.kind} at ${address} is in the assignment`).toBeDefined();
      const entry = flagged.find((f) => f.saleId === saleId);
      expect(entry, `${anomaly.kind} at ${address} is flagged in Quarry Hill`).toBeDefined();
      expect(entry!.reason.trim().length, anomaly.kind).toBeGreaterThan(0);
    }
  });
});

/** A new firm's appraiser, signed in, with an assignment made through the API: subject of 1,450 ft²
 * in Quarry Hill, ten sales on a line of exactly $240/ft² + $55,000 (the scatter is orthogonal to
 * 1 and x, see tests/factories/analysis.ts) and one transfer between relatives well below it. */
async function ownAssignment() {
  const appraiser = await createUser({ role: 'appraiser' });
  const agent = await signedInAgent(api, appraiser);
  const orgs = await agent.get('/api/organisations');
  const lender = (orgs.body.organisations as Array<{ id: number; kind: string }>).find((o) => o.kind === 'lender')!;
  const created = await agent.post('/api/assignments').send({
    subjectAddress: '27 Mooring Way, Port Ellery',
    intendedUse: 'Mortgage lending decision (test assignment)',
    clientOrganisationId: lender.id,
    effectiveDate: '2026-11-15',
  });
  expect(created.status, created.text).toBe(201);
  const assignmentId = created.body.assignment.id as number;
  const detail = await agent.get(`/api/assignments/${assignmentId}`);
  const subject = await agent.put(`/api/assignments/${assignmentId}/subject`).send({ version: detail.body.subject.version, floorArea: 1_450, neighbourhood: 'Quarry Hill' });
  expect(subject.status, subject.text).toBe(200);

  const points = [0, 1].flatMap(() => D_PATTERN.map((d, i) => ({ x: 1_400 + 100 * d, y: 55_000 + 240 * (1_400 + 100 * d) + 3_000 * E_PATTERN[i] })));
  const family = { x: 1_700, y: 300_000 }; // the line says 463,000
  const saleIds: number[] = [];
  for (const p of [...points, family]) {
    const res = await agent.post(`/api/assignments/${assignmentId}/sales`).send(saleFormInput({ salePrice: p.y, floorArea: p.x, neighbourhood: 'Quarry Hill', saleDate: '2026-08-20' }));
    expect(res.status, res.text).toBe(201);
    saleIds.push(res.body.sale.id as number);
  }
  return { appraiser, agent, assignmentId, points, family, saleIds, familyId: saleIds.at(-1)! };
}

describe('an appraiser’s own assignment', () => {
  it('takes an excluded sale out of the fit and lists it with its reason', async () => {
    const { agent, assignmentId, points, family, familyId } = await ownAssignment();
    const before = await getAnalysis(agent, assignmentId);
    const reference = linearRegression([...points, family].map((p) => [p.x, p.y]));
    expect(quarryHill(before).n).toBe(11);
    expect(quarryHill(before).fit!.slope).toBeCloseTo(reference.m, 6);
    expect(Math.abs(reference.m - 240)).toBeGreaterThan(10); // the family sale pulls the line
    expect(before.excluded).toEqual([]);

    // No exclusion endpoint yet: do what the review service will do (flag the row, bump the revision).
    const reason = 'Transfer between relatives; not offered on the open market.';
    await db.update(sales).set({ excluded: true, exclusionReason: reason }).where(eq(sales.id, familyId));
    await bumpDataRevision(db, assignmentId);

    const after = await getAnalysis(agent, assignmentId);
    expect(after.dataRevision).toBe(before.dataRevision + 1);
    expect(quarryHill(after).n).toBe(10);
    expect(quarryHill(after).fit!.slope).toBeCloseTo(240, 8);
    expect(quarryHill(after).fit!.intercept).toBeCloseTo(55_000, 3);
    expect(quarryHill(after).points.map((p) => p.saleId)).not.toContain(familyId);
    expect(after.excluded).toEqual([{ saleId: familyId, address: expect.any(String), reason }]);
    expect(after.adjustedPrices[String(familyId)]).toBeUndefined();
  });

  it('serves the analysis per data revision: a PATCHed sale shows in the next GET', async () => {
    const { agent, assignmentId, saleIds } = await ownAssignment();
    const [quietId, patchedId] = saleIds;
    const first = await getAnalysis(agent, assignmentId);
    const yOf = (a: Analysis, id: number) => quarryHill(a).points.find((p) => p.saleId === id)!.y;

    // A write that bypasses the service (no revision bump) is not seen: the cached answer is served.
    await db.update(sales).set({ salePrice: 333_000 }).where(eq(sales.id, quietId));
    const cached = await getAnalysis(agent, assignmentId);
    expect(cached.dataRevision).toBe(first.dataRevision);
    expect(yOf(cached, quietId)).toBe(yOf(first, quietId));

    const version = (await agent.get(`/api/assignments/${assignmentId}/sales`)).body.sales.find((s: { id: number }) => s.id === patchedId).version;
    const patch = await agent.patch(`/api/assignments/${assignmentId}/sales/${patchedId}`).send({ version, salePrice: 512_345 });
    expect(patch.status, patch.text).toBe(200);

    const fresh = await getAnalysis(agent, assignmentId);
    expect(fresh.dataRevision).toBeGreaterThan(first.dataRevision);
    expect(yOf(fresh, patchedId)).toBe(512_345);
    expect(yOf(fresh, quietId)).toBe(333_000);
  });
});

describe('who may read the analysis', () => {
  it('answers 401 to no one signed in, 403 to a client, 404 to another firm, 200 to the firm’s reviewer and admin', async () => {
    const { appraiser, assignmentId } = await ownAssignment();
    const url = `/api/assignments/${assignmentId}/analysis`;

    const anonymous = await bareRequest(api).get(url);
    expect(anonymous.status).toBe(401);
    expectErrorEnvelope(anonymous);

    const expectations: Array<[string, () => Promise<TestUser>, number]> = [
      ['client', () => createUser({ role: 'client' }), 403],
      ['appraiser of another firm', () => createUser({ role: 'appraiser' }), 404],
      ['reviewer of the firm', () => createUser({ role: 'reviewer', organisation: appraiser.organisation }), 200],
      ['admin of the firm', () => createUser({ role: 'admin', organisation: appraiser.organisation }), 200],
    ];
    for (const [who, make, status] of expectations) {
      const res = await (await signedInAgent(api, await make())).get(url);
      expect(res.status, who).toBe(status);
      if (status === 200) expect(analysisWireResponse.parse(res.body).assignmentId, who).toBe(assignmentId);
      else expectErrorEnvelope(res);
    }
  });
});
