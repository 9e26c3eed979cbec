import type { Assignment } from '@contracts/assignments';

export type AreaUnit = Assignment['areaUnit'];

/** 'ft²' or 'm²'. */
export function areaSymbol(unit: AreaUnit): string {
  return unit === 'sqft' ? 'ft²' : 'm²';
}

/** Distances follow the area unit: miles for square-foot assignments, kilometres for square-metre ones. */
export function distanceUnit(unit: AreaUnit): 'miles' | 'kilometers' {
  return unit === 'sqft' ? 'miles' : 'kilometers';
}

function currencyFormat(currency: string, maximumFractionDigits: number, currencyDisplay: 'symbol' | 'narrowSymbol' = 'symbol'): Intl.NumberFormat {
  try {
    return new Intl.NumberFormat(undefined, { style: 'currency', currency, currencyDisplay, maximumFractionDigits, minimumFractionDigits: 0 });
  } catch {
    return new Intl.NumberFormat(undefined, { maximumFractionDigits });
  }
}

export interface Figures {
  currency: string;
  areaSymbol: string;
  /** 'mi' or 'km', for labels. */
  distanceSymbol: string;
  price: (amount: number) => string;
  /** The narrow symbol ($, €) for table cells whose header names the currency. */
  priceInColumn: (amount: number) => string;
  /** A bare number, for cells whose header names the unit. */
  areaInColumn: (value: number) => string;
  pricePerAreaInColumn: (amount: number) => string;
  area: (value: number) => string;
  pricePerArea: (amount: number) => string;
  distance: (value: number) => string;
  distanceInColumn: (value: number) => string;
  months: (value: number) => string;
  count: (value: number) => string;
}

/** Every figure of the comparables step, formatted with Intl in the assignment's currency and unit. */
export function figuresFor(currency: string, unit: AreaUnit): Figures {
  const symbol = areaSymbol(unit);
  const whole = currencyFormat(currency, 0);
  const cents = currencyFormat(currency, 2);
  const narrowWhole = currencyFormat(currency, 0, 'narrowSymbol');
  const narrowCents = currencyFormat(currency, 2, 'narrowSymbol');
  const areaNumber = new Intl.NumberFormat(undefined, { maximumFractionDigits: 0 });
  const distanceNumber = new Intl.NumberFormat(undefined, {
    style: 'unit',
    unit: unit === 'sqft' ? 'mile' : 'kilometer',
    unitDisplay: 'short',
    minimumFractionDigits: 2,
    maximumFractionDigits: 2,
  });
  const plainDistance = new Intl.NumberFormat(undefined, { minimumFractionDigits: 2, maximumFractionDigits: 2 });
  const monthNumber = new Intl.NumberFormat(undefined, { style: 'unit', unit: 'month', unitDisplay: 'short', minimumFractionDigits: 1, maximumFractionDigits: 1 });
  const countNumber = new Intl.NumberFormat(undefined, { maximumFractionDigits: 0 });
  return {
    currency,
    areaSymbol: symbol,
    distanceSymbol: unit === 'sqft' ? 'mi' : 'km',
    price: (amount) => whole.format(amount),
    priceInColumn: (amount) => narrowWhole.format(amount),
    area: (value) => `${areaNumber.format(value)} ${symbol}`,
    areaInColumn: (value) => areaNumber.format(value),
    pricePerAreaInColumn: (amount) => (Math.abs(amount) >= 100 ? narrowWhole : narrowCents).format(amount),
    // Small rates keep their cents (€24.50/m² is not €25/m²); large ones round to whole units.
    pricePerArea: (amount) => `${(Math.abs(amount) >= 100 ? whole : cents).format(amount)}/${symbol}`,
    distance: (value) => distanceNumber.format(value),
    distanceInColumn: (value) => plainDistance.format(value),
    months: (value) => monthNumber.format(value),
    count: (value) => countNumber.format(value),
  };
}
