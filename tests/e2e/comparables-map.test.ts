import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, demoUsers } from '../../db/seed/demo-accounts';
import { DEMO_SUBJECT_ADDRESS } from '../../db/seed/seed-assignment';
import { neighbourhoodAt, type NeighbourhoodBoundaries } from '../../client/features/subject/lib/neighbourhood-at';
import { appAndBrowser, saveScreenshot, SCREENSHOT_DIR, unexpectedFailures, watchPage, type PageWatch } from './support/browser';
import { colourSummary, elementPixels, hex, openLandNearSubject, shareOf } from './comparables-map-pixels';

const appraiser = demoUsers.find((u) => u.role === 'appraiser')!;
const PAPER = hex('#f7f3ea'); // --color-paper: the land of the basemap
const boundaries = JSON.parse(readFileSync('public/basemap/neighbourhoods.geojson', 'utf8')) as NeighbourhoodBoundaries;

/** The demo assignment's workspace at one step, signed in as the demo appraiser. */
async function openStep(page: Page, baseUrl: string, step: 'Subject' | 'Comparables') {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail address').fill(appraiser.email);
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('link', { name: DEMO_SUBJECT_ADDRESS, exact: true }).click();
  await page.getByRole('navigation', { name: 'Assignment steps' }).getByRole('link', { name: step }).click();
  await page.getByRole('heading', { level: 2, name: step, exact: true }).waitFor();
}

function expectClean(watch: PageWatch, alsoExpected: RegExp[] = []) {
  expect(watch.errors).toEqual([]);
  expect(unexpectedFailures(watch, ['401 GET /api/auth/me', ...alsoExpected])).toEqual([]);
}

/** Waits for the answer to the next write of a sale. */
function saleWrite(page: Page, method: 'POST' | 'PATCH' | 'DELETE') {
  return page.waitForResponse((r) => r.request().method() === method && /\/api\/assignments\/\d+\/sales(\/\d+)?(\?.*)?$/.test(r.url()));
}

describe('the comp set on the map, in a real browser', () => {
  const running = appAndBrowser({ viewport: { width: 1280, height: 900 } });

  it('draws the town, adds a sale where the map is clicked, puts three sales in the grid, then undoes it all', async () => {
    await running.browser.context.clearCookies();
    const page = await running.browser.context.newPage();
    const watch = watchPage(page);
    await openStep(page, running.app.baseUrl, 'Comparables');

    const map = page.locator('[data-map-ready="true"]');
    await map.waitFor({ timeout: 30_000 });
    expect(await map.getAttribute('aria-label')).toBe('Map of the subject and the sales');
    const pixels = await elementPixels(map, path.join(SCREENSHOT_DIR, 'comparables-map-canvas.png'));
    const colours = colourSummary(pixels);
    expect(colours.distinct, 'a drawn map has many colours; a blank canvas has one').toBeGreaterThan(40);
    expect(colours.commonestShare).toBeLessThan(0.8);
    // Land is paper; inside the rings a faint ink wash darkens it by a few levels.
    expect(shareOf(pixels, PAPER, 14), 'the land is drawn in the paper colour').toBeGreaterThan(0.1);
    const saleMarkers = page.locator('.cm-sale');
    expect(await saleMarkers.count()).toBeGreaterThan(100);
    await expect(page.locator('.cm-subject').count()).resolves.toBe(1);
    await expect(page.locator('.cm-ring-label').allInnerTexts()).resolves.toEqual(['0.5 mi', '1 mi']);

    // Click on open land: the map offers to add a sale there, and the form opens with the place filled in.
    const spot = await openLandNearSubject(page, map, pixels, PAPER);
    await page.mouse.click(spot.x, spot.y);
    await page.getByRole('button', { name: 'Add a sale here' }).click();
    const dialog = page.getByRole('dialog', { name: 'Add a sale' });
    await dialog.waitFor();
    const lon = Number(await dialog.getByLabel('Longitude').inputValue());
    const lat = Number(await dialog.getByLabel('Latitude').inputValue());
    expect(lon).toBeGreaterThan(-61.44);
    expect(lon).toBeLessThan(-61.36);
    expect(lat).toBeGreaterThan(44.68);
    expect(lat).toBeLessThan(44.72);

    // The contract's own messages come back on the fields, then a complete sale is added.
    await dialog.getByRole('button', { name: 'Add sale' }).click();
    await dialog.getByText('Enter the address.').waitFor();
    await dialog.getByText('Enter the sale price as a number.').waitFor();
    const address = `${Date.now() % 100_000} Lamplight Court`;
    await dialog.getByLabel('Address').fill(address);
    await dialog.getByLabel('Sale price (USD)').fill('418,500');
    await dialog.getByLabel('Sale date').fill('2026-08-14');
    await dialog.getByLabel('Gross living area (ft²)').fill('1760');
    const created = saleWrite(page, 'POST');
    await dialog.getByRole('button', { name: 'Add sale' }).click();
    expect((await created).status()).toBe(201);
    await dialog.waitFor({ state: 'detached' });
    const table = page.getByRole('table', { name: 'Comparable sales' });
    const newRow = table.getByRole('row').filter({ hasText: address });
    await newRow.waitFor();
    expect(await newRow.getAttribute('aria-selected')).toBe('true');
    await page.getByRole('button', { name: `Sale: ${address}` }).waitFor();
    await page.locator('.maplibregl-popup').getByText(address).waitFor();
    const expectedHood = neighbourhoodAt(boundaries, lon, lat) ?? 'No neighbourhood';
    await expect(newRow.innerText()).resolves.toContain(expectedHood);

    // Three sales into the grid, each with the version it was shown with.
    const switches = table.getByRole('switch', { checked: false });
    const chosen: string[] = [];
    for (let i = 0; chosen.length < 3; i++) {
      const name = (await switches.nth(i).getAttribute('aria-label'))!;
      if (name.includes(address) || (await switches.nth(i).isDisabled())) continue;
      const toggle = table.getByRole('switch', { name, exact: true });
      const written = saleWrite(page, 'PATCH');
      await toggle.click();
      expect((await written).status()).toBe(200);
      await expect.poll(() => toggle.getAttribute('aria-checked')).toBe('true');
      chosen.push(name);
      i = -1; // the unchecked list shrank by one: start again from its top
    }
    await expect.poll(() => page.getByTestId('grid-count').innerText()).toMatch(/^3\s+sales in the grid/);
    await expect.poll(() => page.locator('.cm-sale[data-grid="true"]').count()).toBe(3);
    await saveScreenshot(page, 'comparables-map-1280');

    // On a tablet the map sits above the table.
    await page.setViewportSize({ width: 768, height: 1024 });
    await page.waitForTimeout(400);
    const mapBox = (await map.boundingBox())!;
    const tableBox = (await table.boundingBox())!;
    expect(mapBox.y + mapBox.height).toBeLessThanOrEqual(tableBox.y);
    expect(mapBox.width).toBeGreaterThan(600);
    await saveScreenshot(page, 'comparables-map-768');
    await page.setViewportSize({ width: 1280, height: 900 });

    // Leave the demo as it was: the three out of the grid, the added sale deleted (softly).
    for (const name of chosen) {
      const written = saleWrite(page, 'PATCH');
      await table.getByRole('switch', { name, exact: true }).click();
      expect((await written).status()).toBe(200);
    }
    await expect.poll(() => page.getByTestId('grid-count').innerText()).toMatch(/^0\s+sales in the grid/);
    await table.getByRole('button', { name: `Edit ${address}` }).click();
    const editDialog = page.getByRole('dialog', { name: `Edit ${address}` });
    await editDialog.getByRole('button', { name: 'Delete sale…' }).click();
    await editDialog.getByRole('alertdialog').getByText(`Delete ${address}?`).waitFor();
    const deleted = saleWrite(page, 'DELETE');
    await editDialog.getByRole('button', { name: 'Delete this sale' }).click();
    expect((await deleted).status()).toBe(204);
    await newRow.waitFor({ state: 'detached' });
    await expect(page.getByRole('button', { name: `Sale: ${address}` }).count()).resolves.toBe(0);

    expectClean(watch);
    await page.close();
  });

  it('keeps what was typed when someone else saved the sale first, and saves it on the fresh version', async () => {
    await running.browser.context.clearCookies();
    const page = await running.browser.context.newPage();
    const watch = watchPage(page);
    await openStep(page, running.app.baseUrl, 'Comparables');
    const table = page.getByRole('table', { name: 'Comparable sales' });
    const editButton = table.getByRole('button', { name: /^Edit / }).first();
    const address = (await editButton.getAttribute('aria-label'))!.replace(/^Edit /, '');
    await editButton.click();
    const dialog = page.getByRole('dialog', { name: `Edit ${address}` });
    const area = dialog.getByLabel('Gross living area (ft²)');
    const originalArea = await area.inputValue();
    await area.fill(String(Number(originalArea) + 15));

    // Another tab changes the price of the same sale meanwhile.
    const other = await page.evaluate(async (address) => {
      const assignmentId = location.pathname.split('/')[2];
      const { sales } = await (await fetch(`/api/assignments/${assignmentId}/sales`)).json();
      const sale = sales.find((s: { address: string }) => s.address === address);
      const body = JSON.stringify({ salePrice: sale.salePrice + 1000, version: sale.version });
      const res = await fetch(`/api/assignments/${assignmentId}/sales/${sale.id}`, { method: 'PATCH', headers: { 'Content-Type': 'application/json' }, body });
      return { status: res.status, assignmentId, saleId: sale.id as number, price: sale.salePrice as number };
    }, address);
    expect(other.status).toBe(200);

    await dialog.getByRole('button', { name: 'Save changes' }).click();
    const notice = dialog.getByText('Someone else saved this sale while you were editing');
    await notice.waitFor();
    const comparison = dialog.getByRole('row').filter({ hasText: 'Gross living area' });
    await expect(comparison.innerText()).resolves.toContain(String(Number(originalArea) + 15));
    await dialog.getByText('They also changed: Sale price.').waitFor();
    await saveScreenshot(page, 'comparables-sale-conflict');
    await dialog.getByRole('button', { name: 'Load their version, keep my edits' }).click();
    expect(await area.inputValue()).toBe(String(Number(originalArea) + 15));
    expect(Number((await dialog.getByLabel('Sale price (USD)').inputValue()).replace(/\D/g, ''))).toBe(other.price + 1000);
    const saved = saleWrite(page, 'PATCH');
    await dialog.getByRole('button', { name: 'Save changes' }).click();
    expect((await saved).status()).toBe(200);
    await dialog.waitFor({ state: 'detached' });

    // Put the sale back as the seed had it.
    const restored = await page.evaluate(async ({ assignmentId, saleId, price, area }) => {
      const { sales } = await (await fetch(`/api/assignments/${assignmentId}/sales`)).json();
      const sale = sales.find((s: { id: number }) => s.id === saleId);
      const changed = { floorArea: sale.floorArea, salePrice: sale.salePrice };
      const body = JSON.stringify({ salePrice: price, floorArea: area, version: sale.version });
      const res = await fetch(`/api/assignments/${assignmentId}/sales/${saleId}`, { method: 'PATCH', headers: { 'Content-Type': 'application/json' }, body });
      return { status: res.status, changed };
    }, { ...other, area: Number(originalArea) });
    expect(restored.changed).toEqual({ floorArea: Number(originalArea) + 15, salePrice: other.price + 1000 });
    expect(restored.status).toBe(200);

    expectClean(watch, [/^409 PATCH \/api\/assignments\/\d+\/sales\/\d+$/]);
    await page.close();
  });

  it('places the subject with a click on the map and fills its neighbourhood from the boundaries', async () => {
    await running.browser.context.clearCookies();
    const page = await running.browser.context.newPage();
    const watch = watchPage(page);
    await openStep(page, running.app.baseUrl, 'Subject');
    const map = page.locator('[data-map-ready="true"]');
    await map.waitFor({ timeout: 30_000 });
    const lonField = page.getByLabel('Longitude');
    const before = await lonField.inputValue();
    const pixels = await elementPixels(map);
    const spot = await openLandNearSubject(page, map, pixels, PAPER);
    await page.mouse.click(spot.x, spot.y);
    await expect.poll(() => lonField.inputValue()).not.toBe(before);
    const lon = Number(await lonField.inputValue());
    const lat = Number(await page.getByLabel('Latitude').inputValue());
    await expect.poll(() => page.getByLabel('Neighbourhood').inputValue()).toBe(neighbourhoodAt(boundaries, lon, lat) ?? '');
    await page.getByText('You have unsaved changes.').waitFor();
    await saveScreenshot(page, 'subject-location-picked');
    await page.getByRole('button', { name: 'Undo my changes' }).click();
    expect(await lonField.inputValue()).toBe(before);
    expectClean(watch);
    await page.close();
  });
});
