// Centred sums for least squares, accurate when the data sit far from zero (dates as epoch
// milliseconds, prices in the millions). Two passes: the mean first, then sums of deviations, with
// compensated summation (simple-statistics' `sum`) and the corrected two-pass term.
import { mean, sum } from 'simple-statistics';

export interface Centred {
  /** The mean, rounded to one double (for display and the intercept). */
  mean: number;
  /** v − mean for each value, computed against the unrounded mean. */
  deviations: number[];
  /** v − mean for any other value (the subject, say), computed the same way. */
  deviation: (v: number) => number;
}

/**
 * The mean is carried as two doubles: a first estimate, plus the mean of the deviations from it.
 * Each deviation subtracts both in turn. Near 1.7e12 a mean rounded to one double is off by up to
 * 1e-4, an error every deviation would otherwise share.
 */
export function centre(values: readonly number[]): Centred {
  const first = mean(values as number[]);
  const raw = values.map((v) => v - first);
  const correction = sum(raw) / values.length;
  return {
    mean: first + correction,
    deviations: raw.map((d) => d - correction),
    deviation: (v: number) => v - first - correction,
  };
}

/** Σ a·b over deviations, less the corrected two-pass term Σa·Σb/n (zero in exact arithmetic). */
export function centredProduct(a: readonly number[], b: readonly number[]): number {
  return sum(a.map((v, i) => v * b[i])) - (sum(a as number[]) * sum(b as number[])) / a.length;
}

/** Residual sum of squares of the least-squares line through the points; 0 when x has no spread. */
export function lineSse(dx: readonly number[], dy: readonly number[]): number {
  const cx = centre(dx);
  const cy = centre(dy);
  const sxx = centredProduct(cx.deviations, cx.deviations);
  if (!(sxx > 0)) return 0;
  const slope = centredProduct(cx.deviations, cy.deviations) / sxx;
  return sum(cy.deviations.map((d, i) => (d - slope * cx.deviations[i]) ** 2));
}
