import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/seed/demo-accounts';
import { analysisWireResponse, type Analysis } from '../../server/contracts/analysis';
import { apiSessionAs, createDemoAssignment, TYPED_RATE } from '../factories/demo-assignment';
import { launchBrowser, saveScreenshot, startApp, unexpectedFailures, watchPage, type PageWatch, type RunningApp, type RunningBrowser } from './support/browser';

const appraiser = demoUsers.find((u) => u.role === 'appraiser')!;
const reviewer = demoUsers.find((u) => u.role === 'reviewer')!;

/** Signs in afresh (each browser keeps one person's session across the tests of this file). */
async function signIn(page: Page, baseUrl: string, email: string, next = '/') {
  await page.context().clearCookies();
  await page.goto(`${baseUrl}/sign-in?next=${encodeURIComponent(next)}`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

function expectCleanPage(watch: PageWatch, expected: ReadonlyArray<string | RegExp> = []) {
  expect(watch.errors).toEqual([]);
  expect(unexpectedFailures(watch, ['401 GET /api/auth/me', ...expected])).toEqual([]);
}

/** R² of the subject's neighbourhood and its n, as the API computes them. */
function subjectFit(analysis: Analysis) {
  const group = analysis.groups.find((g) => g.neighbourhood === analysis.subjectGroup && !g.pooled)!;
  return { rSquared: group.fit!.rSquared!, n: group.n, flagged: group.flagged.map((f) => f.address) };
}

describe('the review of planted outliers, in a real browser', () => {
  let app: RunningApp;
  let reviewerBrowser: RunningBrowser;
  let appraiserBrowser: RunningBrowser;

  beforeAll(async () => {
    app = await startApp();
    reviewerBrowser = await launchBrowser();
    appraiserBrowser = await launchBrowser();
  });

  afterAll(async () => {
    await reviewerBrowser?.close();
    await appraiserBrowser?.close();
    await app?.stop();
  });

  it('the appraiser types a rate, line items and weights, keeps their text through a stale save, and submits', async () => {
    const copy = await createDemoAssignment(app.baseUrl, { subjectAddress: '16 Lantern Lane', completeGrid: false, submit: false });
    const page = await appraiserBrowser.context.newPage();
    const watch = watchPage(page);
    await signIn(page, app.baseUrl, appraiser.email, `/assignments/${copy.id}/adjustments`);
    const grid = page.getByRole('table', { name: 'Adjustment grid' });
    await grid.waitFor();
    await expect(page.getByText('Correlation gate not met').count()).resolves.toBe(1);
    for (const address of Object.keys(copy.gridSaleIds)) await expect(grid.getByRole('columnheader', { name: address }).count()).resolves.toBe(1);

    // The gate fails while the typo is in the fit: type a rate, which needs its justification.
    await page.getByLabel('Type a rate').check();
    await page.getByLabel(/^Rate \(USD per ft²\)/).fill(String(TYPED_RATE));
    await page.getByRole('button', { name: 'Save the rate' }).click();
    await page.getByText('Required: say what supports this rate').waitFor();
    await page.getByLabel('Justification of the rate (required)').fill('Paired sales of similar Quarry Hill houses support about $110 per ft².');
    await page.getByRole('button', { name: 'Save the rate' }).click();
    await expect.poll(() => page.getByTestId('rate-in-use').innerText()).toContain('110');

    // The floor-area adjustment shows its arithmetic: 110 × (1,850 − 1,820) for 66 Quarry Road.
    const areaCell = grid.getByRole('row', { name: /^Floor-area adjustment/ }).locator('span[title*="1,820 ft²"]');
    await expect(areaCell.getAttribute('title')).resolves.toMatch(/110 per ft² × \(1,850 ft² − 1,820 ft²\) = \+US\$3,300/);

    await page.getByRole('button', { name: 'Edit the line items of 66 Quarry Road' }).click();
    await page.getByRole('button', { name: 'Add a line item' }).click();
    await page.getByLabel('Feature of line item 1').selectOption('garage');
    await page.getByLabel('Amount of line item 1').fill('-5000');
    await page.getByLabel('Note of line item 1').fill('Two-car garage against the subject’s one; paired sales on Flint Street.');
    await saveScreenshot(page, 'adjustments-line-items-1280');
    await page.getByRole('button', { name: 'Save line items' }).click();
    await grid.getByRole('row', { name: /^Garage/ }).waitFor();
    await expect(grid.getByRole('row', { name: /^Garage/ }).innerText()).resolves.toContain('−US$5,000');

    // Weights must total 100%: the total is shown as it is typed.
    await page.getByRole('button', { name: 'Set the weights' }).click();
    await page.getByLabel('Weight of 66 Quarry Road, percent').fill('50');
    await page.getByLabel('Weight of 25 Flint Street, percent').fill('30');
    await page.getByLabel('Weight of 102 Flint Street, percent').fill('10');
    await expect(page.getByTestId('weights-total').innerText()).resolves.toBe('90.0%');
    await expect(page.getByRole('button', { name: 'Save the weights' }).isDisabled()).resolves.toBe(true);
    await saveScreenshot(page, 'adjustments-weights-1280');
    await page.getByLabel('Weight of 102 Flint Street, percent').fill('20');
    await expect(page.getByTestId('weights-total').innerText()).resolves.toBe('100.0%');
    await page.getByRole('button', { name: 'Save the weights' }).click();
    await page.getByTestId('weights-total').waitFor({ state: 'detached' });
    const weights = await grid.getByRole('row', { name: /^Weight/ }).innerText();
    for (const share of ['50.0%', '30.0%', '20.0%', 'set by the appraiser']) expect(weights).toContain(share);
    await expect(page.getByTestId('opinion-of-value').innerText()).resolves.toMatch(/^US\$\d{3},\d{3}$/);

    // Someone else saves the comment first (another tab): the typed comment survives the 409.
    const api = await apiSessionAs(app.baseUrl, 'appraiser');
    const current = await api.request<{ settings: { version: number } }>('GET', `/api/assignments/${copy.id}/grid`);
    const theirs = await api.request('PUT', `/api/assignments/${copy.id}/grid/settings`, { version: current.body.settings.version, reconciliationComment: 'Draft from the other tab.' });
    expect(theirs.status).toBe(200);
    const mine = 'Most weight on 66 Quarry Road: the most recent sale and the closest in floor area.';
    const comment = page.getByLabel('Reconciliation comment (required before submission)');
    await comment.fill(mine);
    await page.getByRole('button', { name: 'Save the comment' }).click();
    const stale = page.getByRole('status').filter({ hasText: 'Someone else saved first' });
    await stale.waitFor();
    await expect(stale.innerText()).resolves.toContain('The reconciliation comment reads “Draft from the other tab.”');
    await expect(comment.inputValue()).resolves.toBe(mine);
    await saveScreenshot(page, 'adjustments-stale-save-1280');
    await page.getByRole('button', { name: 'Save the comment' }).click();
    await stale.waitFor({ state: 'detached' });
    await expect(page.getByTestId('submission-missing').count()).resolves.toBe(0);
    await saveScreenshot(page, 'adjustments-appraiser-1280');
    await page.setViewportSize({ width: 768, height: 1024 });
    await saveScreenshot(page, 'adjustments-appraiser-768');
    await page.setViewportSize({ width: 1280, height: 800 });

    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.getByText('Read-only', { exact: true }).waitFor();
    await expect(page.locator('main header').first().innerText()).resolves.toMatch(/in review/i);
    const saved = await api.request<{ assignment: { status: string } }>('GET', `/api/assignments/${copy.id}`);
    expect(saved.body.assignment.status).toBe('in_review');
    expectCleanPage(watch, [/^409 PUT \/api\/assignments\/\d+\/grid\/settings$/]);
    await page.close();
  });

  it('the reviewer queries the family transfer, the appraiser excludes it, the new R² shows, and the reviewer approves', async () => {
    const copy = await createDemoAssignment(app.baseUrl, { subjectAddress: '18 Lantern Lane' });
    const family = copy.anomalies['family-transfer'];
    expect(family.address).toBe('41 Cobble Lane');
    const appraiserApi = await apiSessionAs(app.baseUrl, 'appraiser');
    const before = subjectFit(analysisWireResponse.parse((await appraiserApi.request<unknown>('GET', `/api/assignments/${copy.id}/analysis`)).body));
    expect(before.flagged).toContain(family.address);

    // The reviewer opens the file from the queue and finds the family transfer flagged.
    const review = await reviewerBrowser.context.newPage();
    const reviewWatch = watchPage(review);
    await signIn(review, app.baseUrl, reviewer.email);
    const queueRow = review.getByRole('table', { name: 'Assignments waiting for review' }).getByRole('row', { name: new RegExp(copy.subjectAddress) });
    await queueRow.waitFor();
    await expect(queueRow.innerText()).resolves.toMatch(/In review/);
    await saveScreenshot(review, 'review-queue-1280');
    await queueRow.getByRole('link', { name: copy.subjectAddress }).click();
    await review.waitForURL(`${app.baseUrl}/assignments/${copy.id}/review`);
    // Its address heads its row (another flagged sale's reason names it too).
    const flaggedRow = review.getByTestId('flagged-sale').filter({ has: review.getByText(family.address, { exact: true }) });
    await flaggedRow.waitFor();
    await expect(flaggedRow.innerText()).resolves.toContain('family or related party');

    await flaggedRow.getByRole('button', { name: `Raise a query on ${family.address}` }).click();
    await flaggedRow.getByLabel(`Your question on ${family.address}`).fill('Sold at about 60% of the line to a relative: was it exposed to the open market?');
    await saveScreenshot(review, 'review-query-form-1280');
    await flaggedRow.getByRole('button', { name: 'Send the query' }).click();
    const reviewerThread = review.getByRole('article', { name: `Query on ${family.address}` });
    await reviewerThread.waitFor();
    await expect(reviewerThread.innerText()).resolves.toContain('Open');
    const approve = review.getByRole('button', { name: 'Approve', exact: true });
    await expect(approve.isDisabled()).resolves.toBe(true);
    await expect(review.locator('#approve-explanation').innerText()).resolves.toContain('1 query is still open');
    await saveScreenshot(review, 'review-query-raised-1280');

    // The appraiser, in a browser of their own, excludes the sale with a reason.
    const work = await appraiserBrowser.context.newPage();
    const workWatch = watchPage(work);
    await signIn(work, app.baseUrl, appraiser.email, `/assignments/${copy.id}/review`);
    const appraiserThread = work.getByRole('article', { name: `Query on ${family.address}` });
    await appraiserThread.waitFor();
    await work.getByTestId('subject-r-squared').waitFor();
    await appraiserThread.getByRole('button', { name: 'Exclude the sale' }).click();
    const reason = 'Transfer from parent to daughter, never offered on the open market: not an arm’s-length sale.';
    await appraiserThread.getByLabel(/^Reason for excluding the sale/).fill(reason);
    await appraiserThread.getByRole('button', { name: 'Exclude the sale' }).click();
    const excluded = work.getByTestId('excluded-sale').filter({ hasText: family.address });
    await excluded.waitFor();
    await expect(excluded.innerText()).resolves.toContain(reason);
    await expect(excluded.locator('.line-through').innerText()).resolves.toBe(family.address);

    const after = subjectFit(analysisWireResponse.parse((await appraiserApi.request<unknown>('GET', `/api/assignments/${copy.id}/analysis`)).body));
    expect(after.n).toBe(before.n - 1);
    const change = work.getByTestId('fit-change');
    await change.waitFor();
    const shown = Number((await work.getByTestId('subject-r-squared').innerText()).replace(/[^\d.]/g, ''));
    expect(Math.abs(shown - after.rSquared)).toBeLessThan(0.00006);
    expect(Math.abs(shown - before.rSquared)).toBeGreaterThan(0.00004);
    await expect(change.innerText()).resolves.toMatch(new RegExp(`from ${after.n} sales \\(was ${before.n}\\)`));
    await saveScreenshot(work, 'review-appraiser-excluded-1280');

    // The reviewer sees the answer, resolves the query and approves.
    await review.reload();
    await reviewerThread.waitFor();
    await expect(reviewerThread.innerText()).resolves.toContain('Excluded the sale');
    await review.getByTestId('excluded-sale').filter({ hasText: family.address }).waitFor();
    await reviewerThread.getByRole('button', { name: 'Resolve' }).click();
    await reviewerThread.getByRole('button', { name: 'Resolve the query' }).click();
    await expect.poll(() => reviewerThread.innerText()).toContain('Resolved');
    await expect.poll(() => approve.isEnabled()).toBe(true);
    await approve.click();
    await expect.poll(() => review.getByTestId('assignment-status').innerText()).toBe('Approved');
    await review.getByRole('list', { name: 'Status timeline' }).getByText('Approved').waitFor();
    await saveScreenshot(review, 'review-approved-1280');

    // The grid is read-only now, for the reviewer too, and the excluded sale has left nothing behind in it.
    await review.getByRole('navigation', { name: 'Assignment steps' }).getByRole('link', { name: /Adjustments/ }).click();
    await review.getByRole('table', { name: 'Adjustment grid' }).waitFor();
    await expect(review.getByRole('button', { name: 'Save the rate' }).count()).resolves.toBe(0);
    await expect(review.getByRole('button', { name: 'Submit for review' }).count()).resolves.toBe(0);
    await expect(review.getByTestId('rate-in-use').innerText()).resolves.toContain('110');
    await saveScreenshot(review, 'adjustments-reviewer-1280');
    await review.getByRole('navigation', { name: 'Assignment steps' }).getByRole('link', { name: /Review/ }).click();
    await review.getByTestId('assignment-status').waitFor();
    await review.setViewportSize({ width: 768, height: 1024 });
    await saveScreenshot(review, 'review-approved-768');

    // The e-mails of each step wait in the outbox.
    const adminApi = await apiSessionAs(app.baseUrl, 'admin');
    const outbox = await adminApi.request<{ messages: Array<{ toAddress: string; subject: string }> }>('GET', '/api/outbox');
    const sent = outbox.body.messages.map((m) => `${m.toAddress} | ${m.subject}`);
    expect(sent).toEqual(
      expect.arrayContaining([
        `${reviewer.email} | Ready for review: ${copy.subjectAddress}`,
        `${appraiser.email} | Query on ${family.address}`,
        `${reviewer.email} | Query answered: ${copy.subjectAddress}`,
        `${appraiser.email} | Approved — ready to sign: ${copy.subjectAddress}`,
      ]),
    );
    expectCleanPage(reviewWatch);
    expectCleanPage(workWatch);
    await review.close();
    await work.close();
  });

  it('the reviewer returns a file with a note, and the appraiser edits the grid again and resubmits', async () => {
    const copy = await createDemoAssignment(app.baseUrl, { subjectAddress: '20 Lantern Lane' });
    const review = await reviewerBrowser.context.newPage();
    const reviewWatch = watchPage(review);
    await signIn(review, app.baseUrl, reviewer.email, `/assignments/${copy.id}/review`);
    await review.getByRole('button', { name: 'Request revisions' }).click();
    await review.getByRole('button', { name: 'Return for revisions' }).click();
    await review.getByText('Say what needs revising: the appraiser reads this first.').waitFor();
    const note = 'Explain the weight on 25 Flint Street: its concession is the largest of the three.';
    await review.getByLabel('What needs revising (required)').fill(note);
    await review.getByRole('button', { name: 'Return for revisions' }).click();
    await expect.poll(() => review.getByTestId('assignment-status').innerText()).toBe('Revisions requested');
    // The timeline refetches after the status: wait for it rather than read it once.
    await expect.poll(() => review.getByRole('list', { name: 'Status timeline' }).innerText()).toContain(note);
    await expect(review.getByRole('button', { name: 'Approve', exact: true }).count()).resolves.toBe(0);

    const work = await appraiserBrowser.context.newPage();
    const workWatch = watchPage(work);
    await signIn(work, app.baseUrl, appraiser.email, `/assignments/${copy.id}/adjustments`);
    await work.getByText('The reviewer returned the file.', { exact: false }).waitFor();
    await expect(work.getByRole('button', { name: 'Save the rate' }).count()).resolves.toBe(1);
    await work.getByRole('button', { name: 'Submit again for review' }).click();
    await work.getByText('Read-only', { exact: true }).waitFor();
    const appraiserApi = await apiSessionAs(app.baseUrl, 'appraiser');
    const timeline = await appraiserApi.request<{ changes: Array<{ toStatus: string; note: string | null }> }>('GET', `/api/assignments/${copy.id}/timeline`);
    expect(timeline.body.changes.map((c) => c.toStatus)).toEqual(['in_review', 'revisions_requested', 'in_review']);
    expect(timeline.body.changes[1].note).toBe(note);
    expectCleanPage(reviewWatch);
    expectCleanPage(workWatch);
    await review.close();
    await work.close();
  });
});
