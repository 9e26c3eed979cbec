// Line fits over a range of typed columns, with every point's figures written into columns of the
// same order. Each fit takes a lean path (two-pass centred sums, one pass for the residuals, one for
// the per-point figures) when its data are ordinary: at least 4 finite points within ±1e100, x with
// spread and no point alone at its x, a fit that is not exact, no point carrying almost all of the
// residual sum of squares. Anything else goes to fitColumns (fit-columns.ts), the fit checked against
// the published reference data, so every refusal and every edge case reads exactly as it does there.
// The two agree to rounding where both apply (tests/unit/market-columns.test.ts).
import type { FitSummary } from '../contracts/analysis';
import { allFinite, fitColumns, fitScratch, predictionAt, SAFE_LIMIT, tQuantile, twoSidedPValue } from './fit-columns';
import { summariseFit } from './fit-summary';
import { EXACT_FIT_TOLERANCE, HAS_EXTERNAL, HAS_INTERNAL, HIGH_LEVERAGE, INFLUENTIAL, OUTLIER, OUTLIER_T, pointColumns, soleDistinctX, UNUSUAL, UNUSUAL_T, type PointColumns } from './point-diagnostics';
import type { Prediction, RefusalReason } from './regression';

export type GroupFit =
  | { ok: true; summary: FitSummary; prediction: Prediction | null }
  | { ok: false; n: number; reason: RefusalReason; message: string };

/** Per-point figures of a set of fits, one slot per position; NaN where a figure is undefined. */
export interface FitColumnsOut extends PointColumns {
  residual: Float64Array;
}

export function fitColumnsOut(n: number): FitColumnsOut {
  return { ...pointColumns(n), residual: new Float64Array(n) };
}

/**
 * Fits y on x over positions [a, b). With `out`, writes every point's figures there at the same
 * positions. Takes the lean path where it can, else fitColumns.
 */
export function fitRange(xs: Float64Array, ys: Float64Array, a: number, b: number, out: FitColumnsOut | null, x0: number | undefined, confidence: number): GroupFit {
  const lean = leanFit(xs, ys, a, b, out, x0, confidence);
  return lean ?? referenceFit(xs, ys, a, b, out, x0, confidence);
}

/** fitColumns over the range, its per-point figures copied into `out`. */
function referenceFit(xs: Float64Array, ys: Float64Array, a: number, b: number, out: FitColumnsOut | null, x0: number | undefined, confidence: number): GroupFit {
  const n = b - a;
  const scratch = fitScratch(n);
  let bad = -1;
  for (let k = 0; k < n; k++) {
    const x = xs[a + k], y = ys[a + k];
    if (bad < 0 && !(Number.isFinite(x) && Number.isFinite(y))) bad = k;
    scratch.xs[k] = x;
    scratch.ys[k] = y;
  }
  const fit = fitColumns(n, bad, x0 !== undefined ? { x0, confidence } : { confidence });
  if (!fit.ok) return { ok: false, n: fit.n, reason: fit.reason, message: fit.message };
  if (out) {
    const c = scratch.points;
    for (let k = 0; k < n; k++) {
      const state = c.state[k];
      out.fitted[a + k] = c.fitted[k];
      out.residual[a + k] = scratch.residuals[k];
      out.leverage[a + k] = c.leverage[k];
      out.internal[a + k] = state & HAS_INTERNAL ? c.internal[k] : NaN;
      out.cooks[a + k] = state & HAS_INTERNAL ? c.cooks[k] : NaN;
      out.external[a + k] = state & HAS_EXTERNAL ? c.external[k] : NaN;
      out.state[a + k] = state;
    }
  }
  return { ok: true, summary: summariseFit(fit), prediction: fit.prediction ?? null };
}

interface LeanSums {
  xMean: number;
  yMean: number;
  sxx: number;
  syy: number;
  sxy: number;
  xMin: number;
  xMax: number;
}

/** Means, centred sums and the range of x over [a, b), or null when the data are not ordinary. */
export function leanSums(xs: Float64Array, ys: Float64Array, a: number, b: number): LeanSums | null {
  const n = b - a;
  if (n < 4) return null;
  let sx = 0, sy = 0;
  let xMin = xs[a], xMax = xs[a], yMin = ys[a], yMax = ys[a];
  for (let k = a; k < b; k++) {
    const x = xs[k], y = ys[k];
    sx += x;
    sy += y;
    if (x < xMin) xMin = x;
    else if (x > xMax) xMax = x;
    if (y < yMin) yMin = y;
    else if (y > yMax) yMax = y;
  }
  // NaN and ±Infinity make the sums non-finite; the limits keep squares in the normal double range.
  if (!(Number.isFinite(sx) && Number.isFinite(sy))) return null;
  if (Math.max(-xMin, xMax, -yMin, yMax) > SAFE_LIMIT || !(xMax > xMin)) return null;
  const xMean = sx / n, yMean = sy / n;
  let sxx = 0, syy = 0, sxy = 0;
  for (let k = a; k < b; k++) {
    const dx = xs[k] - xMean, dy = ys[k] - yMean;
    sxx += dx * dx;
    syy += dy * dy;
    sxy += dx * dy;
  }
  if (!(sxx > 0 && syy > 0) || xMax - xMin < 2 / SAFE_LIMIT || yMax - yMin < 2 / SAFE_LIMIT) return null;
  if (soleDistinctX(xs.subarray(a, b), n) >= 0) return null;
  return { xMean, yMean, sxx, syy, sxy, xMin, xMax };
}

/**
 * The lean fit, or null when the data are not ordinary (see the top of this file) and the range
 * must go to fitColumns (which then overwrites whatever figures it had written into `out`).
 */
function leanFit(xs: Float64Array, ys: Float64Array, a: number, b: number, out: FitColumnsOut | null, x0: number | undefined, confidence: number): GroupFit | null {
  const n = b - a;
  if (!(confidence > 0 && confidence < 1)) return null;
  if (x0 !== undefined && !(Math.abs(x0) <= SAFE_LIMIT)) return null;
  const sums = leanSums(xs, ys, a, b);
  if (sums === null) return null;
  const { xMean, yMean, sxx, syy, sxy, xMin, xMax } = sums;
  const slope = sxy / sxx;
  let sse = 0;
  if (out) {
    const residual = out.residual;
    for (let k = a; k < b; k++) {
      const e = ys[k] - yMean - slope * (xs[k] - xMean);
      residual[k] = e;
      sse += e * e;
    }
  } else {
    // Without per-point figures, SSE = Syy − Sxy²/Sxx saves a pass. It loses about
    // ε·Syy/SSE of relative accuracy, so where the line explains more than 99.99% of Syy the
    // residuals are summed instead.
    sse = syy - slope * sxy;
    if (!(sse > 1e-4 * syy)) {
      sse = 0;
      for (let k = a; k < b; k++) {
        const e = ys[k] - yMean - slope * (xs[k] - xMean);
        sse += e * e;
      }
    }
  }
  if (sse <= EXACT_FIT_TOLERANCE * EXACT_FIT_TOLERANCE * syy) return null;
  const df = n - 2;
  const mse = sse / df;
  const s = Math.sqrt(mse);
  if (out && !diagnoseRange(xs, ys, a, b, out, xMean, yMean, slope, sxx, syy, s)) return null;
  const sst = syy;
  const ssr = Math.min(sst, (sxy * sxy) / sxx);
  const r = Math.min(1, Math.max(-1, sxy / (Math.sqrt(sxx) * Math.sqrt(syy))));
  const slopeStdError = s / Math.sqrt(sxx);
  const interceptStdError = s * Math.sqrt(1 / n + (xMean * xMean) / sxx);
  const slopeTStat = slope / slopeStdError;
  const tCritical = tQuantile(confidence, df);
  const half = tCritical * slopeStdError;
  const summary: FitSummary = {
    n, slope, intercept: yMean - slope * xMean, r, rSquared: Math.min(1, ssr / sst), adjustedRSquared: 1 - mse / (sst / (n - 1)),
    sst, ssr, sse, residualStdError: s, slopeStdError, interceptStdError, slopeTStat, slopePValue: twoSidedPValue(slopeTStat, df),
    slopeInterval: [slope - half, slope + half], tCritical, xMean, yMean, xMin, xMax,
  };
  const { slopeInterval } = summary;
  if (!allFinite([summary.intercept, r, summary.rSquared, summary.adjustedRSquared, ssr, sse, s, slopeStdError, interceptStdError, slopeTStat, summary.slopePValue, slopeInterval[0], slopeInterval[1], xMean, yMean])) return null;
  if (x0 === undefined) return { ok: true, summary, prediction: null };
  const prediction = predictionAt(x0, x0 - xMean, n, sxx, yMean, slope, s, tCritical, xMin, xMax);
  return prediction === null ? null : { ok: true, summary, prediction };
}

/**
 * Every point's leverage, studentized residuals, Cook's distance and flags, with the formulas and
 * cut-offs of point-diagnostics.ts. False when a point needs what only the reference path does
 * (a deleted fit that must be refitted, or one that is exact) or a figure is not finite.
 */
function diagnoseRange(xs: Float64Array, ys: Float64Array, a: number, b: number, out: FitColumnsOut, xMean: number, yMean: number, slope: number, sxx: number, syy: number, s: number): boolean {
  const n = b - a;
  const df = n - 2;
  const cutOff = 4 / n;
  const s2 = s * s;
  const exactOthers = EXACT_FIT_TOLERANCE * EXACT_FIT_TOLERANCE * syy;
  // Reciprocals once per fit, so that each point costs two square roots and two divisions:
  // r = e/(s·√(1 − h)), D = r²/2 · h/(1 − h), and t = r·√((df − 1)/(df − r²)), which is
  // e/(√(SSE₍ᵢ₎/(df − 1))·√(1 − h)) with SSE₍ᵢ₎ = s²·(df − r²).
  const invN = 1 / n, keep = (n - 1) / n, invSxx = 1 / sxx, invS = 1 / s, dfLess1 = df - 1, minDenominator = 1e-3 * df, minSse = exactOthers / s2;
  const { residual, fitted, leverage: leverages, internal: internals, external: externals, cooks: cookss, state: states } = out;
  let check = 0;
  for (let k = a; k < b; k++) {
    const dx = xs[k] - xMean;
    const e = residual[k];
    const spread = dx * dx * invSxx;
    const leverage = Math.min(1, invN + spread);
    const oneMinusLeverage = Math.max(0, keep - spread);
    const invRoot = 1 / Math.sqrt(oneMinusLeverage);
    const internal = e * invS * invRoot;
    const internal2 = internal * internal;
    const cooks = 0.5 * internal2 * leverage * invRoot * invRoot;
    const denominator = df - internal2;
    // Where the update formula cancels badly, or the others lie exactly on a line: reference path.
    if (!(denominator > minDenominator) || !(denominator > minSse)) return false;
    const external = internal * Math.sqrt(dfLess1 / denominator);
    const size = Math.abs(external);
    fitted[k] = yMean + slope * dx;
    leverages[k] = leverage;
    internals[k] = internal;
    cookss[k] = cooks;
    externals[k] = external;
    states[k] = HAS_INTERNAL | HAS_EXTERNAL | (size > UNUSUAL_T ? UNUSUAL : 0) | (size > OUTLIER_T ? OUTLIER : 0) | (cooks > cutOff ? INFLUENTIAL : 0) | (leverage > cutOff ? HIGH_LEVERAGE : 0);
    check += leverage + external + cooks;
  }
  // A NaN or an infinity anywhere makes the sum non-finite (a finite overflow of the sum alone would
  // send the range to the reference path, which is merely slower).
  return Number.isFinite(check);
}
