// Per-point regression diagnostics for a fitted line: leverage, internally and externally
// studentized residuals, Cook's distance, and the flags an appraiser sees. Undefined values are
// null, never NaN. Thresholds: |externally studentized| > 2 "unusual", > 3 "outlier",
// Cook's D > 4/n "influential", leverage > 4/n "high-leverage" (common practice cut-offs, no
// single source).
import { lineSse } from './centred-sums';
import type { FitPoint, PointFlag } from './regression';

/**
 * A fit whose root-mean-square residual is below this fraction of the root-mean-square spread of
 * y is exact to working precision: what is left is rounding noise, and studentizing it would flag
 * points at random. Such a fit is reported as exact (residuals 0, s = 0).
 */
export const EXACT_FIT_TOLERANCE = 1e-12;
const UNUSUAL_T = 2;
const OUTLIER_T = 3;
const PARAMETERS = 2;

export interface DiagnosticsInput {
  xs: readonly number[];
  ys: readonly number[];
  /** Centred x and y (see centred-sums.ts). */
  dx: readonly number[];
  dy: readonly number[];
  residuals: readonly number[];
  sxx: number;
  sst: number;
  /** Residual standard error of the whole fit. */
  s: number;
  yMean: number;
  slope: number;
  exactFit: boolean;
}

/** Index of the one point whose x differs from all the others (it has leverage exactly 1), or −1. */
export function soleDistinctX(xs: readonly number[]): number {
  const counts = new Map<number, number>();
  for (const x of xs) counts.set(x, (counts.get(x) ?? 0) + 1);
  if (counts.size !== 2) return -1;
  return xs.findIndex((x) => counts.get(x) === 1);
}

export function diagnosePoints(input: DiagnosticsInput): FitPoint[] {
  const pivot = soleDistinctX(input.xs);
  return input.xs.map((_, i) => diagnosePoint(input, i, i === pivot));
}

/**
 * Residual SS without point i. The update formula s²·(df − r²) cancels badly when the point
 * carries almost all of the SSE, so there the line is refitted without it.
 */
function deletedSse(input: DiagnosticsInput, i: number, internal: number): number {
  const df = input.xs.length - PARAMETERS;
  const denominator = df - internal * internal;
  if (denominator > 1e-3 * df) return input.s * input.s * denominator;
  const others = (values: readonly number[]) => values.filter((_, j) => j !== i);
  return lineSse(others(input.dx), others(input.dy));
}

function diagnosePoint(input: DiagnosticsInput, i: number, isPivot: boolean): FitPoint {
  const { sxx, s } = input;
  const n = input.xs.length;
  const df = n - PARAMETERS;
  const x = input.xs[i];
  const y = input.ys[i];
  const dx = input.dx[i];
  const residual = input.residuals[i];
  const spread = (dx * dx) / sxx;
  // A point alone at its x has leverage exactly 1: the line must pass through it.
  const leverage = isPivot ? 1 : Math.min(1, 1 / n + spread);
  const oneMinusLeverage = isPivot ? 0 : Math.max(0, (n - 1) / n - spread);
  const fitted = isPivot || input.exactFit ? y : input.yMean + input.slope * dx;

  let internal: number | null = null;
  let external: number | null = null;
  let cooks: number | null = null;
  let othersExact = false;
  if (s > 0 && oneMinusLeverage > 0) {
    internal = residual / (s * Math.sqrt(oneMinusLeverage));
    cooks = ((internal * internal) / PARAMETERS) * (leverage / oneMinusLeverage);
    if (df - 1 > 0) {
      const sseWithout = deletedSse(input, i, internal);
      // The others lie exactly on a line (to working precision) and this point does not: its
      // deleted residual is infinite. Reported as null, but the point is certainly an outlier.
      othersExact = sseWithout <= EXACT_FIT_TOLERANCE ** 2 * input.sst;
      if (!othersExact) external = residual / (Math.sqrt(sseWithout / (df - 1)) * Math.sqrt(oneMinusLeverage));
    }
  }

  const flags: PointFlag[] = [];
  const size = external === null ? (othersExact ? Infinity : 0) : Math.abs(external);
  if (size > UNUSUAL_T) flags.push('unusual');
  if (size > OUTLIER_T) flags.push('outlier');
  if (cooks !== null && cooks > 4 / n) flags.push('influential');
  if (leverage > 4 / n) flags.push('high-leverage');

  return {
    x, y, fitted, residual, leverage,
    internallyStudentized: internal, externallyStudentized: external, cooksDistance: cooks, flags,
  };
}
