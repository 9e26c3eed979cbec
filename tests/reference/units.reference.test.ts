// Area units against their legal definition: 1 ft = 0.3048 m exactly (international yard and
// pound agreement, 1959), so 1 ft² = 0.09290304 m² and 1 m² = 1/0.09290304 ft².
import { describe, expect, it } from 'vitest';
import { fitLine, type LineFitOk } from '../../server/analysis/regression';
import {
  convertArea,
  convertRatePerArea,
  SQUARE_METRES_PER_SQUARE_FOOT,
  squareFeetToSquareMetres,
  squareMetresToSquareFeet,
} from '../../server/analysis/units';
import { expectRelative } from './agreement';
import { Fraction } from './exact-fraction';

const EXACT_SQM_PER_SQFT = new Fraction(3048n * 3048n, 10n ** 8n); // (0.3048)², exactly

describe('square feet and square metres', () => {
  it('1 ft² is the double nearest to exactly 0.09290304 m²', () => {
    expect(SQUARE_METRES_PER_SQUARE_FOOT).toBe(EXACT_SQM_PER_SQFT.toNumber());
    expect(SQUARE_METRES_PER_SQUARE_FOOT).toBe(0.09290304);
  });

  it('1 m² = 10.763910416709722 ft², the double nearest to 1/0.09290304', () => {
    expect(squareMetresToSquareFeet(1)).toBe(10.763910416709722);
    expect(squareMetresToSquareFeet(1)).toBe(Fraction.ONE.div(EXACT_SQM_PER_SQFT).toNumber());
  });

  it('converts a 2,000 ft² house to 185.80608 m² and back', () => {
    // 2000 × 0.09290304 = 185.80608 exactly in decimals.
    expectRelative(squareFeetToSquareMetres(2000), 185.80608, 1e-15, 'ft² → m²');
    expectRelative(convertArea(convertArea(2000, 'sqft', 'sqm'), 'sqm', 'sqft'), 2000, 1e-15, 'round trip');
    expect(convertArea(2000, 'sqft', 'sqft')).toBe(2000);
  });

  it('a rate per area moves the other way: $100 per ft² is $1,076.39… per m²', () => {
    const exact = new Fraction(100n).div(EXACT_SQM_PER_SQFT).toNumber();
    expectRelative(convertRatePerArea(100, 'sqft', 'sqm'), exact, 1e-15, 'per ft² → per m²');
    expectRelative(convertRatePerArea(exact, 'sqm', 'sqft'), 100, 1e-15, 'per m² → per ft²');
  });
});

describe('a fitted line does not depend on the area unit', () => {
  // Not a published figure but a property of least squares that follows from the formulas: changing
  // the unit of x rescales the slope by the conversion factor and leaves R², t, residuals and all
  // diagnostics unchanged (they are scale-free).
  const sales = [
    [1180, 254500], [1320, 281000], [1410, 289900], [1495, 312750], [1560, 309000], [1625, 335500],
    [1710, 341250], [1790, 352000], [1880, 377900], [2010, 389500], [2150, 432000], [2890, 515000],
  ];
  const inFeet = fitLine(sales.map(([x, y]) => ({ x, y })), { x0: 1850 }) as LineFitOk;
  const inMetres = fitLine(sales.map(([x, y]) => ({ x: squareFeetToSquareMetres(x), y })), {
    x0: squareFeetToSquareMetres(1850),
  }) as LineFitOk;

  it('rescales the slope, keeps everything scale-free', () => {
    expect(inFeet.ok && inMetres.ok).toBe(true);
    expectRelative(inMetres.slope, convertRatePerArea(inFeet.slope, 'sqft', 'sqm'), 1e-13, 'slope per m²');
    expectRelative(inMetres.intercept, inFeet.intercept, 1e-12, 'intercept');
    expectRelative(inMetres.rSquared, inFeet.rSquared as number, 1e-13, 'R²');
    expectRelative(inMetres.slopeTStat, inFeet.slopeTStat as number, 1e-13, 't');
    expectRelative(inMetres.prediction?.estimate, inFeet.prediction!.estimate, 1e-13, 'estimate');
    expectRelative(inMetres.prediction?.upper, inFeet.prediction!.upper, 1e-13, 'upper');
    inFeet.points.forEach((p, i) => {
      const q = inMetres.points[i];
      expectRelative(q.residual, p.residual, 1e-9, `residual ${i}`);
      expectRelative(q.leverage, p.leverage, 1e-13, `leverage ${i}`);
      expectRelative(q.cooksDistance, p.cooksDistance as number, 1e-9, `Cook ${i}`);
      expect(q.flags).toEqual(p.flags);
    });
  });
});
