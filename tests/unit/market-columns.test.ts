// The lean fits of market-columns.ts against fitLine, the fit the reference tests hold to published
// data (NIST StRD Norris, Anscombe's quartet, R's `cars` output, exact rational arithmetic: see
// tests/reference). Where the lean path applies, the two must agree to rounding (relative 1e-9);
// where it does not, the columns must carry exactly what fitLine gives (same doubles).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fitColumnsOut, fitRange, type FitColumnsOut, type GroupFit } from '../../server/analysis/lean-fit';
import { analyseColumns } from '../../server/analysis/market-columns';
import { readSales } from '../../server/analysis/sale-columns';
import { revealMaskedOutliers } from '../../server/analysis/masked-outliers';
import { fitLine, type FitPoint, type LineFitOk } from '../../server/analysis/regression';
import { flagsOf, HAS_EXTERNAL, HAS_INTERNAL } from '../../server/analysis/point-diagnostics';
import { analysisInput, analysisSale } from '../factories/analysis';

const close = (actual: number | null, expected: number | null, what: string) => {
  if (expected === null || actual === null) return expect(actual, what).toBe(expected);
  const scale = Math.max(1, Math.abs(expected));
  expect(Math.abs(actual - expected) / scale, `${what}: ${actual} against ${expected}`).toBeLessThan(1e-9);
};

function columnsFit(points: Array<{ x: number; y: number }>, x0?: number): { fit: GroupFit; out: FitColumnsOut; figuresOnly: GroupFit } {
  const n = points.length;
  // Offset by 3 so that a range that does not start at 0 is exercised.
  const xs = new Float64Array(n + 5).fill(12345);
  const ys = new Float64Array(n + 5).fill(-7);
  points.forEach((p, i) => ((xs[i + 3] = p.x), (ys[i + 3] = p.y)));
  const out = fitColumnsOut(n + 5);
  return { fit: fitRange(xs, ys, 3, 3 + n, out, x0, 0.95), out, figuresOnly: fitRange(xs, ys, 3, 3 + n, null, x0, 0.95) };
}

function pointOf(out: FitColumnsOut, points: Array<{ x: number; y: number }>, i: number): FitPoint {
  const k = i + 3;
  const state = out.state[k];
  return {
    x: points[i].x, y: points[i].y, fitted: out.fitted[k], residual: out.residual[k], leverage: out.leverage[k],
    internallyStudentized: state & HAS_INTERNAL ? out.internal[k] : null,
    externallyStudentized: state & HAS_EXTERNAL ? out.external[k] : null,
    cooksDistance: state & HAS_INTERNAL ? out.cooks[k] : null,
    flags: flagsOf(state),
  };
}

function expectAgreement(points: Array<{ x: number; y: number }>, x0?: number) {
  const reference = fitLine(points, x0 === undefined ? {} : { x0 });
  const { fit, out, figuresOnly } = columnsFit(points, x0);
  expect(fit.ok).toBe(reference.ok);
  expect(figuresOnly.ok).toBe(reference.ok);
  if (!reference.ok || !fit.ok || !figuresOnly.ok) return;
  // The fit without per-point figures (as the trends take it) must give the same summary.
  for (const [key, value] of Object.entries(figuresOnly.summary)) {
    if (typeof value === 'number') close(value, (fit.summary as unknown as Record<string, number>)[key], `figures only: ${key}`);
  }
  const summary = fit.summary;
  for (const key of ['slope', 'intercept', 'r', 'rSquared', 'adjustedRSquared', 'sst', 'ssr', 'sse', 'residualStdError', 'slopeStdError', 'interceptStdError', 'slopeTStat', 'slopePValue', 'tCritical', 'xMean', 'yMean', 'xMin', 'xMax'] as const) {
    close(summary[key], reference[key], key);
  }
  close(summary.slopeInterval[0], reference.slopeInterval[0], 'slopeInterval[0]');
  close(summary.slopeInterval[1], reference.slopeInterval[1], 'slopeInterval[1]');
  if (x0 !== undefined) {
    for (const key of ['estimate', 'lower', 'upper', 'meanLower', 'meanUpper'] as const) close(fit.prediction![key], reference.prediction![key], key);
    expect(fit.prediction!.extrapolated).toBe(reference.prediction!.extrapolated);
  }
  reference.points.forEach((expected, i) => {
    const actual = pointOf(out, points, i);
    for (const key of ['fitted', 'leverage', 'internallyStudentized', 'externallyStudentized', 'cooksDistance'] as const) close(actual[key], expected[key], `point ${i} ${key}`);
    // Residuals are differences: compared on the scale of the scatter, not of the residual itself.
    expect(Math.abs(actual.residual - expected.residual) / Math.max(1, reference.residualStdError)).toBeLessThan(1e-9);
    expect(actual.flags, `point ${i} flags`).toEqual(expected.flags);
  });
}

describe('the lean fits agree with fitLine', () => {
  it('on random sales-like data (floor areas and prices, 4 to 300 points)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 4, max: 300 }),
        fc.integer({ min: 1, max: 2 ** 31 - 1 }),
        fc.double({ min: 20, max: 400, noNaN: true }),
        (n, seed, rate) => {
          let state = seed;
          const rand = () => ((state = (state * 48_271) % 2_147_483_647) / 2_147_483_647);
          const points = Array.from({ length: n }, () => {
            const x = Math.round(700 + rand() * 3_000);
            return { x, y: Math.round(50_000 + rate * x + (rand() - 0.5) * 150_000) };
          });
          expectAgreement(points, 1_850);
        },
      ),
      { numRuns: 300, seed: 42 },
    );
  });

  it('on months and prices per square foot, as the trend fits them', () => {
    const points = Array.from({ length: 60 }, (_, i) => ({ x: ((i * 7) % 18) + (i % 5) / 10, y: 210 + 0.8 * ((i * 7) % 18) + ((i * 13) % 9) - 4 }));
    expectAgreement(points);
  });

  it('with gross outliers (the family transfer, a ×10 area typo)', () => {
    const points = Array.from({ length: 25 }, (_, i) => ({ x: 1_200 + 40 * i, y: 60_000 + 180 * (1_200 + 40 * i) + (((i * 7919) % 11) - 5) * 3_000 }));
    points.push({ x: 1_500, y: 120_000 }, { x: 16_000, y: 330_000 });
    expectAgreement(points, 1_600);
  });

  it.each([
    ['three points', [{ x: 1, y: 2 }, { x: 2, y: 3 }, { x: 4, y: 1 }]],
    ['an exact line', [1, 2, 3, 4, 5].map((x) => ({ x, y: 3 * x + 1 }))],
    ['every price equal', [1, 2, 3, 4, 5].map((x) => ({ x, y: 7 }))],
    ['one sale alone at its floor area', [{ x: 1, y: 1 }, { x: 1, y: 3 }, { x: 1, y: 2 }, { x: 5, y: 9 }]],
    ['no spread in floor area', [1, 2, 3, 4].map((y) => ({ x: 9, y }))],
    ['a missing price', [{ x: 1, y: 1 }, { x: 2, y: NaN }, { x: 3, y: 2 }, { x: 4, y: 5 }]],
    ['an infinite floor area', [{ x: 1, y: 1 }, { x: Infinity, y: 4 }, { x: 3, y: 2 }, { x: 4, y: 5 }]],
    ['values beyond ±1e100', [{ x: 1, y: 1e120 }, { x: 2, y: 3e120 }, { x: 3, y: 2e120 }, { x: 4, y: 5e120 }]],
    ['all but one exactly on a line', [...[1, 2, 3, 4, 5, 6].map((x) => ({ x, y: 2 * x })), { x: 7, y: 30 }]],
  ])('%s: the columns carry exactly what fitLine gives', (_, points) => {
    const reference = fitLine(points, { x0: 2 });
    const { fit, out } = columnsFit(points, 2);
    if (!reference.ok) {
      expect(fit).toEqual({ ok: false, n: reference.n, reason: reference.reason, message: reference.message });
      return;
    }
    expect(fit.ok).toBe(true);
    const { points: referencePoints, degreesOfFreedom, confidence, exactFit, fStatistic, ok, prediction, ...figures } = reference as LineFitOk;
    void [degreesOfFreedom, confidence, exactFit, fStatistic, ok];
    expect(fit.ok && fit.summary).toEqual(figures);
    expect(fit.ok && fit.prediction).toEqual(prediction);
    referencePoints.forEach((expected, i) => expect(pointOf(out, points, i)).toEqual(expected));
  });
});

describe('the masked-outlier pass on columns', () => {
  it('reveals what revealMaskedOutliers reveals, with the same figures', () => {
    // Two gross outliers: the ×10 area typo drags the line and hides the family transfer.
    const line = Array.from({ length: 20 }, (_, i) => ({ x: 1_000 + 60 * i, y: 50_000 + 200 * (1_000 + 60 * i) + (((i * 7919) % 13) - 6) * 900 }));
    const points = [...line, { x: 2_000, y: 0.6 * (50_000 + 200 * 2_000) }, { x: 15_000, y: 50_000 + 200 * 1_500 }];
    const sales = points.map((p, i) => analysisSale({ id: i + 1, neighbourhood: 'Quarry Hill', floorArea: p.x, salePrice: p.y }));
    const columns = analyseColumns(readSales(analysisInput(sales)), { timeAdjustment: false, x0: 1_500 });
    const full = fitLine(points) as LineFitOk;
    const outliers = full.points.flatMap((p, i) => (p.flags.includes('outlier') ? [i] : []));
    const expected = revealMaskedOutliers(points, outliers, full.points);
    expect(expected.length).toBeGreaterThan(0);
    const actual = columns.revealed[0];
    expect(actual.map((r) => [r.index, r.setAside])).toEqual(expected.map((r) => [r.index, r.setAside]));
    actual.forEach((r, i) => {
      for (const key of ['fitted', 'residual', 'leverage', 'internallyStudentized', 'externallyStudentized', 'cooksDistance'] as const) close(r.point[key], expected[i].point[key], key);
      expect(r.point.flags).toEqual(expected[i].point.flags);
    });
  });
});

describe('reading the sales into columns', () => {
  it('puts each neighbourhood in one run, the subject’s first, the rest by name, sales in their order', () => {
    const names = ['Tannery Row', 'Quarry Hill', null, 'Orchard Rise', 'Quarry Hill', 'Tannery Row'];
    const sales = names.map((neighbourhood, i) => analysisSale({ id: 10 + i, neighbourhood, excluded: i === 3 }));
    const columns = readSales(analysisInput(sales, { subject: { floorArea: 1_400, neighbourhood: 'Tannery Row' } }));
    expect(columns.names).toEqual(['Tannery Row', 'No neighbourhood', 'Quarry Hill']);
    expect(Array.from(columns.start)).toEqual([0, 2, 3, 5]);
    expect(Array.from(columns.saleId)).toEqual([10, 15, 12, 11, 14]);
    expect(columns.excluded.map((s) => s.id)).toEqual([13]);
    expect(columns.subjectGroup).toBe(0);
  });
});
