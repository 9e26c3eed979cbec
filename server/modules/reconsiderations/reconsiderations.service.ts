import { and, desc, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../../../db/client';
import { assignments, sales } from '../../../db/schema/assignments';
import { reconsiderations } from '../../../db/schema/delivery';
import { users } from '../../../db/schema/organisations';
import type { SessionUser } from '../../contracts/auth';
import type { ReportSnapshot } from '../../contracts/report';
import type { reconsiderationRequest, reconsiderationResponseRequest } from '../../contracts/reconsiderations';
import { saleFields, type SaleFields } from '../../contracts/sales';
import { analyseMarket, type AnalysisSale } from '../../analysis/market-analysis';
import { conflict, notFound, staleVersion } from '../../errors';
import { enqueueMail } from '../../integrations/mail/outbox';
import { audit } from '../audit/audit.service';
import { bumpDataRevision } from '../assignments/assignments.repo';
import { loadAssignmentFor } from '../assignments/assignment-access';
import { recordStatusChange } from '../review/status-changes';
import { userById } from '../review/review.repo';
import { readableVersion } from '../reports/reports.service';
import { withNeighbourhood } from '../sales/sales.service';

/** A sale as the form sent it, with every optional field present (null when not given). */
function completeSale(s: z.infer<typeof reconsiderationRequest>['sales'][number]): SaleFields {
  const blank = { lon: null, lat: null, neighbourhood: null, lotSize: null, bedrooms: null, bathrooms: null, yearBuilt: null, condition: null, quality: null, garageSpaces: null, dataSource: null, verificationNote: null };
  return saleFields.parse({ ...blank, ...Object.fromEntries(Object.entries(s).filter(([, v]) => v !== undefined)) });
}

/** The client files a request on a delivered report, with a comment and up to five extra sales. */
export async function fileReconsideration(user: SessionUser, reportVersionId: number, input: z.infer<typeof reconsiderationRequest>, appOrigin: string) {
  const version = await readableVersion(user, reportVersionId);
  const extra = input.sales.map((s) => completeSale(withNeighbourhood(s)));
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(reconsiderations)
      .values({ reportVersionId, assignmentId: version.assignmentId, requestedBy: user.id, comment: input.comment, extraSales: extra as unknown as Record<string, unknown>[] })
      .returning({ id: reconsiderations.id });
    const [assignment] = await tx.select().from(assignments).where(eq(assignments.id, version.assignmentId));
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'reconsideration-filed', entityType: 'reconsideration', entityId: row.id, details: { reportVersionId, extraSales: extra.length } });
    const appraiser = await userById(tx, assignment.appraiserUserId);
    await enqueueMail(tx, {
      to: appraiser.email,
      subject: `Reconsideration of value requested: ${assignment.subjectAddress}`,
      text: `${user.name} (${user.organisationName}) asks for a reconsideration of value with ${extra.length} extra sale(s):\n\n${input.comment}\n\nAnswer it: ${appOrigin}/assignments/${assignment.id}/report`,
    });
    return { id: row.id };
  });
}

type Summary = { n: number; slope: number | null; rSquared: number | null; estimate: number | null };

/** How the extra sales would move the subject neighbourhood's fit, computed beside the frozen one. */
function effectOf(snapshot: ReportSnapshot, extraSales: Record<string, unknown>[]) {
  const frozen: AnalysisSale[] = snapshot.sales;
  const extra: AnalysisSale[] = extraSales.map((s, i) => ({ ...(s as SaleFields), id: -(i + 1), excluded: false, exclusionReason: null, inGrid: false }));
  const base = { assignmentId: snapshot.assignment.id, dataRevision: 0, areaUnit: snapshot.assignment.areaUnit, currency: snapshot.assignment.currency, effectiveDate: snapshot.assignment.effectiveDate, timeAdjustment: snapshot.assignment.timeAdjustment, subject: snapshot.analysis.subject };
  const pick = (sales: AnalysisSale[]): Summary | null => {
    const analysis = analyseMarket({ ...base, sales });
    const g = analysis.groups.find((x) => x.neighbourhood === analysis.subjectGroup && !x.pooled);
    return g ? { n: g.n, slope: g.fit?.slope ?? null, rSquared: g.fit?.rSquared ?? null, estimate: g.prediction?.estimate ?? null } : null;
  };
  const before = pick(frozen);
  const withExtra = pick([...frozen, ...extra]);
  return before && withExtra && snapshot.analysis.subjectGroup ? { neighbourhood: snapshot.analysis.subjectGroup, before, withExtra } : null;
}

export async function listReconsiderations(user: SessionUser, filter: { assignmentId?: number; reportVersionId?: number }) {
  if (filter.assignmentId !== undefined) await loadAssignmentFor(db, user, filter.assignmentId);
  if (filter.reportVersionId !== undefined) await readableVersion(user, filter.reportVersionId);
  const rows = await db
    .select({ r: reconsiderations, requestedByName: users.name })
    .from(reconsiderations)
    .innerJoin(users, eq(users.id, reconsiderations.requestedBy))
    .where(
      and(
        filter.assignmentId !== undefined ? eq(reconsiderations.assignmentId, filter.assignmentId) : undefined,
        filter.reportVersionId !== undefined ? eq(reconsiderations.reportVersionId, filter.reportVersionId) : undefined,
      ),
    )
    .orderBy(desc(reconsiderations.id));
  const result = [];
  for (const { r, requestedByName } of rows) {
    const effect = user.role === 'client' ? null : effectOf((await readableVersion(user, r.reportVersionId)).snapshot as ReportSnapshot, r.extraSales);
    result.push({ ...r, requestedByName, effect });
  }
  return result;
}

/** The appraiser keeps the value with reasons, or opens a new draft with the extra sales added;
 * signing that draft issues the new version. Either way the client is told. */
export async function respond(user: SessionUser, id: number, input: z.infer<typeof reconsiderationResponseRequest>, appOrigin: string) {
  await db.transaction(async (tx) => {
    const [row] = await tx.select().from(reconsiderations).where(eq(reconsiderations.id, id));
    if (!row) throw notFound('That reconsideration');
    const assignment = await loadAssignmentFor(tx, user, row.assignmentId);
    if (row.status !== 'open') throw conflict('This request has already been answered.', 'already_answered');
    const status = input.decision === 'keep-value' ? 'value_kept' : 'new_version';
    const [updated] = await tx
      .update(reconsiderations)
      .set({ status, response: input.response, respondedBy: user.id, respondedAt: sql`now()`, version: sql`${reconsiderations.version} + 1` })
      .where(and(eq(reconsiderations.id, id), eq(reconsiderations.version, input.version)))
      .returning({ id: reconsiderations.id });
    if (!updated) throw staleVersion('This reconsideration');
    if (input.decision === 'revise') {
      if (assignment.status !== 'signed') throw conflict('The assignment is already back in work.', 'not_signed');
      await tx.update(assignments).set({ status: 'in_progress', version: sql`${assignments.version} + 1`, updatedAt: sql`now()` }).where(eq(assignments.id, assignment.id));
      await recordStatusChange(tx, assignment.id, 'signed', 'in_progress', user, `Reconsideration of value: new draft with the client's ${row.extraSales.length} extra sale(s).`);
      if (row.extraSales.length) {
        await tx.insert(sales).values(row.extraSales.map((s) => ({ ...(s as SaleFields), assignmentId: assignment.id, verificationNote: `Submitted by the client with reconsideration request ${id}.` })));
        await bumpDataRevision(tx, assignment.id);
      }
    }
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'reconsideration-answered', entityType: 'reconsideration', entityId: id, details: { decision: input.decision } });
    const client = await userById(tx, row.requestedBy);
    await enqueueMail(tx, {
      to: client.email,
      subject: `Reconsideration answered: ${assignment.subjectAddress}`,
      text: `${user.name} answered your request: ${input.decision === 'keep-value' ? 'the value stands' : 'a revised report will be issued as a new signed version'}.\n\n${input.response}\n\nThe report: ${appOrigin}/reports/${row.reportVersionId}`,
    });
  });
}
