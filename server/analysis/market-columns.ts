// The market analysis as numbers only, on columns: every sale's figures sit in typed arrays, sorted
// so that each neighbourhood's sales are one contiguous run, and every fit writes its per-point
// figures into columns of the same order. No objects per sale, no words: the answer (with the
// flag words, gates and warnings) is put together from these columns by analysis-wire.ts.
//
// Each fit takes a lean path (two-pass centred sums, one pass for the residuals, one for the
// diagnostics) when its data are ordinary: at least 4 finite points within ±1e100, x with spread
// and no point alone at its x, a fit that is not exact, no point carrying almost all of the
// residual sum of squares. Anything else goes to fitColumns (fit-columns.ts), the fit checked
// against the published reference data, so every refusal and every edge case reads exactly as
// before. The two agree to rounding where both apply (tests/unit/market-columns.test.ts).
import type { FitSummary } from '../contracts/analysis';
import type { AnalysisInput, AnalysisSale } from './market-analysis';
import { allFinite, fitColumns, fitScratch, predictionAt, SAFE_LIMIT, tQuantile, twoSidedPValue } from './fit-columns';
import { summariseFit } from './fit-summary';
import { revealMaskedOutliers, type RevealedOutlier } from './masked-outliers';
import { EXACT_FIT_TOLERANCE, flagsOf, HAS_EXTERNAL, HAS_INTERNAL, HIGH_LEVERAGE, INFLUENTIAL, OUTLIER, pointColumns, soleDistinctX, UNUSUAL, type PointColumns } from './point-diagnostics';
import type { FitPoint, Prediction, RefusalReason } from './regression';
import { monthsBetween, utcDayMs } from './time-trend';

const UNUSUAL_T = 2;
const OUTLIER_T = 3;
const MAX_MASKING_ROUNDS = 6;

/** The usable sales as columns, neighbourhood by neighbourhood (a "position" indexes them). */
export interface SaleColumns {
  usable: readonly AnalysisSale[];
  excluded: readonly AnalysisSale[];
  /** Neighbourhood names in display order: the subject's first, then by name. */
  names: string[];
  /** Group g holds positions start[g] to start[g + 1] − 1. */
  start: Int32Array;
  /** The index into `usable` of the sale at each position. */
  order: Int32Array;
  saleId: Float64Array;
  floorArea: Float64Array;
  salePrice: Float64Array;
  monthsBefore: Float64Array;
  pricePerArea: Float64Array;
  /** The index of the subject's neighbourhood in `names`, or −1. */
  subjectGroup: number;
}

export const NO_NEIGHBOURHOOD = 'No neighbourhood';

/** The order of String.prototype.localeCompare without arguments, from one collator made once. */
const compareNames = new Intl.Collator().compare;

/**
 * Reads the sales once: sets the excluded ones aside, numbers the neighbourhoods, and writes each
 * usable sale's figures into the columns at its position (a counting sort by neighbourhood, stable,
 * so that sales keep their order within a neighbourhood).
 */
export function readSales(input: Pick<AnalysisInput, 'sales' | 'effectiveDate' | 'subject'>): SaleColumns {
  const all = input.sales;
  const usable: AnalysisSale[] = [];
  const excluded: AnalysisSale[] = [];
  const codeOf = new Map<string, number>();
  const firstNames: string[] = [];
  const codes: number[] = [];
  for (let i = 0; i < all.length; i++) {
    const s = all[i];
    if (s.excluded) {
      excluded.push(s);
      continue;
    }
    const name = s.neighbourhood ?? NO_NEIGHBOURHOOD;
    let code = codeOf.get(name);
    if (code === undefined) {
      codeOf.set(name, (code = firstNames.length));
      firstNames.push(name);
    }
    usable.push(s);
    codes.push(code);
  }
  const subjectName = input.subject.neighbourhood;
  const names = [...firstNames].sort((a, b) => (a === subjectName ? -1 : b === subjectName ? 1 : compareNames(a, b)));
  const rankOf = new Int32Array(names.length);
  names.forEach((name, rank) => (rankOf[codeOf.get(name)!] = rank));
  const G = names.length;
  const n = usable.length;
  const start = new Int32Array(G + 1);
  for (let i = 0; i < n; i++) start[rankOf[codes[i]] + 1]++;
  for (let g = 0; g < G; g++) start[g + 1] += start[g];
  const next = start.slice(0, G);
  const order = new Int32Array(n);
  const saleId = new Float64Array(n);
  const floorArea = new Float64Array(n);
  const salePrice = new Float64Array(n);
  const monthsBefore = new Float64Array(n);
  const pricePerArea = new Float64Array(n);
  const effectiveMs = utcDayMs(input.effectiveDate);
  for (let i = 0; i < n; i++) {
    const s = usable[i];
    const k = next[rankOf[codes[i]]]++;
    order[k] = i;
    saleId[k] = s.id;
    floorArea[k] = s.floorArea;
    salePrice[k] = s.salePrice;
    monthsBefore[k] = monthsBetween(utcDayMs(s.saleDate), effectiveMs);
    pricePerArea[k] = s.salePrice / s.floorArea;
  }
  const subjectGroup = subjectName === null ? -1 : names.indexOf(subjectName);
  return { usable, excluded, names, start, order, saleId, floorArea, salePrice, monthsBefore, pricePerArea, subjectGroup };
}

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

export interface MarketColumns {
  sales: SaleColumns;
  /** The prices the floor-area fits use, by position (time-adjusted or as sold). */
  prices: Float64Array;
  /** Trend fits by group, the pooled one last (index names.length). */
  trends: GroupFit[];
  /** Monthly rate by group, pooled last; NaN where there is none. */
  monthlyRates: Float64Array;
  /** Floor-area fits by group, the pooled one last. */
  fits: GroupFit[];
  /** Per-point figures of each neighbourhood's fit, by position. */
  points: FitColumnsOut;
  /** Per-point figures of the pooled fit, by position. */
  pooledPoints: FitColumnsOut;
  /** Sales the masked-outlier pass revealed, by group; `index` and `setAside` are offsets within the group. */
  revealed: RevealedOutlier[][];
}

export interface ColumnOptions {
  timeAdjustment: boolean;
  /** The subject's floor area: the subject's neighbourhood and the pooled fit predict there. */
  x0: number | null;
  confidence?: number;
}

/** The whole analysis of the columns: trends, prices, floor-area fits with diagnostics, masking. */
export function analyseColumns(sales: SaleColumns, options: ColumnOptions): MarketColumns {
  const confidence = options.confidence ?? 0.95;
  const { start, monthsBefore, pricePerArea, salePrice, floorArea } = sales;
  const G = sales.names.length;
  const n = start[G];
  const trends = new Array<GroupFit>(G + 1);
  const monthlyRates = new Float64Array(G + 1);
  for (let g = 0; g <= G; g++) {
    const [a, b] = g < G ? [start[g], start[g + 1]] : [0, n];
    const fit = fitRange(monthsBefore, pricePerArea, a, b, null, undefined, confidence);
    trends[g] = fit;
    // The slope is per month *before* the effective date, so a rising market has a negative slope.
    monthlyRates[g] = fit.ok && fit.summary.yMean > 0 ? -fit.summary.slope / fit.summary.yMean : NaN;
  }
  let prices = salePrice;
  if (options.timeAdjustment) {
    prices = new Float64Array(n);
    const pooledRate = monthlyRates[G];
    for (let g = 0; g < G; g++) {
      const rate = Number.isNaN(monthlyRates[g]) ? pooledRate : monthlyRates[g];
      const end = start[g + 1];
      if (Number.isNaN(rate)) for (let k = start[g]; k < end; k++) prices[k] = salePrice[k];
      else for (let k = start[g]; k < end; k++) prices[k] = salePrice[k] * (1 + rate * monthsBefore[k]);
    }
  }
  const points = fitColumnsOut(n);
  const pooledPoints = fitColumnsOut(n);
  const fits = new Array<GroupFit>(G + 1);
  const revealed = new Array<RevealedOutlier[]>(G + 1);
  const x0 = options.x0 ?? undefined;
  for (let g = 0; g < G; g++) {
    const a = start[g], b = start[g + 1];
    fits[g] = fitRange(floorArea, prices, a, b, points, g === sales.subjectGroup ? x0 : undefined, confidence);
    revealed[g] = fits[g].ok ? maskedOutliers(floorArea, prices, a, b, points, confidence) : [];
  }
  fits[G] = fitRange(floorArea, prices, 0, n, pooledPoints, x0, confidence);
  revealed[G] = [];
  return { sales, prices, trends, monthlyRates, fits, points, pooledPoints, revealed };
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
function leanSums(xs: Float64Array, ys: Float64Array, a: number, b: number): LeanSums | null {
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

let maskScratch = { xs: new Float64Array(256), ys: new Float64Array(256), kept: new Int32Array(256) };

/**
 * The masked-outlier pass of masked-outliers.ts over one neighbourhood's range, on the lean fit:
 * set aside the most extreme outlier, refit, repeat while one remains. A refit the lean path cannot
 * take sends the whole neighbourhood to revealMaskedOutliers itself.
 */
function maskedOutliers(xs: Float64Array, ys: Float64Array, a: number, b: number, full: FitColumnsOut, confidence: number): RevealedOutlier[] {
  const n = b - a;
  let worst = -1, worstT = 0;
  for (let k = a; k < b; k++) {
    // As revealMaskedOutliers reads the full fit: an undefined studentized residual counts as 0.
    const t = Math.abs(full.external[k]);
    if (!(t > OUTLIER_T)) continue;
    if (worst < 0 || t > worstT) {
      worst = k - a;
      worstT = t;
    }
  }
  if (worst < 0) return [];
  if (maskScratch.xs.length < n) {
    const size = Math.max(n, 2 * maskScratch.xs.length);
    maskScratch = { xs: new Float64Array(size), ys: new Float64Array(size), kept: new Int32Array(size) };
  }
  const { xs: kx, ys: ky, kept } = maskScratch;
  const setAside = [worst];
  const isSetAside = new Uint8Array(n);
  isSetAside[worst] = 1;
  const revealed: RevealedOutlier[] = [];
  for (let round = 1; round < MAX_MASKING_ROUNDS; round++) {
    let m = 0;
    for (let k = 0; k < n; k++) {
      if (isSetAside[k]) continue;
      kx[m] = xs[a + k];
      ky[m] = ys[a + k];
      kept[m++] = k;
    }
    const worstPoint = leanWorstPoint(kx, ky, m);
    if (worstPoint === null) return referenceMasking(xs, ys, a, b, full);
    if (worstPoint === undefined) break;
    const index = kept[worstPoint.at];
    if (!(full.state[a + index] & OUTLIER)) revealed.push({ index, point: worstPoint.point, setAside: [...setAside] });
    setAside.push(index);
    isSetAside[index] = 1;
  }
  return revealed;
}

function referenceMasking(xs: Float64Array, ys: Float64Array, a: number, b: number, full: FitColumnsOut): RevealedOutlier[] {
  const points = [];
  const firstPass: number[] = [];
  const fullFit = [];
  for (let k = a; k < b; k++) {
    points.push({ x: xs[k], y: ys[k] });
    if (full.state[k] & OUTLIER) firstPass.push(k - a);
    fullFit.push({ externallyStudentized: full.state[k] & HAS_EXTERNAL ? full.external[k] : null });
  }
  return revealMaskedOutliers(points, firstPass, fullFit);
}

/**
 * The refit of a masking round over the first m points, reduced to what the round needs: the point
 * with the largest externally studentized residual, when that exceeds 3, with all its figures.
 * |t| = |r|·√((df − 1)/(df − r²)) grows with r² = e²/(s²·(1 − h)), so the largest e²/(1 − h)
 * marks it, and only that point's figures are worked out. undefined: no outlier is left; null: the
 * data are not ordinary (see leanFit), and the reference pass must decide.
 */
function leanWorstPoint(xs: Float64Array, ys: Float64Array, m: number): { at: number; point: FitPoint } | null | undefined {
  const sums = leanSums(xs, ys, 0, m);
  if (sums === null) return null;
  const { xMean, yMean, sxx, syy, sxy } = sums;
  const slope = sxy / sxx;
  const invSxx = 1 / sxx, keep = (m - 1) / m;
  let sse = 0, at = -1, largest = -1;
  for (let j = 0; j < m; j++) {
    const dx = xs[j] - xMean;
    const e = ys[j] - yMean - slope * dx;
    sse += e * e;
    const ratio = (e * e) / Math.max(0, keep - dx * dx * invSxx);
    if (ratio > largest || ratio !== ratio) {
      if (ratio !== ratio) return null;
      largest = ratio;
      at = j;
    }
  }
  if (!(sse > EXACT_FIT_TOLERANCE * EXACT_FIT_TOLERANCE * syy) || !Number.isFinite(largest)) return null;
  const df = m - 2;
  const s2 = sse / df;
  const s = Math.sqrt(s2);
  const dx = xs[at] - xMean;
  const e = ys[at] - yMean - slope * dx;
  const spread = dx * dx * invSxx;
  const leverage = Math.min(1, 1 / m + spread);
  const oneMinusLeverage = Math.max(0, keep - spread);
  const internal = e / (s * Math.sqrt(oneMinusLeverage));
  const denominator = df - internal * internal;
  // The point with the smallest denominator decides for all: the reference pass where it cancels.
  if (!(denominator > 1e-3 * df) || !(s2 * denominator > EXACT_FIT_TOLERANCE * EXACT_FIT_TOLERANCE * syy)) return null;
  const external = internal * Math.sqrt((df - 1) / denominator);
  const size = Math.abs(external);
  if (!(size > OUTLIER_T)) return undefined;
  const cooks = ((internal * internal) / 2) * (leverage / oneMinusLeverage);
  const cutOff = 4 / m;
  const state = HAS_INTERNAL | HAS_EXTERNAL | UNUSUAL | OUTLIER | (cooks > cutOff ? INFLUENTIAL : 0) | (leverage > cutOff ? HIGH_LEVERAGE : 0);
  return {
    at,
    point: { x: xs[at], y: ys[at], fitted: yMean + slope * dx, residual: e, leverage, internallyStudentized: internal, externallyStudentized: external, cooksDistance: cooks, flags: flagsOf(state) },
  };
}
