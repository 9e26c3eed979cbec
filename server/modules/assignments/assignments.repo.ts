import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { db, type DbOrTx } from '../../../db/client';
import { assignments, sales, subjects } from '../../../db/schema/assignments';
import { organisations, users } from '../../../db/schema/organisations';

const clientOrg = alias(organisations, 'client_org');

const assignmentColumns = {
  id: assignments.id,
  firmOrganisationId: assignments.firmOrganisationId,
  subjectAddress: assignments.subjectAddress,
  intendedUse: assignments.intendedUse,
  loanReference: assignments.loanReference,
  clientOrganisationId: assignments.clientOrganisationId,
  clientOrganisationName: clientOrg.name,
  appraiserUserId: assignments.appraiserUserId,
  appraiserName: users.name,
  effectiveDate: assignments.effectiveDate,
  dueDate: assignments.dueDate,
  areaUnit: assignments.areaUnit,
  currency: assignments.currency,
  status: assignments.status,
  timeAdjustment: assignments.timeAdjustment,
  version: assignments.version,
  dataRevision: assignments.dataRevision,
  updatedAt: assignments.updatedAt,
};

function selectAssignments(tx: DbOrTx) {
  return tx
    .select(assignmentColumns)
    .from(assignments)
    .innerJoin(clientOrg, eq(clientOrg.id, assignments.clientOrganisationId))
    .innerJoin(users, eq(users.id, assignments.appraiserUserId));
}

export type AssignmentRow = Awaited<ReturnType<typeof findAssignment>> & {};

/** Every per-assignment request reads its assignment first (access check, data revision): outside
 * a transaction it runs as a named prepared statement, so neither Drizzle nor PostgreSQL plans it
 * again each time. */
const findAssignmentStatement = selectAssignments(db)
  .where(and(eq(assignments.id, sql.placeholder('id')), isNull(assignments.archivedAt)))
  .prepare('compline_find_assignment');

export async function findAssignment(tx: DbOrTx, id: number) {
  const [row] =
    tx === db
      ? await findAssignmentStatement.execute({ id })
      : await selectAssignments(tx).where(and(eq(assignments.id, id), isNull(assignments.archivedAt)));
  return row;
}

export async function listFirmAssignments(firmOrganisationId: number) {
  const saleCount = sql<number>`(select count(*)::int from ${sales} where ${sales.assignmentId} = ${assignments.id} and ${sales.deletedAt} is null)`;
  return db
    .select({ ...assignmentColumns, saleCount })
    .from(assignments)
    .innerJoin(clientOrg, eq(clientOrg.id, assignments.clientOrganisationId))
    .innerJoin(users, eq(users.id, assignments.appraiserUserId))
    .where(and(eq(assignments.firmOrganisationId, firmOrganisationId), isNull(assignments.archivedAt)))
    .orderBy(desc(assignments.updatedAt));
}

export async function findSubject(tx: DbOrTx, assignmentId: number) {
  const [row] = await tx.select().from(subjects).where(eq(subjects.assignmentId, assignmentId));
  return row;
}

/** Marks the assignment's data as changed (subject or sales): the cached analysis is keyed on it. */
export async function bumpDataRevision(tx: DbOrTx, assignmentId: number): Promise<number> {
  const [row] = await tx
    .update(assignments)
    .set({ dataRevision: sql`${assignments.dataRevision} + 1`, updatedAt: sql`now()` })
    .where(eq(assignments.id, assignmentId))
    .returning({ dataRevision: assignments.dataRevision });
  return row.dataRevision;
}
