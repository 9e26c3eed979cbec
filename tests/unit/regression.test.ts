import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fitLine, type LineFit, type LineFitOk } from '../../server/analysis/regression';

type Point = { x: number; y: number };

function ok(fit: LineFit): LineFitOk {
  if (!fit.ok) throw new Error(`expected a fit, got refusal ${fit.reason}: ${fit.message}`);
  return fit;
}

/** Every number anywhere in the result, with its path. */
function numbersIn(value: unknown, path = 'fit'): Array<[string, number]> {
  if (typeof value === 'number') return [[path, value]];
  if (Array.isArray(value)) return value.flatMap((v, i) => numbersIn(v, `${path}[${i}]`));
  if (value !== null && typeof value === 'object') {
    return Object.entries(value).flatMap(([k, v]) => numbersIn(v, `${path}.${k}`));
  }
  return [];
}

function expectNoNonFinite(fit: LineFit): void {
  const bad = numbersIn(fit).filter(([, v]) => !Number.isFinite(v));
  expect(bad).toEqual([]);
}

// A line of sales at $150/ft² + $40,000 with a fixed, irregular scatter (invented).
const SCATTER = [3100, -4200, 1800, -900, 5200, -2600, 700, -3900, 2400, -1500, 4100, -3700];
const SALES: Point[] = SCATTER.map((e, i) => ({ x: 1400 + 60 * i, y: 40000 + 150 * (1400 + 60 * i) + e }));

describe('refusals: a typed answer, never a throw', () => {
  it.each([
    [[], 'too-few-points'],
    [[{ x: 1, y: 1 }], 'too-few-points'],
    [[{ x: 1, y: 1 }, { x: 2, y: 2 }], 'too-few-points'],
    [[{ x: 5, y: 1 }, { x: 5, y: 2 }, { x: 5, y: 9 }], 'no-spread-in-x'],
    [[{ x: 1, y: 1 }, { x: Number.NaN, y: 2 }, { x: 3, y: 3 }], 'non-finite-input'],
    [[{ x: 1, y: 1 }, { x: 2, y: Number.POSITIVE_INFINITY }, { x: 3, y: 3 }], 'non-finite-input'],
    [[{ x: Number.NEGATIVE_INFINITY, y: 1 }, { x: 2, y: 2 }], 'non-finite-input'],
  ] as Array<[Point[], string]>)('%j → %s', (points, reason) => {
    const fit = fitLine(points);
    expect(fit.ok).toBe(false);
    if (fit.ok) return;
    expect(fit.reason).toBe(reason);
    expect(fit.n).toBe(points.length);
    expect(fit.message).toMatch(/^[A-Z].*\.$/);
  });

  it('refuses a non-finite point to predict at', () => {
    const fit = fitLine(SALES, { x0: Number.NaN });
    expect(fit.ok ? null : fit.reason).toBe('non-finite-input');
  });

  it('refuses values too large to square rather than return Infinity, and spreads too small to square', () => {
    const reason = (points: Point[]) => {
      const fit = fitLine(points);
      return fit.ok ? 'fitted' : fit.reason;
    };
    expect(reason([{ x: 0, y: 0 }, { x: 1e300, y: 1 }, { x: -1e300, y: 2 }])).toBe('non-finite-input');
    expect(reason([{ x: 0, y: 1 }, { x: 0, y: 2 }, { x: 2.4e-162, y: 3 }])).toBe('no-spread-in-x');
    expect(reason([{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 3e-142 }])).toBe('non-finite-input');
    expect(reason([{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 3e-42 }])).toBe('fitted');
  });

  it('throws only for a caller mistake: a confidence level outside (0, 1)', () => {
    expect(() => fitLine(SALES, { confidence: 95 })).toThrow(RangeError);
    expect(() => fitLine(SALES, { confidence: 0 })).toThrow(RangeError);
  });
});

describe('flags', () => {
  it('a sale planted 30% below the line is flagged outlier and unusual; no other sale is', () => {
    const planted = SALES.map((p, i) => (i === 6 ? { x: p.x, y: p.y * 0.7 } : p));
    const fit = ok(fitLine(planted));
    expect(fit.points[6].flags).toEqual(expect.arrayContaining(['unusual', 'outlier']));
    expect(fit.points[6].externallyStudentized!).toBeLessThan(-3);
    fit.points.forEach((p, i) => i !== 6 && expect(p.flags).not.toContain('outlier'));
  });

  it('a sale far out in floor area but on the line is high-leverage, not an outlier', () => {
    const fit = ok(fitLine([...SALES, { x: 4200, y: 40000 + 150 * 4200 }]));
    const far = fit.points[fit.points.length - 1];
    expect(far.flags).toContain('high-leverage');
    expect(far.flags).not.toContain('outlier');
    expect(far.leverage).toBeGreaterThan(4 / fit.n);
  });

  it('a sale far out in floor area and off the line is influential', () => {
    const fit = ok(fitLine([...SALES, { x: 4200, y: 0.75 * (40000 + 150 * 4200) }]));
    const far = fit.points[fit.points.length - 1];
    expect(far.flags).toEqual(expect.arrayContaining(['influential', 'high-leverage']));
    expect(far.cooksDistance!).toBeGreaterThan(4 / fit.n);
  });

  it('a sale off a line the others follow exactly: deleted residual infinite → null, still an outlier', () => {
    const fit = ok(fitLine([{ x: 1, y: 1 }, { x: 2, y: 2 }, { x: 3, y: 3 }, { x: 4, y: 4 }, { x: 5, y: 10 }]));
    const last = fit.points[4];
    expect(last.externallyStudentized).toBeNull();
    expect(last.flags).toEqual(expect.arrayContaining(['unusual', 'outlier']));
    expectNoNonFinite(fit);
  });
});

describe('degenerate but valid fits', () => {
  it('an exact line: R² = 1, s = 0, t undefined (null), p = 0, diagnostics null', () => {
    const fit = ok(fitLine([1, 2, 3, 4, 5, 6].map((x) => ({ x: 1000 * x, y: 150 * 1000 * x + 50000 })), { x0: 2500 }));
    expect(fit.exactFit).toBe(true);
    expect([fit.slope, fit.intercept, fit.r, fit.rSquared, fit.adjustedRSquared]).toEqual([150, 50000, 1, 1, 1]);
    expect([fit.sse, fit.residualStdError, fit.slopeStdError, fit.slopeTStat, fit.slopePValue]).toEqual([0, 0, 0, null, 0]);
    expect(fit.slopeInterval).toEqual([150, 150]);
    expect(fit.prediction).toMatchObject({ estimate: 425000, lower: 425000, upper: 425000 });
    for (const p of fit.points) {
      expect([p.residual, p.internallyStudentized, p.externallyStudentized, p.cooksDistance]).toEqual([0, null, null, null]);
    }
    expectNoNonFinite(fit);
  });

  it('every price equal: slope 0, and r, R², t, p all null', () => {
    const fit = ok(fitLine([1, 2, 3, 4].map((x) => ({ x, y: 300000 }))));
    expect(fit.slope).toBe(0);
    expect([fit.r, fit.rSquared, fit.slopeTStat, fit.slopePValue, fit.fStatistic]).toEqual([null, null, null, null, null]);
    expectNoNonFinite(fit);
  });

  it('three points: the deleted residual has no degrees of freedom, so it is null', () => {
    const fit = ok(fitLine([{ x: 1, y: 2 }, { x: 2, y: 3.5 }, { x: 4, y: 5 }]));
    expect(fit.points.every((p) => p.externallyStudentized === null)).toBe(true);
    expect(fit.points.every((p) => p.internallyStudentized !== null)).toBe(true);
  });

  it('extrapolation is flagged outside [xMin, xMax] only', () => {
    const at = (x0: number) => ok(fitLine(SALES, { x0 })).prediction!.extrapolated;
    expect([at(1400), at(2060), at(1399), at(2061)]).toEqual([false, false, true, true]);
  });
});

describe('large offsets cost nothing', () => {
  it('shifting x by 1.7e12 and y by 2e6 keeps slope and residuals (1e-7 relative)', () => {
    const base = ok(fitLine(SALES));
    const moved = ok(fitLine(SALES.map((p) => ({ x: p.x + 1.7e12, y: p.y + 2e6 }))));
    expect(Math.abs(moved.slope / base.slope - 1)).toBeLessThan(1e-7);
    moved.points.forEach((p, i) => expect(Math.abs(p.residual / base.points[i].residual - 1)).toBeLessThan(1e-7));
    moved.points.forEach((p, i) => expect(p.flags).toEqual(base.points[i].flags));
  });
});

// Random sales-like data: n from 3 to 40, x to 0.01 and y to the cent, on their own scales and
// offsets (floor areas, dates as epoch milliseconds, prices in the millions).
const salesData = fc
  .record({
    xs: fc.array(fc.integer({ min: -100000, max: 100000 }), { minLength: 3, maxLength: 40 }),
    ys: fc.array(fc.integer({ min: -1e8, max: 1e8 }), { minLength: 40, maxLength: 40 }),
    xOffset: fc.constantFrom(0, 2500, 1.7e12),
    yOffset: fc.constantFrom(0, 350000, 2e6),
  })
  .filter(({ xs }) => new Set(xs).size > 1)
  .map(({ xs, ys, xOffset, yOffset }) => xs.map((x, i) => ({ x: x / 100 + xOffset, y: ys[i] / 100 + yOffset })));

describe('properties on random data (fast-check)', () => {
  it('residuals sum to 0 and are orthogonal to x; R² in [0, 1]; leverages sum to 2', () => {
    fc.assert(
      fc.property(salesData, (points) => {
        const fit = ok(fitLine(points));
        // Residuals are differences of centred prices, so their rounding error scales with Σ|y − ȳ|.
        const scale = fit.points.reduce((s, p) => s + Math.abs(p.y - fit.yMean) + Math.abs(p.residual), 0);
        const xScale = fit.points.reduce((s, p) => s + Math.abs(p.x - fit.xMean), 0);
        const sumE = fit.points.reduce((s, p) => s + p.residual, 0);
        const sumEx = fit.points.reduce((s, p) => s + p.residual * (p.x - fit.xMean), 0);
        expect(Math.abs(sumE)).toBeLessThanOrEqual(1e-9 * scale);
        expect(Math.abs(sumEx)).toBeLessThanOrEqual(1e-9 * scale * xScale);
        if (fit.rSquared !== null) expect(fit.rSquared >= 0 && fit.rSquared <= 1).toBe(true);
        // The hat matrix of a line has trace p = 2.
        expect(Math.abs(fit.points.reduce((s, p) => s + p.leverage, 0) - 2)).toBeLessThan(1e-9);
        expect(fit.points.every((p) => p.cooksDistance === null || p.cooksDistance >= 0)).toBe(true);
        return true;
      }),
      { numRuns: 300 },
    );
  });

  it('intervals are nested around the estimate', () => {
    fc.assert(
      fc.property(salesData, fc.double({ min: -2e3, max: 2e3, noNaN: true }), (points, offset) => {
        const fit = fitLine(points, { x0: points[0].x + offset });
        if (!fit.ok) return true;
        const p = fit.prediction!;
        expect(p.lower <= p.meanLower && p.meanLower <= p.estimate).toBe(true);
        expect(p.estimate <= p.meanUpper && p.meanUpper <= p.upper).toBe(true);
        expect(fit.slopeInterval[0] <= fit.slope && fit.slope <= fit.slopeInterval[1]).toBe(true);
        return true;
      }),
      { numRuns: 200 },
    );
  });

  it('never throws and never returns NaN or ±Infinity, whatever the doubles', () => {
    const anyPoint = fc.record({ x: fc.double(), y: fc.double() });
    fc.assert(
      fc.property(fc.array(anyPoint, { maxLength: 12 }), fc.option(fc.double(), { nil: undefined }), (points, x0) => {
        const fit = fitLine(points, { x0 });
        expectNoNonFinite(fit);
        return true;
      }),
      { numRuns: 500 },
    );
  });
});
