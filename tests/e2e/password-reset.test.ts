import { describe, expect, it } from 'vitest';
import { createUser } from '../factories/accounts';
import { linkIn, onlyMailTo } from '../setup/mailbox';
import { appAndBrowser, saveScreenshot, unexpectedFailures, watchPage } from './support/browser';

const SERVER_ACCEPTED = 'If that address has an account, a reset link is on its way.';
const LINK_USED = 'This reset link is not valid any more. Ask for a new one.';

describe('resetting a forgotten password in a real browser', () => {
  const running = appAndBrowser();

  it('sends a link, sets the new password through it, signs in with it, and refuses the link a second time', async () => {
    const user = await createUser({ role: 'appraiser', name: 'Perrin Voss' });
    const newPassword = 'saltmarsh-flats-tide';
    const page = await running.browser.context.newPage();
    const watch = watchPage(page);

    await page.goto(`${running.app.baseUrl}/sign-in`);
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    await page.getByRole('heading', { level: 1, name: 'Reset your password' }).waitFor();
    await page.getByLabel('E-mail address').fill(user.email);
    await page.getByRole('button', { name: 'Send the reset link' }).click();
    const accepted = page.getByRole('status').filter({ hasText: 'Check your e-mail' });
    await accepted.waitFor();
    await expect(accepted.innerText()).resolves.toContain(SERVER_ACCEPTED);
    await saveScreenshot(page, 'forgot-password');

    const { url } = linkIn((await onlyMailTo(user.email)).textBody);
    expect(url.pathname).toBe('/reset-password');
    await page.goto(`${running.app.baseUrl}${url.pathname}${url.search}`);
    await page.getByRole('heading', { level: 1, name: 'Choose a new password' }).waitFor();

    // The contract's own rule, checked before anything is sent.
    await page.getByLabel('New password', { exact: true }).fill('short');
    await page.getByLabel('The new password again', { exact: true }).fill('short');
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await page.getByText('Use at least 10 characters.').waitFor();

    await page.getByLabel('New password', { exact: true }).fill(newPassword);
    await page.getByLabel('The new password again', { exact: true }).fill(newPassword);
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await page.getByText('Your password is changed').waitFor();
    await page.getByRole('link', { name: 'Sign in' }).click();

    await page.waitForURL(`${running.app.baseUrl}/sign-in`);
    await page.getByLabel('E-mail address').fill(user.email);
    await page.getByLabel('Password', { exact: true }).fill(newPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { level: 1, name: 'My assignments' }).waitFor();
    await expect(page.getByTestId('signed-in-user').innerText()).resolves.toContain(user.name);

    // A used link is refused with the server's words and a way to ask for another.
    await page.goto(`${running.app.baseUrl}${url.pathname}${url.search}`);
    await page.getByLabel('New password', { exact: true }).fill(newPassword);
    await page.getByLabel('The new password again', { exact: true }).fill(newPassword);
    await page.getByRole('button', { name: 'Save the new password' }).click();
    const refused = page.getByRole('alert');
    await refused.waitFor();
    await expect(refused.innerText()).resolves.toContain(LINK_USED);
    await refused.getByRole('link', { name: 'Ask for a new link' }).waitFor();
    await saveScreenshot(page, 'reset-password-link-used');

    expect(watch.errors).toEqual([]);
    expect(unexpectedFailures(watch, ['401 GET /api/auth/me', '400 POST /api/auth/password-reset/confirm'])).toEqual([]);
    await page.close();
  });
});
