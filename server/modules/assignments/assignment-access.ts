import type { SessionUser } from '../../contracts/auth';
import { conflict, notFound } from '../../errors';
import type { DbOrTx } from '../../../db/client';
import { findAssignment } from './assignments.repo';

/** Loads an assignment the user may see: the firm's own staff see the firm's assignments. Anything
 * else is "not found", so that other organisations' ids reveal nothing. */
export async function loadAssignmentFor(tx: DbOrTx, user: SessionUser, id: number) {
  const row = await findAssignment(tx, id);
  if (!row || user.organisationKind !== 'firm' || row.firmOrganisationId !== user.organisationId) {
    throw notFound('That assignment');
  }
  return row;
}

/** The subject and sales can change only while the appraiser holds the file. */
export function assertEditable(assignment: { status: string }) {
  if (assignment.status !== 'in_progress' && assignment.status !== 'revisions_requested') {
    throw conflict('This assignment is with the reviewer or already signed; its data cannot change now.', 'not_editable');
  }
}
