import { and, desc, eq, max, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../../db/client';
import { assignments } from '../../../db/schema/assignments';
import { reportVersions } from '../../../db/schema/delivery';
import { users } from '../../../db/schema/organisations';

const summaryColumns = {
  id: reportVersions.id,
  assignmentId: reportVersions.assignmentId,
  versionNumber: reportVersions.versionNumber,
  sha256: reportVersions.sha256,
  signedAt: reportVersions.signedAt,
  signerName: users.name,
  firmOrganisationId: assignments.firmOrganisationId,
  clientOrganisationId: assignments.clientOrganisationId,
  snapshot: reportVersions.snapshot,
};

export async function listReportVersions(tx: DbOrTx, filter: { firmOrganisationId?: number; clientOrganisationId?: number; assignmentId?: number }) {
  const conditions = [
    filter.firmOrganisationId !== undefined ? eq(assignments.firmOrganisationId, filter.firmOrganisationId) : undefined,
    filter.clientOrganisationId !== undefined ? eq(assignments.clientOrganisationId, filter.clientOrganisationId) : undefined,
    filter.assignmentId !== undefined ? eq(reportVersions.assignmentId, filter.assignmentId) : undefined,
  ].filter((c) => c !== undefined);
  return tx
    .select(summaryColumns)
    .from(reportVersions)
    .innerJoin(assignments, eq(assignments.id, reportVersions.assignmentId))
    .innerJoin(users, eq(users.id, reportVersions.signedBy))
    .where(and(...conditions))
    .orderBy(desc(reportVersions.signedAt));
}

export async function findReportVersion(tx: DbOrTx, id: number) {
  const [row] = await tx
    .select({ ...summaryColumns, canonicalJson: reportVersions.canonicalJson })
    .from(reportVersions)
    .innerJoin(assignments, eq(assignments.id, reportVersions.assignmentId))
    .innerJoin(users, eq(users.id, reportVersions.signedBy))
    .where(eq(reportVersions.id, id));
  return row;
}

export async function findBySha(tx: DbOrTx, sha256: string) {
  const [row] = await tx
    .select(summaryColumns)
    .from(reportVersions)
    .innerJoin(assignments, eq(assignments.id, reportVersions.assignmentId))
    .innerJoin(users, eq(users.id, reportVersions.signedBy))
    .where(eq(reportVersions.sha256, sha256));
  return row;
}

export async function nextVersionNumber(tx: DbOrTx, assignmentId: number): Promise<number> {
  const [row] = await tx.select({ n: max(reportVersions.versionNumber) }).from(reportVersions).where(eq(reportVersions.assignmentId, assignmentId));
  return (row?.n ?? 0) + 1;
}

/** Whether a signed version of the assignment froze this photo: its files must then stay, because
 * the old report still shows them. */
export async function photoFrozenInReport(tx: DbOrTx, assignmentId: number, photoId: number): Promise<boolean> {
  const [row] = await tx
    .select({ id: reportVersions.id })
    .from(reportVersions)
    .where(and(eq(reportVersions.assignmentId, assignmentId), sql`${reportVersions.snapshot} -> 'photos' @> ${JSON.stringify([{ id: photoId }])}::jsonb`))
    .limit(1);
  return row !== undefined;
}
