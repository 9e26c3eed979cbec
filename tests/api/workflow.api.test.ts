import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { assignments } from '../../db/schema/assignments';
import { auditEvents } from '../../db/schema/audit';
import { timelineResponse } from '../../server/contracts/review';
import { createUser } from '../factories/accounts';
import type { AssignmentStatus } from '../factories/assignments';
import { assignmentRow, createWorkflowAssignment, createWorkflowWorld, takeAction, workflowState, type Action, type WorkflowWorld } from '../factories/workflow';
import { expectErrorEnvelope, signedInAgent, startTestApi, stopTestApi, type TestApi } from '../setup/test-api';

/** The review workflow (product journey 5, "Records"): every step by every role from every status,
 * what a refused step leaves behind (nothing), what submission and revisions require, and stale writes. */

let api: TestApi;
let world: WorkflowWorld;
beforeAll(async () => {
  api = await startTestApi();
  world = await createWorkflowWorld(api);
});
afterAll(async () => {
  await stopTestApi(api);
});

const STATUSES: AssignmentStatus[] = ['in_progress', 'in_review', 'revisions_requested', 'approved', 'signed'];
const ACTIONS: Action[] = ['submit', 'request-revisions', 'approve', 'sign'];
type RoleKey = keyof WorkflowWorld['agents'];
const ROLES: RoleKey[] = ['appraiser', 'reviewer', 'admin', 'client', 'outsider'];

/** The workflow as the product describes it, written out here rather than read from the server. */
const RULES: Record<Action, { from: AssignmentStatus[]; to: AssignmentStatus; by: RoleKey }> = {
  submit: { from: ['in_progress', 'revisions_requested'], to: 'in_review', by: 'appraiser' },
  'request-revisions': { from: ['in_review'], to: 'revisions_requested', by: 'reviewer' },
  approve: { from: ['in_review'], to: 'approved', by: 'reviewer' },
  sign: { from: ['approved'], to: 'signed', by: 'appraiser' },
};

type Outcome = { status: number; code?: string };

function expected(action: Action, from: AssignmentStatus, role: RoleKey): Outcome {
  // The route guards refuse a client and an admin before anything is looked up.
  if (role === 'client' || role === 'admin') return { status: 403, code: 'forbidden' };
  // Another firm's assignment does not exist for its appraiser, whatever the step.
  if (role === 'outsider') return { status: 404, code: 'not_found' };
  const rule = RULES[action];
  if (role !== rule.by) return { status: 403, code: 'forbidden' };
  if (!rule.from.includes(from)) return { status: 409, code: 'invalid_transition' };
  return { status: action === 'sign' ? 201 : 200 };
}

const NOTE = 'Explain the floor-area rate against the paired sales on Signal Row.';

describe('every step by every role from every status', () => {
  for (const action of ACTIONS) {
    for (const from of STATUSES) {
      for (const role of ROLES) {
        const outcome = expected(action, from, role);
        const label = outcome.code ? `refused ${outcome.status} ${outcome.code}` : `moves to ${RULES[action].to}`;
        it(`${action} from ${from} by ${role === 'outsider' ? 'another firm’s appraiser' : `the ${role}`}: ${label}`, async () => {
          const assignment = await createWorkflowAssignment(world, from);
          const before = await workflowState(assignment.id);
          const res = await takeAction(world.agents[role], assignment.id, action, before.version, action === 'request-revisions' ? NOTE : undefined);
          expect(res.status, res.text).toBe(outcome.status);
          const after = await workflowState(assignment.id);
          const timeline = await world.agents.reviewer.get(`/api/assignments/${assignment.id}/timeline`);
          expect(timeline.status).toBe(200);
          const changes = timelineResponse.parse(timeline.body).changes;

          if (outcome.code) {
            expect(expectErrorEnvelope(res).code).toBe(outcome.code);
            expect(after).toEqual(before);
            expect(after.statusChanges).toBe(0);
            expect(changes).toEqual([]);
            return;
          }
          const to = RULES[action].to;
          if (action !== 'sign') expect(res.body).toEqual({ status: to, version: before.version + 1 });
          expect(after.status).toBe(to);
          expect(after.version).toBe(before.version + 1);
          expect(changes).toHaveLength(1);
          expect(changes[0]).toMatchObject({ fromStatus: from, toStatus: to, byName: world[role].name });
          if (action === 'request-revisions') expect(changes[0].note).toBe(NOTE);
          const audits = await db
            .select()
            .from(auditEvents)
            .where(and(eq(auditEvents.action, 'status-changed'), eq(auditEvents.entityType, 'assignment'), eq(auditEvents.entityId, String(assignment.id))));
          expect(audits).toHaveLength(1);
          expect(audits[0]).toMatchObject({ actorUserId: world[role].id, details: { from, to } });
        });
      }
    }
  }
});

describe('signing belongs to the assignment’s own appraiser', () => {
  it('refuses another appraiser of the same firm with 403 and changes nothing', async () => {
    const colleague = await createUser({ role: 'appraiser', organisation: world.appraiser.organisation });
    const colleagueAgent = await signedInAgent(api, colleague);
    const assignment = await createWorkflowAssignment(world, 'approved');
    const before = await workflowState(assignment.id);
    const res = await takeAction(colleagueAgent, assignment.id, 'sign', before.version);
    expect(res.status).toBe(403);
    expect(expectErrorEnvelope(res).code).toBe('forbidden');
    expect(await workflowState(assignment.id)).toEqual(before);
  });
});

describe('submission needs a complete grid', () => {
  it('is refused with 422 naming the reconciliation comment when only that is missing, and changes nothing', async () => {
    const assignment = await createWorkflowAssignment(world, 'in_progress', 'no-comment');
    const before = await workflowState(assignment.id);
    const res = await takeAction(world.agents.appraiser, assignment.id, 'submit', before.version);
    expect(res.status).toBe(422);
    const error = expectErrorEnvelope(res);
    expect(error.fields?.grid).toBe('A reconciliation comment.');
    expect(error.message).toContain('A reconciliation comment.');
    expect(await workflowState(assignment.id)).toEqual(before);
  });

  it('lists everything missing on an empty assignment: floor area, rate, grid sales and comment', async () => {
    const assignment = await createWorkflowAssignment(world, 'revisions_requested', 'none');
    const before = await workflowState(assignment.id);
    const res = await takeAction(world.agents.appraiser, assignment.id, 'submit', before.version);
    expect(res.status).toBe(422);
    const listed = expectErrorEnvelope(res).fields?.grid ?? '';
    for (const part of ['floor area', 'floor-area rate', 'At least one sale marked for the grid', 'A reconciliation comment']) expect(listed).toContain(part);
    expect(await workflowState(assignment.id)).toEqual(before);
  });

  it('goes through once the missing comment is written', async () => {
    const assignment = await createWorkflowAssignment(world, 'in_progress', 'no-comment');
    const version = (await assignmentRow(assignment.id)).version;
    expect((await takeAction(world.agents.appraiser, assignment.id, 'submit', version)).status).toBe(422);
    const grid = await world.agents.appraiser.get(`/api/assignments/${assignment.id}/grid`);
    expect(grid.body.missing).toEqual(['A reconciliation comment.']);
    const put = await world.agents.appraiser
      .put(`/api/assignments/${assignment.id}/grid/settings`)
      .send({ reconciliationComment: 'All three grid sales bracket the subject; most weight on the nearest in size.', version: grid.body.settings.version });
    expect(put.status, put.text).toBe(200);
    const res = await takeAction(world.agents.appraiser, assignment.id, 'submit', version);
    expect(res.status, res.text).toBe(200);
    expect((await assignmentRow(assignment.id)).status).toBe('in_review');
  });
});

describe('requesting revisions needs a note', () => {
  for (const note of [undefined, '', '   ']) {
    it(`is refused with 422 when the note is ${note === undefined ? 'left out' : JSON.stringify(note)}, and changes nothing`, async () => {
      const assignment = await createWorkflowAssignment(world, 'in_review');
      const before = await workflowState(assignment.id);
      const res = await takeAction(world.agents.reviewer, assignment.id, 'request-revisions', before.version, note);
      expect(res.status).toBe(422);
      expect(expectErrorEnvelope(res).fields).toEqual({ note: 'Required.' });
      expect(await workflowState(assignment.id)).toEqual(before);
    });
  }
});

describe('a stale version', () => {
  const cases: Array<{ action: Action; from: AssignmentStatus; by: 'appraiser' | 'reviewer' }> = [
    { action: 'submit', from: 'in_progress', by: 'appraiser' },
    { action: 'request-revisions', from: 'in_review', by: 'reviewer' },
    { action: 'approve', from: 'in_review', by: 'reviewer' },
    { action: 'sign', from: 'approved', by: 'appraiser' },
  ];
  for (const { action, from, by } of cases) {
    it(`${action}: 409 stale_version when someone else changed the assignment first, and nothing changes`, async () => {
      const assignment = await createWorkflowAssignment(world, from);
      const opened = (await assignmentRow(assignment.id)).version;
      // Someone else's edit lands between opening the page and pressing the button.
      await db.update(assignments).set({ version: opened + 1 }).where(eq(assignments.id, assignment.id));
      const before = await workflowState(assignment.id);
      const res = await takeAction(world.agents[by], assignment.id, action, opened, NOTE);
      expect(res.status).toBe(409);
      expect(expectErrorEnvelope(res).code).toBe('stale_version');
      expect(await workflowState(assignment.id)).toEqual(before);
      expect(before.status).toBe(from);
      // The same step with the current version goes through.
      const retry = await takeAction(world.agents[by], assignment.id, action, opened + 1, NOTE);
      expect(retry.status, retry.text).toBe(action === 'sign' ? 201 : 200);
      expect((await assignmentRow(assignment.id)).status).toBe(RULES[action].to);
    });
  }
});
