import type { DbOrTx } from '../../../db/client';
import { statusChanges } from '../../../db/schema/review';
import type { SessionUser } from '../../contracts/auth';
import type { AssignmentStatus } from '../../contracts/assignments';
import type { WorkflowAction } from '../../contracts/review';
import { audit } from '../audit/audit.service';

/** The server-enforced workflow: which action moves which status where, and who may take it.
 * Signing (approved → signed) belongs to the report module. Kept apart from the transition service
 * so that the demo seed can follow the same rules without loading the grid and the analysis. */
export const TRANSITIONS: Record<WorkflowAction, { from: readonly AssignmentStatus[]; to: AssignmentStatus; role: 'appraiser' | 'reviewer' }> = {
  submit: { from: ['in_progress', 'revisions_requested'], to: 'in_review', role: 'appraiser' },
  'request-revisions': { from: ['in_review'], to: 'revisions_requested', role: 'reviewer' },
  approve: { from: ['in_review'], to: 'approved', role: 'reviewer' },
};

/** One step of the assignment's timeline and its audit event, in the caller's transaction. */
export async function recordStatusChange(tx: DbOrTx, assignmentId: number, from: AssignmentStatus | null, to: AssignmentStatus, user: Pick<SessionUser, 'id' | 'organisationId'>, note: string | null) {
  await tx.insert(statusChanges).values({ assignmentId, fromStatus: from, toStatus: to, byUserId: user.id, note });
  await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'status-changed', entityType: 'assignment', entityId: assignmentId, details: { from, to, note } });
}
