import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { db } from '../../db/client';
import { sales } from '../../db/schema/assignments';
import { DEMO_PASSWORD, demoUsers } from '../../db/seed/demo-accounts';
import { generatePortEllery } from '../../db/seed/port-ellery';
import { DEMO_SUBJECT_ADDRESS } from '../../db/seed/seed-assignment';
import { analysisWireResponse, type Analysis, type GroupAnalysis } from '../../server/contracts/analysis';
import { CAUTIONS } from '../../server/contracts/report-text';
import { figureFormat } from '../../client/features/market-analysis/lib/figure-format';
import { predictionHalfWidth } from '../../client/features/market-analysis/lib/prediction-band';
import { apiSessionAs, createDemoAssignment } from '../factories/demo-assignment';
import { appAndBrowser, saveScreenshot, unexpectedFailures, watchPage } from './support/browser';

const appraiser = demoUsers.find((u) => u.role === 'appraiser')!;
const LOCALE = 'en-GB'; // the browser's locale (support/browser.ts), so that figures compare as text

async function signInAsAppraiser(page: Page, baseUrl: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail address').fill(appraiser.email);
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(`${baseUrl}/`);
}

/** A GET of the API through the page's own fetch (its session cookie). */
async function apiGet<T>(page: Page, path: string): Promise<T> {
  return page.evaluate(async (url) => {
    const res = await fetch(url, { headers: { Accept: 'application/json' } });
    if (!res.ok) throw new Error(`${url} answered ${res.status}`);
    return res.json();
  }, path) as Promise<T>;
}

function groupNamed(analysis: Analysis, name: string): GroupAnalysis & { fit: NonNullable<GroupAnalysis['fit']> } {
  const group = analysis.groups.find((g) => g.neighbourhood === name);
  if (!group?.fit) throw new Error(`the analysis has no fitted group ${name}`);
  return { ...group, fit: group.fit };
}

const scatterDots = (page: Page) => page.locator('[data-chart="price-area"] circle[data-sale-id]');
const figure = (page: Page, name: string) => page.locator(`[data-figure="${name}"]`).first();

/** Waits until the scatter shows `count` sales (the chart draws after it has measured its box). */
async function waitForDots(page: Page, count: number) {
  await page.waitForFunction((n) => document.querySelectorAll('[data-chart="price-area"] circle[data-sale-id]').length === n, count);
}

describe('the market analysis step in a real browser', () => {
  const running = appAndBrowser({ freshCookies: true });

  it('shows the demo fit of Quarry Hill with its figures, flagged anomalies and cautions, then Orchard Rise, at 1280 and 768 px', async () => {
    const page = await running.browser.context.newPage();
    const watch = watchPage(page);
    await signInAsAppraiser(page, running.app.baseUrl);
    const { assignments } = await apiGet<{ assignments: Array<{ id: number; subjectAddress: string }> }>(page, '/api/assignments');
    const demo = assignments.find((a) => a.subjectAddress === DEMO_SUBJECT_ADDRESS);
    expect(demo, 'the demo assignment is seeded').toBeDefined();
    const id = demo!.id;

    await page.goto(`${running.app.baseUrl}/assignments/${id}/market-analysis`);
    const analysis = analysisWireResponse.parse(await apiGet<unknown>(page, `/api/assignments/${id}/analysis`));
    const format = figureFormat(analysis.currency, analysis.areaUnit, LOCALE);
    expect(analysis.subjectGroup).toBe('Quarry Hill');
    const quarryHill = groupNamed(analysis, 'Quarry Hill');
    expect(quarryHill.points.length).toBeGreaterThan(30);

    // The subject's neighbourhood is chosen first, and its scatter has one dot per sale in the fit.
    await expect(page.getByRole('tab', { name: /Quarry Hill/ }).getAttribute('aria-selected')).resolves.toBe('true');
    await waitForDots(page, quarryHill.points.length);
    expect(await scatterDots(page).count()).toBe(quarryHill.points.length);
    // Flagged sales are ringed: one magenta ring per flagged sale of the group.
    expect(await page.locator('[data-chart="price-area"] circle[stroke="var(--color-flag-ring)"]').count()).toBe(quarryHill.flagged.length);

    // The figures are the API's, formatted as the page formats them.
    expect(await figure(page, 'n').innerText()).toBe(format.count(quarryHill.n));
    expect(await figure(page, 'r-squared').innerText()).toBe(format.ratio(quarryHill.fit.rSquared));
    expect(await figure(page, 'slope').innerText()).toBe(format.rateAmount(quarryHill.fit.slope));
    const prediction = quarryHill.prediction!;
    expect(await figure(page, 'estimate').innerText()).toBe(format.money(prediction.estimate));
    expect(await figure(page, 'prediction-interval').innerText()).toBe(`${format.money(prediction.lower)} to ${format.money(prediction.upper)}`);
    // The band drawn from the fit summary (Sxx = (s / SE(b))²) meets the server's own interval at the subject.
    const halfWidth = predictionHalfWidth(quarryHill.fit, prediction.x0)!;
    expect(halfWidth).toBeCloseTo((prediction.upper - prediction.lower) / 2, 4);

    // The correlation gate in words, with the rule of thumb named as such.
    const gate = page.getByTestId('correlation-gate');
    expect(await gate.innerText()).toContain(quarryHill.gate!.message);
    expect(await gate.innerText()).toContain('common-practice rule of thumb');

    // The four planted anomalies are in the flagged list.
    const scenario = generatePortEllery();
    const plantedAddresses = scenario.plantedAnomalies.map((a) => scenario.sales.find((s) => s.key === a.saleKey)!.address);
    expect(plantedAddresses).toHaveLength(4);
    const flaggedText = await page.getByTestId('flagged-sales').innerText();
    for (const address of plantedAddresses) expect(flaggedText).toContain(address);
    expect(flaggedText).toContain('Seen only once others were set aside');

    // The cautions, word for word.
    const cautions = page.getByRole('complementary', { name: 'Cautions' });
    expect(await cautions.isVisible()).toBe(true);
    for (const caution of CAUTIONS) expect(await cautions.innerText()).toContain(caution);

    // Nothing on the page reads NaN, null or undefined.
    expect(await page.locator('main').innerText()).not.toMatch(/\bNaN\b|\bnull\b|\bundefined\b/);
    await saveScreenshot(page, 'market-analysis-quarry-hill-1280');

    // Hovering a sale names it; its figures follow.
    const mason = quarryHill.flagged.find((f) => f.address === '144 Mason Street')!;
    await page.locator(`[data-chart="price-area"] circle[data-sale-id="${mason.saleId}"]`).hover();
    await page.locator('.recharts-tooltip-wrapper', { hasText: '144 Mason Street' }).waitFor();
    expect(await page.locator('.recharts-tooltip-wrapper').first().innerText()).toContain(format.area(groupPoint(quarryHill, mason.saleId).x));
    await saveScreenshot(page, 'market-analysis-tooltip-1280');

    // Zoomed to the main cluster, the sale keyed at 16,400 ft² leaves the plot for a mark on its edge.
    await page.getByRole('button', { name: 'Main cluster' }).click();
    await page.locator(`[data-off-scale-sale-id="${mason.saleId}"]`).waitFor();
    expect(await page.locator(`[data-chart="price-area"] circle[data-sale-id="${mason.saleId}"]`).count()).toBe(0);
    expect(await scatterDots(page).count()).toBeGreaterThan(quarryHill.points.length - 3);
    await saveScreenshot(page, 'market-analysis-quarry-hill-zoomed-1280');
    await page.getByRole('button', { name: 'All sales' }).click();
    await waitForDots(page, quarryHill.points.length);

    // Orchard Rise: the choice is kept in the address and survives a reload.
    await page.getByRole('tab', { name: /Orchard Rise/ }).click();
    await page.waitForURL(/neighbourhood=Orchard\+Rise/);
    const orchardRise = groupNamed(analysis, 'Orchard Rise');
    await waitForDots(page, orchardRise.points.length);
    expect(await figure(page, 'r-squared').innerText()).toBe(format.ratio(orchardRise.fit.rSquared));
    expect(await figure(page, 'n').innerText()).toBe(format.count(orchardRise.n));
    await page.reload();
    await waitForDots(page, orchardRise.points.length);
    await expect(page.getByRole('tab', { name: /Orchard Rise/ }).getAttribute('aria-selected')).resolves.toBe('true');
    await saveScreenshot(page, 'market-analysis-orchard-rise-1280');

    // The pooled fit comes last; it flags no sale and says why.
    const tabs = await page.getByRole('tab').allInnerTexts();
    expect(tabs[0]).toContain('Quarry Hill');
    expect(tabs[tabs.length - 1]).toContain('All neighbourhoods');
    await page.getByRole('tab', { name: /All neighbourhoods/ }).click();
    const pooled = groupNamed(analysis, 'All neighbourhoods');
    await waitForDots(page, pooled.points.length);
    expect(await figure(page, 'n').innerText()).toBe(format.count(pooled.n));
    await page.getByText('Flags are judged within each neighbourhood').waitFor();
    await saveScreenshot(page, 'market-analysis-pooled-1280');

    // At tablet width the charts shrink to fit and nothing scrolls sideways.
    await page.setViewportSize({ width: 768, height: 1024 });
    await page.getByRole('tab', { name: /Quarry Hill/ }).click();
    await waitForDots(page, quarryHill.points.length);
    const chartWidth = await page.locator('[data-chart="price-area"] svg.recharts-surface').first().evaluate((svg) => svg.getBoundingClientRect().width);
    expect(chartWidth).toBeLessThan(768);
    expect(chartWidth).toBeGreaterThan(500);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(768);
    await saveScreenshot(page, 'market-analysis-quarry-hill-768');

    // A click on a sale opens it on the comparables step.
    await page.locator(`[data-chart="price-area"] circle[data-sale-id="${mason.saleId}"]`).click({ force: true });
    await page.waitForURL(`${running.app.baseUrl}/assignments/${id}/comparables?sale=${mason.saleId}`);

    expect(watch.errors).toEqual([]);
    expect(unexpectedFailures(watch, ['401 GET /api/auth/me'])).toEqual([]);
    await page.close();
  });

  it('switches time-adjusted prices on, tells the appraiser when someone else changed the assignment, and lists set-aside sales struck through', async () => {
    const copy = await createDemoAssignment(running.app.baseUrl, { subjectAddress: `14 Lantern Lane, analysis copy ${Date.now()}`, completeGrid: false, submit: false });
    const distressed = copy.anomalies['distressed-sale'];
    const tearDown = copy.anomalies['tear-down'];
    await db.update(sales).set({ inGrid: true }).where(and(eq(sales.assignmentId, copy.id), eq(sales.id, distressed.saleId)));
    await db
      .update(sales)
      .set({ excluded: true, exclusionReason: 'Bought for the land and demolished; the price says nothing about floor area.' })
      .where(and(eq(sales.assignmentId, copy.id), eq(sales.id, tearDown.saleId)));

    const page = await running.browser.context.newPage();
    const watch = watchPage(page);
    await page.setViewportSize({ width: 1280, height: 800 });
    await signInAsAppraiser(page, running.app.baseUrl);
    await page.goto(`${running.app.baseUrl}/assignments/${copy.id}/market-analysis`);
    await page.locator('[data-chart="price-area"] circle[data-sale-id]').first().waitFor();

    // The set-aside sale is listed apart, struck through, with its reason; the flagged sale in the grid says so.
    const excluded = page.getByTestId('excluded-sales');
    expect(await excluded.innerText()).toContain(tearDown.address);
    expect(await excluded.innerText()).toContain('Bought for the land and demolished');
    expect(await excluded.getByRole('link', { name: tearDown.address }).evaluate((a) => getComputedStyle(a).textDecorationLine)).toContain('line-through');
    const inGridItem = page.getByTestId('flagged-sales').getByRole('listitem').filter({ hasText: distressed.address }).first();
    expect(await inGridItem.innerText()).toContain('In the grid');

    // Switching on fits time-adjusted prices.
    const timeSwitch = page.getByRole('switch', { name: /Time-adjust sale prices/ });
    expect(await timeSwitch.getAttribute('aria-checked')).toBe('false');
    const saved = page.waitForResponse((r) => r.request().method() === 'PATCH' && r.url().endsWith(`/api/assignments/${copy.id}`));
    await timeSwitch.click();
    expect((await saved).status()).toBe(200);
    await page.getByText('Time-adjusted prices ·').waitFor();
    expect(await timeSwitch.getAttribute('aria-checked')).toBe('true');
    const adjusted = analysisWireResponse.parse(await apiGet<unknown>(page, `/api/assignments/${copy.id}/analysis`));
    expect(adjusted.timeAdjustment).toBe(true);
    // The scatter and figures now show the time-adjusted fit.
    const adjustedFormat = figureFormat(adjusted.currency, adjusted.areaUnit, LOCALE);
    expect(await figure(page, 'r-squared').innerText()).toBe(adjustedFormat.ratio(groupNamed(adjusted, 'Quarry Hill').fit.rSquared));
    await saveScreenshot(page, 'market-analysis-time-adjusted-1280');

    // Someone else switches it off meanwhile: the page's version is stale, the server says 409.
    const other = await apiSessionAs(running.app.baseUrl, 'appraiser');
    const current = await other.request<{ assignment: { version: number } }>('GET', `/api/assignments/${copy.id}`);
    expect((await other.request('PATCH', `/api/assignments/${copy.id}`, { timeAdjustment: false, version: current.body.assignment.version })).status).toBe(200);
    const refused = page.waitForResponse((r) => r.request().method() === 'PATCH' && r.url().endsWith(`/api/assignments/${copy.id}`));
    await timeSwitch.click();
    expect((await refused).status()).toBe(409);
    await page.getByText('Someone changed this assignment while you had it open').waitFor();
    // The page fetched the assignment again and shows what the server holds: off.
    await page.getByText('Prices as sold ·').waitFor();
    expect(await timeSwitch.getAttribute('aria-checked')).toBe('false');
    await saveScreenshot(page, 'market-analysis-stale-switch-1280');

    expect(watch.errors).toEqual([]);
    expect(unexpectedFailures(watch, ['401 GET /api/auth/me', `409 PATCH /api/assignments/${copy.id}`])).toEqual([]);
    await page.close();
  });
  it('draws a neighbourhood of 1,600 more sales as one layer, with its flagged sales on top as marks that open', async () => {
    const copy = await createDemoAssignment(running.app.baseUrl, { subjectAddress: `14 Lantern Lane, dense copy ${Date.now()}`, completeGrid: false, submit: false });
    // Invented sales on an invented Port Ellery street, spread around a line with some scatter.
    const extra = Array.from({ length: 1_600 }, (_, i) => {
      const floorArea = 1_000 + ((i * 7919) % 1_600);
      return { assignmentId: copy.id, address: `${i + 1} Tidewater Row`, neighbourhood: 'Quarry Hill', floorArea, salePrice: 60_000 + 220 * floorArea + (((i * 104_729) % 60_001) - 30_000), saleDate: `2026-0${1 + (i % 9)}-1${i % 10}` };
    });
    for (let start = 0; start < extra.length; start += 800) await db.insert(sales).values(extra.slice(start, start + 800));

    const page = await running.browser.context.newPage();
    const watch = watchPage(page);
    await signInAsAppraiser(page, running.app.baseUrl);
    await page.goto(`${running.app.baseUrl}/assignments/${copy.id}/market-analysis`);
    const chart = page.locator('[data-chart="price-area"]');
    await chart.locator('[data-chart-layer="dense-sales"]').waitFor();
    const analysis = analysisWireResponse.parse(await apiGet<unknown>(page, `/api/assignments/${copy.id}/analysis`));
    const quarryHill = groupNamed(analysis, 'Quarry Hill');
    expect(quarryHill.n).toBeGreaterThan(1_600);
    const flaggedIds = new Set(quarryHill.flagged.map((f) => f.saleId));
    expect(flaggedIds.size).toBeGreaterThan(0);

    // Every sale is drawn once: the flagged ones as marks, the others inside the layer.
    const markIds = await chart.locator('circle[data-sale-id]').evaluateAll((circles) => circles.map((c) => Number(c.getAttribute('data-sale-id'))));
    const layered = Number(await chart.locator('[data-chart-layer="dense-sales"]').getAttribute('data-sale-count'));
    expect(new Set(markIds)).toEqual(flaggedIds);
    expect(markIds.length + layered).toBe(quarryHill.n);
    await page.getByText(/sales: those not flagged are drawn as one layer/).first().waitFor();
    await saveScreenshot(page, 'market-analysis-dense-1280');

    // Zoomed to the main cluster, the layer shows the run of sales along the line.
    await page.getByRole('button', { name: 'Main cluster' }).click();
    await saveScreenshot(page, 'market-analysis-dense-zoomed-1280');
    await page.getByRole('button', { name: 'All sales' }).click();

    // A flagged mark still opens its sale (the one farthest from the subject's mark, the largest).
    const flaggedId = quarryHill.points.filter((p) => flaggedIds.has(p.saleId)).sort((a, b) => b.x - a.x)[0].saleId;
    await chart.locator(`circle[data-sale-id="${flaggedId}"]`).click({ force: true });
    await page.waitForURL(`${running.app.baseUrl}/assignments/${copy.id}/comparables?sale=${flaggedId}`);

    expect(watch.errors).toEqual([]);
    expect(unexpectedFailures(watch, ['401 GET /api/auth/me'])).toEqual([]);
    await page.close();
  });
});

function groupPoint(group: GroupAnalysis, saleId: number) {
  const point = group.points.find((p) => p.saleId === saleId);
  if (!point) throw new Error(`sale ${saleId} is not in ${group.neighbourhood}`);
  return point;
}
