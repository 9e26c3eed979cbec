// Not a budget of its own: how the market analysis page copes with a large comp set. Measures, in
// Debian's Chromium, the time from navigation to the scatter of the subject's neighbourhood drawn
// with every sale, for 20 and for 2,000 and 20,000 sales in that one neighbourhood (the worst case:
// every sale in the chart on screen).
import { eq } from 'drizzle-orm';
import { db } from '../../db/client';
import { sales, subjects } from '../../db/schema/assignments';
import { launchBrowser, startApp } from '../../tests/e2e/support/browser';
import { benchAssignment, benchFirm } from './bench-fixtures';
import { median, recordFigures } from './report';

async function assignmentWithSales(firm: Awaited<ReturnType<typeof benchFirm>>, count: number) {
  const a = await benchAssignment(firm);
  await db.update(subjects).set({ neighbourhood: 'Quarry Hill' }).where(eq(subjects.assignmentId, a.id));
  for (let start = 0; start < count; start += 2000) {
    const batch = Array.from({ length: Math.min(2000, count - start) }, (_, k) => {
      const i = start + k;
      const area = 900 + ((i * 7919) % 2200);
      return { assignmentId: a.id, address: `${i + 1} Scatter Street`, neighbourhood: 'Quarry Hill', salePrice: 40_000 + 200 * area + ((i * 104729) % 50_000), saleDate: `2026-0${1 + (i % 9)}-1${i % 10}`, floorArea: area };
    });
    await db.insert(sales).values(batch);
  }
  return a.id;
}

const firm = await benchFirm('analysis-page');
const sizes = [20, 2_000, 20_000];
const ids = new Map<number, number>();
for (const n of sizes) ids.set(n, await assignmentWithSales(firm, n));
const app = await startApp();
const browser = await launchBrowser();
browser.context.setDefaultTimeout(180_000);
const page = await browser.context.newPage();
await page.goto(`${app.baseUrl}/sign-in`);
await page.getByLabel('E-mail address').fill(firm.appraiser.email);
await page.getByLabel('Password', { exact: true }).fill(firm.appraiser.password);
await page.getByRole('button', { name: 'Sign in' }).click();
await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));

async function timeToScatter(n: number): Promise<number> {
  const id = ids.get(n)!;
  await page.goto(`${app.baseUrl}/assignments/${id}/subject`);
  const t0 = Date.now();
  await page.goto(`${app.baseUrl}/assignments/${id}/market-analysis`);
  // Every sale drawn: as an interactive mark, or within the dense layer of a large chart.
  await page.waitForFunction(
    (count) => {
      const chart = document.querySelector('[data-chart="price-area"]');
      if (!chart) return false;
      const dense = [...chart.querySelectorAll('[data-sale-count]')].reduce((sum, layer) => sum + Number(layer.getAttribute('data-sale-count')), 0);
      return chart.querySelectorAll('circle[data-sale-id]').length + dense >= count;
    },
    n,
    { polling: 50 },
  );
  return Date.now() - t0;
}

await timeToScatter(20); // warm the chunks
const times = new Map<number, number[]>(sizes.map((n) => [n, []]));
for (let run = 0; run < 3; run++) for (const n of sizes) times.get(n)!.push(await timeToScatter(n));
await browser.close();
await app.stop();
const ms = sizes.map((n) => median(times.get(n)!));
const line = sizes.map((n, i) => `${n.toLocaleString('en-US')} sales ${ms[i]} ms`).join(', ');
console.log(`navigation → scatter drawn: ${line}`);
recordFigures('analysis-page', sizes.map((n, i) => [`navigation → the subject neighbourhood's scatter drawn, ${n.toLocaleString('en-US')} sales in it (median of 3)`, `${ms[i]} ms${i > 0 ? ` (${(ms[i] / ms[0]).toFixed(1)}× the 20-sale page)` : ''}`]));
