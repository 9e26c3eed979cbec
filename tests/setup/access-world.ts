import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { assignments, photos } from '../../db/schema/assignments';
import { reconsiderations } from '../../db/schema/delivery';
import { queryMessages, reviewQueries } from '../../db/schema/review';
import type { Role } from '../../server/contracts/auth';
import type { FakePaymentsApi } from '../../server/integrations/payments/fake-payments-api';
import { photoStorage } from '../../server/integrations/storage/photo-storage';
import { createUser, type TestUser } from '../factories/accounts';
import { createAssignment, createSale } from '../factories/assignments';
import { plainJpeg } from '../factories/images';
import { createFee, createOrderRow, startPayments } from '../factories/orders';
import { createSignedReport } from '../factories/signed-report';
import type { RecordIds } from './route-table';
import { browserAgent, signedInAgent, type Agent, type TestApi } from './test-api';

/** A demo-like world for calling every route: firm A (appraiser, reviewer, admin) working for
 * lender A (a client), each with records of their own, and a firm B / lender B with records of
 * theirs. Everything is made by the factories with invented names. */

export type CallerName = 'anonymous' | Role | 'other-lender client';
export const CALLERS: readonly CallerName[] = ['anonymous', 'appraiser', 'reviewer', 'client', 'admin', 'other-lender client'];

export interface Caller {
  name: CallerName;
  /** The role the guard sees (none when anonymous). */
  role: Role | null;
  user: TestUser | null;
  agent: Agent;
}

export interface AccessWorld {
  callers: Record<CallerName, Caller>;
  /** Ids of firm A's and lender A's own records. */
  own: RecordIds;
  /** Ids of firm B's and lender B's records. */
  foreign: RecordIds;
  /** A photo of firm A that DELETE /photos/:id may take (the report's photo stays). */
  disposablePhotoId: number;
  firmA: TestUser['organisation'];
  appraiserA: TestUser;
  payments: FakePaymentsApi;
  /** A new signed-in user of firm A (or lender A for a client), for checks that need a clean slate. */
  freshAgent(role: Role): Promise<{ user: TestUser; agent: Agent }>;
}

/** Writes a small JPEG straight to storage and a photo row for it (no API call). */
export async function storedPhoto(assignmentId: number, uploadedBy: number): Promise<number> {
  const key = `${assignmentId}/${randomUUID()}`;
  const bytes = await plainJpeg(64, 48, '#5b7c99');
  await photoStorage().put(`${key}-display.jpg`, bytes, 'image/jpeg');
  await photoStorage().put(`${key}-thumb.jpg`, bytes, 'image/jpeg');
  const [row] = await db
    .insert(photos)
    .values({ assignmentId, storageKey: key, width: 64, height: 48, bytes: bytes.length, sha256: 'f'.repeat(64), originalName: 'front.jpg', uploadedBy })
    .returning({ id: photos.id });
  return row.id;
}

async function uploadPhoto(agent: Agent, assignmentId: number, name: string): Promise<number> {
  const res = await agent.post(`/api/assignments/${assignmentId}/photos`).attach('files', await plainJpeg(), name);
  if (res.status !== 201) throw new Error(`photo upload answered ${res.status} ${res.text}`);
  return res.body.photos[0].id as number;
}

/** Takes a signed report back to a draft, adds a photo through the API, and signs again: the new
 * version's snapshot carries the photo, so /reports/:id/photos/:photoId has something to serve. */
async function resignWithPhoto(agent: Agent, assignmentId: number) {
  const version = async () => (await db.select({ v: assignments.version }).from(assignments).where(eq(assignments.id, assignmentId)))[0].v;
  const draft = await agent.post(`/api/assignments/${assignmentId}/new-draft`).send({ version: await version(), reason: 'Add the street photograph.' });
  if (draft.status !== 200) throw new Error(`new-draft answered ${draft.status} ${draft.text}`);
  const photoId = await uploadPhoto(agent, assignmentId, 'street-view.jpg');
  await db.update(assignments).set({ status: 'approved' }).where(eq(assignments.id, assignmentId));
  const signed = await agent.post(`/api/assignments/${assignmentId}/sign`).send({
    certify: true,
    licenceNumber: 'PE-CR-99001',
    jurisdiction: 'Port Ellery Board of Appraisers (invented)',
    version: await version(),
  });
  if (signed.status !== 201) throw new Error(`re-sign answered ${signed.status} ${signed.text}`);
  return { photoId, reportVersionId: signed.body.reportVersionId as number, sha256: signed.body.sha256 as string };
}

async function queryOn(assignmentId: number, saleId: number, reviewerId: number) {
  const [query] = await db.insert(reviewQueries).values({ assignmentId, saleId, raisedBy: reviewerId }).returning({ id: reviewQueries.id });
  await db.insert(queryMessages).values({ queryId: query.id, authorId: reviewerId, kind: 'question', body: 'Is the floor area of this sale verified?' });
  return query.id;
}

async function reconsiderationOn(reportVersionId: number, assignmentId: number, clientId: number) {
  const [row] = await db
    .insert(reconsiderations)
    .values({ reportVersionId, assignmentId, requestedBy: clientId, comment: 'Please weigh the two newer sales on Ropewalk Lane.', extraSales: [] })
    .returning({ id: reconsiderations.id });
  return row.id;
}

export async function buildAccessWorld(api: TestApi): Promise<AccessWorld> {
  const payments = await startPayments(api);
  const clientA = await createUser({ role: 'client' });
  const reportA = await createSignedReport(api, { lenderClient: clientA });
  const firmA = reportA.firm;
  const resigned = await resignWithPhoto(reportA.appraiserAgent, reportA.assignmentId);
  const adminA = await createUser({ role: 'admin', organisation: firmA });
  const working = await createAssignment({ appraiser: reportA.appraiser });
  await db.update(assignments).set({ clientOrganisationId: clientA.organisation.id }).where(eq(assignments.id, working.id));
  const sale = await createSale(working.id);
  const disposablePhotoId = await uploadPhoto(reportA.appraiserAgent, working.id, 'spare.jpg');
  const fee = await createFee(firmA);
  const orderA = await createOrderRow({ firm: firmA, lender: clientA.organisation, client: clientA, fee });

  const clientB = await createUser({ role: 'client' });
  const reportB = await createSignedReport(api, { lenderClient: clientB });
  const orderB = await createOrderRow({ firm: reportB.firm, lender: clientB.organisation, client: clientB, fee: await createFee(reportB.firm) });

  const own: RecordIds = {
    assignment: working.id,
    sale: sale.id,
    photo: resigned.photoId,
    report: resigned.reportVersionId,
    order: orderA.id,
    query: await queryOn(working.id, sale.id, reportA.reviewer.id),
    reconsideration: await reconsiderationOn(resigned.reportVersionId, reportA.assignmentId, clientA.id),
    user: reportA.appraiser.id,
    sha256: resigned.sha256,
  };
  const foreign: RecordIds = {
    assignment: reportB.assignmentId,
    sale: reportB.saleIds[0],
    photo: await storedPhoto(reportB.assignmentId, reportB.appraiser.id),
    report: reportB.reportVersionId,
    order: orderB.id,
    query: await queryOn(reportB.assignmentId, reportB.saleIds[0], reportB.reviewer.id),
    reconsideration: await reconsiderationOn(reportB.reportVersionId, reportB.assignmentId, clientB.id),
    user: reportB.appraiser.id,
    sha256: reportB.sha256,
  };

  const caller = async (name: CallerName, user: TestUser | null, agent?: Agent): Promise<Caller> => ({
    name,
    role: user?.role ?? null,
    user,
    agent: agent ?? (user ? await signedInAgent(api, user) : browserAgent(api)),
  });
  const callers: Record<CallerName, Caller> = {
    anonymous: await caller('anonymous', null),
    appraiser: await caller('appraiser', reportA.appraiser, reportA.appraiserAgent),
    reviewer: await caller('reviewer', reportA.reviewer),
    client: await caller('client', clientA),
    admin: await caller('admin', adminA),
    'other-lender client': await caller('other-lender client', clientB),
  };
  const freshAgent = async (role: Role) => {
    const user = await createUser({ role, organisation: role === 'client' ? clientA.organisation : firmA });
    return { user, agent: await signedInAgent(api, user) };
  };
  return { callers, own, foreign, disposablePhotoId, firmA, appraiserA: reportA.appraiser, payments, freshAgent };
}
