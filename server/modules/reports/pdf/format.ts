// How figures read in the PDF: money in the assignment's currency through Intl (en-US), areas with
// their unit, dates spelled out. A missing or non-finite value prints as a dash, never as NaN.
import { formatMoney } from '../../../analysis/format-money';

export const MISSING = '—';
const MINUS = '−';

type Maybe = number | null | undefined;
const usable = (v: Maybe): v is number => typeof v === 'number' && Number.isFinite(v);

export interface Units {
  currency: string;
  areaUnit: 'sqft' | 'sqm';
}

export const areaSymbol = (unit: 'sqft' | 'sqm') => (unit === 'sqft' ? 'ft²' : 'm²');

export function money(v: Maybe, currency: string): string {
  if (!usable(v)) return MISSING;
  return formatMoney(v, currency).replace('-', MINUS);
}

/** An adjustment: always signed, so that a reader sees its direction ("+$4,200", "−$1,000"). */
export function signedMoney(v: Maybe, currency: string): string {
  if (!usable(v)) return MISSING;
  const whole = Math.round(v);
  if (whole === 0) return formatMoney(0, currency);
  return `${whole > 0 ? '+' : MINUS}${formatMoney(Math.abs(whole), currency)}`;
}

/** Money in short form for chart ticks ("$420K"). */
export function compactMoney(v: number, currency: string): string {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency, notation: 'compact', minimumFractionDigits: 0, maximumFractionDigits: 1 })
    .format(v)
    .replace('-', MINUS);
}

export function area(v: Maybe, unit: 'sqft' | 'sqm'): string {
  if (!usable(v)) return MISSING;
  return `${Math.round(v).toLocaleString('en-US')} ${areaSymbol(unit)}`;
}

/** Money per unit of floor area ("$231/ft²"), with cents only when the figure is small. */
export function perArea(v: Maybe, units: Units): string {
  if (!usable(v)) return MISSING;
  const digits = Math.abs(v) < 20 ? 2 : 0;
  const text = new Intl.NumberFormat('en-US', { style: 'currency', currency: units.currency, maximumFractionDigits: digits, minimumFractionDigits: digits }).format(v);
  return `${text.replace('-', MINUS)}/${areaSymbol(units.areaUnit)}`;
}

export function percent(v: Maybe, digits = 1): string {
  if (!usable(v)) return MISSING;
  return `${(v * 100).toFixed(digits).replace('-', MINUS)}%`;
}

export function signedPercent(v: Maybe, digits = 2): string {
  if (!usable(v)) return MISSING;
  const text = `${Math.abs(v * 100).toFixed(digits)}%`;
  return v > 0 ? `+${text}` : v < 0 ? `${MINUS}${text}` : text;
}

export function decimal(v: Maybe, digits = 2): string {
  if (!usable(v)) return MISSING;
  return v.toFixed(digits).replace('-', MINUS);
}

export function count(v: Maybe): string {
  return usable(v) ? v.toLocaleString('en-US') : MISSING;
}

/** An ISO day ("2026-11-15") or timestamp as "November 15, 2026". */
export function longDate(iso: string | null | undefined): string {
  if (!iso) return MISSING;
  const day = new Date(iso.length === 10 ? `${iso}T00:00:00Z` : iso);
  if (Number.isNaN(day.getTime())) return MISSING;
  return new Intl.DateTimeFormat('en-US', { year: 'numeric', month: 'long', day: 'numeric', timeZone: 'UTC' }).format(day);
}

/** An ISO day as "Nov 15, 2026", for tables. */
export function shortDate(iso: string | null | undefined): string {
  if (!iso) return MISSING;
  const day = new Date(iso.length === 10 ? `${iso}T00:00:00Z` : iso);
  if (Number.isNaN(day.getTime())) return MISSING;
  return new Intl.DateTimeFormat('en-US', { year: 'numeric', month: 'short', day: 'numeric', timeZone: 'UTC' }).format(day);
}

/** Text that may be missing or blank. */
export function orDash(text: string | null | undefined): string {
  return text && text.trim() ? text.trim() : MISSING;
}
