// The Port Ellery demo as the global setup seeds it: the file already with the reviewer (9 Cobble
// Lane) is in the status a submission leaves, complete enough to have been submitted, with the
// history the services write; and seeding again adds nothing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, count, eq, inArray, or } from 'drizzle-orm';
import { db } from '../../db/client';
import { assignments, sales } from '../../db/schema/assignments';
import { auditEvents } from '../../db/schema/audit';
import { gridSettings, statusChanges } from '../../db/schema/review';
import { organisations } from '../../db/schema/organisations';
import { DEMO_FIRM, DEMO_PASSWORD, demoUsers } from '../../db/seed/demo-accounts';
import { DEMO_SUBJECT_ADDRESS } from '../../db/seed/seed-assignment';
import { seedDemo } from '../../db/seed/seed-demo';
import { DEMO_REVIEW_GRID_SALES, DEMO_REVIEW_SUBJECT_ADDRESS } from '../../db/seed/seed-review-assignment';
import { gridResponse } from '../../server/contracts/grid';
import { reviewQueueResponse, timelineResponse } from '../../server/contracts/review';
import { signedInAgent, startTestApi, stopTestApi, type Agent, type TestApi } from '../setup/test-api';

let api: TestApi;
let reviewer: Agent;
let appraiser: Agent;
const demoUser = (role: 'appraiser' | 'reviewer') => demoUsers.find((u) => u.role === role)!;

beforeAll(async () => {
  api = await startTestApi();
  reviewer = await signedInAgent(api, { email: demoUser('reviewer').email, password: DEMO_PASSWORD });
  appraiser = await signedInAgent(api, { email: demoUser('appraiser').email, password: DEMO_PASSWORD });
});
afterAll(async () => {
  await stopTestApi(api);
});

async function demoFile(subjectAddress: string) {
  const [firm] = await db.select().from(organisations).where(eq(organisations.name, DEMO_FIRM));
  const rows = await db.select().from(assignments).where(and(eq(assignments.firmOrganisationId, firm.id), eq(assignments.subjectAddress, subjectAddress)));
  expect(rows, subjectAddress).toHaveLength(1);
  return rows[0];
}

describe('the demo file already in review', () => {
  it('waits in the demo reviewer’s queue as “in review”, beside the demo file still in progress', async () => {
    const res = await reviewer.get('/api/review-queue');
    expect(res.status).toBe(200);
    const { items } = reviewQueueResponse.parse(res.body);
    const file = items.find((i) => i.subjectAddress === DEMO_REVIEW_SUBJECT_ADDRESS);
    expect(file).toBeDefined();
    expect(file).toMatchObject({ status: 'in_review', appraiserName: demoUser('appraiser').name, clientOrganisationName: 'Harbourside Mutual', openQueries: 0 });
    // The planted anomalies are in its market too: the reviewer has flagged sales to look at.
    expect(file!.flaggedSales).toBeGreaterThan(0);
    expect(items.some((i) => i.subjectAddress === DEMO_SUBJECT_ADDRESS)).toBe(false);
    expect((await demoFile(DEMO_SUBJECT_ADDRESS)).status).toBe('in_progress');
  });

  it('has everything a submission requires: subject, three grid sales, a justified typed rate and a reconciliation', async () => {
    const file = await demoFile(DEMO_REVIEW_SUBJECT_ADDRESS);
    const res = await reviewer.get(`/api/assignments/${file.id}/grid`);
    expect(res.status).toBe(200);
    const grid = gridResponse.parse(res.body);
    expect(grid.missing).toEqual([]);
    expect(grid.subjectArea).toBe(1_720);
    expect(grid.rows.map((r) => r.address).sort()).toEqual([...DEMO_REVIEW_GRID_SALES].sort());
    expect(grid.rate.source).toBe('typed');
    expect(grid.settings.rateJustification).toMatch(/per ft²/);
    expect(grid.settings.reconciliationComment).toMatch(/68 Quarry Road/);
    expect(grid.indicatedValue).not.toBeNull();
    // The comment says the adjusted prices lie close together: within 5% of one another.
    const [low, high] = grid.adjustedRange!;
    expect(high / low).toBeLessThan(1.05);
  });

  it('is read-only for its appraiser, as a submitted file is', async () => {
    const file = await demoFile(DEMO_REVIEW_SUBJECT_ADDRESS);
    const [sale] = await db.select().from(sales).where(eq(sales.assignmentId, file.id)).limit(1);
    const res = await appraiser.patch(`/api/assignments/${file.id}/sales/${sale.id}`).send({ version: sale.version, inGrid: !sale.inGrid });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('not_editable');
  });

  it('has the timeline and audit trail of a file created, prepared and submitted by its appraiser', async () => {
    const file = await demoFile(DEMO_REVIEW_SUBJECT_ADDRESS);
    const timeline = await reviewer.get(`/api/assignments/${file.id}/timeline`);
    expect(timeline.status).toBe(200);
    const { changes } = timelineResponse.parse(timeline.body);
    expect(changes.map((c) => [c.fromStatus, c.toStatus, c.byName])).toEqual([['in_progress', 'in_review', demoUser('appraiser').name]]);
    // One write of the assignment row since it was created: the submission.
    expect(file.version).toBe(2);

    const gridSaleIds = (await db.select({ id: sales.id }).from(sales).where(and(eq(sales.assignmentId, file.id), eq(sales.inGrid, true)))).map((s) => String(s.id));
    expect(gridSaleIds).toHaveLength(3);
    const events = await db
      .select()
      .from(auditEvents)
      .where(or(and(eq(auditEvents.entityType, 'assignment'), eq(auditEvents.entityId, String(file.id))), and(eq(auditEvents.entityType, 'sale'), inArray(auditEvents.entityId, gridSaleIds))))
      .orderBy(auditEvents.id);
    expect(events.map((e) => e.action)).toEqual(['assignment-created', 'sale-updated', 'sale-updated', 'sale-updated', 'grid-settings-updated', 'status-changed']);
    const appraiserId = events[0].actorUserId;
    expect(events.every((e) => e.actorUserId === appraiserId && e.organisationId === file.firmOrganisationId)).toBe(true);
    expect(appraiserId).toBe(file.appraiserUserId);
    expect(events[0].details).toMatchObject({ subjectAddress: DEMO_REVIEW_SUBJECT_ADDRESS });
    for (const e of events.slice(1, 4)) expect(e.details).toEqual({ assignmentId: file.id, changed: { inGrid: { from: false, to: true } } });
    expect(events[5].details).toEqual({ from: 'in_progress', to: 'in_review', note: null });
    const [settings] = await db.select().from(gridSettings).where(eq(gridSettings.assignmentId, file.id));
    expect(events[4].details).toEqual({ typedRate: settings.typedRate, rateJustification: settings.rateJustification, reconciliationComment: settings.reconciliationComment });
  });
});

describe('seeding the demo again', () => {
  it('adds no assignment, sale, status change or audit event', async () => {
    const totals = async () => {
      const [a] = await db.select({ n: count() }).from(assignments);
      const [s] = await db.select({ n: count() }).from(sales);
      const [c] = await db.select({ n: count() }).from(statusChanges);
      const [e] = await db.select({ n: count() }).from(auditEvents);
      return { assignments: a.n, sales: s.n, statusChanges: c.n, auditEvents: e.n };
    };
    const before = await totals();
    await seedDemo(db);
    expect(await totals()).toEqual(before);
    expect((await demoFile(DEMO_REVIEW_SUBJECT_ADDRESS)).status).toBe('in_review');
  });
});
