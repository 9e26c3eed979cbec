import { and, eq, isNull } from 'drizzle-orm';
import type { DbOrTx } from '../../../db/client';
import { photos } from '../../../db/schema/assignments';
import type { SessionUser } from '../../contracts/auth';
import { CAUTIONS, CERTIFICATION_STATEMENTS, LIMITING_CONDITIONS } from '../../contracts/report-text';
import type { ReportSnapshot } from '../../contracts/report';
import { findSubject } from '../assignments/assignments.repo';
import type { loadAssignmentFor } from '../assignments/assignment-access';
import { computeAnalysis } from '../analysis/analysis.service';
import { buildGrid } from '../grid/grid.service';
import { listQueries } from '../review/review.repo';
import { listSales } from '../sales/sales.repo';
import { canonicalJson } from './canonical-json';

type AssignmentRow = Awaited<ReturnType<typeof loadAssignmentFor>>;

export interface SigningFacts {
  licenceNumber: string;
  jurisdiction: string;
  extraordinaryAssumptions: string;
  hypotheticalConditions: string;
}

/** Gathers every input and result of the assignment into one plain object (no Dates: ISO strings),
 * computed afresh from the database rather than from any cache. */
export async function buildSnapshot(tx: DbOrTx, assignment: AssignmentRow, signer: SessionUser, facts: SigningFacts, versionNumber: number, signedAt: Date): Promise<ReportSnapshot> {
  // One after another: these share the signing transaction's connection.
  const subject = await findSubject(tx, assignment.id);
  const sales = await listSales(tx, assignment.id);
  const photoRows = await tx
    .select({ id: photos.id, saleId: photos.saleId, sha256: photos.sha256, width: photos.width, height: photos.height })
    .from(photos)
    .where(and(eq(photos.assignmentId, assignment.id), isNull(photos.deletedAt)));
  const queries = await listQueries(tx, assignment.id);
  const analysis = await computeAnalysis(assignment);
  const grid = await buildGrid(assignment);
  const snapshot: ReportSnapshot = {
    schemaVersion: 1,
    firmName: signer.organisationName,
    clientName: assignment.clientOrganisationName,
    assignment: { ...assignment, updatedAt: assignment.updatedAt.toISOString() },
    subject: subject!,
    sales: sales.map(({ updatedAt: _u, ...s }) => s),
    photos: photoRows,
    analysis,
    grid,
    queries: queries.map((q) => ({ ...q, createdAt: q.createdAt.toISOString(), messages: q.messages.map((m) => ({ ...m, createdAt: m.createdAt.toISOString() })) })),
    cautions: [...CAUTIONS],
    certification: [...CERTIFICATION_STATEMENTS],
    limitingConditions: [...LIMITING_CONDITIONS],
    extraordinaryAssumptions: facts.extraordinaryAssumptions,
    hypotheticalConditions: facts.hypotheticalConditions,
    signer: { name: signer.name, licenceNumber: facts.licenceNumber, jurisdiction: facts.jurisdiction },
    signedAt: signedAt.toISOString(),
    versionNumber,
    reconciliationComment: grid.settings.reconciliationComment,
    opinionOfValue: grid.opinionOfValue,
  };
  // Round-trip once so that the stored object is exactly what the canonical text says.
  return JSON.parse(canonicalJson(snapshot)) as ReportSnapshot;
}
