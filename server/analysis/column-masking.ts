// The masked-outlier pass of masked-outliers.ts on the columns of one neighbourhood, with the lean
// fit of lean-fit.ts; a round the lean path cannot take sends the neighbourhood to the reference pass.
import { EXACT_FIT_TOLERANCE, flagsOf, HAS_EXTERNAL, HAS_INTERNAL, HIGH_LEVERAGE, INFLUENTIAL, OUTLIER, OUTLIER_T, UNUSUAL } from './point-diagnostics';
import { leanSums, type FitColumnsOut } from './lean-fit';
import { revealMaskedOutliers, type RevealedOutlier } from './masked-outliers';
import type { FitPoint } from './regression';

const MAX_MASKING_ROUNDS = 6;

let maskScratch = { xs: new Float64Array(256), ys: new Float64Array(256), kept: new Int32Array(256) };

/**
 * The masked-outlier pass of masked-outliers.ts over one neighbourhood's range, on the lean fit:
 * set aside the most extreme outlier, refit, repeat while one remains. A refit the lean path cannot
 * take sends the whole neighbourhood to revealMaskedOutliers itself.
 */
export function maskedOutliers(xs: Float64Array, ys: Float64Array, a: number, b: number, full: FitColumnsOut): RevealedOutlier[] {
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
