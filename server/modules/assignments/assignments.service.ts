import { and, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db, type DbOrTx } from '../../../db/client';
import { assignments, subjects } from '../../../db/schema/assignments';
import type { SessionUser } from '../../contracts/auth';
import type { assignmentInput, assignmentUpdate, subjectUpdate } from '../../contracts/assignments';
import { staleVersion, unprocessable } from '../../errors';
import { audit } from '../audit/audit.service';
import { findOrganisation } from '../users/users.repo';
import { assertEditable, loadAssignmentFor } from './assignment-access';
import { bumpDataRevision, findAssignment, findSubject } from './assignments.repo';
import { neighbourhoodAt } from './neighbourhood-lookup';

async function checkClientOrganisation(id: number) {
  const org = await findOrganisation(db, id);
  if (!org || org.kind !== 'lender') {
    throw unprocessable('Pick the lender client of this assignment.', { clientOrganisationId: 'Not a lender client.' });
  }
}

/** Inserts an assignment with its empty subject row and the audit event, in the caller's
 * transaction (also used when the firm accepts a client's order). Returns the new id. */
export async function insertAssignment(tx: DbOrTx, actor: SessionUser, values: typeof assignments.$inferInsert, details: Record<string, unknown>): Promise<number> {
  const [row] = await tx.insert(assignments).values(values).returning({ id: assignments.id });
  await tx.insert(subjects).values({ assignmentId: row.id });
  await audit(tx, { actorUserId: actor.id, organisationId: actor.organisationId, action: 'assignment-created', entityType: 'assignment', entityId: row.id, details });
  return row.id;
}

export async function createAssignment(user: SessionUser, input: z.infer<typeof assignmentInput>) {
  await checkClientOrganisation(input.clientOrganisationId);
  return db.transaction(async (tx) => {
    const id = await insertAssignment(tx, user, { ...input, firmOrganisationId: user.organisationId, appraiserUserId: user.id }, { ...input });
    return (await findAssignment(tx, id))!;
  });
}

export async function getAssignmentDetail(user: SessionUser, id: number) {
  const assignment = await loadAssignmentFor(db, user, id);
  const subject = (await findSubject(db, id))!;
  return { assignment, subject };
}

export async function updateAssignment(user: SessionUser, id: number, input: z.infer<typeof assignmentUpdate>) {
  if (input.clientOrganisationId) await checkClientOrganisation(input.clientOrganisationId);
  return db.transaction(async (tx) => {
    const before = await loadAssignmentFor(tx, user, id);
    assertEditable(before);
    const { version, ...changes } = input;
    const [updated] = await tx
      .update(assignments)
      .set({ ...changes, version: sql`${assignments.version} + 1`, dataRevision: sql`${assignments.dataRevision} + 1`, updatedAt: sql`now()` })
      .where(and(eq(assignments.id, id), eq(assignments.version, version)))
      .returning({ id: assignments.id });
    if (!updated) throw staleVersion('This assignment');
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'assignment-updated', entityType: 'assignment', entityId: id, details: changes });
    return (await findAssignment(tx, id))!;
  });
}

export async function updateSubject(user: SessionUser, assignmentId: number, input: z.infer<typeof subjectUpdate>) {
  return db.transaction(async (tx) => {
    assertEditable(await loadAssignmentFor(tx, user, assignmentId));
    const { version, ...changes } = input;
    // A new location picks the neighbourhood from the map's boundaries unless the appraiser typed one.
    if (changes.lon != null && changes.lat != null && changes.neighbourhood === undefined) {
      changes.neighbourhood = neighbourhoodAt(changes.lon, changes.lat);
    }
    const [updated] = await tx
      .update(subjects)
      .set({ ...changes, version: sql`${subjects.version} + 1`, updatedAt: sql`now()` })
      .where(and(eq(subjects.assignmentId, assignmentId), eq(subjects.version, version)))
      .returning();
    if (!updated) throw staleVersion('The subject');
    await bumpDataRevision(tx, assignmentId);
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'subject-updated', entityType: 'assignment', entityId: assignmentId, details: changes });
    return updated;
  });
}
