import { and, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../client';
import { assignments, sales } from '../schema/assignments';
import { gridSettings } from '../schema/review';
import { audit } from '../../server/modules/audit/audit.service';
import { recordStatusChange, TRANSITIONS } from '../../server/modules/review/status-changes';
import { demoParties, insertPortElleryAssignment } from './seed-assignment';

/**
 * The demo's second file, 9 Cobble Lane in Quarry Hill: the demo appraiser has built it on the same
 * Port Ellery market, marked three sales for the grid, typed a floor-area rate with its reasons and
 * submitted it, so a reviewer signing in finds it waiting. Its history is written as the services
 * write it: the audit events of creating the file, marking the sales and saving the grid settings,
 * then the submission through the workflow's own rule and `recordStatusChange`. No e-mail is queued:
 * the seed records history, it does not notify anyone.
 */
export const DEMO_REVIEW_SUBJECT_ADDRESS = '9 Cobble Lane';

/** Arm's-length Quarry Road sales of the last eleven months around the subject's 1,720 ft²
 * (1,510, 1,700 and 1,820 ft²); none is a planted anomaly. */
export const DEMO_REVIEW_GRID_SALES = ['15 Quarry Road', '68 Quarry Road', '66 Quarry Road'] as const;

const TYPED_RATE = 55;
const RATE_JUSTIFICATION =
  'The Quarry Hill fit fails its correlation gate while 144 Mason Street carries a floor area keyed ten times too large. ' +
  'The three Quarry Road sales, brought to the effective date at the neighbourhood trend, differ by about $45 to $60 per ft² of floor area; $55 per ft² is used.';
const RECONCILIATION_COMMENT =
  'Most weight on 68 Quarry Road, the closest in floor area to the subject; 15 and 66 Quarry Road bracket it from below and above, and the three adjusted prices lie close together.';

export async function seedDemoReviewAssignment(db: Db): Promise<void> {
  await db.transaction(async (tx) => {
    const { firm, lender, appraiser, existing } = await demoParties(tx, DEMO_REVIEW_SUBJECT_ADDRESS);
    if (existing) return;
    const actor = { id: appraiser.id, organisationId: firm.id };

    const values = { firmOrganisationId: firm.id, clientOrganisationId: lender.id, appraiserUserId: appraiser.id, subjectAddress: DEMO_REVIEW_SUBJECT_ADDRESS };
    const file = { subject: 'review', loanReference: 'HM-2026-0452', dueDate: '2026-12-04', subjectNotes: 'Two-storey house near the top of the lane; inspected 2026-11-13.' } as const;
    const id = await insertPortElleryAssignment(tx, values, file);
    const [created] = await tx.select().from(assignments).where(eq(assignments.id, id));
    await audit(tx, {
      actorUserId: actor.id,
      organisationId: actor.organisationId,
      action: 'assignment-created',
      entityType: 'assignment',
      entityId: id,
      details: { subjectAddress: created.subjectAddress, intendedUse: created.intendedUse, loanReference: created.loanReference, clientOrganisationId: created.clientOrganisationId, effectiveDate: created.effectiveDate, dueDate: created.dueDate, areaUnit: created.areaUnit, currency: created.currency },
    });

    // The three grid sales, marked one by one as the sale form does.
    const gridSales = await tx
      .select({ id: sales.id, address: sales.address })
      .from(sales)
      .where(and(eq(sales.assignmentId, id), inArray(sales.address, [...DEMO_REVIEW_GRID_SALES])));
    if (gridSales.length !== DEMO_REVIEW_GRID_SALES.length) throw new Error(`the Port Ellery scenario lacks a grid sale of ${DEMO_REVIEW_SUBJECT_ADDRESS}`);
    for (const sale of gridSales) {
      await tx.update(sales).set({ inGrid: true, version: sql`${sales.version} + 1`, updatedAt: sql`now()` }).where(eq(sales.id, sale.id));
      await audit(tx, { actorUserId: actor.id, organisationId: actor.organisationId, action: 'sale-updated', entityType: 'sale', entityId: sale.id, details: { assignmentId: id, changed: { inGrid: { from: false, to: true } } } });
      await tx.update(assignments).set({ dataRevision: sql`${assignments.dataRevision} + 1`, updatedAt: sql`now()` }).where(eq(assignments.id, id));
    }

    // The grid settings, created on first read and saved once.
    const settings = { typedRate: TYPED_RATE, rateJustification: RATE_JUSTIFICATION, reconciliationComment: RECONCILIATION_COMMENT };
    await tx.insert(gridSettings).values({ assignmentId: id, ...settings, version: 2 });
    await audit(tx, { actorUserId: actor.id, organisationId: actor.organisationId, action: 'grid-settings-updated', entityType: 'assignment', entityId: id, details: settings });

    // Submitted for review: the workflow's own rule, and its record of the change.
    const submit = TRANSITIONS.submit;
    if (!submit.from.includes(created.status) || submit.role !== appraiser.role) throw new Error('the demo appraiser cannot submit this file');
    await tx.update(assignments).set({ status: submit.to, version: sql`${assignments.version} + 1`, updatedAt: sql`now()` }).where(eq(assignments.id, id));
    await recordStatusChange(tx, id, created.status, submit.to, actor, null);
  });
}
