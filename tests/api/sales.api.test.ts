import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { booleanPointInPolygon, pointOnFeature } from '@turf/turf';
import type { FeatureCollection, MultiPolygon, Polygon } from 'geojson';
import { auditEventsFor, createFirmWithAssignment, createSale, saleFormInput, saleRow } from '../factories/assignments';
import { expectErrorEnvelope, signedInAgent, startTestApi, stopTestApi, type TestApi } from '../setup/test-api';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

async function appraiserWithAssignment() {
  const team = await createFirmWithAssignment();
  return { ...team, agent: await signedInAgent(api, team.appraiser) };
}

const basemap = JSON.parse(readFileSync(path.resolve('public/basemap/neighbourhoods.geojson'), 'utf8')) as FeatureCollection<
  Polygon | MultiPolygon,
  { name: string }
>;

describe('creating a sale from the form', () => {
  it('creates the sale with its fields and answers 201', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const input = saleFormInput({ address: '7 Ropewalk Lane', salePrice: 455_000, saleDate: '2026-04-09', floorArea: 1_810, bedrooms: 4 });
    const res = await agent.post(`/api/assignments/${assignment.id}/sales`).send(input);
    expect(res.status).toBe(201);
    expect(res.body.sale).toMatchObject({
      assignmentId: assignment.id,
      address: '7 Ropewalk Lane',
      salePrice: 455_000,
      saleDate: '2026-04-09',
      floorArea: 1_810,
      bedrooms: 4,
      inGrid: false,
      version: 1,
    });
    const row = await saleRow(res.body.sale.id);
    expect(row).toMatchObject({ assignmentId: assignment.id, address: '7 Ropewalk Lane', salePrice: 455_000, deletedAt: null });
    const list = await agent.get(`/api/assignments/${assignment.id}/sales`);
    expect(list.body.sales.map((s: { id: number }) => s.id)).toEqual([res.body.sale.id]);
  });

  it('answers 400 with a message on each bad field and stores nothing', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const res = await agent
      .post(`/api/assignments/${assignment.id}/sales`)
      .send(saleFormInput({ salePrice: 'four hundred thousand', floorArea: -20, saleDate: '14/03/2026' }));
    expect(res.status).toBe(400);
    const { fields } = expectErrorEnvelope(res);
    expect(fields?.salePrice).toEqual(expect.any(String));
    expect(fields?.floorArea).toEqual(expect.any(String));
    expect(fields?.saleDate).toEqual(expect.any(String));
    expect(Object.keys(fields ?? {})).not.toContain('address');
    const negative = await agent.post(`/api/assignments/${assignment.id}/sales`).send(saleFormInput({ salePrice: -5 }));
    expect(negative.status).toBe(400);
    expect(expectErrorEnvelope(negative).fields?.salePrice).toEqual(expect.any(String));
    // An impossible calendar day alone must be a field message too, not a database error.
    const impossible = await agent.post(`/api/assignments/${assignment.id}/sales`).send(saleFormInput({ saleDate: '2026-02-30' }));
    expect(impossible.status).toBe(400);
    expect(expectErrorEnvelope(impossible).fields?.saleDate).toEqual(expect.any(String));
    expect((await agent.get(`/api/assignments/${assignment.id}/sales`)).body.sales).toEqual([]);
  });

  it('picks the neighbourhood from the basemap boundaries when a location is given', async () => {
    const quarryHill = basemap.features.find((f) => f.properties.name === 'Quarry Hill');
    expect(quarryHill).toBeDefined();
    const [lon, lat] = pointOnFeature(quarryHill!).geometry.coordinates;
    // The expected name comes from the file itself, found by turf, not from the server's lookup.
    const containing = basemap.features.filter((f) => booleanPointInPolygon([lon, lat], f)).map((f) => f.properties.name);
    expect(containing).toEqual(['Quarry Hill']);

    const { agent, assignment } = await appraiserWithAssignment();
    const res = await agent.post(`/api/assignments/${assignment.id}/sales`).send(saleFormInput({ lon, lat }));
    expect(res.status).toBe(201);
    expect(res.body.sale.neighbourhood).toBe(containing[0]);

    const outside = await agent.post(`/api/assignments/${assignment.id}/sales`).send(saleFormInput({ lon: -61.2, lat: 44.9 }));
    expect(outside.status).toBe(201);
    expect(outside.body.sale.neighbourhood).toBeNull();
  });
});

describe('editing a sale', () => {
  it('refuses a stale version with 409 stale_version and keeps the first edit', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const sale = await createSale(assignment.id, { salePrice: 300_000 });
    const first = await agent.patch(`/api/assignments/${assignment.id}/sales/${sale.id}`).send({ version: 1, salePrice: 310_000 });
    expect(first.status).toBe(200);
    expect(first.body.sale).toMatchObject({ salePrice: 310_000, version: 2 });

    const second = await agent.patch(`/api/assignments/${assignment.id}/sales/${sale.id}`).send({ version: 1, salePrice: 999_000 });
    expect(second.status).toBe(409);
    expect(expectErrorEnvelope(second).code).toBe('stale_version');
    expect(await saleRow(sale.id)).toMatchObject({ salePrice: 310_000, version: 2 });
  });

  it('toggles inGrid on and off', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const sale = await createSale(assignment.id);
    const on = await agent.patch(`/api/assignments/${assignment.id}/sales/${sale.id}`).send({ version: 1, inGrid: true });
    expect(on.status).toBe(200);
    expect(on.body.sale.inGrid).toBe(true);
    expect((await saleRow(sale.id)).inGrid).toBe(true);
    const off = await agent.patch(`/api/assignments/${assignment.id}/sales/${sale.id}`).send({ version: on.body.sale.version, inGrid: false });
    expect(off.status).toBe(200);
    expect(off.body.sale.inGrid).toBe(false);
    expect((await saleRow(sale.id)).inGrid).toBe(false);
  });

  it('keeps an excluded sale out of the grid', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const sale = await createSale(assignment.id, { excluded: true, exclusionReason: 'Sold between relatives.' });
    const res = await agent.patch(`/api/assignments/${assignment.id}/sales/${sale.id}`).send({ version: sale.version, inGrid: true });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('sale_excluded');
    expect((await saleRow(sale.id)).inGrid).toBe(false);
  });

  it('soft-deletes: the sale leaves the list, the row stays with deleted_at set', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const kept = await createSale(assignment.id);
    const gone = await createSale(assignment.id);
    const res = await agent.delete(`/api/assignments/${assignment.id}/sales/${gone.id}?version=1`);
    expect(res.status).toBe(204);
    const list = await agent.get(`/api/assignments/${assignment.id}/sales`);
    expect(list.body.sales.map((s: { id: number }) => s.id)).toEqual([kept.id]);
    const row = await saleRow(gone.id);
    expect(row).toBeDefined();
    expect(row.deletedAt).toBeInstanceOf(Date);
    expect((await saleRow(kept.id)).deletedAt).toBeNull();
    const patchDeleted = await agent.patch(`/api/assignments/${assignment.id}/sales/${gone.id}`).send({ version: 2, salePrice: 1 });
    expect(patchDeleted.status).toBe(404);
  });

  it('writes an audit event, naming the appraiser, for every change', async () => {
    const { agent, assignment, appraiser } = await appraiserWithAssignment();
    const created = await agent.post(`/api/assignments/${assignment.id}/sales`).send(saleFormInput());
    const saleId = created.body.sale.id as number;
    expect(await auditEventsFor('sale', saleId)).toHaveLength(1);
    await agent.patch(`/api/assignments/${assignment.id}/sales/${saleId}`).send({ version: 1, floorArea: 1_700 });
    expect(await auditEventsFor('sale', saleId)).toHaveLength(2);
    await agent.patch(`/api/assignments/${assignment.id}/sales/${saleId}`).send({ version: 2, inGrid: true });
    expect(await auditEventsFor('sale', saleId)).toHaveLength(3);
    await agent.delete(`/api/assignments/${assignment.id}/sales/${saleId}?version=3`);
    const events = await auditEventsFor('sale', saleId);
    expect(events).toHaveLength(4);
    for (const event of events) {
      expect(event.actorUserId).toBe(appraiser.id);
      expect(event.organisationId).toBe(appraiser.organisation.id);
    }
    expect(events.map((e) => e.action)).toEqual([
      expect.stringMatching(/creat/),
      expect.stringMatching(/updat/),
      expect.stringMatching(/updat/),
      expect.stringMatching(/delet/),
    ]);
    expect(JSON.stringify(events[1].details)).toContain('1700');
  });

  it('a failed (stale) edit writes no audit event', async () => {
    const { agent, assignment } = await appraiserWithAssignment();
    const sale = await createSale(assignment.id);
    const res = await agent.patch(`/api/assignments/${assignment.id}/sales/${sale.id}`).send({ version: 7, salePrice: 1 });
    expect(res.status).toBe(409);
    expect(await auditEventsFor('sale', sale.id)).toEqual([]);
  });
});

describe('access from another firm', () => {
  it('answers 404, not 403, for the assignment and its sales, and changes nothing', async () => {
    const { assignment } = await createFirmWithAssignment();
    const sale = await createSale(assignment.id, { salePrice: 275_000 });
    const outsider = await signedInAgent(api, (await createFirmWithAssignment()).appraiser);
    const base = `/api/assignments/${assignment.id}`;
    const attempts = [
      ['GET assignment', await outsider.get(base)],
      ['GET sales', await outsider.get(`${base}/sales`)],
      ['POST sale', await outsider.post(`${base}/sales`).send(saleFormInput())],
      ['PATCH sale', await outsider.patch(`${base}/sales/${sale.id}`).send({ version: 1, salePrice: 1 })],
      ['DELETE sale', await outsider.delete(`${base}/sales/${sale.id}?version=1`)],
    ] as const;
    for (const [name, res] of attempts) {
      expect(res.status, name).toBe(404);
      expect(expectErrorEnvelope(res).code, name).toBe('not_found');
      expect(res.text, name).not.toContain('275000');
    }
    expect(await saleRow(sale.id)).toMatchObject({ salePrice: 275_000, version: 1, deletedAt: null });
  });

  it('a reviewer of the same firm may read the sales but not change them (403)', async () => {
    const { assignment, reviewer } = await createFirmWithAssignment();
    const sale = await createSale(assignment.id);
    const agent = await signedInAgent(api, reviewer);
    const list = await agent.get(`/api/assignments/${assignment.id}/sales`);
    expect(list.status).toBe(200);
    expect(list.body.sales.map((s: { id: number }) => s.id)).toEqual([sale.id]);
    const patch = await agent.patch(`/api/assignments/${assignment.id}/sales/${sale.id}`).send({ version: 1, inGrid: true });
    expect(patch.status).toBe(403);
    expect((await saleRow(sale.id)).inGrid).toBe(false);
  });
});
