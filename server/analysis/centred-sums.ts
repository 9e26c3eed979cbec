// Centred sums for least squares, accurate when the data sit far from zero (dates as epoch
// milliseconds, prices in the millions). Two passes: the mean first, then sums of deviations, with
// compensated (Kahan–Babuška–Neumaier) summation and the corrected two-pass term.
//
// The summation is written out here, in loops over the arrays, rather than taken from a library on
// arrays built for it: the analysis of 50,000 sales calls it hundreds of times, and the temporary
// arrays cost more than the arithmetic. Each sum adds the terms in the same order, with the same
// correction, as simple-statistics' `sum` (which the reference tests were first checked with), so
// every result is the same double.

export interface Centred {
  /** The mean, rounded to one double (for display and the intercept). */
  mean: number;
  /** v − mean for each value, computed against the unrounded mean. */
  deviations: number[];
  /** v − mean for any other value (the subject, say), computed the same way. */
  deviation: (v: number) => number;
}

/**
 * Σ values[0..n) with Neumaier's correction: the running sum, plus the rounding error of each
 * addition kept apart and added back at the end. 0 for no values.
 */
export function compensatedSum(values: ArrayLike<number>, n = values.length): number {
  if (n === 0) return 0;
  let total = values[0];
  let correction = 0;
  for (let i = 1; i < n; i++) {
    const v = values[i];
    const next = total + v;
    correction += Math.abs(total) >= Math.abs(v) ? total - next + v : v - next + total;
    total = next;
  }
  return total + correction;
}

/** Σ a[i]·b[i] over i < n, compensated as compensatedSum. */
export function compensatedDot(a: ArrayLike<number>, b: ArrayLike<number>, n = a.length): number {
  if (n === 0) return 0;
  let total = a[0] * b[0];
  let correction = 0;
  for (let i = 1; i < n; i++) {
    const v = a[i] * b[i];
    const next = total + v;
    correction += Math.abs(total) >= Math.abs(v) ? total - next + v : v - next + total;
    total = next;
  }
  return total + correction;
}

/**
 * Writes values[i] − mean into out[0..n) and returns the mean as two doubles: `first` (the
 * compensated mean) and `correction` (the mean of the deviations from it), so that out[i] is
 * (v − first) − correction. Near 1.7e12 a mean rounded to one double is off by up to 1e-4, an
 * error every deviation would otherwise share.
 */
export function centreInto(values: ArrayLike<number>, n: number, out: Float64Array): { first: number; correction: number } {
  const first = compensatedSum(values, n) / n;
  for (let i = 0; i < n; i++) out[i] = values[i] - first;
  const correction = compensatedSum(out, n) / n;
  for (let i = 0; i < n; i++) out[i] -= correction;
  return { first, correction };
}

/**
 * The mean is carried as two doubles: a first estimate, plus the mean of the deviations from it.
 * Each deviation subtracts both in turn.
 */
export function centre(values: readonly number[]): Centred {
  const n = values.length;
  if (n === 0) throw new Error('mean requires at least one data point');
  const scratch = new Float64Array(n);
  const { first, correction } = centreInto(values, n, scratch);
  const deviations = new Array<number>(n);
  for (let i = 0; i < n; i++) deviations[i] = scratch[i];
  return {
    mean: first + correction,
    deviations,
    deviation: (v: number) => v - first - correction,
  };
}

/** Σ a·b over deviations, less the corrected two-pass term Σa·Σb/n (zero in exact arithmetic). */
export function centredProduct(a: ArrayLike<number>, b: ArrayLike<number>): number {
  return compensatedDot(a, b) - (compensatedSum(a) * compensatedSum(b)) / a.length;
}

/** Residual sum of squares of the least-squares line through the points; 0 when x has no spread. */
export function lineSse(dx: ArrayLike<number>, dy: ArrayLike<number>): number {
  const n = dx.length;
  if (n === 0) throw new Error('mean requires at least one data point');
  const cx = new Float64Array(n);
  const cy = new Float64Array(n);
  centreInto(dx, n, cx);
  centreInto(dy, n, cy);
  const sxx = centredProduct(cx, cx);
  if (!(sxx > 0)) return 0;
  const slope = centredProduct(cx, cy) / sxx;
  for (let i = 0; i < n; i++) {
    cx[i] = (cy[i] - slope * cx[i]) ** 2;
  }
  return compensatedSum(cx, n);
}

/** Everything a line fit needs from its x and y columns, gathered in three passes. */
export interface CentredSums {
  /** The means as two doubles each (see centreInto). */
  xFirst: number;
  xCorrection: number;
  yFirst: number;
  yCorrection: number;
  /** max |x|, max |y|, max |x − x̄|, max |y − ȳ| (Math.max: a NaN would stick). */
  largestX: number;
  largestY: number;
  largestDx: number;
  largestDy: number;
  xMin: number;
  xMax: number;
  /** Compensated Σdx, Σdy, Σdx², Σdy², Σdx·dy over the deviations. */
  sumDx: number;
  sumDy: number;
  sumDxDx: number;
  sumDyDy: number;
  sumDxDy: number;
}

/**
 * centreInto for x and y, the largest magnitudes, the range of x, and the five sums of deviations,
 * in three passes instead of fifteen. Every sum adds the same terms in the same order, with the
 * same correction, as compensatedSum and compensatedDot: the results are the same doubles.
 * Needs n ≥ 1; writes x − x̄ into dx and y − ȳ into dy.
 */
export function centredSums(xs: Float64Array, ys: Float64Array, n: number, dx: Float64Array, dy: Float64Array): CentredSums {
  // Pass 1: Σx and Σy (each a running total t and a correction c), magnitudes, range.
  let tx = xs[0], cx = 0, ty = ys[0], cy = 0;
  let largestX = Math.max(0, Math.abs(tx)), largestY = Math.max(0, Math.abs(ty)), xMin = tx, xMax = tx;
  for (let i = 1; i < n; i++) {
    const x = xs[i], y = ys[i];
    const nx = tx + x, ny = ty + y;
    cx += Math.abs(tx) >= Math.abs(x) ? tx - nx + x : x - nx + tx;
    cy += Math.abs(ty) >= Math.abs(y) ? ty - ny + y : y - ny + ty;
    tx = nx;
    ty = ny;
    largestX = Math.max(largestX, Math.abs(x));
    largestY = Math.max(largestY, Math.abs(y));
    xMin = Math.min(xMin, x);
    xMax = Math.max(xMax, x);
  }
  const xFirst = (tx + cx) / n, yFirst = (ty + cy) / n;
  // Pass 2: deviations from the first means, and their sums.
  for (let i = 0; i < n; i++) {
    dx[i] = xs[i] - xFirst;
    dy[i] = ys[i] - yFirst;
  }
  tx = dx[0], cx = 0, ty = dy[0], cy = 0;
  for (let i = 1; i < n; i++) {
    const x = dx[i], y = dy[i];
    const nx = tx + x, ny = ty + y;
    cx += Math.abs(tx) >= Math.abs(x) ? tx - nx + x : x - nx + tx;
    cy += Math.abs(ty) >= Math.abs(y) ? ty - ny + y : y - ny + ty;
    tx = nx;
    ty = ny;
  }
  const xCorrection = (tx + cx) / n, yCorrection = (ty + cy) / n;
  // Pass 3: final deviations, their magnitudes, and the five sums.
  const x0 = (dx[0] -= xCorrection), y0 = (dy[0] -= yCorrection);
  let largestDx = Math.max(0, Math.abs(x0)), largestDy = Math.max(0, Math.abs(y0));
  let sx = x0, csx = 0, sy = y0, csy = 0, sxx = x0 * x0, csxx = 0, syy = y0 * y0, csyy = 0, sxy = x0 * y0, csxy = 0;
  for (let i = 1; i < n; i++) {
    const x = (dx[i] -= xCorrection), y = (dy[i] -= yCorrection);
    largestDx = Math.max(largestDx, Math.abs(x));
    largestDy = Math.max(largestDy, Math.abs(y));
    const xx = x * x, yy = y * y, xy = x * y;
    const nsx = sx + x, nsy = sy + y, nsxx = sxx + xx, nsyy = syy + yy, nsxy = sxy + xy;
    csx += Math.abs(sx) >= Math.abs(x) ? sx - nsx + x : x - nsx + sx;
    csy += Math.abs(sy) >= Math.abs(y) ? sy - nsy + y : y - nsy + sy;
    csxx += Math.abs(sxx) >= Math.abs(xx) ? sxx - nsxx + xx : xx - nsxx + sxx;
    csyy += Math.abs(syy) >= Math.abs(yy) ? syy - nsyy + yy : yy - nsyy + syy;
    csxy += Math.abs(sxy) >= Math.abs(xy) ? sxy - nsxy + xy : xy - nsxy + sxy;
    sx = nsx;
    sy = nsy;
    sxx = nsxx;
    syy = nsyy;
    sxy = nsxy;
  }
  return {
    xFirst, xCorrection, yFirst, yCorrection, largestX, largestY, largestDx, largestDy, xMin, xMax,
    sumDx: sx + csx, sumDy: sy + csy, sumDxDx: sxx + csxx, sumDyDy: syy + csyy, sumDxDy: sxy + csxy,
  };
}
