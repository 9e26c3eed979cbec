// The least-squares computation behind fitLine (regression.ts), on columns of doubles instead of
// arrays of objects. Callers write x and y into the scratch columns, call fitColumns, and read the
// per-point figures out of the same scratch before the next call overwrites them. fitLine turns
// them into FitPoint objects; the market analysis builds its own point objects (with the sale id)
// straight from the columns, and the time trend and the masked-outlier pass need no point objects.
//
// Scratch columns live as long as the module and grow to the largest set fitted; nothing here is
// asynchronous, so one fit is always read out before the next begins.
import jStat from 'jstat';
import { centredSums, compensatedDot } from './centred-sums';
import { diagnoseColumns, EXACT_FIT_TOLERANCE, pointColumns, soleDistinctX, type PointColumns } from './point-diagnostics';
import type { LineFit, LineFitOk, LineFitRefusal, Prediction, RefusalReason } from './regression';

const PARAMETERS = 2;
/**
 * Values beyond ±1e100, or spreads below 1e-100, would push squares and cross-products out of the
 * normal double range (overflow, or underflow that silently drops digits). Real sales sit far
 * inside; anything outside is refused rather than answered wrongly.
 */
export const SAFE_LIMIT = 1e100;

export interface FitScratch {
  xs: Float64Array;
  ys: Float64Array;
  /** Centred x and y, and the residuals, of the last fit. */
  dx: Float64Array;
  dy: Float64Array;
  residuals: Float64Array;
  points: PointColumns;
}

let scratch: FitScratch = allocate(256);

function allocate(capacity: number): FitScratch {
  const column = () => new Float64Array(capacity);
  return { xs: column(), ys: column(), dx: column(), dy: column(), residuals: column(), points: pointColumns(capacity) };
}

/** Scratch columns with room for n points; write x and y into xs and ys [0, n) before fitColumns. */
export function fitScratch(n: number): FitScratch {
  if (n > scratch.xs.length) scratch = allocate(Math.max(n, 2 * scratch.xs.length));
  return scratch;
}

// Taken from the jStat object once: it holds hundreds of properties, and reading them in the hot
// path left V8 without the type feedback it needs to keep computeFit optimised.
const ibeta = jStat.ibeta;
const studentTQuantile = jStat.studentt.inv;

/**
 * Two-sided p-value of Student's t as I_{df/(df+t²)}(df/2, 1/2). It keeps its relative accuracy in
 * the far tail, where 2·(1 − F(|t|)) cancels (to 0 for t = 2331 on 34 df; already 6e-5 off at t = 9.5).
 */
export function twoSidedPValue(t: number, df: number): number {
  // 0.5·df is df/2 exactly; written as a product so that V8 does not guess an integer result and
  // drop out of optimised code at every odd df.
  const p = ibeta(df / (df + t * t), 0.5 * df, 0.5);
  return Math.min(1, Math.max(0, p));
}

/** Student t quantiles are iterative and the same for every fit with the same df: kept once computed. */
const quantiles = new Map<number, Map<number, number>>();
export function tQuantile(confidence: number, df: number): number {
  let byDf = quantiles.get(confidence);
  if (!byDf) quantiles.set(confidence, (byDf = new Map()));
  let t = byDf.get(df);
  if (t === undefined) {
    if (byDf.size >= 100_000) byDf.clear(); // bounded in a long-running server
    t = studentTQuantile(1 - (1 - confidence) / 2, df);
    byDf.set(df, t);
  }
  return t;
}

function refuse(n: number, reason: RefusalReason, message: string): LineFitRefusal {
  return { ok: false, n, reason, message };
}

/**
 * Fits the first n points of the scratch columns (see fitLine for the refusals, in their order).
 * `bad` is the index of the first point with a non-finite x or y, or −1. The fit it returns has
 * `points: []`; the per-point figures are in the scratch columns until the next call.
 */
export function fitColumns(n: number, bad: number, options: { x0?: number; confidence?: number } = {}): LineFit {
  const confidence = options.confidence ?? 0.95;
  if (!(confidence > 0 && confidence < 1)) {
    // A caller's mistake, not a property of the sales: fail loudly.
    throw new RangeError(`confidence must be strictly between 0 and 1, got ${confidence}`);
  }
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
  const { xs } = scratch;
  let spreadInX = false;
  for (let i = 1; i < n && !spreadInX; i++) spreadInX = xs[i] !== xs[0];
  if (!spreadInX) {
    return refuse(n, 'no-spread-in-x', 'Every point has the same x value, so the slope cannot be measured.');
  }
  const fit = computeFit(n, confidence, x0);
  if (fit === 'no-spread') {
    return refuse(n, 'no-spread-in-x', 'The x values are too close together to measure a slope.');
  }
  if (fit === 'out-of-range' || fit === 'non-finite') {
    return refuse(n, 'non-finite-input', 'Some values are too large, or differ by too little, to compute with safely.');
  }
  return fit;
}

function computeFit(n: number, confidence: number, x0: number | undefined): LineFitOk | 'no-spread' | 'out-of-range' | 'non-finite' {
  const { xs, ys, dx, dy, residuals } = scratch;
  const df = n - PARAMETERS;
  const sums = centredSums(xs, ys, n, dx, dy);
  const xMean = sums.xFirst + sums.xCorrection;
  const yMean = sums.yFirst + sums.yCorrection;
  if (sums.largestX > SAFE_LIMIT || sums.largestY > SAFE_LIMIT || (x0 !== undefined && Math.abs(x0) > SAFE_LIMIT)) {
    return 'out-of-range';
  }
  const ySpread = sums.largestDy;
  if (ySpread > 0 && ySpread < 1 / SAFE_LIMIT) return 'out-of-range';
  if (sums.largestDx < 1 / SAFE_LIMIT) return 'no-spread';
  // Each product sum is Σa·b less the corrected two-pass term Σa·Σb/n (zero in exact arithmetic).
  const { sumDx, sumDy } = sums;
  const sxx = sums.sumDxDx - (sumDx * sumDx) / n;
  if (!(sxx > 0)) return 'no-spread';
  const syy = Math.max(0, sums.sumDyDy - (sumDy * sumDy) / n);
  const sxy = sums.sumDxDy - (sumDx * sumDy) / n;
  const slope = sxy / sxx;
  const intercept = yMean - slope * xMean;

  const pivot = soleDistinctX(xs, n);
  for (let i = 0; i < n; i++) residuals[i] = i === pivot ? 0 : dy[i] - slope * dx[i];
  let sse = compensatedDot(residuals, residuals, n);
  const exactFit = sse <= EXACT_FIT_TOLERANCE * EXACT_FIT_TOLERANCE * syy;
  if (exactFit) {
    residuals.fill(0, 0, n);
    sse = 0;
  }
  const sst = syy;
  const ssr = exactFit ? sst : Math.min(sst, (sxy * sxy) / sxx);
  const rSquared = sst > 0 ? (exactFit ? 1 : Math.min(1, ssr / sst)) : null;
  const r = sst > 0 ? (exactFit ? Math.sign(slope) : Math.min(1, Math.max(-1, sxy / (Math.sqrt(sxx) * Math.sqrt(syy))))) : null;
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
  const tCritical = tQuantile(confidence, df);
  const slopeHalfWidth = tCritical * slopeStdError;

  const { xMin, xMax } = sums;
  const pointsFinite = diagnoseColumns({ n, pivot, xs, ys, dx, dy, residuals, sxx, sst, s, yMean, slope, exactFit }, scratch.points);

  const slopeInterval: [number, number] = [slope - slopeHalfWidth, slope + slopeHalfWidth];
  // Every figure that could come out NaN or ±Infinity, checked directly (null is undefined, not wrong).
  const finite = pointsFinite && allFinite([
    slope, intercept, r, rSquared, adjustedRSquared, sst, ssr, sse, s, slopeStdError, interceptStdError,
    slopeTStat, slopePValue, fStatistic, tCritical, slopeInterval[0], slopeInterval[1], xMean, yMean, xMin, xMax,
  ]);
  const fit: LineFitOk = {
    ok: true, n, degreesOfFreedom: df, confidence,
    slope, intercept, r, rSquared, adjustedRSquared, sst, ssr, sse, exactFit,
    residualStdError: s, slopeStdError, interceptStdError, slopeTStat, slopePValue, fStatistic, tCritical,
    slopeInterval, xMean, yMean, xMin, xMax, points: [],
  };
  if (x0 === undefined || !finite) return finite ? fit : 'non-finite';
  // Only the subject's fits come this way. Object.assign rather than `fit.prediction =`: a property
  // store this rare has no type feedback each time V8 optimises this function, and would undo it.
  const prediction = predictionAt(x0, x0 - sums.xFirst - sums.xCorrection, n, sxx, yMean, slope, s, tCritical, xMin, xMax);
  return prediction === null ? 'non-finite' : Object.assign(fit, { prediction });
}

/** The estimate at x0 (d0 = x0 − x̄), with its prediction and mean intervals; null if any is not finite. */
export function predictionAt(x0: number, d0: number, n: number, sxx: number, yMean: number, slope: number, s: number, tCritical: number, xMin: number, xMax: number): Prediction | null {
  const estimate = yMean + slope * d0;
  const meanHalf = tCritical * s * Math.sqrt(1 / n + (d0 * d0) / sxx);
  const newHalf = tCritical * s * Math.sqrt(1 + 1 / n + (d0 * d0) / sxx);
  const [lower, upper, meanLower, meanUpper] = [estimate - newHalf, estimate + newHalf, estimate - meanHalf, estimate + meanHalf];
  if (!allFinite([estimate, lower, upper, meanLower, meanUpper])) return null;
  return { x0, estimate, lower, upper, meanLower, meanUpper, extrapolated: x0 < xMin || x0 > xMax };
}

export function allFinite(values: ReadonlyArray<number | null>): boolean {
  for (const v of values) if (v !== null && !Number.isFinite(v)) return false;
  return true;
}
