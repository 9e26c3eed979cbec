/** Figures of one assignment, formatted with Intl in its currency and area unit. Every formatter
 * takes null (or a non-finite number) and answers '—': the page never shows NaN, null or undefined. */
export type AreaUnit = 'sqft' | 'sqm';

export const areaUnitLabels: Record<AreaUnit, string> = { sqft: 'ft²', sqm: 'm²' };

export interface Figures {
  currency: string;
  unit: string;
  /** Whole currency units: $412,500. */
  money: (value: number | null | undefined) => string;
  /** With a sign for adjustments: +$3,300, −$2,000, $0. */
  adjustment: (value: number | null | undefined) => string;
  /** A rate per unit area, to the cent when it has cents: $110 per ft². */
  rate: (value: number | null | undefined) => string;
  /** A currency amount to the cent where it has cents (increments, slopes). */
  precise: (value: number | null | undefined) => string;
  area: (value: number | null | undefined) => string;
  number: (value: number | null | undefined) => string;
  /** A fraction as a percentage: 0.123 → 12.3%. */
  fraction: (value: number | null | undefined) => string;
  /** A value already in percent: 12.34 → 12.3%. */
  percent: (value: number | null | undefined) => string;
}

const DASH = '—';
const ok = (value: number | null | undefined): value is number => typeof value === 'number' && Number.isFinite(value);

function currencyFormat(currency: string, options: Intl.NumberFormatOptions): Intl.NumberFormat {
  try {
    return new Intl.NumberFormat(undefined, { style: 'currency', currency, ...options });
  } catch {
    // An unknown code still shows the amount, with the code beside it.
    return new Intl.NumberFormat(undefined, { ...options, style: 'decimal' });
  }
}

export function makeFigures(currency: string, areaUnit: AreaUnit): Figures {
  const unit = areaUnitLabels[areaUnit];
  const whole = currencyFormat(currency, { maximumFractionDigits: 0 });
  const signed = currencyFormat(currency, { maximumFractionDigits: 0, signDisplay: 'exceptZero' });
  const cents = currencyFormat(currency, { minimumFractionDigits: 0, maximumFractionDigits: 2 });
  const plain = new Intl.NumberFormat(undefined, { maximumFractionDigits: 2 });
  const pct = new Intl.NumberFormat(undefined, { style: 'percent', minimumFractionDigits: 1, maximumFractionDigits: 1 });
  const withCode = (format: Intl.NumberFormat, value: number) => {
    const text = format.format(value);
    return format.resolvedOptions().style === 'currency' ? text : `${text} ${currency}`;
  };
  return {
    currency,
    unit,
    money: (v) => (ok(v) ? withCode(whole, Math.round(v) === 0 ? 0 : v) : DASH),
    adjustment: (v) => (ok(v) ? withCode(signed, Math.abs(v) < 0.5 ? 0 : v).replace('-', '−') : DASH),
    rate: (v) => (ok(v) ? `${withCode(cents, v)} per ${unit}` : DASH),
    precise: (v) => (ok(v) ? withCode(cents, v) : DASH),
    area: (v) => (ok(v) ? `${plain.format(v)} ${unit}` : DASH),
    number: (v) => (ok(v) ? plain.format(v) : DASH),
    fraction: (v) => (ok(v) ? pct.format(v) : DASH),
    percent: (v) => (ok(v) ? pct.format(v / 100) : DASH),
  };
}
