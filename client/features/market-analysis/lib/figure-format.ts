/**
 * Every figure of the market analysis, formatted with Intl in the assignment's currency and area
 * unit. A value that is not a finite number is never printed as NaN: it reads "not defined".
 * `locale` defaults to the reader's; tests pass one to compare text exactly.
 */
export type AreaUnit = 'sqft' | 'sqm';

export const areaUnitSymbol: Record<AreaUnit, string> = { sqft: 'ft²', sqm: 'm²' };

export const NOT_DEFINED = 'not defined';

function currencyNumber(locale: string | undefined, currency: string, options: Intl.NumberFormatOptions): (v: number) => string {
  try {
    const format = new Intl.NumberFormat(locale, { style: 'currency', currency, signDisplay: 'negative', ...options });
    return (v) => format.format(v);
  } catch {
    // An unknown currency code: the amount and the code as they are.
    const format = new Intl.NumberFormat(locale, { signDisplay: 'negative', ...options });
    return (v) => `${format.format(v)} ${currency}`;
  }
}

function finiteOnly(format: (v: number) => string): (v: number | null | undefined) => string {
  return (v) => (typeof v === 'number' && Number.isFinite(v) ? format(v) : NOT_DEFINED);
}

export interface FigureFormat {
  unit: string;
  /** $433,195 */
  money: (v: number | null | undefined) => string;
  /** +$12,400 / −$92,241 */
  signedMoney: (v: number | null | undefined) => string;
  /** $430K, for chart axes */
  compactMoney: (v: number | null | undefined) => string;
  /** $283.32 per ft² */
  rate: (v: number | null | undefined) => string;
  /** $283.32, for chart axes labelled with the unit */
  rateAmount: (v: number | null | undefined) => string;
  /** 1,850 ft² */
  area: (v: number | null | undefined) => string;
  /** 1,850 */
  areaNumber: (v: number | null | undefined) => string;
  /** 0.945 (r, R², adjusted R²) */
  ratio: (v: number | null | undefined) => string;
  /** +2.09 / −10.81 (studentized residuals) */
  signedRatio: (v: number | null | undefined) => string;
  /** −17.5% */
  signedPercent: (v: number | null | undefined) => string;
  /** +0.64% (a monthly rate) */
  monthlyPercent: (v: number | null | undefined) => string;
  /** 38 */
  count: (v: number | null | undefined) => string;
  /** 0.377, or "< 0.001" */
  pValue: (v: number | null | undefined) => string;
  /** 12.4 months */
  months: (v: number | null | undefined) => string;
}

export function figureFormat(currency: string, areaUnit: AreaUnit, locale?: string): FigureFormat {
  const unit = areaUnitSymbol[areaUnit];
  const whole = currencyNumber(locale, currency, { maximumFractionDigits: 0, minimumFractionDigits: 0 });
  const signedWhole = currencyNumber(locale, currency, { maximumFractionDigits: 0, minimumFractionDigits: 0, signDisplay: 'exceptZero' });
  // Axis ticks use the narrow symbol ($ rather than US$): the page states the currency once above the charts.
  const compact = currencyNumber(locale, currency, { notation: 'compact', maximumSignificantDigits: 3, currencyDisplay: 'narrowSymbol' });
  const cents = currencyNumber(locale, currency, { maximumFractionDigits: 2, minimumFractionDigits: 2 });
  const plain = new Intl.NumberFormat(locale, { maximumFractionDigits: 0, signDisplay: 'negative' });
  const threeDecimals = new Intl.NumberFormat(locale, { minimumFractionDigits: 3, maximumFractionDigits: 3, signDisplay: 'negative' });
  const twoDecimalsSigned = new Intl.NumberFormat(locale, { minimumFractionDigits: 2, maximumFractionDigits: 2, signDisplay: 'exceptZero' });
  const percentSigned = new Intl.NumberFormat(locale, { style: 'percent', minimumFractionDigits: 1, maximumFractionDigits: 1, signDisplay: 'exceptZero' });
  const monthly = new Intl.NumberFormat(locale, { style: 'percent', minimumFractionDigits: 2, maximumFractionDigits: 2, signDisplay: 'exceptZero' });
  const oneDecimal = new Intl.NumberFormat(locale, { maximumFractionDigits: 1, signDisplay: 'negative' });
  const smallP = new Intl.NumberFormat(locale, { minimumFractionDigits: 3, maximumFractionDigits: 3 }).format(0.001);

  return {
    unit,
    money: finiteOnly(whole),
    signedMoney: finiteOnly(signedWhole),
    compactMoney: finiteOnly(compact),
    rate: finiteOnly((v) => `${cents(v)} per ${unit}`),
    rateAmount: finiteOnly(cents),
    area: finiteOnly((v) => `${plain.format(v)} ${unit}`),
    areaNumber: finiteOnly((v) => plain.format(v)),
    ratio: finiteOnly((v) => threeDecimals.format(v)),
    signedRatio: finiteOnly((v) => twoDecimalsSigned.format(v)),
    signedPercent: finiteOnly((v) => percentSigned.format(v)),
    monthlyPercent: finiteOnly((v) => monthly.format(v)),
    count: finiteOnly((v) => plain.format(v)),
    pValue: finiteOnly((v) => (v < 0.001 ? `< ${smallP}` : threeDecimals.format(v))),
    months: finiteOnly((v) => `${oneDecimal.format(v)} ${Math.abs(v) === 1 ? 'month' : 'months'}`),
  };
}
