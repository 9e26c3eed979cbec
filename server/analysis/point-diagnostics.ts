// Per-point regression diagnostics for a fitted line: leverage, internally and externally
// studentized residuals, Cook's distance, and the flags an appraiser sees. Undefined values are
// null, never NaN. Thresholds: |externally studentized| > 2 "unusual", > 3 "outlier",
// Cook's D > 4/n "influential", leverage > 4/n "high-leverage" (common practice cut-offs, no
// single source).
//
// The figures are computed into columns (typed arrays, one slot per point) and turned into objects
// only by the caller that needs objects: a fit of 50,000 sales otherwise spends most of its time
// allocating and collecting them.
import { lineSse } from './centred-sums';
import type { FitPoint, PointFlag } from './regression';

/**
 * A fit whose root-mean-square residual is below this fraction of the root-mean-square spread of
 * y is exact to working precision: what is left is rounding noise, and studentizing it would flag
 * points at random. Such a fit is reported as exact (residuals 0, s = 0).
 */
export const EXACT_FIT_TOLERANCE = 1e-12;
export const UNUSUAL_T = 2;
export const OUTLIER_T = 3;
const PARAMETERS = 2;

export interface DiagnosticsInput {
  xs: ArrayLike<number>;
  ys: ArrayLike<number>;
  /** Centred x and y (see centred-sums.ts). */
  dx: ArrayLike<number>;
  dy: ArrayLike<number>;
  residuals: ArrayLike<number>;
  sxx: number;
  sst: number;
  /** Residual standard error of the whole fit. */
  s: number;
  yMean: number;
  slope: number;
  exactFit: boolean;
  /** How many points (the columns may be longer); default xs.length. */
  n?: number;
  /** soleDistinctX(xs), when the caller has it already. */
  pivot?: number;
}

/** Bits of PointColumns.state. */
export const UNUSUAL = 1;
export const OUTLIER = 2;
export const INFLUENTIAL = 4;
export const HIGH_LEVERAGE = 8;
/** The internally studentized residual and Cook's distance are defined (not null). */
export const HAS_INTERNAL = 16;
/** The externally studentized residual is defined (not null). */
export const HAS_EXTERNAL = 32;

/** One slot per point; internal, external and cooks hold a number only where state says so. */
export interface PointColumns {
  fitted: Float64Array;
  leverage: Float64Array;
  internal: Float64Array;
  external: Float64Array;
  cooks: Float64Array;
  state: Uint8Array;
}

export function pointColumns(capacity: number): PointColumns {
  return {
    fitted: new Float64Array(capacity),
    leverage: new Float64Array(capacity),
    internal: new Float64Array(capacity),
    external: new Float64Array(capacity),
    cooks: new Float64Array(capacity),
    state: new Uint8Array(capacity),
  };
}

/** The flags in a state, in their fixed order; a new array each time (callers may keep it). */
export function flagsOf(state: number): PointFlag[] {
  if ((state & 15) === 0) return [];
  const flags: PointFlag[] = [];
  if (state & UNUSUAL) flags.push('unusual');
  if (state & OUTLIER) flags.push('outlier');
  if (state & INFLUENTIAL) flags.push('influential');
  if (state & HIGH_LEVERAGE) flags.push('high-leverage');
  return flags;
}

/** Index of the one point whose x differs from all the others (it has leverage exactly 1), or −1. */
export function soleDistinctX(xs: ArrayLike<number>, n = xs.length): number {
  if (n === 0) return -1;
  const a = xs[0];
  // Equality as a Map key sees it (SameValueZero): NaN equals NaN, and 0 equals −0.
  const isA = (v: number) => v === a || (v !== v && a !== a);
  let j = 1;
  while (j < n && isA(xs[j])) j++;
  if (j === n) return -1; // one value only
  const b = xs[j];
  let countA = j;
  let countB = 1;
  for (let k = j + 1; k < n; k++) {
    const v = xs[k];
    if (isA(v)) countA++;
    else if (v === b || (v !== v && b !== b)) countB++;
    else return -1; // a third value
    if (countA > 1 && countB > 1) return -1;
  }
  return countA === 1 ? 0 : countB === 1 ? j : -1;
}

/**
 * Residual SS without point i. The update formula s²·(df − r²) cancels badly when the point
 * carries almost all of the SSE, so there the line is refitted without it.
 */
function deletedSse(input: DiagnosticsInput, n: number, i: number, internal: number): number {
  const df = n - PARAMETERS;
  const denominator = df - internal * internal;
  if (denominator > 1e-3 * df) return input.s * input.s * denominator;
  const dx = new Float64Array(n - 1);
  const dy = new Float64Array(n - 1);
  for (let j = 0, k = 0; j < n; j++) {
    if (j === i) continue;
    dx[k] = input.dx[j];
    dy[k++] = input.dy[j];
  }
  return lineSse(dx, dy);
}

/**
 * Fills out[0..n) with every point's diagnostics. Returns false when any figure (fitted value,
 * residual, leverage, or a defined studentized residual or Cook's distance) is NaN or ±Infinity.
 */
export function diagnoseColumns(input: DiagnosticsInput, out: PointColumns): boolean {
  const { sxx, s, xs, ys, dx: dxs, residuals, exactFit, yMean, slope } = input;
  const n = input.n ?? xs.length;
  const pivot = input.pivot ?? soleDistinctX(xs, n);
  const df = n - PARAMETERS;
  const cutOff = 4 / n;
  const exactOthers = EXACT_FIT_TOLERANCE ** 2 * input.sst;
  let finite = true;
  for (let i = 0; i < n; i++) {
    const isPivot = i === pivot;
    const dx = dxs[i];
    const residual = residuals[i];
    const spread = (dx * dx) / sxx;
    // A point alone at its x has leverage exactly 1: the line must pass through it.
    const leverage = isPivot ? 1 : Math.min(1, 1 / n + spread);
    const oneMinusLeverage = isPivot ? 0 : Math.max(0, (n - 1) / n - spread);
    const fitted = isPivot || exactFit ? ys[i] : yMean + slope * dx;
    let state = 0;
    let size = 0;
    if (s > 0 && oneMinusLeverage > 0) {
      const internal = residual / (s * Math.sqrt(oneMinusLeverage));
      const cooks = ((internal * internal) / PARAMETERS) * (leverage / oneMinusLeverage);
      out.internal[i] = internal;
      out.cooks[i] = cooks;
      state = HAS_INTERNAL;
      finite = finite && Number.isFinite(internal) && Number.isFinite(cooks);
      if (cooks > cutOff) state |= INFLUENTIAL;
      if (df - 1 > 0) {
        const sseWithout = deletedSse(input, n, i, internal);
        // The others lie exactly on a line (to working precision) and this point does not: its
        // deleted residual is infinite. Reported as null, but the point is certainly an outlier.
        if (sseWithout <= exactOthers) size = Infinity;
        else {
          const external = residual / (Math.sqrt(sseWithout / (df - 1)) * Math.sqrt(oneMinusLeverage));
          out.external[i] = external;
          state |= HAS_EXTERNAL;
          finite = finite && Number.isFinite(external);
          size = Math.abs(external);
        }
      }
    }
    if (size > UNUSUAL_T) state |= UNUSUAL;
    if (size > OUTLIER_T) state |= OUTLIER;
    if (leverage > cutOff) state |= HIGH_LEVERAGE;
    out.fitted[i] = fitted;
    out.leverage[i] = leverage;
    out.state[i] = state;
    finite = finite && Number.isFinite(fitted) && Number.isFinite(residual) && Number.isFinite(leverage);
  }
  return finite;
}

/** Point i of filled columns as the object fitLine reports. */
export function pointAt(xs: ArrayLike<number>, ys: ArrayLike<number>, residuals: ArrayLike<number>, c: PointColumns, i: number): FitPoint {
  const state = c.state[i];
  const hasInternal = (state & HAS_INTERNAL) !== 0;
  return {
    x: xs[i], y: ys[i], fitted: c.fitted[i], residual: residuals[i], leverage: c.leverage[i],
    internallyStudentized: hasInternal ? c.internal[i] : null,
    externallyStudentized: state & HAS_EXTERNAL ? c.external[i] : null,
    cooksDistance: hasInternal ? c.cooks[i] : null,
    flags: flagsOf(state),
  };
}

export function diagnosePoints(input: DiagnosticsInput): FitPoint[] {
  const n = input.n ?? input.xs.length;
  const columns = pointColumns(n);
  diagnoseColumns(input, columns);
  const points = new Array<FitPoint>(n);
  for (let i = 0; i < n; i++) points[i] = pointAt(input.xs, input.ys, input.residuals, columns, i);
  return points;
}
