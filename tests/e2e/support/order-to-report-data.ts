import { execFileSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { and, eq, inArray, sql } from 'drizzle-orm';
import sharp from 'sharp';
import { db } from '../../../db/client';
import { assignments, sales, subjects } from '../../../db/schema/assignments';
import { DEMO_PASSWORD, demoUsers } from '../../../db/seed/demo-accounts';
import { generatePortEllery } from '../../../db/seed/port-ellery';
import type { Page } from 'playwright-core';
import { configurePayments } from '../../../server/integrations/payments/payments-client';
import { startFakePaymentsApi, type FakePaymentsApi } from '../../../server/integrations/payments/fake-payments-api';
import { saveScreenshot } from './browser';

/**
 * Helpers of the order-to-report browser test: the local fake payment provider wired to the
 * in-process app, a signed-in API session of a demo user, and the firm's work on an accepted order
 * (the invented Port Ellery market written into its assignment, then review through the API).
 */

/** Figures as the browser (locale en-GB) and the PDF (en-US) print them. */
export const money = (v: number) => new Intl.NumberFormat('en-GB', { style: 'currency', currency: 'USD', maximumFractionDigits: 0 }).format(v);
export const moneyUS = (v: number) => new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', maximumFractionDigits: 0 }).format(v);
export const dayFromToday = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

export async function signIn(page: Page, baseUrl: string, role: 'client' | 'admin' | 'appraiser', next = '/') {
  await page.context().clearCookies();
  await page.goto(`${baseUrl}/sign-in?next=${encodeURIComponent(next)}`);
  await page.getByLabel('E-mail address').fill(demoUser(role).email);
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

export async function atWidths(page: Page, name: string) {
  await saveScreenshot(page, `${name}-1280`);
  await page.setViewportSize({ width: 768, height: 1024 });
  await saveScreenshot(page, `${name}-768`);
  await page.setViewportSize({ width: 1280, height: 800 });
}

/** Starts the fake provider, points the app's payments SDK at it and its webhooks at the app. */
export async function startPaymentsFor(baseUrl: string): Promise<FakePaymentsApi> {
  const fake = await startFakePaymentsApi({ webhookUrl: `${baseUrl}/api/payments/webhook`, retryDelaysMs: [100, 300] });
  configurePayments({ apiUrl: fake.url, secretKey: fake.secretKey, webhookSecret: fake.webhookSecret });
  return fake;
}

export type DemoRole = 'appraiser' | 'reviewer' | 'admin' | 'client';
export const demoUser = (role: DemoRole) => demoUsers.find((u) => u.role === role)!;

export interface Session {
  json: <T = unknown>(method: string, path: string, body?: unknown) => Promise<T>;
  upload: (path: string, form: FormData) => Promise<unknown>;
}

/** Signs a demo user in against the running app; every call throws on a status of 300 or more. */
export async function sessionAs(baseUrl: string, role: DemoRole): Promise<Session> {
  const response = await fetch(`${baseUrl}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: baseUrl },
    body: JSON.stringify({ email: demoUser(role).email, password: DEMO_PASSWORD }),
  });
  if (response.status !== 204) throw new Error(`sign-in of the demo ${role} answered ${response.status}`);
  const cookie = response.headers.getSetCookie().map((line) => line.split(';')[0]).join('; ');
  const send = async (method: string, path: string, body: BodyInit | undefined, type?: string) => {
    const res = await fetch(`${baseUrl}${path}`, { method, headers: { Cookie: cookie, Origin: baseUrl, Accept: 'application/json', ...(type ? { 'Content-Type': type } : {}) }, body });
    const text = await res.text();
    if (res.status >= 300) throw new Error(`${role}: ${method} ${path} answered ${res.status}: ${text}`);
    return text ? (JSON.parse(text) as unknown) : undefined;
  };
  return {
    json: async <T,>(method: string, path: string, body?: unknown) => (await send(method, path, body === undefined ? undefined : JSON.stringify(body), body === undefined ? undefined : 'application/json')) as T,
    upload: (path, form) => send('POST', path, form),
  };
}

/** An invented photo: a house front drawn in one colour, rendered to JPEG by sharp. */
async function housePhoto(wall: string, roof: string): Promise<Blob> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="640" height="480">
    <rect width="640" height="480" fill="#c9d6d3"/><rect y="380" width="640" height="100" fill="#8d9b6a"/>
    <polygon points="150,200 320,90 490,200" fill="${roof}"/><rect x="170" y="200" width="300" height="190" fill="${wall}"/>
    <rect x="295" y="290" width="50" height="100" fill="#3b3b3b"/><rect x="200" y="240" width="60" height="50" fill="#e8eef0"/>
    <rect x="380" y="240" width="60" height="50" fill="#e8eef0"/></svg>`;
  const jpeg = await sharp(Buffer.from(svg)).jpeg({ quality: 80 }).toBuffer();
  return new Blob([new Uint8Array(jpeg)], { type: 'image/jpeg' });
}

export const GRID_SALES = ['66 Quarry Road', '25 Flint Street', '102 Flint Street'] as const;
export const EXCLUDED = {
  '144 Mason Street': 'Floor area keyed as 16,400 ft²; the deed and the listing give 1,640 ft². The record is wrong, not the market.',
  '41 Cobble Lane': 'Sold between relatives at about 60% of market without exposure to the open market; not an arm’s-length sale.',
  '119 Flint Street': 'Foreclosure resale, sold as is after a short marketing time by a motivated seller; not comparable to the subject.',
} as const;
export const KEPT = { '71 Flint Street': 'Estate sale, but marketed openly for seven weeks with several offers (confirmed with the executor’s agent); the price stands as market evidence.' } as const;
export const TYPED_RATE = 110;

/** The firm's work on the accepted order's assignment, up to an approved file ready to sign. */
export async function prepareApprovedAssignment(baseUrl: string, assignmentId: number): Promise<void> {
  const scenario = generatePortEllery();
  const nameOf = (slug: string) => scenario.neighbourhoods.find((n) => n.slug === slug)!.name;
  const { subject } = scenario;
  await db.transaction(async (tx) => {
    await tx.update(assignments).set({ effectiveDate: scenario.effectiveDate, timeAdjustment: true, dataRevision: sql`${assignments.dataRevision} + 1` }).where(eq(assignments.id, assignmentId));
    await tx
      .update(subjects)
      .set({ lon: subject.lon, lat: subject.lat, neighbourhood: nameOf(subject.neighbourhood), floorArea: subject.floorArea, lotSize: subject.lotSize, bedrooms: subject.bedrooms, bathrooms: subject.bathrooms, yearBuilt: subject.yearBuilt, condition: subject.condition, quality: subject.quality, garageSpaces: subject.garageSpaces, notes: 'Single-storey house on a quiet lane.' })
      .where(eq(subjects.assignmentId, assignmentId));
    await tx.insert(sales).values(
      scenario.sales.map(({ key: _key, neighbourhood, saleType, ...sale }) => ({ ...sale, assignmentId, neighbourhood: nameOf(neighbourhood), saleType: saleType.replace('-', '_') as 'arms_length' })),
    );
    await tx.update(sales).set({ inGrid: true }).where(and(eq(sales.assignmentId, assignmentId), inArray(sales.address, [...GRID_SALES])));
  });
  const rows = await db.select({ id: sales.id, address: sales.address }).from(sales).where(eq(sales.assignmentId, assignmentId));
  const saleId = (address: string) => rows.find((r) => r.address === address)!.id;

  const appraiser = await sessionAs(baseUrl, 'appraiser');
  const reviewer = await sessionAs(baseUrl, 'reviewer');
  const colours = [['#d8c7a3', '#7a4b3a'], ['#b9c4cc', '#4b5563'], ['#e2d5c3', '#5d6b4f'], ['#cdb7a0', '#3f4a5c']] as const;
  for (const [i, target] of [null, ...GRID_SALES].entries()) {
    const form = new FormData();
    if (target) form.set('saleId', String(saleId(target)));
    form.append('files', await housePhoto(colours[i][0], colours[i][1]), `${target ?? 'subject'}.jpg`);
    await appraiser.upload(`/api/assignments/${assignmentId}/photos`, form);
  }

  const grid = await appraiser.json<{ settings: { version: number } }>('GET', `/api/assignments/${assignmentId}/grid`);
  await appraiser.json('PUT', `/api/assignments/${assignmentId}/grid/settings`, {
    version: grid.settings.version,
    typedRate: TYPED_RATE,
    rateJustification: 'The Quarry Hill fit fails its correlation gate while 144 Mason Street carries a floor area keyed ten times too large; paired sales of similar Quarry Hill houses this year support about $110 per ft².',
    reconciliationComment: 'Most weight on 66 Quarry Road, the most recent sale and the closest in floor area; the three adjusted prices lie close together and bracket the regression estimate.',
  });
  const assignmentVersion = async () => (await appraiser.json<{ assignment: { version: number } }>('GET', `/api/assignments/${assignmentId}`)).assignment.version;
  await appraiser.json('POST', `/api/assignments/${assignmentId}/transitions`, { action: 'submit', version: await assignmentVersion() });

  const asked = { ...EXCLUDED, ...KEPT };
  for (const address of Object.keys(asked)) {
    await reviewer.json('POST', `/api/assignments/${assignmentId}/queries`, { saleId: saleId(address), body: `The fit flags ${address}. What do the facts of this sale say?` });
  }
  type Query = { id: number; saleAddress: string | null; version: number };
  const open = (await appraiser.json<{ queries: Query[] }>('GET', `/api/assignments/${assignmentId}/queries`)).queries;
  for (const query of open) {
    const address = query.saleAddress as keyof typeof asked;
    const exclude = address in EXCLUDED;
    await appraiser.json('POST', `/api/queries/${query.id}/answer`, { action: exclude ? 'exclude' : 'keep', explanation: asked[address], version: query.version });
  }
  for (const query of (await reviewer.json<{ queries: Query[] }>('GET', `/api/assignments/${assignmentId}/queries`)).queries) {
    await reviewer.json('POST', `/api/queries/${query.id}/resolve`, { version: query.version });
  }
  // With the three bad records set aside the fit passes its gate: the reviewer asks for the
  // measured rate instead of the typed one, and approves the resubmitted file.
  await reviewer.json('POST', `/api/assignments/${assignmentId}/transitions`, { action: 'request-revisions', version: await assignmentVersion(), note: 'The fit now meets its gate; use the measured floor-area rate.' });
  const revised = await appraiser.json<{ settings: { version: number } }>('GET', `/api/assignments/${assignmentId}/grid`);
  await appraiser.json('PUT', `/api/assignments/${assignmentId}/grid/settings`, { version: revised.settings.version, typedRate: null, rateJustification: null });
  await appraiser.json('POST', `/api/assignments/${assignmentId}/transitions`, { action: 'submit', version: await assignmentVersion() });
  await reviewer.json('POST', `/api/assignments/${assignmentId}/transitions`, { action: 'approve', version: await assignmentVersion() });
}

/** The text of a PDF (pdftotext) with its whitespace folded, and its pages rendered as PNGs at
 * 50 dpi (pdftoppm) under `prefix`-N.png; returns the text and the page files. */
export function readPdf(pdfPath: string, prefix: string): { text: string; pages: string[] } {
  const text = execFileSync('pdftotext', ['-enc', 'UTF-8', pdfPath, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
  execFileSync('pdftoppm', ['-png', '-r', '50', pdfPath, prefix]);
  const dir = path.dirname(prefix);
  const pages = readdirSync(dir).filter((f) => f.startsWith(`${path.basename(prefix)}-`) && f.endsWith('.png')).map((f) => path.join(dir, f));
  return { text, pages };
}

/** A reopened draft taken back through review and signed again through the API: version 2. */
export async function resubmitAndSign(baseUrl: string, assignmentId: number): Promise<{ reportVersionId: number; versionNumber: number }> {
  const appraiser = await sessionAs(baseUrl, 'appraiser');
  const reviewer = await sessionAs(baseUrl, 'reviewer');
  const version = async () => (await appraiser.json<{ assignment: { version: number } }>('GET', `/api/assignments/${assignmentId}`)).assignment.version;
  await appraiser.json('POST', `/api/assignments/${assignmentId}/transitions`, { action: 'submit', version: await version() });
  await reviewer.json('POST', `/api/assignments/${assignmentId}/transitions`, { action: 'approve', version: await version() });
  return appraiser.json('POST', `/api/assignments/${assignmentId}/sign`, {
    certify: true,
    licenceNumber: 'PE-CR-04417',
    jurisdiction: 'Port Ellery Board of Appraisers (invented)',
    extraordinaryAssumptions: '',
    hypotheticalConditions: '',
    version: await version(),
  });
}
