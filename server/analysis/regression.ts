// Least-squares line y = slope·x + intercept with the statistics an appraiser needs to judge it:
// ANOVA sums of squares, standard errors, a t test and interval for the slope, a prediction
// interval at the subject, and per-point leverage, studentized residuals and Cook's distance.
// Pure: no I/O, never throws on data, never returns NaN or ±Infinity (undefined values are null).
//
// Precision: every sum is taken over centred values (centred-sums.ts: two passes, compensated
// summation), and fitted values and residuals are formed around the means, never through the
// intercept. Dates as epoch milliseconds (~1.7e12) or prices in the millions cost no digits.
// Per-point diagnostics and flags live in point-diagnostics.ts. Student t quantiles and p-values
// come from jstat, good to about 1e-8 relative: far below what any figure on screen shows.
import jStat from 'jstat';
import { sum } from 'simple-statistics';
import { centre, centredProduct } from './centred-sums';
import { diagnosePoints, EXACT_FIT_TOLERANCE, soleDistinctX } from './point-diagnostics';

export type PointFlag = 'unusual' | 'outlier' | 'influential' | 'high-leverage';
export type RefusalReason = 'too-few-points' | 'no-spread-in-x' | 'non-finite-input';

export interface FitPoint {
  x: number;
  y: number;
  fitted: number;
  residual: number;
  /** h = 1/n + (x − x̄)²/Sxx, always in [1/n, 1]. */
  leverage: number;
  /** e / (s·√(1 − h)); null when s = 0 or h = 1. */
  internallyStudentized: number | null;
  /** Deleted (externally) studentized residual; null also when n = 3 (no degrees of freedom left). */
  externallyStudentized: number | null;
  /** D = r²/2 · h/(1 − h); null when the internally studentized residual is. */
  cooksDistance: number | null;
  flags: PointFlag[];
}

export interface Prediction {
  x0: number;
  estimate: number;
  /** Prediction interval for one new observation at x0. */
  lower: number;
  upper: number;
  /** Confidence interval for the mean of y at x0. */
  meanLower: number;
  meanUpper: number;
  /** True when x0 lies outside [xMin, xMax]: the line is being used beyond the data. */
  extrapolated: boolean;
}

export interface LineFitRefusal {
  ok: false;
  n: number;
  reason: RefusalReason;
  message: string;
}

export interface LineFitOk {
  ok: true;
  n: number;
  degreesOfFreedom: number;
  confidence: number;
  slope: number;
  intercept: number;
  /** Pearson r; null when every y is equal (no variation to correlate). */
  r: number | null;
  /** SSR/SST; null when SST = 0. */
  rSquared: number | null;
  /** 1 − (SSE/(n−2)) / (SST/(n−1)); can be negative for a weak fit; null when SST = 0. */
  adjustedRSquared: number | null;
  sst: number;
  ssr: number;
  sse: number;
  /** True when the residuals are rounding noise only (EXACT_FIT_TOLERANCE in point-diagnostics.ts); they are then 0. */
  exactFit: boolean;
  /** s = √(SSE/(n−2)). */
  residualStdError: number;
  slopeStdError: number;
  interceptStdError: number;
  /** slope / its standard error; null when that error is 0 (exact fit). */
  slopeTStat: number | null;
  /** Two-sided; 0 for an exact fit with a non-zero slope, null for an exact flat fit. */
  slopePValue: number | null;
  /** F = SSR / (SSE/(n−2)) = t²; null when SSE = 0. */
  fStatistic: number | null;
  /** Student t quantile used for every interval, with n − 2 degrees of freedom. */
  tCritical: number;
  slopeInterval: [number, number];
  xMean: number;
  yMean: number;
  xMin: number;
  xMax: number;
  prediction?: Prediction;
  points: FitPoint[];
}

export type LineFit = LineFitOk | LineFitRefusal;

export interface FitOptions {
  /** Where to predict (the subject's floor area, say). */
  x0?: number;
  /** Confidence level for every interval, strictly between 0 and 1. Default 0.95. */
  confidence?: number;
}

const PARAMETERS = 2;
/**
 * Values beyond ±1e100, or spreads below 1e-100, would push squares and cross-products out of the
 * normal double range (overflow, or underflow that silently drops digits). Real sales sit far
 * inside; anything outside is refused rather than answered wrongly.
 */
const SAFE_LIMIT = 1e100;

/**
 * Two-sided p-value of Student's t as I_{df/(df+t²)}(df/2, 1/2). It keeps its relative accuracy in
 * the far tail, where 2·(1 − F(|t|)) cancels (to 0 for t = 2331 on 34 df; already 6e-5 off at t = 9.5).
 */
function twoSidedPValue(t: number, df: number): number {
  const p = jStat.ibeta(df / (df + t * t), df / 2, 0.5);
  return Math.min(1, Math.max(0, p));
}

function refuse(n: number, reason: RefusalReason, message: string): LineFitRefusal {
  return { ok: false, n, reason, message };
}

function isAllFinite(value: unknown): boolean {
  if (typeof value === 'number') return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(isAllFinite);
  if (value !== null && typeof value === 'object') return Object.values(value).every(isAllFinite);
  return true;
}

/**
 * Fits y = slope·x + intercept by least squares. Refuses, in this order, any non-finite x, y or x0
 * ('non-finite-input'), fewer than 3 points ('too-few-points'), x without spread ('no-spread-in-x'),
 * and values outside ±1e100 or y spreads under 1e-100 ('non-finite-input': not computable).
 * Throws only for a confidence level outside (0, 1), a programming error.
 */
export function fitLine(points: ReadonlyArray<{ x: number; y: number }>, options: FitOptions = {}): LineFit {
  const confidence = options.confidence ?? 0.95;
  if (!(confidence > 0 && confidence < 1)) {
    // A caller's mistake, not a property of the sales: fail loudly.
    throw new RangeError(`confidence must be strictly between 0 and 1, got ${confidence}`);
  }
  const n = points.length;
  const bad = points.findIndex((p) => !Number.isFinite(p.x) || !Number.isFinite(p.y));
  if (bad >= 0) {
    return refuse(n, 'non-finite-input', `Point ${bad + 1} of ${n} has a missing or non-numeric value, so no line can be fitted.`);
  }
  const { x0 } = options;
  if (x0 !== undefined && !Number.isFinite(x0)) {
    return refuse(n, 'non-finite-input', 'The value to predict at is missing or not a number.');
  }
  if (n < 3) {
    return refuse(n, 'too-few-points', `At least 3 points are needed to fit a line and measure its scatter; ${n} ${n === 1 ? 'was' : 'were'} given.`);
  }
  const xs = points.map((p) => p.x);
  const ys = points.map((p) => p.y);
  if (xs.every((x) => x === xs[0])) {
    return refuse(n, 'no-spread-in-x', 'Every point has the same x value, so the slope cannot be measured.');
  }
  const fit = computeFit(xs, ys, confidence, x0);
  if (fit === 'no-spread') {
    return refuse(n, 'no-spread-in-x', 'The x values are too close together to measure a slope.');
  }
  if (fit === 'out-of-range' || !isAllFinite(fit)) {
    return refuse(n, 'non-finite-input', 'Some values are too large, or differ by too little, to compute with safely.');
  }
  return fit;
}

type ComputeResult = LineFitOk | 'no-spread' | 'out-of-range';

function computeFit(xs: number[], ys: number[], confidence: number, x0: number | undefined): ComputeResult {
  const n = xs.length;
  const df = n - PARAMETERS;
  const { mean: xMean, deviations: dx, deviation: xDeviation } = centre(xs);
  const { mean: yMean, deviations: dy } = centre(ys);
  const largest = (values: number[]) => values.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
  if (largest(xs) > SAFE_LIMIT || largest(ys) > SAFE_LIMIT || (x0 !== undefined && Math.abs(x0) > SAFE_LIMIT)) {
    return 'out-of-range';
  }
  const ySpread = largest(dy);
  if (ySpread > 0 && ySpread < 1 / SAFE_LIMIT) return 'out-of-range';
  if (largest(dx) < 1 / SAFE_LIMIT) return 'no-spread';
  const sxx = centredProduct(dx, dx);
  if (!(sxx > 0)) return 'no-spread';
  const syy = Math.max(0, centredProduct(dy, dy));
  const sxy = centredProduct(dx, dy);
  const slope = sxy / sxx;
  const intercept = yMean - slope * xMean;

  const pivot = soleDistinctX(xs);
  let residuals = dy.map((d, i) => (i === pivot ? 0 : d - slope * dx[i]));
  let sse = sum(residuals.map((e) => e * e));
  const exactFit = sse <= EXACT_FIT_TOLERANCE * EXACT_FIT_TOLERANCE * syy;
  if (exactFit) {
    residuals = residuals.map(() => 0);
    sse = 0;
  }
  const sst = syy;
  const ssr = exactFit ? sst : Math.min(sst, (sxy * sxy) / sxx);
  const rSquared = sst > 0 ? (exactFit ? 1 : Math.min(1, ssr / sst)) : null;
  const r = sst > 0 ? (exactFit ? Math.sign(slope) : clamp(sxy / (Math.sqrt(sxx) * Math.sqrt(syy)), -1, 1)) : null;
  const mse = sse / df;
  const s = Math.sqrt(mse);
  const adjustedRSquared = sst > 0 ? 1 - mse / (sst / (n - 1)) : null;
  const slopeStdError = s / Math.sqrt(sxx);
  const interceptStdError = s * Math.sqrt(1 / n + (xMean * xMean) / sxx);
  const slopeTStat = slopeStdError > 0 ? slope / slopeStdError : null;
  let slopePValue: number | null = null;
  if (slopeTStat !== null) slopePValue = twoSidedPValue(slopeTStat, df);
  else if (slope !== 0) slopePValue = 0;
  const fStatistic = mse > 0 ? ssr / mse : null;
  const tCritical = jStat.studentt.inv(1 - (1 - confidence) / 2, df);
  const slopeHalfWidth = tCritical * slopeStdError;

  const xMin = xs.reduce((a, b) => Math.min(a, b));
  const xMax = xs.reduce((a, b) => Math.max(a, b));
  const fitPoints = diagnosePoints({ xs, ys, dx, dy, residuals, sxx, sst, s, yMean, slope, exactFit });

  const fit: LineFitOk = {
    ok: true, n, degreesOfFreedom: df, confidence,
    slope, intercept, r, rSquared, adjustedRSquared, sst, ssr, sse, exactFit,
    residualStdError: s, slopeStdError, interceptStdError, slopeTStat, slopePValue, fStatistic, tCritical,
    slopeInterval: [slope - slopeHalfWidth, slope + slopeHalfWidth],
    xMean, yMean, xMin, xMax, points: fitPoints,
  };
  if (x0 !== undefined) {
    const d0 = xDeviation(x0);
    const estimate = yMean + slope * d0;
    const meanHalf = tCritical * s * Math.sqrt(1 / n + (d0 * d0) / sxx);
    const newHalf = tCritical * s * Math.sqrt(1 + 1 / n + (d0 * d0) / sxx);
    fit.prediction = {
      x0, estimate, lower: estimate - newHalf, upper: estimate + newHalf,
      meanLower: estimate - meanHalf, meanUpper: estimate + meanHalf,
      extrapolated: x0 < xMin || x0 > xMax,
    };
  }
  return fit;
}

function clamp(value: number, low: number, high: number): number {
  return Math.min(high, Math.max(low, value));
}
