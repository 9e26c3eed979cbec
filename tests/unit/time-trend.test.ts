import { describe, expect, it } from 'vitest';
import { linearRegression, mean } from 'simple-statistics';
import { analyseMarket } from '../../server/analysis/market-analysis';
import { fitTrend, monthsBefore, timeAdjustedPrice } from '../../server/analysis/time-trend';
import { analysisInput, analysisSale } from '../factories/analysis';

// Months are days / (365.25 / 12): the average month of a 365.25-day (Julian) year, a common
// convention for converting day counts to months (no single source; the code documents the same).
const DAYS_PER_MONTH = 365.25 / 12;
const EFFECTIVE = '2026-11-15';

/** The calendar date `days` days before the effective date, by UTC date arithmetic. */
function daysBeforeEffective(days: number): string {
  return new Date(Date.UTC(2026, 10, 15) - days * 86_400_000).toISOString().slice(0, 10);
}

describe('months before the effective date, from dates', () => {
  // Day counts by hand: 15 May → 15 Nov 2026 is 16 + 30 + 31 + 31 + 30 + 31 + 15 = 184 days;
  // 15 Feb → 15 Mar 2024 spans 29 February (a leap year), 29 days; a year from 15 Nov 2025 is 365.
  it.each([
    ['2026-05-15', '2026-11-15', 184],
    ['2024-02-15', '2024-03-15', 29],
    ['2025-11-15', '2026-11-15', 365],
    ['2026-11-15', '2026-11-15', 0],
    ['2026-11-20', '2026-11-15', -5],
  ])('%s to %s is %i days', (saleDate, effectiveDate, days) => {
    expect(monthsBefore(saleDate, effectiveDate)).toBeCloseTo(days / DAYS_PER_MONTH, 12);
  });
});

describe('time-adjusted price = price × (1 + rate × months), simple not compounded', () => {
  it.each([
    [400_000, 6, 0.005, 412_000], // 400,000 × 1.03
    [250_000, 12, -0.002, 244_000], // 250,000 × 0.976
    [300_000, -2, 0.01, 294_000], // a sale after the effective date moves down in a rising market
    [300_000, 7, null, 300_000], // no rate, no adjustment
  ])('%i, %f months at %s → %i', (price, months, rate, expected) => {
    expect(timeAdjustedPrice(price, months, rate)).toBeCloseTo(expected, 6);
  });
});

/**
 * Sales whose price per ft² changes by exactly `rate` of the mean (250 $/ft²) per month: at m months
 * before the effective date, 250 × (1 + rate × (m̄ − m)). Price per area is then exactly linear in
 * months, so the fitted line is exact: slope −250·rate per month before, mean 250.
 */
function trendingSales(rate: number, neighbourhood = 'Quarry Hill') {
  const days = Array.from({ length: 17 }, (_, i) => 30 * (i + 1));
  const meanMonths = mean(days) / DAYS_PER_MONTH;
  return days.map((d, i) => {
    const floorArea = 1_200 + ((i * 137) % 900);
    const pricePerArea = 250 * (1 + rate * (meanMonths - d / DAYS_PER_MONTH));
    return { days: d, sale: analysisSale({ neighbourhood, floorArea, salePrice: pricePerArea * floorArea, saleDate: daysBeforeEffective(d) }) };
  });
}

describe('market-conditions trend', () => {
  it.each([0.005, -0.003])('recovers a monthly rate of %f of the mean from the sale dates', (rate) => {
    const built = trendingSales(rate);
    const trend = fitTrend('Quarry Hill', built.map(({ sale }) => ({ saleId: sale.id, salePrice: sale.salePrice, saleDate: sale.saleDate, floorArea: sale.floorArea })), EFFECTIVE);
    expect(trend.refusal).toBeNull();
    expect(trend.n).toBe(17);
    expect(trend.monthlyRate).toBeCloseTo(rate, 10);
    expect(trend.fit!.slope).toBeCloseTo(-250 * rate, 8); // per month *before*: a rising market falls
    expect(trend.fit!.yMean).toBeCloseTo(250, 8);
    built.forEach(({ sale, days }, i) => {
      expect(trend.points[i].saleId).toBe(sale.id);
      expect(trend.points[i].monthsBefore).toBeCloseTo(days / DAYS_PER_MONTH, 12);
      expect(trend.points[i].pricePerArea).toBeCloseTo(sale.salePrice / sale.floorArea, 9);
    });
  });

  it('refuses a trend when every sale closed on the same day, with no rate', () => {
    const sales = [1, 2, 3].map((i) => ({ saleId: i, salePrice: 300_000 + i * 10_000, saleDate: '2026-06-01', floorArea: 1_500 }));
    const trend = fitTrend('Tannery Row', sales, EFFECTIVE);
    expect(trend.refusal?.reason).toBe('no-spread-in-x');
    expect(trend.monthlyRate).toBeNull();
    expect(trend.fit).toBeNull();
  });

  it('time-adjusts each sale to the effective date with its neighbourhood’s rate, and fits the adjusted prices', () => {
    const built = trendingSales(0.005);
    const result = analyseMarket(analysisInput(built.map(({ sale }) => sale), { timeAdjustment: true }));
    expect(result.trends[0].neighbourhood).toBe('Quarry Hill');
    expect(result.trends[0].monthlyRate).toBeCloseTo(0.005, 10);
    const quarry = result.groups.find((g) => g.neighbourhood === 'Quarry Hill')!;
    for (const { sale, days } of built) {
      const expected = sale.salePrice * (1 + 0.005 * (days / DAYS_PER_MONTH));
      expect(result.adjustedPrices[String(sale.id)] / expected).toBeCloseTo(1, 10);
      expect(quarry.points.find((p) => p.saleId === sale.id)!.y / expected).toBeCloseTo(1, 10);
    }
  });

  it('uses the pooled rate for a neighbourhood without a trend of its own', () => {
    const quarry = trendingSales(0.005).map(({ sale }) => sale);
    const tannery = [1_300, 1_500, 1_700].map((floorArea) => analysisSale({ neighbourhood: 'Tannery Row', floorArea, salePrice: 180 * floorArea + 40_000, saleDate: '2026-02-01' }));
    const all = [...quarry, ...tannery];
    const result = analyseMarket(analysisInput(all, { timeAdjustment: true }));
    expect(result.trends.find((t) => t.neighbourhood === 'Tannery Row')!.monthlyRate).toBeNull();

    // Reference: the pooled trend recomputed with simple-statistics over all 20 sales.
    const months = (s: (typeof all)[number]) => (Date.UTC(2026, 10, 15) - Date.parse(`${s.saleDate}T00:00:00Z`)) / 86_400_000 / DAYS_PER_MONTH;
    const pricesPerArea = all.map((s) => s.salePrice / s.floorArea);
    const pooledRate = -linearRegression(all.map((s, i) => [months(s), pricesPerArea[i]])).m / mean(pricesPerArea);
    expect(Math.abs(pooledRate * months(tannery[0]))).toBeGreaterThan(0.01); // the adjustment is visible
    for (const s of tannery) {
      const expected = s.salePrice * (1 + pooledRate * months(s));
      expect(result.adjustedPrices[String(s.id)] / expected).toBeCloseTo(1, 9);
    }
  });

  it('leaves prices as sold when the appraiser has not turned the adjustment on', () => {
    const built = trendingSales(0.005);
    const result = analyseMarket(analysisInput(built.map(({ sale }) => sale), { timeAdjustment: false }));
    for (const { sale } of built) expect(result.adjustedPrices[String(sale.id)]).toBe(sale.salePrice);
  });
});
