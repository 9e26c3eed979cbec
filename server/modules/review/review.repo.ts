import { and, asc, eq, inArray, ne, sql } from 'drizzle-orm';
import type { DbOrTx } from '../../../db/client';
import { sales } from '../../../db/schema/assignments';
import { users } from '../../../db/schema/organisations';
import { queryMessages, reviewQueries, statusChanges } from '../../../db/schema/review';

export async function unresolvedQueryCount(tx: DbOrTx, assignmentId: number): Promise<number> {
  const [row] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(reviewQueries)
    .where(and(eq(reviewQueries.assignmentId, assignmentId), ne(reviewQueries.status, 'resolved')));
  return row.n;
}

export async function findQuery(tx: DbOrTx, queryId: number) {
  const [row] = await tx.select().from(reviewQueries).where(eq(reviewQueries.id, queryId));
  return row;
}

/** Every query of an assignment with its thread, in two queries (no query per thread). */
export async function listQueries(tx: DbOrTx, assignmentId: number) {
  const threads = await tx
    .select({
      id: reviewQueries.id,
      assignmentId: reviewQueries.assignmentId,
      saleId: reviewQueries.saleId,
      saleAddress: sales.address,
      status: reviewQueries.status,
      raisedByName: users.name,
      version: reviewQueries.version,
      createdAt: reviewQueries.createdAt,
    })
    .from(reviewQueries)
    .innerJoin(users, eq(users.id, reviewQueries.raisedBy))
    .leftJoin(sales, eq(sales.id, reviewQueries.saleId))
    .where(eq(reviewQueries.assignmentId, assignmentId))
    .orderBy(asc(reviewQueries.id));
  if (threads.length === 0) return [];
  const messages = await tx
    .select({ id: queryMessages.id, queryId: queryMessages.queryId, authorName: users.name, authorRole: users.role, kind: queryMessages.kind, body: queryMessages.body, createdAt: queryMessages.createdAt })
    .from(queryMessages)
    .innerJoin(users, eq(users.id, queryMessages.authorId))
    .where(inArray(queryMessages.queryId, threads.map((t) => t.id)))
    .orderBy(asc(queryMessages.id));
  return threads.map((t) => ({ ...t, messages: messages.filter((m) => m.queryId === t.id).map(({ queryId: _q, ...m }) => m) }));
}

export async function listTimeline(tx: DbOrTx, assignmentId: number) {
  return tx
    .select({ id: statusChanges.id, fromStatus: statusChanges.fromStatus, toStatus: statusChanges.toStatus, byName: users.name, note: statusChanges.note, at: statusChanges.at })
    .from(statusChanges)
    .innerJoin(users, eq(users.id, statusChanges.byUserId))
    .where(eq(statusChanges.assignmentId, assignmentId))
    .orderBy(asc(statusChanges.id));
}

export async function activeFirmUsers(tx: DbOrTx, organisationId: number, role: 'reviewer' | 'appraiser' | 'admin') {
  return tx
    .select({ id: users.id, email: users.email, name: users.name })
    .from(users)
    .where(and(eq(users.organisationId, organisationId), eq(users.role, role), eq(users.active, true)));
}

export async function userById(tx: DbOrTx, id: number) {
  const [row] = await tx.select({ id: users.id, email: users.email, name: users.name }).from(users).where(eq(users.id, id));
  return row;
}
