import { and, eq } from 'drizzle-orm';
import type { Db } from '../client';
import { fees } from '../schema/delivery';
import { organisations } from '../schema/organisations';
import { DEMO_FIRM } from './demo-accounts';

/** The demo firm's fee list (invented prices). */
export const demoFees = [
  { name: 'Single-family, full interior and exterior', description: 'Interior and exterior inspection of a one-unit house, sales comparison approach.', amount: 525 },
  { name: 'Single-family, exterior only', description: 'Exterior inspection from the street of a one-unit house, sales comparison approach.', amount: 375 },
  { name: 'Condominium unit', description: 'Interior and exterior inspection of a condominium unit, sales comparison approach.', amount: 450 },
];

/** Idempotent: a fee is matched by firm and name, so a second run adds nothing and never changes a
 * price the office has since edited. */
export async function seedDemoFees(db: Db): Promise<void> {
  await db.transaction(async (tx) => {
    const [firm] = await tx.select({ id: organisations.id }).from(organisations).where(eq(organisations.name, DEMO_FIRM));
    if (!firm) return;
    for (const fee of demoFees) {
      const [existing] = await tx.select({ id: fees.id }).from(fees).where(and(eq(fees.firmOrganisationId, firm.id), eq(fees.name, fee.name)));
      if (!existing) await tx.insert(fees).values({ ...fee, firmOrganisationId: firm.id, currency: 'USD' });
    }
  });
}
