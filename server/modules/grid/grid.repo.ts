import { eq } from 'drizzle-orm';
import type { DbOrTx } from '../../../db/client';
import { firmSettings, gridEntries, gridSettings } from '../../../db/schema/review';

/** The grid settings row, created on first use. */
export async function loadGridSettings(tx: DbOrTx, assignmentId: number) {
  await tx.insert(gridSettings).values({ assignmentId }).onConflictDoNothing();
  const [row] = await tx.select().from(gridSettings).where(eq(gridSettings.assignmentId, assignmentId));
  return row;
}

export async function loadFirmSettings(tx: DbOrTx, organisationId: number) {
  await tx.insert(firmSettings).values({ organisationId }).onConflictDoNothing();
  const [row] = await tx.select().from(firmSettings).where(eq(firmSettings.organisationId, organisationId));
  return row;
}

export async function loadGridEntries(tx: DbOrTx, assignmentId: number) {
  return tx.select().from(gridEntries).where(eq(gridEntries.assignmentId, assignmentId));
}
