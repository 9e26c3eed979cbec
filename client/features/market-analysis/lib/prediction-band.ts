import type { FitSummary } from '@contracts/analysis';

/** The fit's figures that the band needs (a FitSummary has them all). */
export type BandFit = Pick<FitSummary, 'n' | 'slope' | 'intercept' | 'residualStdError' | 'slopeStdError' | 'tCritical' | 'xMean'>;

export interface BandPoint {
  x: number;
  fitted: number;
  lower: number;
  upper: number;
}

export function fittedAt(fit: BandFit, x: number): number {
  // Around the mean, as the server forms fitted values: large intercepts cost no digits.
  const yMean = fit.intercept + fit.slope * fit.xMean;
  return yMean + fit.slope * (x - fit.xMean);
}

/**
 * Half the width of the 95% prediction interval for one new sale at floor area x:
 *
 *     t · s · √(1 + 1/n + (x − x̄)² / Sxx)
 *
 * t is Student's t at 97.5% with n − 2 degrees of freedom (the summary's tCritical), s the residual
 * standard error and Sxx = Σ(xᵢ − x̄)², the spread of the sales' floor areas. The summary does not
 * carry Sxx, but it carries the slope's standard error, SE(b) = s / √Sxx, so Sxx = (s / SE(b))².
 * When s is 0 every sale lies on the line and the band has no width (and SE(b) is 0 too, so the
 * ratio would be 0/0): that case is answered first. Returns null when the figures cannot give a
 * band (n < 3, a non-finite value), so that nothing is drawn rather than NaN.
 */
export function predictionHalfWidth(fit: BandFit, x: number): number | null {
  const { n, residualStdError: s, slopeStdError, tCritical: t, xMean } = fit;
  if (n < 3 || ![s, slopeStdError, t, xMean, x].every(Number.isFinite) || s < 0) return null;
  if (s === 0) return 0;
  if (slopeStdError <= 0) return null;
  const sxx = (s / slopeStdError) ** 2;
  const half = t * s * Math.sqrt(1 + 1 / n + (x - xMean) ** 2 / sxx);
  return Number.isFinite(half) ? half : null;
}

/** The fitted line and its prediction band sampled from `from` to `to` (the band is a hyperbola,
 * so it needs more than its two ends). Empty when no band can be drawn. */
export function predictionBand(fit: BandFit, from: number, to: number, steps = 64): BandPoint[] {
  if (!Number.isFinite(from) || !Number.isFinite(to) || to <= from) return [];
  const band: BandPoint[] = [];
  for (let i = 0; i <= steps; i++) {
    const x = from + ((to - from) * i) / steps;
    const half = predictionHalfWidth(fit, x);
    if (half === null) return [];
    const fitted = fittedAt(fit, x);
    band.push({ x, fitted, lower: fitted - half, upper: fitted + half });
  }
  return band;
}
