import { and, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../../../db/client';
import { firmSettings, gridEntries, gridSettings } from '../../../db/schema/review';
import type { SessionUser } from '../../contracts/auth';
import type { firmSettingsUpdate, gridEntryUpdate, gridSettingsUpdate } from '../../contracts/grid';
import { badRequest, notFound, staleVersion } from '../../errors';
import { audit } from '../audit/audit.service';
import { assertEditable, loadAssignmentFor } from '../assignments/assignment-access';
import { findSale } from '../sales/sales.repo';
import { loadFirmSettings, loadGridSettings } from './grid.repo';

export async function updateGridSettings(user: SessionUser, assignmentId: number, input: z.infer<typeof gridSettingsUpdate>) {
  await db.transaction(async (tx) => {
    assertEditable(await loadAssignmentFor(tx, user, assignmentId));
    await loadGridSettings(tx, assignmentId);
    const { version, ...changes } = input;
    const [row] = await tx
      .update(gridSettings)
      .set({ ...changes, version: sql`${gridSettings.version} + 1`, updatedAt: sql`now()` })
      .where(and(eq(gridSettings.assignmentId, assignmentId), eq(gridSettings.version, version)))
      .returning({ version: gridSettings.version });
    if (!row) throw staleVersion('The grid settings');
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'grid-settings-updated', entityType: 'assignment', entityId: assignmentId, details: changes });
  });
}

/** Line items and weight of one grid sale; version 0 creates the entry. */
export async function updateGridEntry(user: SessionUser, assignmentId: number, saleId: number, input: z.infer<typeof gridEntryUpdate>) {
  await db.transaction(async (tx) => {
    assertEditable(await loadAssignmentFor(tx, user, assignmentId));
    const sale = await findSale(tx, assignmentId, saleId);
    if (!sale) throw notFound('That sale');
    if (!sale.inGrid) throw badRequest('Mark the sale for the grid first.', { saleId: 'Not in the grid.' });
    const values = { lineItems: input.lineItems, weightPct: input.weightPct };
    const written =
      input.version === 0
        ? await tx.insert(gridEntries).values({ saleId, assignmentId, ...values }).onConflictDoNothing().returning({ v: gridEntries.version })
        : await tx
            .update(gridEntries)
            .set({ ...values, version: sql`${gridEntries.version} + 1`, updatedAt: sql`now()` })
            .where(and(eq(gridEntries.saleId, saleId), eq(gridEntries.version, input.version)))
            .returning({ v: gridEntries.version });
    if (written.length === 0) throw staleVersion('This sale’s grid entry');
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'adjustments-updated', entityType: 'sale', entityId: saleId, details: { assignmentId, ...values } });
  });
}

export async function getFirmSettings(user: SessionUser) {
  return loadFirmSettings(db, user.organisationId);
}

export async function updateFirmSettings(user: SessionUser, input: z.infer<typeof firmSettingsUpdate>) {
  return db.transaction(async (tx) => {
    await loadFirmSettings(tx, user.organisationId);
    const { version, ...changes } = input;
    const [row] = await tx
      .update(firmSettings)
      .set({ ...changes, version: sql`${firmSettings.version} + 1` })
      .where(and(eq(firmSettings.organisationId, user.organisationId), eq(firmSettings.version, version)))
      .returning();
    if (!row) throw staleVersion('The firm settings');
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'firm-settings-updated', entityType: 'organisation', entityId: user.organisationId, details: changes });
    return row;
  });
}
