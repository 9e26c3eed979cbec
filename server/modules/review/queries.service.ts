import { and, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db, type DbOrTx } from '../../../db/client';
import { sales } from '../../../db/schema/assignments';
import { queryMessages, reviewQueries } from '../../../db/schema/review';
import type { SessionUser } from '../../contracts/auth';
import type { answerQueryRequest, raiseQueryRequest } from '../../contracts/review';
import { badRequest, conflict, forbidden, notFound, staleVersion } from '../../errors';
import { enqueueMail } from '../../integrations/mail/outbox';
import { audit } from '../audit/audit.service';
import { loadAssignmentFor } from '../assignments/assignment-access';
import { bumpDataRevision } from '../assignments/assignments.repo';
import { findSale } from '../sales/sales.repo';
import { findQuery, listQueries, userById } from './review.repo';

type Status = 'open' | 'answered' | 'resolved';

export async function queriesOf(user: SessionUser, assignmentId: number) {
  await loadAssignmentFor(db, user, assignmentId);
  return listQueries(db, assignmentId);
}

/** Loads a query through its assignment, so other firms' ids are "not found". */
async function loadQueryFor(tx: DbOrTx, user: SessionUser, queryId: number) {
  const query = await findQuery(tx, queryId);
  if (!query) throw notFound('That query');
  const assignment = await loadAssignmentFor(tx, user, query.assignmentId);
  return { query, assignment };
}

async function setStatus(tx: DbOrTx, queryId: number, version: number, status: Status) {
  const [row] = await tx
    .update(reviewQueries)
    .set({ status, version: sql`${reviewQueries.version} + 1`, updatedAt: sql`now()` })
    .where(and(eq(reviewQueries.id, queryId), eq(reviewQueries.version, version)))
    .returning({ version: reviewQueries.version });
  if (!row) throw staleVersion('This query');
}

async function notify(tx: DbOrTx, userId: number, subject: string, text: string) {
  const to = await userById(tx, userId);
  if (to) await enqueueMail(tx, { to: to.email, subject, text });
}

export async function raiseQuery(user: SessionUser, assignmentId: number, input: z.infer<typeof raiseQueryRequest>, appOrigin: string) {
  return db.transaction(async (tx) => {
    const assignment = await loadAssignmentFor(tx, user, assignmentId);
    if (assignment.status !== 'in_review') throw conflict('Queries are raised while the assignment is in review.', 'not_in_review');
    const sale = input.saleId === null ? null : await findSale(tx, assignmentId, input.saleId);
    if (input.saleId !== null && !sale) throw notFound('That sale');
    const [query] = await tx.insert(reviewQueries).values({ assignmentId, saleId: input.saleId, raisedBy: user.id }).returning();
    await tx.insert(queryMessages).values({ queryId: query.id, authorId: user.id, kind: 'question', body: input.body });
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'query-raised', entityType: 'query', entityId: query.id, details: { assignmentId, saleId: input.saleId } });
    await notify(tx, assignment.appraiserUserId, `Query on ${sale ? sale.address : assignment.subjectAddress}`, `${user.name} asks:\n\n${input.body}\n\nAnswer it: ${appOrigin}/assignments/${assignmentId}/review`);
    return query;
  });
}

export async function addMessage(user: SessionUser, queryId: number, body: string) {
  await db.transaction(async (tx) => {
    const { query } = await loadQueryFor(tx, user, queryId);
    if (query.status === 'resolved') throw conflict('This query is resolved; reopen it to continue.', 'query_resolved');
    await tx.insert(queryMessages).values({ queryId, authorId: user.id, kind: 'comment', body });
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'query-comment', entityType: 'query', entityId: queryId });
  });
}

/** The appraiser keeps the sale with an explanation, or excludes it with a reason: an excluded sale
 * stays visible, struck through, and leaves every fit and the grid. */
export async function answerQuery(user: SessionUser, queryId: number, input: z.infer<typeof answerQueryRequest>, appOrigin: string) {
  await db.transaction(async (tx) => {
    const { query, assignment } = await loadQueryFor(tx, user, queryId);
    if (assignment.status === 'signed' || assignment.status === 'approved') throw conflict('This assignment is approved or signed; its sales cannot change now.', 'not_editable');
    if (query.status === 'resolved') throw conflict('This query is resolved; the reviewer can reopen it.', 'query_resolved');
    if (input.action === 'exclude' && query.saleId === null) throw badRequest('This query is about the assignment as a whole, not a sale.', { action: 'Nothing to exclude.' });
    await setStatus(tx, queryId, input.version, 'answered');
    await tx.insert(queryMessages).values({ queryId, authorId: user.id, kind: input.action === 'keep' ? 'kept' : 'excluded', body: input.explanation });
    if (query.saleId !== null) {
      const excluded = input.action === 'exclude';
      await tx
        .update(sales)
        .set({ excluded, exclusionReason: excluded ? input.explanation : null, ...(excluded && { inGrid: false }), version: sql`${sales.version} + 1`, updatedAt: sql`now()` })
        .where(eq(sales.id, query.saleId));
      await bumpDataRevision(tx, assignment.id);
      await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: excluded ? 'sale-excluded' : 'sale-kept', entityType: 'sale', entityId: query.saleId, details: { queryId, reason: input.explanation } });
    }
    await notify(tx, query.raisedBy, `Query answered: ${assignment.subjectAddress}`, `${user.name} answered (${input.action === 'keep' ? 'kept the sale' : 'excluded the sale'}):\n\n${input.explanation}\n\nReview it: ${appOrigin}/assignments/${assignment.id}/review`);
  });
}

export async function resolveOrReopen(user: SessionUser, queryId: number, to: 'resolved' | 'open', version: number, body: string | undefined) {
  await db.transaction(async (tx) => {
    const { query, assignment } = await loadQueryFor(tx, user, queryId);
    if (to === 'resolved' && query.status === 'resolved') throw conflict('This query is already resolved.', 'query_resolved');
    if (to === 'open' && query.status !== 'resolved') throw conflict('Only a resolved query can be reopened.', 'query_open');
    if (user.role !== 'reviewer') throw forbidden();
    await setStatus(tx, queryId, version, to);
    await tx.insert(queryMessages).values({ queryId, authorId: user.id, kind: to === 'resolved' ? 'resolved' : 'reopened', body: body || (to === 'resolved' ? 'Resolved.' : 'Reopened.') });
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: to === 'resolved' ? 'query-resolved' : 'query-reopened', entityType: 'query', entityId: queryId });
    if (to === 'open') await notify(tx, assignment.appraiserUserId, `Query reopened: ${assignment.subjectAddress}`, `${user.name} reopened a query.${body ? `\n\n${body}` : ''}`);
  });
}
