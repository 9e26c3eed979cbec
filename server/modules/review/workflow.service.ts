import { and, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../../../db/client';
import { assignments } from '../../../db/schema/assignments';
import type { SessionUser } from '../../contracts/auth';
import { statusLabels } from '../../contracts/assignments';
import type { transitionRequest, WorkflowAction } from '../../contracts/review';
import { conflict, forbidden, staleVersion, unprocessable } from '../../errors';
import { enqueueMail } from '../../integrations/mail/outbox';
import { loadAssignmentFor } from '../assignments/assignment-access';
import { buildGrid } from '../grid/grid.service';
import { activeFirmUsers, unresolvedQueryCount, userById } from './review.repo';
import { recordStatusChange, TRANSITIONS } from './status-changes';

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
