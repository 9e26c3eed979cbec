import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_FIRM, DEMO_PASSWORD, demoUsers } from '../../db/seed/demo-accounts';
import { DEMO_SUBJECT_ADDRESS } from '../../db/seed/seed-assignment';
import { DEMO_REVIEW_SUBJECT_ADDRESS } from '../../db/seed/seed-review-assignment';
import { roleLabels, type Role } from '../../server/contracts/auth';
import {
  appAndBrowser,
  saveScreenshot,
  unexpectedFailures,
  watchPage,
  type PageWatch,
} from './support/browser';

/** The heading each role's home page opens with. */
const homeHeading: Record<Role, string> = {
  appraiser: 'My assignments',
  reviewer: 'Review queue',
  client: 'My orders',
  admin: 'Team',
};

/** HTTP failures a page may meet on these journeys: "who am I" and a wrong password answer 401
 * while signed out. Any other failed answer fails the test. */
const EXPECTED_FAILURES = [
  '401 GET /api/auth/me',
  '401 POST /api/auth/sign-in',
];

const WRONG_CREDENTIALS = 'That e-mail address and password do not match an active account.';

function account(role: Role) {
  const user = demoUsers.find((u) => u.role === role);
  if (!user) throw new Error(`no demo ${role}`);
  return user;
}

async function signIn(page: Page, email: string, password: string) {
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

function heading(page: Page, name: string) {
  return page.getByRole('heading', { level: 1, name, exact: true });
}

/** Waits until no loading placeholder is left in the page's main area. */
async function settled(page: Page) {
  await page.waitForFunction(() => !document.querySelector('main [role="status"][aria-live]'));
}

function expectCleanPage(watch: PageWatch) {
  expect(watch.errors).toEqual([]);
  expect(unexpectedFailures(watch, EXPECTED_FAILURES)).toEqual([]);
}

describe('signing in to Compline in a real browser', () => {
  const running = appAndBrowser({ freshCookies: true });

  for (const role of ['appraiser', 'reviewer', 'client', 'admin'] as const) {
    it(`signs the ${role} in to their own home, shows who is signed in, and signs out`, async () => {
      const user = account(role);
      const page = await running.browser.context.newPage();
      const watch = watchPage(page);

      await page.goto(`${running.app.baseUrl}/`);
      await page.waitForURL(`${running.app.baseUrl}/sign-in`);
      await signIn(page, user.email, DEMO_PASSWORD);
      await page.waitForURL(`${running.app.baseUrl}/`);
      await heading(page, homeHeading[role]).waitFor();

      const signedInAs = page.getByTestId('signed-in-user');
      await expect(signedInAs.innerText()).resolves.toContain(user.name);
      await expect(signedInAs.innerText()).resolves.toContain(roleLabels[role]);
      await expect(signedInAs.innerText()).resolves.toContain(user.organisation);
      // Only this role's home: no other role's heading on the page.
      for (const other of Object.values(homeHeading).filter((h) => h !== homeHeading[role])) {
        expect(await heading(page, other).count()).toBe(0);
      }
      await settled(page);
      // The home's list loaded (a table or an empty state), not an error panel.
      expect(await page.locator('main [role="alert"]').allInnerTexts()).toEqual([]);
      await saveScreenshot(page, `${role}-home`);

      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.waitForURL(`${running.app.baseUrl}/sign-in`);
      // The session is really over: the home page sends us back to sign in.
      await page.goto(`${running.app.baseUrl}/`);
      await page.waitForURL(`${running.app.baseUrl}/sign-in`);
      await heading(page, 'Sign in').waitFor();

      expectCleanPage(watch);
      await page.close();
    });
  }

  it('lets the office manager read the team, the outbox and the audit trail', async () => {
    const admin = account('admin');
    const page = await running.browser.context.newPage();
    const watch = watchPage(page);
    await page.goto(`${running.app.baseUrl}/sign-in`);
    await signIn(page, admin.email, DEMO_PASSWORD);
    await heading(page, 'Team').waitFor();

    const team = page.getByRole('table', { name: 'Team members' });
    await team.waitFor();
    for (const user of demoUsers) await expect(team.innerText()).resolves.toContain(user.name);
    await expect(team.innerText()).resolves.toContain(DEMO_FIRM);

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Outbox' }).click();
    await heading(page, 'Outbox').waitFor();
    await settled(page);
    await saveScreenshot(page, 'admin-outbox');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Audit trail' }).click();
    await heading(page, 'Audit trail').waitFor();
    const trail = page.getByRole('table', { name: 'Audit trail' });
    await trail.waitFor();
    // This very sign-in is on the trail, by name.
    await expect(trail.innerText()).resolves.toMatch(new RegExp(`${admin.name}\\s+Sign in`));
    await saveScreenshot(page, 'admin-audit-trail');

    // Both typefaces come from the app itself and were really used on this page.
    const loadedFaces = await page.evaluate(() =>
      [...document.fonts].filter((face) => face.status === 'loaded').map((face) => `${face.family.replace(/"/g, '')} ${face.weight}`),
    );
    expect(loadedFaces).toEqual(expect.arrayContaining(['Public Sans 400', 'Public Sans 600', 'IBM Plex Mono 400']));

    expectCleanPage(watch);
    await page.close();
  });

  it('gives the demo reviewer a file waiting in the queue, which opens at its review with the submission on its timeline', async () => {
    const page = await running.browser.context.newPage();
    const watch = watchPage(page);
    await page.goto(`${running.app.baseUrl}/sign-in`);
    await signIn(page, account('reviewer').email, DEMO_PASSWORD);
    await heading(page, 'Review queue').waitFor();

    const queue = page.getByRole('table', { name: 'Assignments waiting for review' });
    const row = queue.getByRole('row', { name: new RegExp(DEMO_REVIEW_SUBJECT_ADDRESS) });
    await row.waitFor();
    await expect(row.innerText()).resolves.toMatch(/In review/);
    await expect(row.innerText()).resolves.toContain(account('appraiser').name);
    // The demo file still being built is not the reviewer's yet.
    expect(await queue.getByRole('row', { name: new RegExp(DEMO_SUBJECT_ADDRESS) }).count()).toBe(0);
    await settled(page);
    await saveScreenshot(page, 'reviewer-demo-queue');

    await row.getByRole('link', { name: DEMO_REVIEW_SUBJECT_ADDRESS }).click();
    await page.waitForURL(/\/assignments\/\d+\/review$/);
    await heading(page, DEMO_REVIEW_SUBJECT_ADDRESS).waitFor();
    const timeline = page.getByRole('list', { name: 'Status timeline' });
    await timeline.waitFor();
    const steps = await timeline.getByRole('listitem').allInnerTexts();
    expect(steps).toHaveLength(1);
    expect(steps[0]).toContain('Submitted for review');
    expect(steps[0]).toContain(account('appraiser').name);
    await expect(page.getByTestId('assignment-status').innerText()).resolves.toBe('In review');
    await page.getByTestId('flagged-sale').first().waitFor();
    await settled(page);
    await saveScreenshot(page, 'reviewer-demo-review');

    expectCleanPage(watch);
    await page.close();
  });

  it('shows the server’s message for a wrong password and stays on the sign-in page', async () => {
    const page = await running.browser.context.newPage();
    const watch = watchPage(page);
    await page.goto(`${running.app.baseUrl}/sign-in`);
    await signIn(page, account('appraiser').email, 'not-the-password');

    const alert = page.getByRole('alert');
    await alert.waitFor();
    expect(await alert.innerText()).toBe(WRONG_CREDENTIALS);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    expect(await page.getByLabel('Password', { exact: true }).inputValue()).toBe('');
    expect(watch.failedResponses).toContain('401 POST /api/auth/sign-in');
    await saveScreenshot(page, 'sign-in-wrong-password');

    expectCleanPage(watch);
    await page.close();
  });

  it('sends a signed-out deep link to sign in, then back to the page asked for', async () => {
    const appraiser = account('appraiser');
    const page = await running.browser.context.newPage();
    const watch = watchPage(page);

    await page.goto(`${running.app.baseUrl}/assignments/1`);
    await page.waitForURL(`${running.app.baseUrl}/sign-in?next=%2Fassignments%2F1`);
    await heading(page, 'Sign in').waitFor();
    await saveScreenshot(page, 'sign-in');

    await signIn(page, appraiser.email, DEMO_PASSWORD);
    await page.waitForURL(`${running.app.baseUrl}/assignments/1`);
    // The demo assignment opens at its first step.
    await heading(page, DEMO_SUBJECT_ADDRESS).waitFor();
    await page.getByRole('heading', { level: 2, name: 'Subject', exact: true }).waitFor();
    const steps = page.getByRole('navigation', { name: 'Assignment steps' }).getByRole('link');
    expect(await steps.allInnerTexts()).toEqual(['01\nSubject', '02\nComparables', '03\nMarket analysis', '04\nAdjustments', '05\nReview', '06\nReport']);
    expect(await steps.first().getAttribute('aria-current')).toBe('step');
    await settled(page);
    await saveScreenshot(page, 'assignment-workspace');

    await steps.filter({ hasText: 'Market analysis' }).click();
    await page.waitForURL(`${running.app.baseUrl}/assignments/1/market-analysis`);
    await page.getByRole('heading', { level: 2, name: 'Market analysis', exact: true }).waitFor();
    await expect(page.getByRole('complementary', { name: 'Cautions' }).innerText()).resolves.toContain(
      'A flagged sale is a question, not a verdict',
    );
    await settled(page);
    await saveScreenshot(page, 'assignment-market-analysis');

    await page.goto(`${running.app.baseUrl}/no-such-page`);
    await heading(page, 'There is no page at this address').waitFor();

    expectCleanPage(watch);
    await page.close();
  });

  it('fits a tablet screen (768 px) without sideways scrolling', async () => {
    const page = await running.browser.context.newPage();
    await page.setViewportSize({ width: 768, height: 1024 });
    const watch = watchPage(page);
    const overflow = () => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);

    await page.goto(`${running.app.baseUrl}/sign-in`);
    await heading(page, 'Sign in').waitFor();
    expect(await overflow()).toBeLessThanOrEqual(0);
    await saveScreenshot(page, 'tablet-sign-in');

    await signIn(page, account('admin').email, DEMO_PASSWORD);
    await page.getByRole('table', { name: 'Team members' }).waitFor();
    expect(await overflow()).toBeLessThanOrEqual(0);
    await saveScreenshot(page, 'tablet-admin-team');

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(`${running.app.baseUrl}/sign-in`);
    await signIn(page, account('reviewer').email, DEMO_PASSWORD);
    await heading(page, 'Review queue').waitFor();
    await page.goto(`${running.app.baseUrl}/assignments/1/adjustments`);
    await page.getByRole('heading', { level: 2, name: 'Adjustments', exact: true }).waitFor();
    expect(await overflow()).toBeLessThanOrEqual(0);
    await settled(page);
    await saveScreenshot(page, 'tablet-reviewer-workspace');

    expectCleanPage(watch);
    await page.close();
  });
});
