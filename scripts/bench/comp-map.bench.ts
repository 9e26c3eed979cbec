// Budget: the comp map with 20,000 sales stays usable (clustered). Measures, in Debian's Chromium,
// the time from navigation to the map's first idle event (data-map-ready) with 20,000 sales, beside
// the same page with 20 sales in the same run.
import { eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { sales, subjects } from '../../db/schema/assignments';
import { launchBrowser, startApp } from '../../tests/e2e/support/browser';
import { benchAssignment, benchFirm } from './bench-fixtures';
import { median, recordFigures } from './report';

const [WEST, SOUTH, EAST, NORTH] = [-61.428, 44.69, -61.372, 44.716];

async function assignmentWithLocatedSales(firm: Awaited<ReturnType<typeof benchFirm>>, count: number) {
  const a = await benchAssignment(firm);
  await db.update(subjects).set({ lon: -61.41, lat: 44.707, neighbourhood: 'Quarry Hill' }).where(eq(subjects.assignmentId, a.id));
  for (let start = 0; start < count; start += 2000) {
    const batch = Array.from({ length: Math.min(2000, count - start) }, (_, k) => {
      const i = start + k;
      const area = 900 + ((i * 7919) % 2200);
      return {
        assignmentId: a.id,
        address: `${i + 1} Cluster Street`,
        lon: WEST + (((i * 2654435761) % 10007) / 10007) * (EAST - WEST),
        lat: SOUTH + (((i * 40503) % 9973) / 9973) * (NORTH - SOUTH),
        neighbourhood: 'Quarry Hill',
        salePrice: 40_000 + 200 * area + ((i * 104729) % 50_000),
        saleDate: `2026-0${1 + (i % 9)}-1${i % 10}`,
        floorArea: area,
      };
    });
    await db.insert(sales).values(batch);
  }
  return a.id;
}

const firm = await benchFirm('map');
const small = await assignmentWithLocatedSales(firm, 20);
const large = await assignmentWithLocatedSales(firm, 20_000);
const app = await startApp();
const browser = await launchBrowser();
browser.context.setDefaultTimeout(120_000);
const page = await browser.context.newPage();
await page.goto(`${app.baseUrl}/sign-in`);
await page.getByLabel('E-mail address').fill(firm.appraiser.email);
await page.getByLabel('Password').fill(firm.appraiser.password);
await page.getByRole('button', { name: 'Sign in' }).click();
await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));

async function timeToMapReady(assignmentId: number): Promise<number> {
  await page.goto(`${app.baseUrl}/assignments/${assignmentId}/subject`);
  const t0 = Date.now();
  await page.goto(`${app.baseUrl}/assignments/${assignmentId}/comparables`);
  await page.locator('[data-map-ready="true"]').waitFor();
  return Date.now() - t0;
}

await timeToMapReady(small); // warm the chunks and the worker
const smallTimes: number[] = [];
const largeTimes: number[] = [];
for (let run = 0; run < 3; run++) {
  smallTimes.push(await timeToMapReady(small));
  largeTimes.push(await timeToMapReady(large));
}
// Usable: a click on the map still answers quickly with 20,000 sales on it.
const t0 = Date.now();
await page.locator('[data-map-ready="true"]').click({ position: { x: 200, y: 200 } });
await page.waitForTimeout(50);
const clickMs = Date.now() - t0;
await browser.close();
await app.stop();
const [s, l] = [median(smallTimes), median(largeTimes)];
console.log(`navigation → map idle: 20 sales ${s} ms, 20,000 sales ${l} ms (ratio ${(l / s).toFixed(1)}×); a click on the loaded map answered in ${clickMs} ms`);
recordFigures('comp-map', [
  ['navigation → map idle, 20,000 sales (median of 3, clustered)', `${l} ms`],
  ['baseline: same page, 20 sales', `${s} ms`],
  ['ratio', `${(l / s).toFixed(1)}×`],
  ['a click on the loaded 20,000-sale map', `${clickMs} ms`],
]);
