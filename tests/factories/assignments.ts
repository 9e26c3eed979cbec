import { and, count, eq, isNull } from 'drizzle-orm';
import { db } from '../../db/client';
import { assignments, photos, sales, subjects } from '../../db/schema/assignments';
import { auditEvents } from '../../db/schema/audit';
import { createOrganisation, createUser, uniqueSuffix, type TestOrganisation, type TestUser } from './accounts';

/** Assignments and sales written straight through Drizzle, so that a test of one endpoint does not
 * lean on another endpoint to build its data. Addresses are invented (the demo town of Port Ellery). */

/** A house number no other call in this file's run returns. */
function houseNumber(): number {
  return Number(uniqueSuffix().split('-')[0]);
}

export type AssignmentStatus = typeof assignments.$inferSelect.status;

export interface TestAssignment {
  id: number;
  firm: TestOrganisation;
  appraiser: TestUser;
  effectiveDate: string;
  status: AssignmentStatus;
}

export interface AssignmentOptions {
  /** The appraiser who holds the file; a new appraiser in a new firm when left out. */
  appraiser?: TestUser;
  status?: AssignmentStatus;
  effectiveDate?: string;
  areaUnit?: 'sqft' | 'sqm';
}

export async function createAssignment(options: AssignmentOptions = {}): Promise<TestAssignment> {
  const appraiser = options.appraiser ?? (await createUser({ role: 'appraiser' }));
  const lender = await createOrganisation('lender');
  const effectiveDate = options.effectiveDate ?? '2026-11-15';
  const status = options.status ?? 'in_progress';
  const [row] = await db
    .insert(assignments)
    .values({
      firmOrganisationId: appraiser.organisation.id,
      clientOrganisationId: lender.id,
      appraiserUserId: appraiser.id,
      subjectAddress: `${houseNumber()} Factory Lane, Port Ellery`,
      intendedUse: 'Mortgage lending decision (test assignment)',
      effectiveDate,
      areaUnit: options.areaUnit ?? 'sqft',
      currency: 'USD',
      status,
    })
    .returning({ id: assignments.id });
  await db.insert(subjects).values({ assignmentId: row.id });
  return { id: row.id, firm: appraiser.organisation, appraiser, effectiveDate, status };
}

/** A firm with an appraiser holding one assignment, plus a reviewer of the same firm. */
export async function createFirmWithAssignment(options: Omit<AssignmentOptions, 'appraiser'> = {}) {
  const firm = await createOrganisation('firm');
  const appraiser = await createUser({ role: 'appraiser', organisation: firm });
  const reviewer = await createUser({ role: 'reviewer', organisation: firm });
  const assignment = await createAssignment({ ...options, appraiser });
  return { firm, appraiser, reviewer, assignment };
}

/** What the sale form sends: the required fields and a few optional ones. */
export function saleFormInput(overrides: Record<string, unknown> = {}) {
  return {
    address: `${houseNumber()} Brackwater Road`,
    salePrice: 412_500,
    saleDate: '2026-06-18',
    floorArea: 1_640,
    bedrooms: 3,
    bathrooms: 2,
    yearBuilt: 1978,
    saleType: 'arms_length',
    dataSource: 'Port Ellery county deed record (invented)',
    ...overrides,
  };
}

export type SaleValues = Partial<typeof sales.$inferInsert>;

/** A sale row in the assignment, written directly (no API call). */
export async function createSale(assignmentId: number, overrides: SaleValues = {}) {
  const [row] = await db
    .insert(sales)
    .values({
      assignmentId,
      address: `${houseNumber()} Gullwing Street`,
      salePrice: 389_000,
      saleDate: '2026-05-02',
      floorArea: 1_520,
      ...overrides,
    })
    .returning();
  return row;
}

export async function saleRow(id: number) {
  const [row] = await db.select().from(sales).where(eq(sales.id, id));
  return row;
}

/** Every row of the sales table, live or deleted, across all assignments. */
export async function totalSalesRows(): Promise<number> {
  const [row] = await db.select({ n: count() }).from(sales);
  return row.n;
}

export async function liveSalesRows(assignmentId: number) {
  return db
    .select()
    .from(sales)
    .where(and(eq(sales.assignmentId, assignmentId), isNull(sales.deletedAt)));
}

export async function photoRows(assignmentId: number) {
  return db.select().from(photos).where(eq(photos.assignmentId, assignmentId));
}

export async function totalPhotoRows(): Promise<number> {
  const [row] = await db.select({ n: count() }).from(photos);
  return row.n;
}

export async function auditEventsFor(entityType: string, entityId: number) {
  return db
    .select()
    .from(auditEvents)
    .where(and(eq(auditEvents.entityType, entityType), eq(auditEvents.entityId, String(entityId))))
    .orderBy(auditEvents.id);
}
