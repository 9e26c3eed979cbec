// The analysis modules take shortcuts for speed (dates read from their digits, sums written out in
// fused loops, refits that skip what they do not need, a memo of t quantiles). Each shortcut must
// give exactly what the plain way gives: these tests hold each one against the plain way, compared
// with Object.is (same double, same sign of zero).
import fc from 'fast-check';
import jStat from 'jstat';
import { sum } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { centredSums, centre, centredProduct, compensatedDot, compensatedSum } from '../../server/analysis/centred-sums';
import { analyseMarket } from '../../server/analysis/market-analysis';
import { revealMaskedOutliers } from '../../server/analysis/masked-outliers';
import { soleDistinctX } from '../../server/analysis/point-diagnostics';
import { fitLine, type LineFitOk } from '../../server/analysis/regression';
import { monthsBefore, timeAdjustedPrice, utcDayMs } from '../../server/analysis/time-trend';
import { analysisInput, analysisSale } from '../factories/analysis';

const DAY = 86_400_000;
const viaDateParse = (date: string) => Date.parse(`${date}T00:00:00Z`);

describe('utcDayMs reads a date from its digits exactly as Date.parse does', () => {
  it('for random real dates from year 0 to year 9999', () => {
    fc.assert(
      fc.property(fc.integer({ min: -719_528, max: 2_932_896 }), (day) => {
        const date = new Date(day * DAY).toISOString().slice(0, 10);
        expect(utcDayMs(date)).toBe(viaDateParse(date));
      }),
      { numRuns: 5_000, seed: 1 },
    );
  });

  it('for every day of 1899–1901 and 1999–2001 (century and leap-year edges)', () => {
    for (const start of [Date.UTC(1899, 0, 1), Date.UTC(1999, 0, 1)]) {
      for (let ms = start; ms < start + 3 * 366 * DAY; ms += DAY) {
        const date = new Date(ms).toISOString().slice(0, 10);
        expect(utcDayMs(date), date).toBe(ms);
      }
    }
  });

  it.each(['2026-02-30', '2026-04-31', '2025-02-29', '2026-13-01', '2026-00-10', '2026-01-00', '2026-01-32', '0050-03-01', '2026-1-01', ' 2026-01-01', '2026-01-01x', '', 'junk', '2026/01/01'])(
    'for %j (odd or impossible), whatever Date.parse makes of it',
    (date) => expect(Object.is(utcDayMs(date), viaDateParse(date))).toBe(true),
  );
});

describe('soleDistinctX with an early exit answers as counting every value would', () => {
  /** The plain way: count each value (Map keys: NaN equals NaN, 0 equals −0). */
  function byCounting(xs: number[]): number {
    const counts = new Map<number, number>();
    for (const x of xs) counts.set(x, (counts.get(x) ?? 0) + 1);
    return counts.size === 2 ? xs.findIndex((x) => counts.get(x) === 1) : -1;
  }
  it('on short arrays drawn from a few values, NaN and both zeros among them', () => {
    const value = fc.constantFrom(0, -0, 1, 2, 3, Number.NaN);
    fc.assert(
      fc.property(fc.array(value, { maxLength: 9 }), (xs) => {
        expect(soleDistinctX(xs)).toBe(byCounting(xs));
      }),
      { numRuns: 3_000, seed: 2 },
    );
  });
});

describe('the written-out compensated sums give the same doubles as the plain ones', () => {
  const column = fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 60 });
  const offset = fc.constantFrom(0, 2_500, 1.7e12);

  it('compensatedSum and compensatedDot match simple-statistics’ sum', () => {
    fc.assert(
      fc.property(column, offset, (values, shift) => {
        const xs = values.map((v) => v + shift);
        expect(Object.is(compensatedSum(xs), sum(xs))).toBe(true);
        expect(Object.is(compensatedDot(xs, values), sum(xs.map((x, i) => x * values[i])))).toBe(true);
      }),
      { numRuns: 1_000, seed: 3 },
    );
  });

  it('centredSums (three fused passes) matches centre and centredProduct (one sum at a time)', () => {
    fc.assert(
      fc.property(column, column, offset, offset, (a, b, xShift, yShift) => {
        const n = Math.min(a.length, b.length);
        const xs = a.slice(0, n).map((v) => v + xShift);
        const ys = b.slice(0, n).map((v) => v + yShift);
        const dx = new Float64Array(n);
        const dy = new Float64Array(n);
        const sums = centredSums(Float64Array.from(xs), Float64Array.from(ys), n, dx, dy);
        const cx = centre(xs);
        const cy = centre(ys);
        expect(Array.from(dx)).toEqual(cx.deviations);
        expect(Array.from(dy)).toEqual(cy.deviations);
        expect(Object.is(sums.xFirst + sums.xCorrection, cx.mean)).toBe(true);
        const sxx = sums.sumDxDx - (sums.sumDx * sums.sumDx) / n;
        const sxy = sums.sumDxDy - (sums.sumDx * sums.sumDy) / n;
        expect(Object.is(sxx, centredProduct(cx.deviations, cx.deviations))).toBe(true);
        expect(Object.is(sxy, centredProduct(cx.deviations, cy.deviations))).toBe(true);
      }),
      { numRuns: 1_000, seed: 4 },
    );
  });
});

describe('shortcuts in the fits', () => {
  it('Student t quantiles, kept once computed, are the ones jstat computes', () => {
    for (const n of [3, 4, 12, 36, 250, 3, 12]) {
      const points = Array.from({ length: n }, (_, i) => ({ x: i, y: (i * 37) % 11 }));
      const fit = fitLine(points, { confidence: 0.9 }) as LineFitOk;
      expect(fit.tCritical).toBe(jStat.studentt.inv(0.95, n - 2));
    }
  });

  it('the masked-outlier pass given the full fit finds what it finds when it refits everything', () => {
    const line = Array.from({ length: 20 }, (_, i) => ({ x: 1_000 + 60 * i, y: 50_000 + 200 * (1_000 + 60 * i) + ((i * 7919) % 13 - 6) * 900 }));
    const points = [...line, { x: 2_000, y: 0.6 * (50_000 + 200 * 2_000) }, { x: 15_000, y: 50_000 + 200 * 1_500 }];
    const full = fitLine(points) as LineFitOk;
    const outliers = full.points.flatMap((p, i) => (p.flags.includes('outlier') ? [i] : []));
    const revealed = revealMaskedOutliers(points, outliers, full.points);
    expect(revealed.length).toBeGreaterThan(0);
    expect(revealed).toEqual(revealMaskedOutliers(points, outliers));
  });
});

describe('prices keyed by sale id', () => {
  const sales = (id: (i: number) => number) =>
    Array.from({ length: 40 }, (_, i) =>
      analysisSale({ id: id(i), neighbourhood: i % 3 ? 'Quarry Hill' : 'Tannery Row', floorArea: 1_100 + 37 * i, salePrice: 300_000 + 7_000 * ((i * 17) % 23), saleDate: `2026-0${1 + (i % 9)}-1${i % 10}` }));
  /** The plain way: each neighbourhood's fitted prices, entered in neighbourhood order. */
  const expected = (a: ReturnType<typeof analyseMarket>) =>
    Object.fromEntries(a.groups.filter((g) => !g.pooled).flatMap((g) => g.points.map((p) => [String(p.saleId), p.y])));

  it.each([
    ['ids in ascending order', (i: number) => 500 + i],
    ['ids in descending order', (i: number) => 900 - i],
    ['ids negative and positive, unordered', (i: number) => (i % 2 ? -i - 1 : 3_000 + ((i * 7) % 40))],
  ])('are the prices fitted, keyed in the same order, with %s', (_, id) => {
    const analysis = analyseMarket(analysisInput(sales(id), { timeAdjustment: true }));
    expect(JSON.stringify(analysis.adjustedPrices)).toBe(JSON.stringify(expected(analysis)));
  });

  it('adjust each sale with its own neighbourhood’s rate, when neighbourhoods arrive interleaved', () => {
    const names = ['Quarry Hill', 'Tannery Row', 'Orchard Rise', null];
    const mixed = Array.from({ length: 60 }, (_, i) =>
      analysisSale({ neighbourhood: names[i % 4], floorArea: 1_200 + 23 * i, salePrice: 250_000 + 900 * i * (1 + (i % 4)), saleDate: `2026-${String(1 + (i % 10)).padStart(2, '0')}-0${1 + (i % 9)}` }));
    const analysis = analyseMarket(analysisInput(mixed, { timeAdjustment: true }));
    const rateOf = (name: string) => analysis.trends.find((t) => t.neighbourhood === name)!.monthlyRate;
    expect(new Set(names.map((name) => rateOf(name ?? 'No neighbourhood'))).size).toBe(4);
    for (const s of mixed) {
      const expectedPrice = timeAdjustedPrice(s.salePrice, monthsBefore(s.saleDate, '2026-11-15'), rateOf(s.neighbourhood ?? 'No neighbourhood'));
      expect(analysis.adjustedPrices[String(s.id)]).toBe(expectedPrice);
    }
  });

  it('when two sales share an id (the database never allows it), each is still fitted at its own price', () => {
    const input = analysisInput(sales((i) => (i === 7 ? 4 : i)), { timeAdjustment: true });
    const analysis = analyseMarket(input);
    const rateOf = (name: string) => analysis.trends.find((t) => t.neighbourhood === name)!.monthlyRate;
    const shared = analysis.groups.filter((g) => !g.pooled).flatMap((g) => g.points.filter((p) => p.saleId === 4));
    const own = input.sales.filter((s) => s.id === 4).map((s) => timeAdjustedPrice(s.salePrice, monthsBefore(s.saleDate, '2026-11-15'), rateOf(s.neighbourhood!)));
    expect(own).toHaveLength(2);
    expect(own[0]).not.toBe(own[1]);
    expect(shared.map((p) => p.y).sort()).toEqual([...own].sort());
  });
});
