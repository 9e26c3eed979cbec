import { and, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db, type DbOrTx } from '../../../db/client';
import { assignments } from '../../../db/schema/assignments';
import { statusChanges } from '../../../db/schema/review';
import type { SessionUser } from '../../contracts/auth';
import { statusLabels, type AssignmentStatus } from '../../contracts/assignments';
import type { transitionRequest, WorkflowAction } from '../../contracts/review';
import { conflict, forbidden, staleVersion, unprocessable } from '../../errors';
import { enqueueMail } from '../../integrations/mail/outbox';
import { audit } from '../audit/audit.service';
import { loadAssignmentFor } from '../assignments/assignment-access';
import { buildGrid } from '../grid/grid.service';
import { activeFirmUsers, unresolvedQueryCount, userById } from './review.repo';

/** The server-enforced workflow: which action moves which status where, and who may take it.
 * Signing (approved → signed) belongs to the report module. */
export const TRANSITIONS: Record<WorkflowAction, { from: readonly AssignmentStatus[]; to: AssignmentStatus; role: 'appraiser' | 'reviewer' }> = {
  submit: { from: ['in_progress', 'revisions_requested'], to: 'in_review', role: 'appraiser' },
  'request-revisions': { from: ['in_review'], to: 'revisions_requested', role: 'reviewer' },
  approve: { from: ['in_review'], to: 'approved', role: 'reviewer' },
};

export async function recordStatusChange(tx: DbOrTx, assignmentId: number, from: AssignmentStatus | null, to: AssignmentStatus, user: SessionUser, note: string | null) {
  await tx.insert(statusChanges).values({ assignmentId, fromStatus: from, toStatus: to, byUserId: user.id, note });
  await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'status-changed', entityType: 'assignment', entityId: assignmentId, details: { from, to, note } });
}

export async function transition(user: SessionUser, assignmentId: number, input: z.infer<typeof transitionRequest>, appOrigin: string) {
  const rule = TRANSITIONS[input.action];
  // Another firm's assignment is "not found" whatever the action: look it up before judging the role.
  const assignment = await loadAssignmentFor(db, user, assignmentId);
  if (user.role !== rule.role) throw forbidden(`Only the ${rule.role} can ${input.action.replace('-', ' ')}.`);
  if (!rule.from.includes(assignment.status)) {
    throw conflict(`An assignment that is “${statusLabels[assignment.status].toLowerCase()}” cannot be moved that way.`, 'invalid_transition');
  }
  if (input.action === 'submit') {
    const grid = await buildGrid(assignment);
    if (grid.missing.length) throw unprocessable(`Before submitting, complete: ${grid.missing.join(' ')}`, { grid: grid.missing.join(' ') });
  }
  if (input.action === 'request-revisions' && !input.note) throw unprocessable('Say what needs revising.', { note: 'Required.' });
  return db.transaction(async (tx) => {
    if (input.action === 'approve' && (await unresolvedQueryCount(tx, assignmentId)) > 0) {
      throw conflict('Resolve every query before approving.', 'open_queries');
    }
    const [updated] = await tx
      .update(assignments)
      .set({ status: rule.to, version: sql`${assignments.version} + 1`, updatedAt: sql`now()` })
      .where(and(eq(assignments.id, assignmentId), eq(assignments.version, input.version), eq(assignments.status, assignment.status)))
      .returning({ version: assignments.version });
    if (!updated) throw staleVersion('This assignment');
    await recordStatusChange(tx, assignmentId, assignment.status, rule.to, user, input.note ?? null);
    const link = `${appOrigin}/assignments/${assignmentId}/${input.action === 'submit' ? 'review' : 'adjustments'}`;
    const recipients = input.action === 'submit' ? await activeFirmUsers(tx, assignment.firmOrganisationId, 'reviewer') : [await userById(tx, assignment.appraiserUserId)];
    const subjects: Record<WorkflowAction, string> = {
      submit: `Ready for review: ${assignment.subjectAddress}`,
      'request-revisions': `Revisions requested: ${assignment.subjectAddress}`,
      approve: `Approved — ready to sign: ${assignment.subjectAddress}`,
    };
    for (const r of recipients) {
      await enqueueMail(tx, {
        to: r.email,
        subject: subjects[input.action],
        text: `${user.name} moved ${assignment.subjectAddress} to “${statusLabels[rule.to]}”.${input.note ? `\n\nNote: ${input.note}` : ''}\n\nOpen it: ${link}`,
      });
    }
    return { status: rule.to, version: updated.version };
  });
}
