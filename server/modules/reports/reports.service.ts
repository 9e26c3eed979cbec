import { and, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../../../db/client';
import { assignments } from '../../../db/schema/assignments';
import { reportVersions } from '../../../db/schema/delivery';
import { users } from '../../../db/schema/organisations';
import type { SessionUser } from '../../contracts/auth';
import type { ReportSnapshot, signRequest } from '../../contracts/report';
import { conflict, forbidden, notFound, staleVersion } from '../../errors';
import { enqueueMail } from '../../integrations/mail/outbox';
import { formatMoney } from '../../analysis/format-money';
import { audit } from '../audit/audit.service';
import { loadAssignmentFor } from '../assignments/assignment-access';
import { recordStatusChange } from '../review/status-changes';
import { canonicalJson, sha256Hex } from './canonical-json';
import { findBySha, findReportVersion, listReportVersions, nextVersionNumber } from './reports.repo';
import { buildSnapshot } from './snapshot';

/** Signs an approved assignment: freezes the snapshot with its fingerprint, marks it signed and
 * delivered, and e-mails the client's people with the links. */
export async function signAssignment(user: SessionUser, assignmentId: number, input: z.infer<typeof signRequest>, appOrigin: string) {
  return db.transaction(async (tx) => {
    const assignment = await loadAssignmentFor(tx, user, assignmentId);
    if (assignment.appraiserUserId !== user.id) throw forbidden('Only the assignment’s own appraiser can sign it.');
    if (assignment.status !== 'approved') throw conflict('Only an approved assignment can be signed.', 'invalid_transition');
    const [locked] = await tx
      .update(assignments)
      .set({ status: 'signed', version: sql`${assignments.version} + 1`, updatedAt: sql`now()` })
      .where(and(eq(assignments.id, assignmentId), eq(assignments.version, input.version), eq(assignments.status, 'approved')))
      .returning({ version: assignments.version });
    if (!locked) throw staleVersion('This assignment');
    await tx.update(users).set({ licenceNumber: input.licenceNumber }).where(eq(users.id, user.id));
    const versionNumber = await nextVersionNumber(tx, assignmentId);
    const snapshot = await buildSnapshot(tx, { ...assignment, status: 'signed' }, user, input, versionNumber, new Date());
    const text = canonicalJson(snapshot);
    const sha256 = sha256Hex(text);
    const [version] = await tx
      .insert(reportVersions)
      .values({ assignmentId, versionNumber, snapshot, canonicalJson: text, sha256, signedBy: user.id })
      .returning({ id: reportVersions.id });
    await recordStatusChange(tx, assignmentId, 'approved', 'signed', user, `Report version ${versionNumber} signed (SHA-256 ${sha256.slice(0, 12)}…).`);
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'report-signed', entityType: 'report_version', entityId: version.id, details: { assignmentId, versionNumber, sha256 } });
    const recipients = await tx
      .select({ email: users.email })
      .from(users)
      .where(and(eq(users.organisationId, assignment.clientOrganisationId), eq(users.role, 'client'), eq(users.active, true)));
    const value = snapshot.opinionOfValue === null ? 'see the report' : formatMoney(snapshot.opinionOfValue, assignment.currency);
    for (const r of recipients) {
      await enqueueMail(tx, {
        to: r.email,
        subject: `Appraisal report delivered: ${assignment.subjectAddress}`,
        text: `The appraisal report for ${assignment.subjectAddress} (loan ${assignment.loanReference ?? '—'}) is signed and delivered.\n\nOpinion of value: ${value} as of ${assignment.effectiveDate}.\n\nRead it: ${appOrigin}/reports/${version.id}\nDownload the PDF: ${appOrigin}/api/reports/${version.id}/pdf\n\nFingerprint (SHA-256): ${sha256}\nCheck a copy: ${appOrigin}/verify/${sha256}`,
      });
    }
    return { reportVersionId: version.id, versionNumber, sha256 };
  });
}

/** A signed assignment goes back to work as a new draft; its signed versions stay as they are. */
export async function openNewDraft(user: SessionUser, assignmentId: number, version: number, reason: string) {
  await db.transaction(async (tx) => {
    const assignment = await loadAssignmentFor(tx, user, assignmentId);
    if (assignment.status !== 'signed') throw conflict('Only a signed assignment opens a new draft.', 'not_signed');
    const [row] = await tx
      .update(assignments)
      .set({ status: 'in_progress', version: sql`${assignments.version} + 1`, updatedAt: sql`now()` })
      .where(and(eq(assignments.id, assignmentId), eq(assignments.version, version)))
      .returning({ id: assignments.id });
    if (!row) throw staleVersion('This assignment');
    await recordStatusChange(tx, assignmentId, 'signed', 'in_progress', user, `New draft opened: ${reason}`);
  });
}

/** A report version the user may read: the firm's staff, or a client of the assignment's lender. */
export async function readableVersion(user: SessionUser, id: number) {
  const row = await findReportVersion(db, id);
  const mayRead = row && (user.role === 'client' ? row.clientOrganisationId === user.organisationId : row.firmOrganisationId === user.organisationId);
  if (!row || !mayRead) throw notFound('That report');
  return row;
}

export async function reportsFor(user: SessionUser, assignmentId?: number) {
  const filter = user.role === 'client' ? { clientOrganisationId: user.organisationId } : { firmOrganisationId: user.organisationId };
  const rows = await listReportVersions(db, { ...filter, assignmentId });
  return rows.map((r) => {
    const s = r.snapshot as ReportSnapshot;
    return {
      id: r.id,
      assignmentId: r.assignmentId,
      versionNumber: r.versionNumber,
      subjectAddress: s.assignment.subjectAddress,
      clientName: s.clientName,
      opinionOfValue: s.opinionOfValue,
      currency: s.assignment.currency,
      effectiveDate: s.assignment.effectiveDate,
      sha256: r.sha256,
      signedAt: r.signedAt,
      signerName: r.signerName,
    };
  });
}

/** Anyone with the fingerprint can check that a report with it was signed, and what it says. */
export async function verifyFingerprint(sha256: string) {
  const row = await findBySha(db, sha256.toLowerCase());
  if (!row) return { found: false, report: null };
  const s = row.snapshot as ReportSnapshot;
  return {
    found: true,
    report: { subjectAddress: s.assignment.subjectAddress, versionNumber: row.versionNumber, signedAt: row.signedAt, signerName: row.signerName, opinionOfValue: s.opinionOfValue, currency: s.assignment.currency, effectiveDate: s.assignment.effectiveDate },
  };
}
