import { eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { assignments, sales, subjects } from '../../db/schema/assignments';
import { gridSettings } from '../../db/schema/review';
import { createOrganisation, createUser, type TestUser } from './accounts';
import { createAssignment, createSale } from './assignments';
import { signedInAgent, type TestApi } from '../setup/test-api';

/** Twelve invented sales on a clean line (about 240 a square foot) plus noise, in one neighbourhood. */
const AREAS = [1320, 1450, 1510, 1580, 1640, 1700, 1760, 1820, 1900, 1990, 2080, 2200];
const NOISE = [6000, -4500, 3000, -7000, 2500, 5000, -3500, 1500, -6000, 4000, -2000, 3500];

/**
 * An approved assignment of a new firm for a new lender (with a client user), signed through the
 * API by its appraiser: a real report version. Returns the people and the version's id.
 */
export async function createSignedReport(api: TestApi, options: { lenderClient?: TestUser } = {}) {
  const client = options.lenderClient ?? (await createUser({ role: 'client' }));
  const firm = await createOrganisation('firm');
  const appraiser = await createUser({ role: 'appraiser', organisation: firm });
  const reviewer = await createUser({ role: 'reviewer', organisation: firm });
  const assignment = await createAssignment({ appraiser, status: 'approved' });
  await db.update(assignments).set({ clientOrganisationId: client.organisation.id }).where(eq(assignments.id, assignment.id));
  await db.update(subjects).set({ floorArea: 1750, neighbourhood: 'Quarry Hill', lon: -61.41, lat: 44.708 }).where(eq(subjects.assignmentId, assignment.id));
  const saleIds: number[] = [];
  for (const [i, area] of AREAS.entries()) {
    const sale = await createSale(assignment.id, {
      address: `${10 + i * 2} Signal Row`,
      neighbourhood: 'Quarry Hill',
      floorArea: area,
      salePrice: 55_000 + 240 * area + NOISE[i],
      saleDate: `2026-0${1 + (i % 9)}-15`,
      inGrid: i === 4 || i === 6 || i === 8,
    });
    saleIds.push(sale.id);
  }
  await db.insert(gridSettings).values({ assignmentId: assignment.id, reconciliationComment: 'Most weight on the least-adjusted sale; all three bracket the subject.' });
  const agent = await signedInAgent(api, appraiser);
  const [row] = await db.select({ version: assignments.version }).from(assignments).where(eq(assignments.id, assignment.id));
  const res = await agent.post(`/api/assignments/${assignment.id}/sign`).send({
    certify: true,
    licenceNumber: 'PE-CR-99001',
    jurisdiction: 'Port Ellery Board of Appraisers (invented)',
    extraordinaryAssumptions: '',
    hypotheticalConditions: '',
    version: row.version,
  });
  if (res.status !== 201) throw new Error(`sign failed: ${res.status} ${res.text}`);
  return { client, firm, appraiser, reviewer, assignmentId: assignment.id, saleIds, reportVersionId: res.body.reportVersionId as number, sha256: res.body.sha256 as string, appraiserAgent: agent };
}

export async function gridSaleIds(assignmentId: number) {
  return (await db.select({ id: sales.id, inGrid: sales.inGrid }).from(sales).where(eq(sales.assignmentId, assignmentId))).filter((s) => s.inGrid).map((s) => s.id);
}
