import { and, eq } from 'drizzle-orm';
import type { Db, DbOrTx } from '../client';
import { assignments, sales, subjects } from '../schema/assignments';
import { organisations, users } from '../schema/organisations';
import { DEMO_FIRM, DEMO_LENDER, demoUsers } from './demo-accounts';
import { generatePortEllery } from './port-ellery';

export const DEMO_SUBJECT_ADDRESS = '14 Lantern Lane';

export interface PortElleryAssignmentInput {
  firmOrganisationId: number;
  clientOrganisationId: number;
  appraiserUserId: number;
  subjectAddress: string;
}

/** Which generated house is the subject, and the file's own loan, due date and inspection note. */
export interface PortElleryFile {
  subject: 'lantern-lane' | 'review';
  loanReference: string;
  dueDate: string;
  subjectNotes: string;
}

const LANTERN_LANE_FILE: PortElleryFile = {
  subject: 'lantern-lane',
  loanReference: 'HM-2026-0419',
  dueDate: '2026-12-10',
  subjectNotes: 'Single-storey house on a quiet lane; inspected 2026-11-12.',
};

/** Inserts one assignment with a Port Ellery subject (14 Lantern Lane unless `file` says otherwise)
 * and every generated market sale; returns its id. The demo seed calls it for its two files; test
 * factories call it for copies of their own. */
export async function insertPortElleryAssignment(tx: DbOrTx, input: PortElleryAssignmentInput, file: PortElleryFile = LANTERN_LANE_FILE): Promise<number> {
  const scenario = generatePortEllery();
  const [assignment] = await tx
    .insert(assignments)
    .values({
      ...input,
      intendedUse: 'Mortgage lending decision for a purchase loan (first lien)',
      loanReference: file.loanReference,
      effectiveDate: scenario.effectiveDate,
      dueDate: file.dueDate,
      areaUnit: 'sqft',
      currency: scenario.currency,
    })
    .returning({ id: assignments.id });
  const neighbourhoodName = (slug: string) => scenario.neighbourhoods.find((n) => n.slug === slug)!.name;
  const subject = file.subject === 'review' ? scenario.reviewSubject : scenario.subject;
  await tx.insert(subjects).values({
    assignmentId: assignment.id,
    lon: subject.lon,
    lat: subject.lat,
    neighbourhood: neighbourhoodName(subject.neighbourhood),
    floorArea: subject.floorArea,
    lotSize: subject.lotSize,
    bedrooms: subject.bedrooms,
    bathrooms: subject.bathrooms,
    yearBuilt: subject.yearBuilt,
    condition: subject.condition,
    quality: subject.quality,
    garageSpaces: subject.garageSpaces,
    notes: file.subjectNotes,
  });
  await tx.insert(sales).values(
    scenario.sales.map(({ key: _key, neighbourhood, saleType, ...sale }) => ({
      ...sale,
      assignmentId: assignment.id,
      neighbourhood: neighbourhoodName(neighbourhood),
      saleType: saleType.replace('-', '_') as 'arms_length',
    })),
  );
  return assignment.id;
}

/** The demo firm, lender and appraiser, and the firm's demo assignment at this address if the seed
 * already wrote it (a later run leaves it, and users' changes, alone). */
export async function demoParties(tx: DbOrTx, subjectAddress: string) {
  const [firm] = await tx.select().from(organisations).where(eq(organisations.name, DEMO_FIRM));
  const [lender] = await tx.select().from(organisations).where(eq(organisations.name, DEMO_LENDER));
  const appraiserEmail = demoUsers.find((u) => u.role === 'appraiser')!.email;
  const [appraiser] = await tx.select().from(users).where(eq(users.email, appraiserEmail));
  const [existing] = await tx
    .select({ id: assignments.id })
    .from(assignments)
    .where(and(eq(assignments.firmOrganisationId, firm.id), eq(assignments.subjectAddress, subjectAddress)));
  return { firm, lender, appraiser, existing };
}

/** The demo assignment for 14 Lantern Lane with the generated Port Ellery market sales. Created once;
 * a later run finds it by firm and subject address and leaves it (and users' changes) alone. */
export async function seedDemoAssignment(db: Db): Promise<void> {
  await db.transaction(async (tx) => {
    const { firm, lender, appraiser, existing } = await demoParties(tx, DEMO_SUBJECT_ADDRESS);
    if (existing) return;
    await insertPortElleryAssignment(tx, {
      firmOrganisationId: firm.id,
      clientOrganisationId: lender.id,
      appraiserUserId: appraiser.id,
      subjectAddress: DEMO_SUBJECT_ADDRESS,
    });
  });
}
