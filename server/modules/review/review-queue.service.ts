import { and, inArray, ne, sql } from 'drizzle-orm';
import { db } from '../../../db/client';
import { reviewQueries } from '../../../db/schema/review';
import type { SessionUser } from '../../contracts/auth';
import { listFirmAssignments } from '../assignments/assignments.repo';
import { cachedAnalysis } from '../analysis/analysis.service';

/** Assignments waiting on a reviewer, the ones with flagged sales first, with open query counts. */
export async function reviewQueue(user: SessionUser) {
  const waiting = (await listFirmAssignments(user.organisationId)).filter((a) => a.status === 'in_review' || a.status === 'revisions_requested');
  if (waiting.length === 0) return [];
  const counts = await db
    .select({ assignmentId: reviewQueries.assignmentId, n: sql<number>`count(*)::int` })
    .from(reviewQueries)
    .where(and(inArray(reviewQueries.assignmentId, waiting.map((a) => a.id)), ne(reviewQueries.status, 'resolved')))
    .groupBy(reviewQueries.assignmentId);
  const items = [];
  for (const a of waiting) {
    const { analysis } = await cachedAnalysis(a);
    const subjectGroup = analysis.groups.find((g) => g.neighbourhood === analysis.subjectGroup && !g.pooled);
    items.push({
      id: a.id,
      subjectAddress: a.subjectAddress,
      appraiserName: a.appraiserName,
      clientOrganisationName: a.clientOrganisationName,
      status: a.status,
      dueDate: a.dueDate,
      openQueries: counts.find((c) => c.assignmentId === a.id)?.n ?? 0,
      flaggedSales: subjectGroup?.flagged.length ?? 0,
      updatedAt: a.updatedAt,
    });
  }
  return items.sort((x, y) => Number(y.status === 'in_review') - Number(x.status === 'in_review') || y.flaggedSales - x.flaggedSales);
}
