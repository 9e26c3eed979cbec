import type { FitSummary } from '@contracts/analysis';

export interface BandPoint {
  x: number;
  fitted: number;
  /** [lower, upper] of the 95% prediction interval for one more sale at x. */
  band: [number, number];
}

/** The fitted value at x, formed around the mean so that large intercepts lose no digits. */
export function fittedAt(fit: FitSummary, x: number): number {
  return fit.yMean + fit.slope * (x - fit.xMean);
}

/**
 * Half-width of the 95% prediction interval at x: t · s · √(1 + 1/n + (x − x̄)² / Sxx), with t the
 * fit's Student t at n − 2 degrees of freedom and Sxx recovered from the slope's standard error,
 * SE(b) = s / √Sxx, so Sxx = (s / SE(b))². Null when the figures cannot give one (nothing is drawn
 * rather than NaN); 0 when every sale lies on the line.
 */
export function predictionHalfWidth(fit: FitSummary, x: number): number | null {
  const { n, residualStdError: s, slopeStdError: se, tCritical: t, xMean } = fit;
  if (n < 3 || ![s, se, t, xMean, x].every(Number.isFinite) || s < 0) return null;
  if (s === 0) return 0;
  if (se <= 0) return null;
  const sxx = (s / se) ** 2;
  const half = t * s * Math.sqrt(1 + 1 / n + (x - xMean) ** 2 / sxx);
  return Number.isFinite(half) ? half : null;
}

/** The line and its band sampled across [from, to]; the band is curved, so it needs many points. */
export function predictionBand(fit: FitSummary, from: number, to: number, steps = 48): BandPoint[] {
  if (!Number.isFinite(from) || !Number.isFinite(to) || to <= from) return [];
  const points: BandPoint[] = [];
  for (let i = 0; i <= steps; i++) {
    const x = from + ((to - from) * i) / steps;
    const half = predictionHalfWidth(fit, x);
    if (half === null) return [];
    const fitted = fittedAt(fit, x);
    points.push({ x, fitted, band: [fitted - half, fitted + half] });
  }
  return points;
}

/** Round, evenly spaced ticks that cover the values (1, 2, 2.5 or 5 × a power of ten apart). */
export function niceTicks(values: readonly number[], target = 6): { domain: [number, number]; ticks: number[] } {
  const finite = values.filter(Number.isFinite);
  if (finite.length === 0) return { domain: [0, 1], ticks: [0, 1] };
  let min = Math.min(...finite);
  let max = Math.max(...finite);
  if (min === max) {
    const pad = Math.abs(min) * 0.1 || 1;
    min -= pad;
    max += pad;
  }
  const raw = (max - min) / target;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * power).find((s) => s >= raw) ?? 10 * power;
  const lo = Math.floor(min / step) * step;
  const hi = Math.ceil(max / step) * step;
  const ticks: number[] = [];
  for (let v = lo; v <= hi + step / 2; v += step) ticks.push(Number(v.toPrecision(12)));
  return { domain: [lo, hi], ticks };
}
