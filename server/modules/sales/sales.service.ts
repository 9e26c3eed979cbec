import { and, eq, isNull, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../../../db/client';
import { photos, sales } from '../../../db/schema/assignments';
import type { SessionUser } from '../../contracts/auth';
import type { saleCreate, saleUpdate } from '../../contracts/sales';
import { badRequest, conflict, notFound, staleVersion } from '../../errors';
import { audit } from '../audit/audit.service';
import { assertEditable, loadAssignmentFor } from '../assignments/assignment-access';
import { bumpDataRevision } from '../assignments/assignments.repo';
import { neighbourhoodAt } from '../assignments/neighbourhood-lookup';
import { findSale, listSales } from './sales.repo';

export async function listAssignmentSales(user: SessionUser, assignmentId: number) {
  const assignment = await loadAssignmentFor(db, user, assignmentId);
  return { sales: await listSales(db, assignmentId), dataRevision: assignment.dataRevision };
}

/** Fills the neighbourhood from the map's boundaries when a location is given without one. */
export function withNeighbourhood<T extends { lon?: number | null; lat?: number | null; neighbourhood?: string | null }>(sale: T): T {
  if (sale.lon != null && sale.lat != null && !sale.neighbourhood) {
    return { ...sale, neighbourhood: neighbourhoodAt(sale.lon, sale.lat) };
  }
  return sale;
}

export async function createSale(user: SessionUser, assignmentId: number, input: z.infer<typeof saleCreate>) {
  return db.transaction(async (tx) => {
    assertEditable(await loadAssignmentFor(tx, user, assignmentId));
    const [row] = await tx.insert(sales).values({ ...withNeighbourhood(input), assignmentId }).returning({ id: sales.id });
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'sale-created', entityType: 'sale', entityId: row.id, details: { assignmentId, ...input } });
    const created = (await findSale(tx, assignmentId, row.id))!;
    // Last: the bump locks the assignment row until commit, and every edit of the file waits on it.
    await bumpDataRevision(tx, assignmentId);
    return created;
  });
}

export async function updateSale(user: SessionUser, assignmentId: number, saleId: number, input: z.infer<typeof saleUpdate>) {
  return db.transaction(async (tx) => {
    assertEditable(await loadAssignmentFor(tx, user, assignmentId));
    const before = await findSale(tx, assignmentId, saleId);
    if (!before) throw notFound('That sale');
    const { version, ...changes } = input;
    if (changes.inGrid === true && before.excluded) {
      throw conflict('This sale was excluded with a reason and stays out of the grid.', 'sale_excluded');
    }
    if (changes.coverPhotoId !== undefined) {
      const [photo] = await tx.select({ id: photos.id }).from(photos).where(and(eq(photos.id, changes.coverPhotoId), eq(photos.saleId, saleId), isNull(photos.deletedAt)));
      if (!photo) throw badRequest('The cover must be one of this sale’s photos.', { coverPhotoId: 'Not a photo of this sale.' });
    }
    const located = changes.lon !== undefined || changes.lat !== undefined;
    const next = located && changes.neighbourhood === undefined ? withNeighbourhood({ ...changes, neighbourhood: null }) : changes;
    const [updated] = await tx
      .update(sales)
      .set({ ...next, version: sql`${sales.version} + 1`, updatedAt: sql`now()` })
      .where(and(eq(sales.id, saleId), eq(sales.assignmentId, assignmentId), eq(sales.version, version)))
      .returning({ id: sales.id });
    if (!updated) throw staleVersion('This sale');
    const changed = Object.fromEntries(Object.entries(next).map(([k, v]) => [k, { from: before[k as keyof typeof before], to: v }]));
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'sale-updated', entityType: 'sale', entityId: saleId, details: { assignmentId, changed } });
    const after = (await findSale(tx, assignmentId, saleId))!;
    // Last: the bump locks the assignment row until commit, and every edit of the file waits on it.
    await bumpDataRevision(tx, assignmentId);
    return after;
  });
}

/** Soft delete: the row stays for the record, out of every list, fit and grid. */
export async function deleteSale(user: SessionUser, assignmentId: number, saleId: number, version: number) {
  await db.transaction(async (tx) => {
    assertEditable(await loadAssignmentFor(tx, user, assignmentId));
    if (!(await findSale(tx, assignmentId, saleId))) throw notFound('That sale');
    const [row] = await tx
      .update(sales)
      .set({ deletedAt: sql`now()`, inGrid: false, version: sql`${sales.version} + 1` })
      .where(and(eq(sales.id, saleId), eq(sales.version, version)))
      .returning({ id: sales.id });
    if (!row) throw staleVersion('This sale');
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'sale-deleted', entityType: 'sale', entityId: saleId, details: { assignmentId } });
    await bumpDataRevision(tx, assignmentId);
  });
}
