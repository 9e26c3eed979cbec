import { and, eq, inArray } from 'drizzle-orm';
import { db } from '../../db/client';
import { sales } from '../../db/schema/assignments';
import { organisations, users } from '../../db/schema/organisations';
import { DEMO_FIRM, DEMO_LENDER, DEMO_PASSWORD, demoUsers } from '../../db/seed/demo-accounts';
import { generatePortEllery, type AnomalyKind } from '../../db/seed/port-ellery';
import { insertPortElleryAssignment } from '../../db/seed/seed-assignment';

/**
 * A private copy of the Port Ellery demo assignment for one test: the generated subject and market
 * sales under a subject address of the test's choosing, held by the demo appraiser of Lantern
 * Valuation Group, so that a test may take it through review without touching the shared demo.
 */

/** Three arm's-length Quarry Hill sales of the generated scenario that bracket the subject's
 * 1,850 ft² and sold within the last nine months: none of them is a planted anomaly. */
export const GOOD_QUARRY_HILL_SALES = ['66 Quarry Road', '25 Flint Street', '102 Flint Street'] as const;

/** The rate the factory types: the Quarry Hill fit fails its correlation gate while the keyed-in
 * floor-area typo is in it, so the appraiser types a rate and says why. */
export const TYPED_RATE = 110;
export const RATE_JUSTIFICATION =
  'The Quarry Hill fit fails its correlation gate while 144 Mason Street carries a floor area keyed ten times too large. ' +
  'Paired sales of similar Quarry Hill houses this year support about $110 per ft².';
export const RECONCILIATION_COMMENT =
  'Most weight on 66 Quarry Road, the most recent sale and the closest in floor area; the three adjusted prices lie close together.';

export interface DemoAssignment {
  id: number;
  subjectAddress: string;
  /** Sale id by address for the sales marked for the grid. */
  gridSaleIds: Record<string, number>;
  /** The sale of the planted anomaly of each kind. */
  anomalies: Record<AnomalyKind, { saleId: number; address: string }>;
}

export interface DemoAssignmentOptions {
  subjectAddress: string;
  /** Write the grid settings and the reconciliation comment (through the API). Default true. */
  completeGrid?: boolean;
  /** Submit it for review as the appraiser (through the API). Default true; needs completeGrid. */
  submit?: boolean;
}

/** A signed-in API session of a demo user against a running app (the browser tests' server). */
export interface ApiSession {
  request: <T = unknown>(method: string, path: string, body?: unknown) => Promise<{ status: number; body: T }>;
}

export async function apiSessionAs(baseUrl: string, role: 'appraiser' | 'reviewer' | 'admin'): Promise<ApiSession> {
  const user = demoUsers.find((u) => u.role === role)!;
  const signIn = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: baseUrl },
    body: JSON.stringify({ email: user.email, password: DEMO_PASSWORD }),
  });
  if (signIn.status !== 204) throw new Error(`sign-in of the demo ${role} answered ${signIn.status}: ${await signIn.text()}`);
  const cookie = signIn.headers
    .getSetCookie()
    .map((line) => line.split(';')[0])
    .join('; ');
  return {
    request: async <T,>(method: string, path: string, body?: unknown) => {
      const res = await fetch(`${baseUrl}${path}`, {
        method,
        headers: { Cookie: cookie, Origin: baseUrl, Accept: 'application/json', ...(body === undefined ? {} : { 'Content-Type': 'application/json' }) },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      const text = await res.text();
      return { status: res.status, body: (text ? JSON.parse(text) : undefined) as T };
    },
  };
}

async function expectOk<T>(call: Promise<{ status: number; body: T }>, what: string): Promise<T> {
  const { status, body } = await call;
  if (status >= 300) throw new Error(`${what} answered ${status}: ${JSON.stringify(body)}`);
  return body;
}

/** Inserts the copy (straight through Drizzle), marks the three good Quarry Hill sales for the grid,
 * then, as the demo appraiser through the API, types the rate with its justification, writes the
 * reconciliation comment and submits it for review. */
export async function createDemoAssignment(baseUrl: string, options: DemoAssignmentOptions): Promise<DemoAssignment> {
  const { subjectAddress, completeGrid = true, submit = true } = options;
  const scenario = generatePortEllery();
  const appraiserEmail = demoUsers.find((u) => u.role === 'appraiser')!.email;
  const [firm] = await db.select().from(organisations).where(eq(organisations.name, DEMO_FIRM));
  const [lender] = await db.select().from(organisations).where(eq(organisations.name, DEMO_LENDER));
  const [appraiser] = await db.select().from(users).where(eq(users.email, appraiserEmail));
  if (!firm || !lender || !appraiser) throw new Error('the Port Ellery demo accounts are missing: the global setup seeds them');

  const id = await db.transaction((tx) =>
    insertPortElleryAssignment(tx, { firmOrganisationId: firm.id, clientOrganisationId: lender.id, appraiserUserId: appraiser.id, subjectAddress }),
  );
  const rows = await db.select({ id: sales.id, address: sales.address }).from(sales).where(eq(sales.assignmentId, id));
  const saleIdOf = (address: string) => {
    const row = rows.find((r) => r.address === address);
    if (!row) throw new Error(`the generated scenario has no sale at ${address}`);
    return row.id;
  };
  await db
    .update(sales)
    .set({ inGrid: true })
    .where(and(eq(sales.assignmentId, id), inArray(sales.address, [...GOOD_QUARRY_HILL_SALES])));

  const anomalies = Object.fromEntries(
    scenario.plantedAnomalies.map((anomaly) => {
      const address = scenario.sales.find((s) => s.key === anomaly.saleKey)!.address;
      return [anomaly.kind, { saleId: saleIdOf(address), address }];
    }),
  ) as DemoAssignment['anomalies'];
  const gridSaleIds = Object.fromEntries(GOOD_QUARRY_HILL_SALES.map((address) => [address, saleIdOf(address)]));

  if (completeGrid || submit) {
    const appraiserApi = await apiSessionAs(baseUrl, 'appraiser');
    const grid = await expectOk(appraiserApi.request<{ settings: { version: number } }>('GET', `/api/assignments/${id}/grid`), 'reading the grid');
    await expectOk(
      appraiserApi.request('PUT', `/api/assignments/${id}/grid/settings`, {
        version: grid.settings.version,
        typedRate: TYPED_RATE,
        rateJustification: RATE_JUSTIFICATION,
        reconciliationComment: RECONCILIATION_COMMENT,
      }),
      'writing the grid settings',
    );
    if (submit) {
      const detail = await expectOk(appraiserApi.request<{ assignment: { version: number } }>('GET', `/api/assignments/${id}`), 'reading the assignment');
      await expectOk(
        appraiserApi.request('POST', `/api/assignments/${id}/transitions`, { action: 'submit', version: detail.assignment.version }),
        'submitting for review',
      );
    }
  }
  return { id, subjectAddress, gridSaleIds, anomalies };
}
