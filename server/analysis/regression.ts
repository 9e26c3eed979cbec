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
// The computation itself is in fit-columns.ts, on columns of doubles; this module keeps the types
// and turns the columns into point objects.
import { fitColumns, fitScratch } from './fit-columns';
import { pointAt } from './point-diagnostics';

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

/**
 * Fits y = slope·x + intercept by least squares. Refuses, in this order, any non-finite x, y or x0
 * ('non-finite-input'), fewer than 3 points ('too-few-points'), x without spread ('no-spread-in-x'),
 * and values outside ±1e100 or y spreads under 1e-100 ('non-finite-input': not computable), and
 * any figure that would come out NaN or ±Infinity ('non-finite-input').
 * Throws only for a confidence level outside (0, 1), a programming error.
 */
export function fitLine(points: ReadonlyArray<{ x: number; y: number }>, options: FitOptions = {}): LineFit {
  const confidence = options.confidence ?? 0.95;
  if (!(confidence > 0 && confidence < 1)) {
    // A caller's mistake, not a property of the sales: fail loudly (before reading the points).
    throw new RangeError(`confidence must be strictly between 0 and 1, got ${confidence}`);
  }
  const n = points.length;
  const { xs, ys } = fitScratch(n);
  let bad = -1;
  for (let i = 0; i < n; i++) {
    const { x, y } = points[i];
    if (bad < 0 && !(Number.isFinite(x) && Number.isFinite(y))) bad = i;
    xs[i] = x;
    ys[i] = y;
  }
  const fit = fitColumns(n, bad, options);
  if (!fit.ok) return fit;
  const { residuals, points: columns } = fitScratch(n);
  const fitPoints = new Array<FitPoint>(n);
  for (let i = 0; i < n; i++) fitPoints[i] = pointAt(xs, ys, residuals, columns, i);
  fit.points = fitPoints;
  return fit;
}
