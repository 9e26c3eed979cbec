import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { db, pool } from '../../db/client';
import { reportVersions } from '../../db/schema/delivery';
import { assignments } from '../../db/schema/assignments';
import { reportResponse } from '../../server/contracts/report';
import { CAUTIONS } from '../../server/contracts/report-text';
import { createUser } from '../factories/accounts';
import { createSignedReport } from '../factories/signed-report';
import { createAssignment } from '../factories/assignments';
import { signedInAgent, startTestApi, stopTestApi, type TestApi } from '../setup/test-api';
import { mailTo } from '../setup/mailbox';

let api: TestApi;
beforeAll(async () => {
  api = await startTestApi();
});
afterAll(async () => {
  await stopTestApi(api);
});

/** The same canonical form the server promises: keys sorted at every depth (written out here
 * independently of the server's code), SHA-256 over its UTF-8 bytes (FIPS 180-4 via node:crypto). */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    return `{${Object.keys(value).sort().map((k) => `${JSON.stringify(k)}:${canonical((value as Record<string, unknown>)[k])}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

describe('a signed report version', () => {
  it('carries a fingerprint that matches its stored snapshot, and the snapshot holds the cautions', async () => {
    const report = await createSignedReport(api);
    const client = await signedInAgent(api, report.client);
    const res = await client.get(`/api/reports/${report.reportVersionId}`);
    expect(res.status).toBe(200);
    const body = reportResponse.parse(res.body);
    expect(createHash('sha256').update(canonical(res.body.snapshot), 'utf8').digest('hex')).toBe(body.sha256);
    const [stored] = await db.select().from(reportVersions).where(eq(reportVersions.id, report.reportVersionId));
    expect(createHash('sha256').update(stored.canonicalJson, 'utf8').digest('hex')).toBe(stored.sha256);
    expect(body.snapshot.cautions).toEqual([...CAUTIONS]);
    expect(body.snapshot.sales).toHaveLength(12);
    const [assignment] = await db.select().from(assignments).where(eq(assignments.id, report.assignmentId));
    expect(assignment.status).toBe('signed');
    expect((await mailTo(report.client.email)).some((m) => m.subject.includes('delivered') && m.textBody.includes(body.sha256))).toBe(true);
  });

  it('cannot be altered: no API route changes it, and the database refuses UPDATE and DELETE', async () => {
    const report = await createSignedReport(api);
    for (const method of ['put', 'patch', 'delete'] as const) {
      const res = await report.appraiserAgent[method](`/api/reports/${report.reportVersionId}`).send({ snapshot: {} });
      expect(res.status).toBe(404);
    }
    await expect(pool.query("update report_versions set sha256 = 'forged' where id = $1", [report.reportVersionId])).rejects.toThrow(/immutable/);
    await expect(pool.query('delete from report_versions where id = $1', [report.reportVersionId])).rejects.toThrow(/immutable/);
    const [stored] = await db.select().from(reportVersions).where(eq(reportVersions.id, report.reportVersionId));
    expect(stored.sha256).toBe(report.sha256);
  });

  it('is readable by its own lender only, and no client reads unsigned work', async () => {
    const report = await createSignedReport(api);
    const otherLender = await signedInAgent(api, await createUser({ role: 'client' }));
    expect((await otherLender.get(`/api/reports/${report.reportVersionId}`)).status).toBe(404);
    expect((await otherLender.get(`/api/reports/${report.reportVersionId}/pdf`)).status).toBe(404);
    expect((await otherLender.get('/api/reports')).body.reports.map((r: { id: number }) => r.id)).not.toContain(report.reportVersionId);
    const ownClient = await signedInAgent(api, report.client);
    const unsigned = await createAssignment();
    await db.update(assignments).set({ clientOrganisationId: report.client.organisation.id }).where(eq(assignments.id, unsigned.id));
    expect((await ownClient.get(`/api/assignments/${unsigned.id}`)).status).toBe(403);
    expect((await ownClient.get(`/api/assignments/${unsigned.id}/analysis`)).status).toBe(403);
    expect((await ownClient.get('/api/reports')).body.reports.map((r: { assignmentId: number }) => r.assignmentId)).not.toContain(unsigned.id);
  });

  it('later edits open a new draft; signing again makes version 2 and version 1 stays readable', async () => {
    const report = await createSignedReport(api);
    const [a] = await db.select().from(assignments).where(eq(assignments.id, report.assignmentId));
    const draft = await report.appraiserAgent.post(`/api/assignments/${report.assignmentId}/new-draft`).send({ version: a.version, reason: 'Client supplied a corrected lot size.' });
    expect(draft.status).toBe(200);
    await db.update(assignments).set({ status: 'approved' }).where(eq(assignments.id, report.assignmentId));
    const [b] = await db.select().from(assignments).where(eq(assignments.id, report.assignmentId));
    const second = await report.appraiserAgent.post(`/api/assignments/${report.assignmentId}/sign`).send({ certify: true, licenceNumber: 'PE-CR-99001', jurisdiction: 'Port Ellery (invented)', version: b.version });
    expect(second.status).toBe(201);
    expect(second.body.versionNumber).toBe(2);
    const client = await signedInAgent(api, report.client);
    const first = await client.get(`/api/reports/${report.reportVersionId}`);
    expect(first.status).toBe(200);
    expect(first.body.sha256).toBe(report.sha256);
    expect(first.body.laterVersions).toEqual([second.body.reportVersionId]);
  });

  it('the verification link confirms a real fingerprint and denies a made-up one, without signing in', async () => {
    const report = await createSignedReport(api);
    const { default: supertest } = await import('supertest');
    const ok = await supertest(api.server).get(`/api/verify/${report.sha256}`);
    expect(ok.status).toBe(200);
    expect(ok.body.found).toBe(true);
    const madeUp = await supertest(api.server).get(`/api/verify/${'0'.repeat(64)}`);
    expect(madeUp.body).toEqual({ found: false, report: null });
  });
});
