// Market-conditions trend: price per unit area against months before the effective date, fitted by
// the same least-squares module. The monthly rate is the fitted change per month as a fraction of
// the mean price per unit area; a sale's time adjustment is price × rate × months before.
import type { Trend } from '../contracts/analysis';
import { fitLine } from './regression';
import { summariseFit } from './fit-summary';

export interface TrendSale {
  saleId: number;
  salePrice: number;
  saleDate: string;
  floorArea: number;
}

const DAYS_PER_MONTH = 365.25 / 12;

/** Months from the sale date to the effective date (positive for sales before it). */
export function monthsBefore(saleDate: string, effectiveDate: string): number {
  return (Date.parse(`${effectiveDate}T00:00:00Z`) - Date.parse(`${saleDate}T00:00:00Z`)) / 86_400_000 / DAYS_PER_MONTH;
}

export function fitTrend(neighbourhood: string, sales: readonly TrendSale[], effectiveDate: string): Trend {
  const points = sales.map((s) => ({ saleId: s.saleId, monthsBefore: monthsBefore(s.saleDate, effectiveDate), pricePerArea: s.salePrice / s.floorArea }));
  const fit = fitLine(points.map((p) => ({ x: p.monthsBefore, y: p.pricePerArea })));
  if (!fit.ok) return { neighbourhood, n: fit.n, fit: null, refusal: { reason: fit.reason, message: fit.message }, monthlyRate: null, points };
  // The slope is per month *before* the effective date, so a rising market has a negative slope.
  const monthlyRate = fit.yMean > 0 ? -fit.slope / fit.yMean : null;
  return { neighbourhood, n: fit.n, fit: summariseFit(fit), refusal: null, monthlyRate, points };
}

/** The sale price brought to the effective date by a monthly rate (simple, not compounded). */
export function timeAdjustedPrice(salePrice: number, months: number, monthlyRate: number | null): number {
  return monthlyRate === null ? salePrice : salePrice * (1 + monthlyRate * months);
}
