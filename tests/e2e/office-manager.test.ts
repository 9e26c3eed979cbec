import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/seed/demo-accounts';
import { appAndBrowser, saveScreenshot, unexpectedFailures, watchPage } from './support/browser';

const admin = demoUsers.find((u) => u.role === 'admin')!;
const reviewer = demoUsers.find((u) => u.role === 'reviewer')!;

async function signIn(page: Page, email: string, password: string) {
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Opens the Team page, signing the office manager in first unless this tab shares a session. */
async function openTeamAsAdmin(page: Page, baseUrl: string, { alreadySignedIn = false } = {}) {
  if (alreadySignedIn) {
    await page.goto(`${baseUrl}/`);
  } else {
    await page.goto(`${baseUrl}/sign-in`);
    await signIn(page, admin.email, DEMO_PASSWORD);
  }
  await page.getByRole('table', { name: 'Team members' }).waitFor();
}

/** Resolves with the status of the next PATCH of a user. */
function nextUserPatch(page: Page) {
  return page.waitForResponse((response) => response.request().method() === 'PATCH' && /\/api\/users\/\d+$/.test(response.url())).then((r) => r.status());
}

describe('the office manager’s work in a real browser', () => {
  const running = appAndBrowser({ freshCookies: true });

  it('invites an appraiser: the e-mail waits in the outbox, the invitation is audited, and its link opens an account', async () => {
    const page = await running.browser.context.newPage();
    const watch = watchPage(page);
    const email = `odile.marsh.${Date.now()}@lantern-valuation.example`;

    await openTeamAsAdmin(page, running.app.baseUrl);
    const inviteForm = page.getByRole('region', { name: 'Invite someone' });
    await inviteForm.getByLabel('Name').fill('Odile Marsh');
    await inviteForm.getByLabel('E-mail address').fill(email);
    await inviteForm.getByLabel('Role').selectOption('appraiser');
    await inviteForm.getByRole('button', { name: 'Send invitation' }).click();
    await inviteForm.getByText('Invitation sent').waitFor();
    expect(await inviteForm.getByLabel('Name').inputValue()).toBe('');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Outbox' }).click();
    const entry = page.locator('details', { hasText: email });
    await entry.waitFor();
    await expect(entry.locator('summary').innerText()).resolves.toContain(`${admin.name} invited you to Compline`);
    await entry.locator('summary').click();
    const body = await entry.locator('pre').innerText();
    expect(body).toContain('as appraiser for Lantern Valuation Group');
    const link = body.match(/https?:\/\/\S+\/invitation\?token=\S+/)?.[0];
    expect(link, 'the invitation e-mail carries a link').toBeDefined();
    await saveScreenshot(page, 'admin-outbox-message');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Audit trail' }).click();
    const trail = page.getByRole('table', { name: 'Audit trail' });
    await trail.waitFor();
    const invitedRow = trail.getByRole('row').filter({ hasText: email });
    await expect(invitedRow.count()).resolves.toBe(1);
    const invitedText = await invitedRow.innerText();
    for (const part of [admin.name, 'User invited', 'role appraiser']) expect(invitedText).toContain(part);
    expect(invitedText).toMatch(/invitation #\d+/);

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(`${running.app.baseUrl}/sign-in`);
    await page.goto(link!);
    await page.getByRole('heading', { level: 1, name: 'Join Compline' }).waitFor();
    const facts = await page.locator('dl').innerText();
    for (const fact of ['Odile Marsh', 'Appraiser', 'Lantern Valuation Group', email]) expect(facts).toContain(fact);
    await page.getByLabel('Choose a password').fill('quarry-hill-2026');
    await page.getByLabel('The password again').fill('quarry-hill-2025');
    await page.getByRole('button', { name: 'Accept and sign in' }).click();
    await page.getByText('The two passwords are not the same.').waitFor();
    await saveScreenshot(page, 'invitation');

    await page.getByLabel('The password again').fill('quarry-hill-2026');
    await page.getByRole('button', { name: 'Accept and sign in' }).click();
    await page.waitForURL(`${running.app.baseUrl}/`);
    await page.getByRole('heading', { level: 1, name: 'My assignments' }).waitFor();
    await expect(page.getByTestId('signed-in-user').innerText()).resolves.toContain('Odile Marsh');

    expect(watch.errors).toEqual([]);
    expect(unexpectedFailures(watch, ['401 GET /api/auth/me'])).toEqual([]);
    await page.close();
  });

  it('refuses a change based on an old copy with the server’s message, and reloads on request', async () => {
    const first = await running.browser.context.newPage();
    await openTeamAsAdmin(first, running.app.baseUrl);
    // A second tab of the same office manager, opened before the first tab's change.
    const second = await running.browser.context.newPage();
    const watch = watchPage(second);
    await openTeamAsAdmin(second, running.app.baseUrl, { alreadySignedIn: true });

    const roleIn = (page: Page) => page.getByLabel(`Role of ${reviewer.name}`);
    const saved = nextUserPatch(first);
    await roleIn(first).selectOption('appraiser');
    expect(await saved).toBe(200);

    const staleRow = second.getByRole('row', { name: new RegExp(reviewer.name) });
    await staleRow.getByRole('button', { name: 'Deactivate' }).click();
    const refused = nextUserPatch(second);
    await staleRow.getByRole('button', { name: `Deactivate ${reviewer.name.split(' ')[0]}` }).click();
    expect(await refused).toBe(409);

    const notice = second.getByRole('status').filter({ hasText: 'Someone else changed this person first' });
    await notice.waitFor();
    await expect(notice.innerText()).resolves.toContain('This user was changed by someone else since you opened it.');
    await saveScreenshot(second, 'team-stale-edit');

    await notice.getByRole('button', { name: 'Reload the team list' }).click();
    await notice.waitFor({ state: 'detached' });
    await expect(roleIn(second).inputValue()).resolves.toBe('appraiser');
    await expect(staleRow.innerText()).resolves.toContain('Active');

    // Put the demo reviewer back, from the now current copy.
    const restored = nextUserPatch(second);
    await roleIn(second).selectOption('reviewer');
    expect(await restored).toBe(200);

    expect(watch.errors).toEqual([]);
    expect(unexpectedFailures(watch, [/^409 PATCH \/api\/users\/\d+$/])).toEqual([]);
    await first.close();
    await second.close();
  });
});
