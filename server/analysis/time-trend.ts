// Market-conditions trend: price per unit area against months before the effective date, fitted by
// the same least-squares module. The monthly rate is the fitted change per month as a fraction of
// the mean price per unit area; a sale's time adjustment is price × rate × months before.
import type { Trend } from '../contracts/analysis';
import { fitColumns, fitScratch } from './fit-columns';
import { summariseFit } from './fit-summary';

export interface TrendSale {
  saleId: number;
  salePrice: number;
  saleDate: string;
  floorArea: number;
}

export interface TrendPoint {
  saleId: number;
  monthsBefore: number;
  pricePerArea: number;
}

const DAYS_PER_MONTH = 365.25 / 12;
const DAY_MS = 86_400_000;

/** The number in date[start, start + length) when every character is a digit, else −1. */
function digitsAt(date: string, start: number, length: number): number {
  let value = 0;
  for (let i = start; i < start + length; i++) {
    const d = date.charCodeAt(i) - 48;
    if (d < 0 || d > 9) return -1;
    value = value * 10 + d;
  }
  return value;
}

function daysInMonth(year: number, month: number): number {
  if (month !== 2) return month === 4 || month === 6 || month === 9 || month === 11 ? 30 : 31;
  return year % 4 === 0 && (year % 100 !== 0 || year % 400 === 0) ? 29 : 28;
}

/**
 * Epoch milliseconds of a calendar date at 00:00 UTC: exactly what Date.parse(`${date}T00:00:00Z`)
 * gives. A real date written YYYY-MM-DD is read from its digits (days from the civil calendar, an
 * exact integer count); anything else goes to Date.parse itself, and NaN stays NaN.
 */
export function utcDayMs(date: string): number {
  if (typeof date === 'string' && date.length === 10 && date.charCodeAt(4) === 45 && date.charCodeAt(7) === 45) {
    const year = digitsAt(date, 0, 4);
    const month = digitsAt(date, 5, 2);
    const day = digitsAt(date, 8, 2);
    if (year >= 0 && month >= 1 && month <= 12 && day >= 1 && day <= daysInMonth(year, month)) {
      // Days since 1970-01-01 in the proleptic Gregorian calendar, counted in 400-year eras from
      // 1 March of year 0 (so that the leap day falls at the end of each counted year).
      const y = month <= 2 ? year - 1 : year;
      const era = Math.floor(y / 400);
      const yearOfEra = y - era * 400;
      const dayOfYear = Math.floor((153 * (month > 2 ? month - 3 : month + 9) + 2) / 5) + day - 1;
      const dayOfEra = yearOfEra * 365 + Math.floor(yearOfEra / 4) - Math.floor(yearOfEra / 100) + dayOfYear;
      return (era * 146_097 + dayOfEra - 719_468) * DAY_MS;
    }
  }
  return Date.parse(`${date}T00:00:00Z`);
}

/** Months between two instants in epoch milliseconds (positive when `saleMs` comes first). */
export function monthsBetween(saleMs: number, effectiveMs: number): number {
  return (effectiveMs - saleMs) / DAY_MS / DAYS_PER_MONTH;
}

/** Months from the sale date to the effective date (positive for sales before it). */
export function monthsBefore(saleDate: string, effectiveDate: string): number {
  return monthsBetween(utcDayMs(saleDate), utcDayMs(effectiveDate));
}

export function fitTrend(neighbourhood: string, sales: readonly TrendSale[], effectiveDate: string): Trend {
  const effectiveMs = utcDayMs(effectiveDate);
  const points = new Array<TrendPoint>(sales.length);
  for (let i = 0; i < sales.length; i++) {
    const s = sales[i];
    points[i] = { saleId: s.saleId, monthsBefore: monthsBetween(utcDayMs(s.saleDate), effectiveMs), pricePerArea: s.salePrice / s.floorArea };
  }
  return fitTrendPoints(neighbourhood, points);
}

/** The trend through points already placed in months and price per area (they become Trend.points). */
export function fitTrendPoints(neighbourhood: string, points: TrendPoint[]): Trend {
  const n = points.length;
  const { xs, ys } = fitScratch(n);
  let bad = -1;
  for (let i = 0; i < n; i++) {
    const { monthsBefore: x, pricePerArea: y } = points[i];
    if (bad < 0 && !(Number.isFinite(x) && Number.isFinite(y))) bad = i;
    xs[i] = x;
    ys[i] = y;
  }
  const fit = fitColumns(n, bad);
  if (!fit.ok) return { neighbourhood, n: fit.n, fit: null, refusal: { reason: fit.reason, message: fit.message }, monthlyRate: null, points };
  // The slope is per month *before* the effective date, so a rising market has a negative slope.
  const monthlyRate = fit.yMean > 0 ? -fit.slope / fit.yMean : null;
  return { neighbourhood, n: fit.n, fit: summariseFit(fit), refusal: null, monthlyRate, points };
}

/** The sale price brought to the effective date by a monthly rate (simple, not compounded). */
export function timeAdjustedPrice(salePrice: number, months: number, monthlyRate: number | null): number {
  return monthlyRate === null ? salePrice : salePrice * (1 + monthlyRate * months);
}
