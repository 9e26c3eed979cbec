import { mkdir, rm } from 'node:fs/promises';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FakePaymentsApi } from '../../server/integrations/payments/fake-payments-api';
import type { ReportSnapshot } from '../../server/contracts/report';
import { CAUTIONS } from '../../server/contracts/report-text';
import { launchBrowser, saveScreenshot, SCREENSHOT_DIR, startApp, unexpectedFailures, watchPage, type PageWatch, type RunningApp, type RunningBrowser } from './support/browser';
import { atWidths, dayFromToday, demoUser, EXCLUDED, KEPT, money, moneyUS, prepareApprovedAssignment, readPdf, resubmitAndSign, sessionAs, signIn, startPaymentsFor, type Session } from './support/order-to-report-data';

/** Journeys 1, 6 and 7: the demo lender orders and pays, the firm accepts, reviews and signs, the
 * lender reads the report, downloads the PDF, checks the fingerprint and asks for a reconsideration.
 * Every name, address and figure is invented (the town of Port Ellery does not exist). */

const ADDRESS = '3 Lantern Lane';
const LOAN = `HM-2026-${String(Date.now()).slice(-5)}`;
const PDF_DIR = path.resolve('test-output/order-to-report');

function expectCleanPage(watch: PageWatch, expected: ReadonlyArray<string | RegExp> = []) {
  expect(watch.errors).toEqual([]);
  expect(unexpectedFailures(watch, ['401 GET /api/auth/me', ...expected])).toEqual([]);
}

describe('order to report, in a real browser', () => {
  let app: RunningApp;
  let payments: FakePaymentsApi;
  let clientBrowser: RunningBrowser;
  let firmBrowser: RunningBrowser;
  let clientApi: Session;
  const state = { orderId: 0, assignmentId: 0, reportId: 0, sha256: '', snapshot: null as ReportSnapshot | null };

  beforeAll(async () => {
    app = await startApp();
    payments = await startPaymentsFor(app.baseUrl);
    clientBrowser = await launchBrowser();
    firmBrowser = await launchBrowser();
    clientApi = await sessionAs(app.baseUrl, 'client');
    await rm(PDF_DIR, { recursive: true, force: true });
    await mkdir(PDF_DIR, { recursive: true });
  });

  afterAll(async () => {
    await clientBrowser?.close();
    await firmBrowser?.close();
    await payments?.close();
    await app?.stop();
  });

  it('the client orders an appraisal; the declined test card leaves it unpaid, the approved one pays it', async () => {
    const page = await clientBrowser.context.newPage();
    const watch = watchPage(page);
    await signIn(page, app.baseUrl, 'client');
    await page.getByRole('heading', { name: 'My orders', level: 1 }).waitFor();
    await page.getByRole('link', { name: 'Order an appraisal' }).first().click();
    await page.waitForURL(`${app.baseUrl}/orders/new`);

    // Nothing is sent while the form breaks the contract's rules.
    await page.getByRole('button', { name: 'Continue to payment' }).click();
    await page.getByText('Enter the subject address.').waitFor();
    await page.getByText('Pick the fee for this appraisal.').waitFor();

    await page.getByLabel('Subject address').fill(ADDRESS);
    await page.getByLabel('Loan reference').fill(LOAN);
    await page.getByLabel('Report due by').fill(dayFromToday(20));
    const firm = page.getByLabel('Appraisal firm');
    if ((await firm.count()) > 0) await firm.selectOption({ label: 'Lantern Valuation Group' });
    await page.getByLabel('Single-family, full interior and exterior').check();
    await atWidths(page, 'order-form');
    await page.getByRole('button', { name: 'Continue to payment' }).click();
    await page.waitForURL(/\/orders\/\d+$/);
    state.orderId = Number(page.url().split('/').pop());

    // The payment step offers the provider's two test cards; the declined one answers 402.
    await page.getByLabel('Test card — declined').check();
    await page.getByRole('button', { name: /^Pay / }).click();
    const declined = page.getByRole('alert').filter({ hasText: 'The payment did not go through' });
    await declined.waitFor();
    await expect(declined.innerText()).resolves.toContain('The card was declined');
    await page.getByText('Payment failed').first().waitFor();
    await saveScreenshot(page, 'order-payment-declined-1280');
    const unpaid = await clientApi.json<{ order: { status: string } }>('GET', `/api/orders/${state.orderId}`);
    expect(unpaid.order.status).toBe('awaiting_payment');

    await page.getByLabel('Test card — approved').check();
    await page.getByRole('button', { name: /^Pay / }).click();
    await page.getByText('Paid — the order is with the firm').waitFor({ timeout: 20_000 });
    const paid = await clientApi.json<{ order: { status: string; timeline: Array<{ kind: string }> } }>('GET', `/api/orders/${state.orderId}`);
    expect(paid.order.status).toBe('received');
    expect(paid.order.timeline.map((e) => e.kind)).toEqual(['placed', 'payment_failed', 'paid']);
    await saveScreenshot(page, 'order-paid-1280');

    await page.goto(`${app.baseUrl}/`);
    const card = page.getByRole('article', { name: `Order ${state.orderId}: ${ADDRESS}` });
    await card.waitFor();
    await expect(card.innerText()).resolves.toMatch(/Paid — waiting for the firm[\s\S]*Fee paid/);
    await atWidths(page, 'my-orders-paid');
    expectCleanPage(watch, [`402 POST /api/orders/${state.orderId}/pay`]);
    await page.close();
  }, 120_000);

  it('the office manager accepts the paid order for the demo appraiser, who works it up to approval', async () => {
    const page = await firmBrowser.context.newPage();
    const watch = watchPage(page);
    await signIn(page, app.baseUrl, 'admin');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Orders' }).click();
    const card = page.getByRole('article', { name: `Order ${state.orderId}: ${ADDRESS}` });
    await card.waitFor();
    await card.getByRole('button', { name: 'Accept…' }).click();
    const picker = card.getByLabel('Appraiser who will hold the assignment');
    await expect.poll(() => picker.locator('option').count()).toBeGreaterThan(1);
    await picker.selectOption({ label: demoUser('appraiser').name });
    await atWidths(page, 'firm-orders-accept');
    await card.getByRole('button', { name: 'Accept the order' }).click();
    await card.getByText(/Accepted as assignment \d+/).waitFor();
    expectCleanPage(watch);
    await page.close();

    const admin = await sessionAs(app.baseUrl, 'admin');
    const accepted = await admin.json<{ order: { status: string; assignmentId: number } }>('GET', `/api/orders/${state.orderId}`);
    expect(accepted.order.status).toBe('accepted');
    state.assignmentId = accepted.order.assignmentId;
    await prepareApprovedAssignment(app.baseUrl, state.assignmentId);
  }, 120_000);

  it('the appraiser confirms the certification and signs; version 1 is listed with its fingerprint', async () => {
    const page = await firmBrowser.context.newPage();
    const watch = watchPage(page);
    await signIn(page, app.baseUrl, 'appraiser', `/assignments/${state.assignmentId}/report`);
    const form = page.getByRole('form', { name: 'Sign the report' });
    await form.waitFor();
    await form.getByRole('button', { name: 'Sign the report' }).click();
    await form.getByText('Confirm the certification to sign.').waitFor();
    await form.getByLabel('I certify each statement above for this report.').check();
    await form.getByLabel('Licence or certificate number').fill('PE-CR-04417');
    await form.getByLabel('Issued by (jurisdiction)').fill('Port Ellery Board of Appraisers (invented)');
    await form.getByLabel('Extraordinary assumptions').fill('The interior was inspected on the effective date; the roof space was not accessible and is assumed sound.');
    await atWidths(page, 'report-step-sign');
    await form.getByRole('button', { name: 'Sign the report' }).click();
    await page.getByText('Version 1 signed and delivered').waitFor();
    const versions = page.getByRole('list', { name: 'Signed versions' });
    await versions.getByRole('link', { name: 'Version 1 (latest)' }).waitFor();
    await saveScreenshot(page, 'report-step-signed-1280');

    const appraiser = await sessionAs(app.baseUrl, 'appraiser');
    const { reports } = await appraiser.json<{ reports: Array<{ id: number; sha256: string }> }>('GET', `/api/reports?assignmentId=${state.assignmentId}`);
    expect(reports).toHaveLength(1);
    state.reportId = reports[0].id;
    state.sha256 = reports[0].sha256;
    expect(await page.getByText(`${state.sha256.slice(0, 12)}…`).count()).toBe(1);
    expectCleanPage(watch);
    await page.close();
  }, 90_000);

  it('the client follows the delivered order to the report: value, R², flagged sales, cautions, map, photos, charts', async () => {
    const page = await clientBrowser.context.newPage();
    const watch = watchPage(page);
    await signIn(page, app.baseUrl, 'client');
    const card = page.getByRole('article', { name: `Order ${state.orderId}: ${ADDRESS}` });
    await card.getByRole('list', { name: `Timeline of order ${state.orderId}` }).getByText('Report delivered').waitFor();
    await saveScreenshot(page, 'my-orders-delivered-1280');
    await card.getByRole('link', { name: 'Read the report (version 1)' }).click();
    await page.waitForURL(`${app.baseUrl}/reports/${state.reportId}`);

    const { snapshot } = await clientApi.json<{ snapshot: ReportSnapshot }>('GET', `/api/reports/${state.reportId}`);
    state.snapshot = snapshot;
    const group = snapshot.analysis.groups.find((g) => g.neighbourhood === snapshot.analysis.subjectGroup && !g.pooled)!;
    expect(snapshot.opinionOfValue).toBeGreaterThan(100_000);
    expect(snapshot.grid.rate.source).toBe('fit');
    await page.getByText('from the fitted slope').waitFor();
    await expect(page.getByTestId('opinion-of-value').innerText()).resolves.toBe(money(snapshot.opinionOfValue!));
    await expect(page.getByTestId('r-squared').innerText()).resolves.toBe(group.fit!.rSquared!.toFixed(3));
    await expect(page.getByTestId('sales-n').innerText()).resolves.toBe(String(group.n));
    await expect(page.getByTestId('regression-estimate').innerText()).resolves.toBe(money(group.prediction!.estimate));

    // Each flagged or excluded sale says how it was handled, in the appraiser's words.
    const handled = (address: string) => page.getByTestId('handled-sale').filter({ has: page.getByRole('heading', { name: address, exact: true }) });
    for (const [address, reason] of Object.entries(EXCLUDED)) await expect(handled(address).innerText()).resolves.toMatch(new RegExp(`Excluded, with reason[\\s\\S]*${reason.slice(0, 40).replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`));
    for (const [address, why] of Object.entries(KEPT)) await expect(handled(address).innerText()).resolves.toContain(why);
    const queried = new Set([...Object.keys(EXCLUDED), ...Object.keys(KEPT)]);
    for (const f of group.flagged.filter((x) => !queried.has(x.address))) await expect(handled(f.address).innerText()).resolves.toContain('Not queried');

    const text = await page.locator('main').innerText();
    for (const caution of CAUTIONS) expect(text.replace(/\s+/g, ' ')).toContain(caution);
    expect(text).not.toMatch(/NaN|undefined|null/);
    await page.locator('svg[aria-label^="Map of the subject"] [data-subject]').waitFor();
    await expect(page.locator('svg[aria-label^="Map of the subject"] [data-sale-id]').count()).resolves.toBe(snapshot.sales.filter((s) => s.lon !== null).length);
    await expect.poll(() => page.locator('.recharts-surface [data-sale-id]').count(), { timeout: 10_000 }).toBeGreaterThanOrEqual(group.n);
    const photos = page.locator('article img[src*="/photos/"]');
    await expect.poll(() => photos.evaluateAll((imgs) => imgs.filter((i) => (i as HTMLImageElement).naturalWidth > 0).length)).toBe(4);
    await page.getByTestId('fingerprint').filter({ hasText: state.sha256.slice(0, 8) }).waitFor();
    await atWidths(page, 'report-page');
    // On paper: no navigation, no app chrome, the report alone.
    await page.emulateMedia({ media: 'print' });
    await expect(page.getByRole('navigation', { name: 'Main' }).isVisible()).resolves.toBe(false);
    await expect(page.getByRole('button', { name: 'Print' }).isVisible()).resolves.toBe(false);
    await saveScreenshot(page, 'report-page-print');
    await page.emulateMedia({ media: 'screen' });

    // The PDF: downloaded through the link, its pages rendered and its text read.
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download PDF' }).first().click()]);
    const pdfPath = path.join(PDF_DIR, 'report.pdf');
    await download.saveAs(pdfPath);
    const pdf = readPdf(pdfPath, path.join(SCREENSHOT_DIR, 'order-to-report-pdf'));
    expect(pdf.pages.length).toBeGreaterThanOrEqual(2);
    expect(pdf.text).toContain(ADDRESS);
    expect(pdf.text).toContain(moneyUS(snapshot.opinionOfValue!));
    expect(pdf.text.replace(/\s/g, '')).toContain(state.sha256);
    for (const caution of CAUTIONS) expect(pdf.text).toContain(caution.slice(0, 60));
    expectCleanPage(watch);
    await page.close();
  }, 120_000);

  it('anyone can check the fingerprint without signing in; a wrong one is refused', async () => {
    const anonymous = await launchBrowser();
    try {
      const page = await anonymous.context.newPage();
      const watch = watchPage(page);
      await page.goto(`${app.baseUrl}/verify/${state.sha256}`);
      const result = page.getByTestId('verify-result');
      await expect(result.getAttribute('data-state')).resolves.toBe('found');
      await expect(page.getByTestId('verify-subject-address').innerText()).resolves.toBe(ADDRESS);
      await expect(page.getByTestId('verify-opinion-of-value').innerText()).resolves.toBe(money(state.snapshot!.opinionOfValue!));
      await expect(page.getByTestId('verify-signed-by').innerText()).resolves.toBe(demoUser('appraiser').name);
      await atWidths(page, 'verify-found');
      const altered = `${state.sha256.slice(0, 63)}${state.sha256.endsWith('0') ? '1' : '0'}`;
      await page.getByLabel('Check another fingerprint').fill(altered);
      await page.getByRole('button', { name: 'Check' }).click();
      await expect.poll(() => result.getAttribute('data-state')).toBe('unknown');
      await saveScreenshot(page, 'verify-unknown-1280');
      expectCleanPage(watch);
    } finally {
      await anonymous.close();
    }
  }, 60_000);

  it('the client asks for a reconsideration; the appraiser weighs its effect, keeps the value, reopens the file, and version 1 points to version 2', async () => {
    const page = await clientBrowser.context.newPage();
    const watch = watchPage(page);
    await page.goto(`${app.baseUrl}/reports/${state.reportId}`);
    await page.getByRole('button', { name: 'Ask for a reconsideration' }).click();
    const form = page.getByRole('form', { name: 'Ask for a reconsideration of value' });
    await form.getByLabel('What should the appraiser reconsider, and why?').fill('A recent Quarry Hill sale of a similar house closed above the opinion; please weigh it.');
    await form.getByRole('button', { name: 'Add an extra sale' }).click();
    const sale = form.getByRole('group', { name: 'Extra sale 1' });
    await sale.getByLabel('Address').fill('58 Quarry Road');
    await sale.getByLabel('Sale date').fill('2026-10-28');
    await sale.getByLabel('Sale price').fill('four hundred');
    await sale.getByLabel(/^Floor area/).fill('1880');
    await form.getByRole('button', { name: 'Send the request' }).click();
    await sale.getByText('Enter the sale price as a number.').waitFor();
    await sale.getByLabel('Sale price').fill('468,500');
    await sale.getByText('More about this sale (optional)').click();
    await sale.getByLabel('Neighbourhood').fill('Quarry Hill');
    await form.screenshot({ path: path.join(SCREENSHOT_DIR, 'reconsideration-form-1280.png'), animations: 'disabled' });
    await form.getByRole('button', { name: 'Send the request' }).click();
    await page.getByText('Request sent').waitFor();
    await page.getByRole('list', { name: 'Your requests' }).getByText('Waiting for the appraiser').waitFor();
    expectCleanPage(watch);
    await page.close();

    const firm = await firmBrowser.context.newPage();
    const firmWatch = watchPage(firm);
    await signIn(firm, app.baseUrl, 'appraiser', `/assignments/${state.assignmentId}/report`);
    const effect = firm.getByRole('table', { name: /Effect on the Quarry Hill fit/ });
    await effect.waitFor();
    const group = state.snapshot!.analysis.groups.find((g) => g.neighbourhood === 'Quarry Hill' && !g.pooled)!;
    await expect(effect.getByRole('row', { name: /Sales in the fit/ }).innerText()).resolves.toMatch(new RegExp(`${group.n}\\s+${group.n + 1}\\s+\\+1`));
    const answer = firm.getByRole('form', { name: /Answer the request of/ });
    await answer.getByLabel('Reasons, as the client will read them').fill('58 Quarry Road sold after a bidding contest with a new kitchen; with it the estimate moves within the interval, so the value stands.');
    await atWidths(firm, 'report-step-reconsideration');
    await answer.getByRole('button', { name: 'Answer: the value stands' }).click();
    await firm.getByText('Answered: the value stands').waitFor();
    const { reconsiderations } = await clientApi.json<{ reconsiderations: Array<{ status: string }> }>('GET', `/api/reports/${state.reportId}/reconsiderations`);
    expect(reconsiderations.map((r) => r.status)).toEqual(['value_kept']);

    // A later change: the appraiser reopens the file; once signed again, version 1 says so.
    await firm.getByRole('button', { name: 'Open a new draft…' }).click();
    await firm.getByLabel('Why a new draft is needed').fill('The client’s sale at 58 Quarry Road is to be added to the comparables.');
    await firm.getByRole('button', { name: 'Open the new draft' }).click();
    await firm.getByText('In progress — not ready to sign').waitFor();
    expectCleanPage(firmWatch);
    await firm.close();
    const second = await resubmitAndSign(app.baseUrl, state.assignmentId);
    expect(second.versionNumber).toBe(2);
    const reader = await clientBrowser.context.newPage();
    await reader.goto(`${app.baseUrl}/reports/${state.reportId}`);
    const later = reader.getByRole('status').filter({ hasText: 'A later version of this report exists' });
    await later.getByRole('link', { name: 'Read the latest version' }).click();
    await reader.waitForURL(`${app.baseUrl}/reports/${second.reportVersionId}`);
    // The address changes before version 2 is drawn: count the notice only once it is.
    await reader.getByText(/Appraisal report · version 2 · signed/).waitFor();
    await expect(reader.getByText('A later version of this report exists').count()).resolves.toBe(0);
    await reader.close();
  }, 150_000);
});
