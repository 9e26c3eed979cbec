/*
 * Journey 2, "build the comp set on a map", in Debian's Chromium against a private copy of the
 * Port Ellery assignment.
 *
 * What this journey uses of the Comparables page (client/pages/assignments/steps/comparables-step.tsx);
 * change the page and the `comparables` helpers below together:
 *  - the map frame (features/comp-map) carries data-map-ready="true" once drawn, maplibre's canvas inside;
 *    a click on empty map offers "Add a sale here", which opens the dialog "Add a sale"
 *    (features/sales: Address, Sale price (…), Sale date, Gross living area (…), submit "Add sale");
 *  - the table "Comparable sales" (sorted by distance from the subject) with a switch
 *    "In grid: <address>" in each row, and the grid count (data-testid="grid-count");
 *  - the selected sale's section "Photos of <address>" with PhotoStrip and PhotoDropZone
 *    (features/photos): file input "Add photos of this sale", list "Photos of this sale";
 *  - the button "Import from CSV", which opens ImportSalesPanel (features/sales-import): file input "CSV file of sales";
 *  - the link "Export sales (CSV)", which downloads GET /api/assignments/:id/sales.csv.
 */
import { readFile } from 'node:fs/promises';
import { and, eq, isNull } from 'drizzle-orm';
import Papa from 'papaparse';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { db } from '../../db/client';
import { photos, sales } from '../../db/schema/assignments';
import { DEMO_PASSWORD, demoUsers } from '../../db/seed/demo-accounts';
import { generatePortEllery } from '../../db/seed/port-ellery';
import { cleanSaleRow, csvFile } from '../factories/csv';
import { createDemoAssignment } from '../factories/demo-assignment';
import { appAndBrowser, saveScreenshot, unexpectedFailures, watchPage } from './support/browser';

const appraiser = demoUsers.find((u) => u.role === 'appraiser')!;
const SUBJECT_ADDRESS = '14 Lantern Lane (comp set journey)';
const MAP_SALE = { address: '9 Saltpan Close', price: '402500', date: '2026-08-21', area: '1760' };

/** Six invented sales a few hundred metres from the subject; spreadsheet row 4 has a price no one can read. */
function exportWithOneBadRow() {
  const { lon, lat } = generatePortEllery().subject;
  const rows = [0, 1, 2, 3, 4, 5].map((i) =>
    cleanSaleRow(700 + i, {
      address: `${31 + i * 2} Ropewalk Lane`,
      date: `2026-0${3 + i}-1${i}`,
      lon: (lon + (i - 2.5) * 0.0011).toFixed(6),
      lat: (lat + (i % 3 - 1) * 0.0008).toFixed(6),
    }),
  );
  rows[2] = { ...rows[2], price: 'call the agent' };
  return { file: csvFile(rows), goodAddresses: rows.filter((_, i) => i !== 2).map((r) => r.address), badRow: 4 };
}

/** How the journey finds things on the Comparables page (see the note at the top). */
const comparables = {
  map: (page: Page) => page.locator('[data-map-ready="true"]'),
  table: (page: Page) => page.getByRole('table', { name: 'Comparable sales' }),
  row: (page: Page, address: string) => comparables.table(page).getByRole('row').filter({ hasText: address }),
  gridSwitch: (page: Page, address: string) => page.getByRole('switch', { name: `In grid: ${address}`, exact: true }),
  photos: (page: Page, address: string) => page.getByRole('region', { name: `Photos of ${address}` }),
  dialog: (page: Page, name: string) => page.getByRole('dialog', { name }),
};

/** How many distinct colours a PNG holds, and the share of its pixels in the commonest one. A blank
 * canvas is one colour; a drawn basemap has land, sea, parks, streets and rings, antialiased. */
async function colourCensus(png: Buffer): Promise<{ distinct: number; commonestShare: number }> {
  const { data, info } = await sharp(png).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  const counts = new Map<number, number>();
  for (let i = 0; i < data.length; i += info.channels) {
    const colour = (data[i] << 16) | (data[i + 1] << 8) | data[i + 2];
    counts.set(colour, (counts.get(colour) ?? 0) + 1);
  }
  return { distinct: counts.size, commonestShare: Math.max(...counts.values()) / (info.width * info.height) };
}

/** A point of the map frame near its middle and clear of every marker, popup and button, so that a
 * click there lands on empty map (maplibre's own marker and popup classes). */
function emptySpotNearMiddle(map: ReturnType<Page['locator']>) {
  return map.evaluate((frame) => {
    const box = frame.getBoundingClientRect();
    const blockers = [...frame.querySelectorAll('.maplibregl-marker, .maplibregl-popup, button')].map((e) => e.getBoundingClientRect());
    const margin = 14;
    for (let ring = 3; ring < 40; ring++) {
      for (let k = 0; k < ring * 8; k++) {
        const angle = (k / (ring * 8)) * 2 * Math.PI;
        const x = box.width / 2 + Math.cos(angle) * ring * 8;
        const y = box.height / 2 + Math.sin(angle) * ring * 8;
        const [px, py] = [box.left + x, box.top + y];
        if (blockers.every((b) => px < b.left - margin || px > b.right + margin || py < b.top - margin || py > b.bottom + margin)) return { x, y };
      }
    }
    throw new Error('no empty spot near the middle of the map');
  });
}

function photoJpeg(): Promise<Buffer> {
  // A facade of sorts: sky over a brick-coloured block, so the thumbnail is not one flat colour.
  const sky = { r: 168, g: 196, b: 214 };
  return sharp({ create: { width: 800, height: 600, channels: 3, background: sky } })
    .composite([{ input: { create: { width: 560, height: 300, channels: 3, background: { r: 150, g: 82, b: 60 } } }, top: 260, left: 120 }])
    .jpeg({ quality: 85 })
    .toBuffer();
}

describe('building the comp set in a real browser', () => {
  const running = appAndBrowser();

  it('adds a sale on the map with a photo, imports a CSV skipping its bad row, and marks three sales for the grid', async () => {
    const copy = await createDemoAssignment(running.app.baseUrl, { subjectAddress: SUBJECT_ADDRESS, completeGrid: false, submit: false });
    // The factory marks three demo sales for the grid; this journey starts from none and marks its own.
    await db.update(sales).set({ inGrid: false }).where(eq(sales.assignmentId, copy.id));

    const page = await running.browser.context.newPage();
    const watch = watchPage(page);
    await page.goto(`${running.app.baseUrl}/sign-in`);
    await page.getByLabel('E-mail address').fill(appraiser.email);
    await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: SUBJECT_ADDRESS }).click();
    await page.getByRole('heading', { level: 1, name: SUBJECT_ADDRESS }).waitFor();
    await page.getByRole('navigation', { name: 'Assignment steps' }).getByRole('link', { name: /Comparables/ }).click();
    await page.waitForURL(`${running.app.baseUrl}/assignments/${copy.id}/comparables`);

    // The map is drawn: its canvas holds the basemap, rings and markers, not a blank rectangle.
    const map = comparables.map(page);
    await map.waitFor({ timeout: 20_000 });
    // Only the WebGL canvas counts: markers, popups and buttons are hidden for the shot, and the
    // frame's border and rounded corners are cropped off.
    const canvasBox = (await map.locator('canvas').first().boundingBox())!;
    const census = await colourCensus(
      await page.screenshot({
        clip: { x: canvasBox.x + 8, y: canvasBox.y + 8, width: canvasBox.width - 16, height: canvasBox.height - 16 },
        style: '[data-map-ready] *:not(canvas):not(:has(canvas)) { visibility: hidden !important; }',
      }),
    );
    expect(census.distinct, 'colours on the map canvas').toBeGreaterThan(20);
    expect(census.commonestShare, 'share of the commonest colour').toBeLessThan(0.9);

    // A sale added where the appraiser clicks on the map: near the middle, between the markers.
    await map.click({ position: await emptySpotNearMiddle(map) });
    await page.getByRole('button', { name: 'Add a sale here' }).click();
    const addDialog = comparables.dialog(page, 'Add a sale');
    await addDialog.getByLabel('Address').fill(MAP_SALE.address);
    await addDialog.getByLabel('Sale price').fill(MAP_SALE.price);
    await addDialog.getByLabel('Sale date').fill(MAP_SALE.date);
    await addDialog.getByLabel('Gross living area').fill(MAP_SALE.area);
    await addDialog.getByRole('button', { name: 'Add sale' }).click();
    await comparables.row(page, MAP_SALE.address).first().waitFor();
    const [mapSale] = await db.select().from(sales).where(and(eq(sales.assignmentId, copy.id), eq(sales.address, MAP_SALE.address)));
    expect(mapSale, 'the sale added on the map is stored').toBeDefined();
    expect(mapSale.lon, 'with the clicked location').not.toBeNull();

    // A photo for that sale: a disguised text file is refused with the server's reason and nothing
    // of the batch is stored; the real JPEG then arrives as a lazy thumbnail and becomes the cover.
    // The new sale is selected: its photo section is open.
    const photoSection = comparables.photos(page, MAP_SALE.address);
    const photoInput = photoSection.getByLabel('Add photos of this sale');
    await photoInput.setInputFiles([
      { name: 'inspection-notes.jpg', mimeType: 'image/jpeg', buffer: Buffer.from('Inspection notes, not a picture.\n'.repeat(40)) },
      { name: 'street-view.jpg', mimeType: 'image/jpeg', buffer: await photoJpeg() },
    ]);
    await photoSection.getByText('inspection-notes.jpg is not a JPEG, PNG or WebP image.').waitFor();
    expect(await db.select().from(photos).where(eq(photos.saleId, mapSale.id))).toHaveLength(0);
    await photoInput.setInputFiles({ name: 'street-view.jpg', mimeType: 'image/jpeg', buffer: await photoJpeg() });
    const strip = photoSection.getByRole('list', { name: 'Photos of this sale' });
    await strip.getByRole('listitem', { name: 'street-view.jpg (cover)' }).waitFor();
    const thumb = strip.locator('img').first();
    expect(await thumb.getAttribute('loading')).toBe('lazy');
    await page.waitForFunction((img) => (img as HTMLImageElement).complete && (img as HTMLImageElement).naturalWidth === 320, await thumb.elementHandle());
    const [stored] = await db.select().from(sales).where(eq(sales.id, mapSale.id));
    expect(stored.coverPhotoId, 'the first photo of a sale becomes its cover').not.toBeNull();
    await saveScreenshot(page, 'build-comp-set-photo');

    // The CSV import: the bad row is named by its spreadsheet row number, skipped explicitly, and
    // the other five sales are committed together.
    const csv = exportWithOneBadRow();
    await page.getByRole('button', { name: 'Import from CSV' }).click();
    // The panel states the server's cap on rows per file.
    await expect(page.getByRole('region', { name: 'Import sales from a CSV file' }).innerText()).resolves.toMatch(/at most 100,000 rows/);
    await page.getByLabel('CSV file of sales').setInputFiles({ name: 'ropewalk-sales.csv', mimeType: 'text/csv', buffer: csv.file });
    const problems = page.getByRole('list', { name: /Rows with problems/ });
    const problem = problems.getByRole('listitem').filter({ hasText: `Row ${csv.badRow}` });
    await problem.waitFor();
    expect(await problem.innerText()).toMatch(/Sale price\s+“call the agent” is not a number\./);
    await expect(problems.getByRole('listitem').count()).resolves.toBe(1);
    const importButton = page.getByRole('button', { name: 'Import 5 sales' });
    expect(await importButton.isDisabled(), 'nothing is imported before the bad row is dealt with').toBe(true);
    await page.getByRole('checkbox', { name: /Skip the 1 row with problems/ }).check();
    await saveScreenshot(page, 'build-comp-set-import-preview');
    await importButton.click();
    await page.getByText('Imported 5 sales; skipped 1 row.').waitFor({ timeout: 20_000 });
    // The table is sorted by distance from the subject: the imported sales, a few hundred metres
    // away, are on its first page.
    for (const address of csv.goodAddresses) await comparables.row(page, address).first().waitFor();
    const badRowSale = await db.select().from(sales).where(and(eq(sales.assignmentId, copy.id), eq(sales.address, '35 Ropewalk Lane')));
    expect(badRowSale, 'the bad row (row 4: 35 Ropewalk Lane) was not imported').toHaveLength(0);

    // Three sales into the grid: the one from the map and two imported ones.
    const gridAddresses = [MAP_SALE.address, csv.goodAddresses[0], csv.goodAddresses[3]];
    for (const address of gridAddresses) {
      await comparables.gridSwitch(page, address).click();
      await expect.poll(() => comparables.gridSwitch(page, address).getAttribute('aria-checked')).toBe('true');
    }
    await expect.poll(() => page.getByTestId('grid-count').innerText()).toMatch(/^3\s*sales in the grid/);
    const inGrid = await db.select({ address: sales.address }).from(sales).where(and(eq(sales.assignmentId, copy.id), eq(sales.inGrid, true)));
    expect(inGrid.map((s) => s.address).sort()).toEqual([...gridAddresses].sort());

    // The comp set leaves as a CSV file: the sale from the map and the imported ones, not the bad row.
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Export sales (CSV)' }).click()]);
    expect(download.suggestedFilename()).toBe(`compline-sales-${copy.id}.csv`);
    const exported = Papa.parse<Record<string, string>>((await readFile(await download.path())).toString('utf8').replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: true });
    const exportedAddresses = exported.data.map((r) => r.Address);
    for (const address of [MAP_SALE.address, ...csv.goodAddresses]) expect(exportedAddresses, address).toContain(address);
    expect(exportedAddresses).not.toContain('35 Ropewalk Lane');
    const liveSales = await db.select({ id: sales.id }).from(sales).where(and(eq(sales.assignmentId, copy.id), isNull(sales.deletedAt)));
    expect(exported.data).toHaveLength(liveSales.length);

    await map.waitFor();
    await saveScreenshot(page, 'build-comp-set');
    expect(watch.errors).toEqual([]);
    expect(unexpectedFailures(watch, ['401 GET /api/auth/me', `415 POST /api/assignments/${copy.id}/photos`])).toEqual([]);
    await page.close();
  }, 90_000);
});
