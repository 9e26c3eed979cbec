import { count, eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { assignments, sales, subjects } from '../../db/schema/assignments';
import { auditEvents } from '../../db/schema/audit';
import { outboxMessages } from '../../db/schema/mail';
import { gridSettings, statusChanges } from '../../db/schema/review';
import { createOrganisation, createUser, type TestUser } from './accounts';
import { createAssignment, type AssignmentStatus } from './assignments';
import { signedInAgent, type Agent, type TestApi } from '../setup/test-api';

/** A firm's people for workflow tests, each signed in once: the appraiser who holds the files, a
 * reviewer and an admin of the same firm, a client of the lender that ordered them, and an
 * appraiser of another firm. Assignments are built per test with createWorkflowAssignment. */
export interface WorkflowWorld {
  appraiser: TestUser;
  reviewer: TestUser;
  admin: TestUser;
  client: TestUser;
  outsider: TestUser;
  agents: Record<'appraiser' | 'reviewer' | 'admin' | 'client' | 'outsider', Agent>;
}

export async function createWorkflowWorld(api: TestApi): Promise<WorkflowWorld> {
  const firm = await createOrganisation('firm');
  const appraiser = await createUser({ role: 'appraiser', organisation: firm });
  const reviewer = await createUser({ role: 'reviewer', organisation: firm });
  const admin = await createUser({ role: 'admin', organisation: firm });
  const client = await createUser({ role: 'client' });
  const outsider = await createUser({ role: 'appraiser' });
  const people = { appraiser, reviewer, admin, client, outsider };
  const agents = {} as WorkflowWorld['agents'];
  for (const [key, user] of Object.entries(people)) agents[key as keyof typeof people] = await signedInAgent(api, user);
  return { ...people, agents };
}

/** Twelve invented sales in one neighbourhood on a clean line (about 240 a square foot) with a
 * little noise, so that the fit passes the correlation gate; three of them are marked for the grid. */
const AREAS = [1320, 1450, 1510, 1580, 1640, 1700, 1760, 1820, 1900, 1990, 2080, 2200];
const NOISE = [6000, -4500, 3000, -7000, 2500, 5000, -3500, 1500, -6000, 4000, -2000, 3500];
const GRID_INDEXES = [4, 6, 8];
export const RECONCILIATION_COMMENT = 'Most weight on the least-adjusted sale; the three grid sales bracket the subject in size.';

export type GridSetup = 'complete' | 'no-comment' | 'none';

export interface WorkflowAssignment {
  id: number;
  saleIds: number[];
  gridSaleIds: number[];
  addresses: Map<number, string>;
}

/** An assignment held by the world's appraiser for the world's client's lender, set straight to
 * `status`. 'complete' gives it a grid that passes submission; 'no-comment' the same grid without a
 * reconciliation comment; 'none' leaves it empty (no floor area, no sales, no grid settings). */
export async function createWorkflowAssignment(world: WorkflowWorld, status: AssignmentStatus, grid: GridSetup = 'complete'): Promise<WorkflowAssignment> {
  const assignment = await createAssignment({ appraiser: world.appraiser, status });
  await db.update(assignments).set({ clientOrganisationId: world.client.organisation.id }).where(eq(assignments.id, assignment.id));
  if (grid === 'none') return { id: assignment.id, saleIds: [], gridSaleIds: [], addresses: new Map() };
  await db.update(subjects).set({ floorArea: 1750, neighbourhood: 'Quarry Hill', lon: -61.41, lat: 44.708 }).where(eq(subjects.assignmentId, assignment.id));
  const rows = await db
    .insert(sales)
    .values(
      AREAS.map((area, i) => ({
        assignmentId: assignment.id,
        address: `${10 + i * 2} Signal Row, Port Ellery`,
        neighbourhood: 'Quarry Hill',
        floorArea: area,
        salePrice: 55_000 + 240 * area + NOISE[i],
        saleDate: `2026-0${1 + (i % 9)}-15`,
        inGrid: GRID_INDEXES.includes(i),
      })),
    )
    .returning({ id: sales.id, address: sales.address, inGrid: sales.inGrid });
  await db.insert(gridSettings).values({ assignmentId: assignment.id, reconciliationComment: grid === 'complete' ? RECONCILIATION_COMMENT : null });
  return {
    id: assignment.id,
    saleIds: rows.map((r) => r.id),
    gridSaleIds: rows.filter((r) => r.inGrid).map((r) => r.id),
    addresses: new Map(rows.map((r) => [r.id, r.address])),
  };
}

export async function assignmentRow(id: number) {
  const [row] = await db.select().from(assignments).where(eq(assignments.id, id));
  return row;
}

/** What a refused request must leave as it was: the assignment's status and version, its timeline
 * rows, and every audit and outbox row in the database. */
export async function workflowState(id: number) {
  const row = await assignmentRow(id);
  const [changes] = await db.select({ n: count() }).from(statusChanges).where(eq(statusChanges.assignmentId, id));
  const [audits] = await db.select({ n: count() }).from(auditEvents);
  const [mails] = await db.select({ n: count() }).from(outboxMessages);
  return { status: row.status, version: row.version, dataRevision: row.dataRevision, statusChanges: changes.n, auditRows: audits.n, outboxRows: mails.n };
}

export type Action = 'submit' | 'request-revisions' | 'approve' | 'sign';

/** Takes a workflow step through the API as the given agent; signing has its own route. */
export function takeAction(agent: Agent, id: number, action: Action, version: number, note?: string) {
  if (action === 'sign') {
    return agent.post(`/api/assignments/${id}/sign`).send({ certify: true, licenceNumber: 'PE-CR-20417', jurisdiction: 'Port Ellery Board of Appraisers (invented)', version });
  }
  return agent.post(`/api/assignments/${id}/transitions`).send({ action, version, ...(note === undefined ? {} : { note }) });
}

/** Every link in an e-mail's text. */
export function linksIn(text: string): URL[] {
  return (text.match(/https?:\/\/\S+/g) ?? []).map((s) => new URL(s));
}
