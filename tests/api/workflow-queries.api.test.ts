import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { queryMessages } from '../../db/schema/review';
import { analysisWireResponse, type Analysis } from '../../server/contracts/analysis';
import { queryListResponse } from '../../server/contracts/review';
import { createOrganisation, createUser } from '../factories/accounts';
import { saleRow } from '../factories/assignments';
import { assignmentRow, createWorkflowAssignment, createWorkflowWorld, linksIn, takeAction, workflowState, type WorkflowWorld } from '../factories/workflow';
import { mailTo } from '../setup/mailbox';
import { expectErrorEnvelope, signedInAgent, startTestApi, stopTestApi, type Agent, type TestApi } from '../setup/test-api';

/** Review queries (product journey 5): open queries block approval, an excluded sale leaves every
 * fit and the grid while a kept one stays, and each step e-mails the person who acts next. */

let api: TestApi;
let world: WorkflowWorld;
beforeAll(async () => {
  api = await startTestApi();
  world = await createWorkflowWorld(api);
});
afterAll(async () => {
  await stopTestApi(api);
});

async function raise(reviewer: Agent, assignmentId: number, saleId: number | null, body = 'Is the floor area of this sale verified?') {
  const res = await reviewer.post(`/api/assignments/${assignmentId}/queries`).send({ saleId, body });
  expect(res.status, res.text).toBe(201);
  return res.body.query as { id: number; version: number; status: string };
}

async function queryById(agent: Agent, assignmentId: number, queryId: number) {
  const res = await agent.get(`/api/assignments/${assignmentId}/queries`);
  expect(res.status).toBe(200);
  const query = queryListResponse.parse(res.body).queries.find((q) => q.id === queryId);
  if (!query) throw new Error(`query ${queryId} is not listed`);
  return query;
}

async function analysisOf(assignmentId: number): Promise<Analysis> {
  const res = await world.agents.reviewer.get(`/api/assignments/${assignmentId}/analysis`);
  expect(res.status).toBe(200);
  return analysisWireResponse.parse(res.body);
}

/** Every sale id the analysis uses anywhere: the points of every group (pooled too) and of every trend. */
function usedSaleIds(analysis: Analysis): Set<number> {
  return new Set([...analysis.groups.flatMap((g) => g.points.map((p) => p.saleId)), ...analysis.trends.flatMap((t) => t.points.map((p) => p.saleId))]);
}

const subjectGroupN = (analysis: Analysis) => analysis.groups.find((g) => g.neighbourhood === analysis.subjectGroup && !g.pooled)?.n;

describe('approval while a query is unresolved', () => {
  it('is refused while the query is open and while it is answered, and goes through once it is resolved', async () => {
    const assignment = await createWorkflowAssignment(world, 'in_review');
    const query = await raise(world.agents.reviewer, assignment.id, assignment.saleIds[0]);
    expect(query.status).toBe('open');

    const approveNow = async () => takeAction(world.agents.reviewer, assignment.id, 'approve', (await assignmentRow(assignment.id)).version);
    const refusedWhile = async () => {
      const before = await workflowState(assignment.id);
      const res = await approveNow();
      expect(res.status).toBe(409);
      expect(expectErrorEnvelope(res).code).toBe('open_queries');
      expect(await workflowState(assignment.id)).toEqual(before);
    };
    await refusedWhile();

    const answer = await world.agents.appraiser
      .post(`/api/queries/${query.id}/answer`)
      .send({ action: 'keep', explanation: 'Measured on site; the registry figure matches the plans.', version: query.version });
    expect(answer.status, answer.text).toBe(200);
    const answered = await queryById(world.agents.reviewer, assignment.id, query.id);
    expect(answered.status).toBe('answered');
    await refusedWhile();

    const resolve = await world.agents.reviewer.post(`/api/queries/${query.id}/resolve`).send({ version: answered.version, body: 'Accepted.' });
    expect(resolve.status, resolve.text).toBe(200);
    expect((await queryById(world.agents.reviewer, assignment.id, query.id)).status).toBe('resolved');
    const res = await approveNow();
    expect(res.status, res.text).toBe(200);
    expect((await assignmentRow(assignment.id)).status).toBe('approved');
  });
});

describe('answering a query on a sale', () => {
  const REASON = 'Sold between relatives below the market; the deed notes a family transfer.';

  it('exclude: the sale is struck out with its reason, leaves the grid and every fit, and n drops by one', async () => {
    const assignment = await createWorkflowAssignment(world, 'in_review');
    const target = assignment.gridSaleIds[1];
    const before = await analysisOf(assignment.id);
    expect(usedSaleIds(before).has(target)).toBe(true);
    const nBefore = subjectGroupN(before)!;
    expect(nBefore).toBe(assignment.saleIds.length);

    const query = await raise(world.agents.reviewer, assignment.id, target);
    const res = await world.agents.appraiser.post(`/api/queries/${query.id}/answer`).send({ action: 'exclude', explanation: REASON, version: query.version });
    expect(res.status, res.text).toBe(200);

    const sale = await saleRow(target);
    expect(sale).toMatchObject({ excluded: true, exclusionReason: REASON, inGrid: false });
    const after = await analysisOf(assignment.id);
    expect(usedSaleIds(after).has(target)).toBe(false);
    expect(Object.keys(after.adjustedPrices)).not.toContain(String(target));
    expect(subjectGroupN(after)).toBe(nBefore - 1);
    expect(after.excluded).toContainEqual({ saleId: target, address: assignment.addresses.get(target), reason: REASON });
    const grid = await world.agents.reviewer.get(`/api/assignments/${assignment.id}/grid`);
    expect(grid.body.rows.map((r: { saleId: number }) => r.saleId)).not.toContain(target);
    const thread = await queryById(world.agents.reviewer, assignment.id, query.id);
    expect(thread.status).toBe('answered');
    expect(thread.messages.map((m) => m.kind)).toEqual(['question', 'excluded']);
  });

  it('keep: the sale stays in the grid and the fit', async () => {
    const assignment = await createWorkflowAssignment(world, 'in_review');
    const target = assignment.gridSaleIds[0];
    const nBefore = subjectGroupN(await analysisOf(assignment.id));
    const query = await raise(world.agents.reviewer, assignment.id, target);
    const res = await world.agents.appraiser
      .post(`/api/queries/${query.id}/answer`)
      .send({ action: 'keep', explanation: 'An open-market sale after six weeks listed; confirmed with the agent.', version: query.version });
    expect(res.status, res.text).toBe(200);
    expect(await saleRow(target)).toMatchObject({ excluded: false, exclusionReason: null, inGrid: true });
    const after = await analysisOf(assignment.id);
    expect(usedSaleIds(after).has(target)).toBe(true);
    expect(subjectGroupN(after)).toBe(nBefore);
    expect(after.excluded.map((e) => e.saleId)).not.toContain(target);
  });

  it('exclude on a query about the assignment as a whole is refused with 400 and changes nothing', async () => {
    const assignment = await createWorkflowAssignment(world, 'in_review');
    const query = await raise(world.agents.reviewer, assignment.id, null, 'Why is the time adjustment switched off?');
    const before = await workflowState(assignment.id);
    const res = await world.agents.appraiser.post(`/api/queries/${query.id}/answer`).send({ action: 'exclude', explanation: REASON, version: query.version });
    expect(res.status).toBe(400);
    expect(expectErrorEnvelope(res).fields).toHaveProperty('action');
    expect(await workflowState(assignment.id)).toEqual(before);
    const thread = await queryById(world.agents.reviewer, assignment.id, query.id);
    expect(thread).toMatchObject({ status: 'open', version: query.version });
    expect(await db.select().from(queryMessages).where(eq(queryMessages.queryId, query.id))).toHaveLength(1);
    for (const saleId of assignment.saleIds) expect((await saleRow(saleId)).excluded).toBe(false);
  });
});

describe('e-mails along the workflow', () => {
  it('go to the firm’s active reviewers on submission, then to whoever acts next, each linking to the assignment', async () => {
    const firm = await createOrganisation('firm');
    const appraiser = await createUser({ role: 'appraiser', organisation: firm });
    const raiser = await createUser({ role: 'reviewer', organisation: firm });
    const colleague = await createUser({ role: 'reviewer', organisation: firm });
    const departed = await createUser({ role: 'reviewer', organisation: firm, active: false });
    const appraiserAgent = await signedInAgent(api, appraiser);
    const raiserAgent = await signedInAgent(api, raiser);
    const local: WorkflowWorld = { ...world, appraiser, reviewer: raiser, agents: { ...world.agents, appraiser: appraiserAgent, reviewer: raiserAgent } };
    const assignment = await createWorkflowAssignment(local, 'in_progress');
    const version = async () => (await assignmentRow(assignment.id)).version;

    const expectMail = async (email: string, count: number, subject?: RegExp) => {
      const messages = await mailTo(email);
      expect(messages, `mail to ${email}`).toHaveLength(count);
      if (count === 0) return;
      if (subject) expect(messages[0].subject).toMatch(subject);
      const links = linksIn(messages[0].textBody);
      expect(links.length).toBeGreaterThan(0);
      expect(links.some((url) => url.pathname.split('/').includes(String(assignment.id)))).toBe(true);
    };

    expect((await takeAction(appraiserAgent, assignment.id, 'submit', await version())).status).toBe(200);
    await expectMail(raiser.email, 1, /Ready for review/);
    await expectMail(colleague.email, 1, /Ready for review/);
    await expectMail(departed.email, 0);
    await expectMail(appraiser.email, 0);

    const query = await raise(raiserAgent, assignment.id, assignment.saleIds[2]);
    await expectMail(appraiser.email, 1, /Query/);

    const answer = await appraiserAgent
      .post(`/api/queries/${query.id}/answer`)
      .send({ action: 'keep', explanation: 'Verified against the deed and the listing sheet.', version: query.version });
    expect(answer.status).toBe(200);
    await expectMail(raiser.email, 2, /Query answered/);
    await expectMail(colleague.email, 1);

    const note = 'Add a line item for the garage of 22 Signal Row.';
    expect((await takeAction(raiserAgent, assignment.id, 'request-revisions', await version(), note)).status).toBe(200);
    await expectMail(appraiser.email, 2, /Revisions requested/);
    expect((await mailTo(appraiser.email))[0].textBody).toContain(note);

    expect((await takeAction(appraiserAgent, assignment.id, 'submit', await version())).status).toBe(200);
    await expectMail(raiser.email, 3, /Ready for review/);
    await expectMail(colleague.email, 2, /Ready for review/);
    const answered = await queryById(raiserAgent, assignment.id, query.id);
    expect((await raiserAgent.post(`/api/queries/${query.id}/resolve`).send({ version: answered.version })).status).toBe(200);
    expect((await takeAction(raiserAgent, assignment.id, 'approve', await version())).status).toBe(200);
    await expectMail(appraiser.email, 3, /Approved/);
    await expectMail(departed.email, 0);
  });
});
