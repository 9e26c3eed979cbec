/**
 * Figures of a report in its own currency and unit, through Intl in the reader's locale. Every
 * formatter answers '—' for a missing or non-finite value, so that NaN, null or undefined never
 * reach the page.
 */
export const DASH = '—';
const MINUS = '\u2212';

export type AreaUnit = 'sqft' | 'sqm';
export const unitSymbol: Record<AreaUnit, string> = { sqft: 'ft²', sqm: 'm²' };

const isFigure = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v);

function numberFormat(options: Intl.NumberFormatOptions) {
  return new Intl.NumberFormat(undefined, options);
}

function currencyFormat(currency: string, digits: number) {
  try {
    return numberFormat({ style: 'currency', currency, maximumFractionDigits: digits, minimumFractionDigits: digits });
  } catch {
    return null;
  }
}

export interface ReportFormat {
  unit: string;
  money: (v: number | null | undefined) => string;
  signedMoney: (v: number | null | undefined) => string;
  compactMoney: (v: number | null | undefined) => string;
  area: (v: number | null | undefined) => string;
  areaNumber: (v: number | null | undefined) => string;
  perArea: (v: number | null | undefined) => string;
  percent: (fraction: number | null | undefined, digits?: number) => string;
  signedPercent: (fraction: number | null | undefined, digits?: number) => string;
  /** A figure the server already gives in percent (net and gross adjustment, weights). */
  pct: (percent: number | null | undefined, digits?: number) => string;
  decimal: (v: number | null | undefined, digits?: number) => string;
  count: (v: number | null | undefined) => string;
}

export function reportFormat(currency: string, areaUnit: AreaUnit): ReportFormat {
  const whole = currencyFormat(currency, 0);
  const compact = (() => {
    try {
      return numberFormat({ style: 'currency', currency, notation: 'compact', maximumFractionDigits: 1 });
    } catch {
      return null;
    }
  })();
  const plain = numberFormat({ maximumFractionDigits: 0 });
  const unit = unitSymbol[areaUnit];
  const money = (v: number | null | undefined) => (!isFigure(v) ? DASH : whole ? whole.format(v) : `${plain.format(v)} ${currency}`);
  const sign = (v: number, text: string) => (v > 0 ? `+${text}` : v < 0 ? `${MINUS}${text}` : text);
  const percentOf = (digits: number) => numberFormat({ style: 'percent', minimumFractionDigits: digits, maximumFractionDigits: digits });
  return {
    unit,
    money,
    signedMoney: (v) => (!isFigure(v) ? DASH : sign(Math.round(v), money(Math.abs(v)))),
    compactMoney: (v) => (!isFigure(v) ? DASH : compact ? compact.format(v) : money(v)),
    area: (v) => (!isFigure(v) ? DASH : `${plain.format(v)} ${unit}`),
    areaNumber: (v) => (!isFigure(v) ? DASH : plain.format(v)),
    perArea: (v) => (!isFigure(v) ? DASH : `${money(v)} per ${unit}`),
    percent: (f, digits = 1) => (!isFigure(f) ? DASH : percentOf(digits).format(f)),
    signedPercent: (f, digits = 1) => (!isFigure(f) ? DASH : sign(f, percentOf(digits).format(Math.abs(f)))),
    pct: (p, digits = 1) => (!isFigure(p) ? DASH : `${numberFormat({ minimumFractionDigits: digits, maximumFractionDigits: digits }).format(p)}%`),
    decimal: (v, digits = 3) => (!isFigure(v) ? DASH : numberFormat({ minimumFractionDigits: digits, maximumFractionDigits: digits }).format(v)),
    count: (v) => (!isFigure(v) ? DASH : plain.format(v)),
  };
}

/** A calendar date sent as 'YYYY-MM-DD', shown as that same day everywhere. */
export function formatDay(value: string | null | undefined): string {
  if (!value) return DASH;
  const [year, month, day] = value.slice(0, 10).split('-').map(Number);
  if (!year || !month || !day) return DASH;
  return new Intl.DateTimeFormat(undefined, { dateStyle: 'long' }).format(new Date(year, month - 1, day));
}

/** An ISO timestamp in the reader's time zone. */
export function formatMoment(value: string | Date | null | undefined): string {
  if (!value) return DASH;
  const at = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(at.getTime())) return DASH;
  return new Intl.DateTimeFormat(undefined, { dateStyle: 'long', timeStyle: 'short' }).format(at);
}

/** A SHA-256 fingerprint in groups of eight, for reading aloud and comparing by eye. */
export function groupedFingerprint(sha256: string): string {
  return sha256.match(/.{1,8}/g)?.join(' ') ?? sha256;
}
