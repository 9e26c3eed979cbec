// fitLine against exact rational arithmetic (BigInt fractions, tests/reference/exact-line-fit.ts),
// which computes the same quantities from their definitions with no rounding. The oracle is first
// checked against NIST's certified Norris values, so that agreement with it means something.
import { describe, expect, it } from 'vitest';
import { fitLine, type LineFitOk } from '../../server/analysis/regression';
import { expectRelative } from './agreement';
import { NORRIS_CERTIFIED as NIST, NORRIS_ROWS } from './data/norris';
import { exactLineFit, type ExactLineFit } from './exact-line-fit';

type Point = { x: number; y: number };

// Twelve sales: floor area (ft²) and price. Invented for the test.
const ORDINARY: Point[] = [
  [1180, 254500], [1320, 281000], [1410, 289900], [1495, 312750], [1560, 309000], [1625, 335500],
  [1710, 341250], [1790, 352000], [1880, 377900], [2010, 389500], [2150, 432000], [2890, 515000],
].map(([x, y]) => ({ x, y }));

// Fourteen sales: sale time as epoch milliseconds (~1.7e12) and price in the millions, to the cent.
// The kind of data on which uncentred sums (Σx², Σxy) lose most of their digits. Invented for the test.
const OFFSET: Point[] = [
  [Date.UTC(2023, 0, 9, 10, 15), 1948250.0], [Date.UTC(2023, 1, 17, 14, 40), 1972400.5],
  [Date.UTC(2023, 2, 28, 9, 5), 1961875.25], [Date.UTC(2023, 4, 5, 16, 20), 2003120.0],
  [Date.UTC(2023, 5, 21, 11, 0), 1989990.99], [Date.UTC(2023, 7, 2, 13, 30), 2021500.0],
  [Date.UTC(2023, 8, 14, 15, 45), 2047333.33], [Date.UTC(2023, 9, 30, 8, 50), 2012875.75],
  [Date.UTC(2023, 11, 11, 12, 10), 2066450.0], [Date.UTC(2024, 0, 26, 10, 35), 2058100.1],
  [Date.UTC(2024, 2, 8, 17, 0), 2091725.0], [Date.UTC(2024, 3, 19, 9, 25), 2079980.45],
  [Date.UTC(2024, 4, 31, 14, 55), 2118400.0], [Date.UTC(2024, 6, 12, 11, 20), 2104260.6],
].map(([x, y]) => ({ x, y }));

function fitOf(points: Point[], x0?: number): LineFitOk {
  const fit = fitLine(points, x0 === undefined ? {} : { x0 });
  if (!fit.ok) throw new Error(fit.message);
  return fit;
}

/** Every number fitLine reports that the oracle also knows, compared at `rel`. */
function compareWithExact(fit: LineFitOk, exact: ExactLineFit, rel: number): void {
  expectRelative(fit.slope, exact.slope, rel, 'slope');
  expectRelative(fit.intercept, exact.intercept, rel, 'intercept');
  expectRelative(fit.sse, exact.sse, rel, 'SSE');
  expectRelative(fit.ssr, exact.ssr, rel, 'SSR');
  expectRelative(fit.sst, exact.sst, rel, 'SST');
  expectRelative(fit.residualStdError ** 2, exact.residualVariance, rel, 's²');
  fit.points.forEach((p, i) => {
    expectRelative(p.fitted, exact.fitted[i], rel, `fitted ${i}`);
    expectRelative(p.residual, exact.residuals[i], rel, `residual ${i}`);
    expectRelative(p.leverage, exact.leverages[i], rel, `leverage ${i}`);
    expectRelative(p.internallyStudentized, exact.internallyStudentized[i] as number, rel, `internal ${i}`);
    expectRelative(p.externallyStudentized, exact.externallyStudentized[i] as number, rel, `external ${i}`);
    expectRelative(p.cooksDistance, exact.cooksDistances[i] as number, rel, `Cook ${i}`);
  });
  if (fit.prediction && exact.newVarianceAt !== undefined && exact.meanVarianceAt !== undefined) {
    const { estimate, upper, meanUpper, x0 } = fit.prediction;
    expectRelative(estimate, exact.intercept + exact.slope * x0, rel, 'estimate');
    // Interval half-widths divided by the t quantile are the exact standard errors.
    expectRelative(((upper - estimate) / fit.tCritical) ** 2, exact.newVarianceAt, rel, 'prediction variance');
    expectRelative(((meanUpper - estimate) / fit.tCritical) ** 2, exact.meanVarianceAt, rel, 'mean variance');
  }
}

describe('the exact oracle itself', () => {
  it('reproduces the NIST certified Norris values to 13 digits', () => {
    // Source: NIST StRD Norris. The oracle runs on the binary doubles nearest NIST's decimals, a
    // perturbation of about 1e-16 that the residual sum of squares amplifies to about 2e-14.
    const exact = exactLineFit(NORRIS_ROWS.map(([y, x]) => ({ x, y })));
    expectRelative(exact.slope, NIST.slope, 1e-13, 'B1');
    expectRelative(exact.intercept, NIST.intercept, 1e-13, 'B0');
    expectRelative(exact.ssr, NIST.regressionSumOfSquares, 1e-13, 'regression SS');
    expectRelative(exact.sse, NIST.residualSumOfSquares, 1e-13, 'residual SS');
    expectRelative(Math.sqrt(exact.residualVariance), NIST.residualStdDev, 1e-13, 'residual sd');
  });
});

describe('fitLine agrees with exact rational arithmetic', () => {
  it('on ordinary sales data, to 1e-9 relative, diagnostics and prediction included', () => {
    compareWithExact(fitOf(ORDINARY, 1850), exactLineFit(ORDINARY, 1850), 1e-9);
  });

  it('on the NIST Norris data, to 1e-9 relative', () => {
    const norris = NORRIS_ROWS.map(([y, x]) => ({ x, y }));
    compareWithExact(fitOf(norris, 500), exactLineFit(norris, 500), 1e-9);
  });

  it('on epoch-millisecond dates against prices in the millions, to 1e-7 relative', () => {
    const effectiveDate = Date.UTC(2024, 8, 30);
    const fit = fitOf(OFFSET, effectiveDate);
    compareWithExact(fit, exactLineFit(OFFSET, effectiveDate), 1e-7);
    expect(fit.prediction?.extrapolated).toBe(true);
  });

  it('on ordinary data moved to a large offset (x + 1.7e12, y + 2e6): same slope and residuals as before', () => {
    const moved = ORDINARY.map((p) => ({ x: p.x + 1.7e12, y: p.y + 2e6 }));
    const fit = fitOf(moved);
    const exact = exactLineFit(moved);
    compareWithExact(fit, exact, 1e-7);
    // Moving the data changes nothing but the intercept (in exact arithmetic, exactly).
    const original = exactLineFit(ORDINARY);
    expectRelative(fit.slope, original.slope, 1e-7, 'slope after the move');
    fit.points.forEach((p, i) => expectRelative(p.residual, original.residuals[i], 1e-7, `residual ${i} after the move`));
  });

  it('when one sale carries almost all the scatter (its deleted fit is refitted), to 1e-9 relative', () => {
    const noise = [0.0011, -0.0023, 0.0016, -0.0004, 0.0019, -0.0015, 0.0007];
    const points = noise.map((e, i) => ({ x: 1000 + 100 * i, y: 250000 + 150 * (1000 + 100 * i) + e }));
    points.push({ x: 1350, y: 250000 + 150 * 1350 + 40000 });
    const fit = fitOf(points);
    compareWithExact(fit, exactLineFit(points), 1e-9);
    expect(fit.points[7].flags).toContain('outlier');
  });

  it('Anscombe IV shape: the oracle and fitLine agree on which diagnostics are undefined', () => {
    const points = [8, 8, 8, 8, 19, 8, 8].map((x, i) => ({ x, y: [6.58, 5.76, 7.71, 8.84, 12.5, 5.25, 7.04][i] }));
    const fit = fitOf(points);
    const exact = exactLineFit(points);
    expect(exact.cooksDistances[4]).toBeNull();
    expect(fit.points[4].cooksDistance).toBeNull();
    expect(fit.points[4].externallyStudentized).toBeNull();
    fit.points.forEach((p, i) => {
      if (i === 4) return;
      expectRelative(p.externallyStudentized, exact.externallyStudentized[i] as number, 1e-9, `external ${i}`);
      expectRelative(p.cooksDistance, exact.cooksDistances[i] as number, 1e-9, `Cook ${i}`);
    });
  });

  it('where the oracle finds a diagnostic undefined, fitLine reports null', () => {
    // Three points: the deleted fits have no degrees of freedom left (n − 3 = 0).
    const three = [{ x: 1, y: 2 }, { x: 2, y: 3.5 }, { x: 4, y: 5 }];
    const fit = fitOf(three);
    const exact = exactLineFit(three);
    expect(exact.externallyStudentized).toEqual([null, null, null]);
    expect(fit.points.map((p) => p.externallyStudentized)).toEqual([null, null, null]);
    fit.points.forEach((p, i) => {
      expectRelative(p.internallyStudentized, exact.internallyStudentized[i] as number, 1e-12, `internal ${i}`);
      expectRelative(p.cooksDistance, exact.cooksDistances[i] as number, 1e-12, `Cook ${i}`);
    });
  });
});
