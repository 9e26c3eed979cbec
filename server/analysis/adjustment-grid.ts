// The adjustment grid and reconciliation, pure. For each grid sale: sale price → seller-concession
// adjustment → market-conditions (time) adjustment → floor-area adjustment = rate × (subject area −
// sale area) → the appraiser's line items → adjusted price; net and gross adjustment as a share of
// the sale price; weights (default 1/gross, normalised); the weighted indicated value and the
// rounded opinion of value. Soft checks say what a reviewer would ask about, and why. Every
// adjustment is computed from the recorded sale price: the time adjustment is price × monthly rate ×
// months, not applied to the concession-adjusted price.

export interface GridLineItem {
  feature: string;
  amount: number;
  note: string;
}

export interface GridSaleInput {
  saleId: number;
  address: string;
  salePrice: number;
  floorArea: number;
  sellerConcessions: number;
  monthsBefore: number;
  distanceKm: number | null;
  flaggedByFit: string | null;
  lineItems: readonly GridLineItem[];
  /** Appraiser's weight in percent; null for the default. */
  weightPct: number | null;
}

export interface GridLimits {
  netLimitPct: number;
  grossLimitPct: number;
  maxSaleAgeMonths: number;
  maxDistanceKm: number;
  checkBracketing: boolean;
}

export interface GridInput {
  subjectArea: number;
  /** Market-conditions rate per month as a fraction (0.004 = +0.4 %/month); null when off. */
  monthlyRate: number | null;
  /** The floor-area rate per unit area, in currency, already chosen (fit slope rounded, or typed). */
  rate: number;
  valueIncrement: number;
  limits: GridLimits;
  sales: readonly GridSaleInput[];
}

export interface GridRow {
  saleId: number;
  address: string;
  salePrice: number;
  concessionAdjustment: number;
  timeAdjustment: number;
  areaAdjustment: number;
  lineItemTotal: number;
  adjustedPrice: number;
  netAdjustmentPct: number;
  grossAdjustmentPct: number;
  netOverLimit: boolean;
  grossOverLimit: boolean;
  weightPct: number;
  weightIsDefault: boolean;
}

export interface GridCheck {
  code: 'few-sales' | 'old-sale' | 'far-sale' | 'not-bracketed' | 'flagged-sale' | 'net-over' | 'gross-over' | 'weights-total' | 'outside-range';
  saleId: number | null;
  message: string;
}

export interface GridResult {
  rows: GridRow[];
  weightsTotalPct: number;
  indicatedValue: number | null;
  opinionOfValue: number | null;
  adjustedRange: [number, number] | null;
  checks: GridCheck[];
}

/** A sale with no adjustment at all would take an infinite default weight; its gross share is
 * floored at this before the 1/gross weighting (0.5 %). */
export const GROSS_FLOOR = 0.005;

export function roundToIncrement(value: number, increment: number): number {
  // `+ 0` turns a rounded −0 into 0, so a tiny negative slope never shows as "-0".
  return increment > 0 ? Math.round(value / increment) * increment + 0 : value;
}

const pct = (v: number) => `${(v * 100).toFixed(1)}%`;

export function computeGrid(input: GridInput): GridResult {
  const { limits } = input;
  const base = input.sales.map((s) => {
    const concessionAdjustment = -s.sellerConcessions;
    const timeAdjustment = input.monthlyRate === null ? 0 : s.salePrice * input.monthlyRate * s.monthsBefore;
    const areaAdjustment = input.rate * (input.subjectArea - s.floorArea);
    const lineItemTotal = s.lineItems.reduce((t, li) => t + li.amount, 0);
    const parts = [concessionAdjustment, timeAdjustment, areaAdjustment, ...s.lineItems.map((li) => li.amount)];
    const net = parts.reduce((t, a) => t + a, 0);
    const gross = parts.reduce((t, a) => t + Math.abs(a), 0);
    return {
      sale: s,
      concessionAdjustment,
      timeAdjustment,
      areaAdjustment,
      lineItemTotal,
      adjustedPrice: s.salePrice + net,
      netAdjustmentPct: Math.abs(net) / s.salePrice,
      grossAdjustmentPct: gross / s.salePrice,
    };
  });

  const inverse = base.map((b) => 1 / Math.max(b.grossAdjustmentPct, GROSS_FLOOR));
  const inverseTotal = inverse.reduce((t, v) => t + v, 0);
  const anyOverride = input.sales.some((s) => s.weightPct !== null);
  const rows: GridRow[] = base.map((b, i) => {
    const weightIsDefault = !anyOverride;
    const weightPct = anyOverride ? (b.sale.weightPct ?? 0) : (inverse[i] / inverseTotal) * 100;
    return {
      saleId: b.sale.saleId,
      address: b.sale.address,
      salePrice: b.sale.salePrice,
      concessionAdjustment: b.concessionAdjustment,
      timeAdjustment: b.timeAdjustment,
      areaAdjustment: b.areaAdjustment,
      lineItemTotal: b.lineItemTotal,
      adjustedPrice: b.adjustedPrice,
      netAdjustmentPct: b.netAdjustmentPct,
      grossAdjustmentPct: b.grossAdjustmentPct,
      // Compare share with share: 0.14 × 100 is 14.000000000000002, so `share × 100 > limit` flagged a sale
      // exactly at a 7 % or 14 % limit as above it; limit / 100 and amount / price round alike.
      netOverLimit: b.netAdjustmentPct > limits.netLimitPct / 100,
      grossOverLimit: b.grossAdjustmentPct > limits.grossLimitPct / 100,
      weightPct,
      weightIsDefault,
    };
  });

  const weightsTotalPct = rows.reduce((t, r) => t + r.weightPct, 0);
  const weightsOk = rows.length > 0 && Math.abs(weightsTotalPct - 100) < 0.01;
  const indicatedValue = weightsOk ? rows.reduce((t, r) => t + (r.weightPct / 100) * r.adjustedPrice, 0) : null;
  const opinionOfValue = indicatedValue === null ? null : roundToIncrement(indicatedValue, input.valueIncrement);
  const adjusted = rows.map((r) => r.adjustedPrice);
  const adjustedRange: [number, number] | null = rows.length ? [Math.min(...adjusted), Math.max(...adjusted)] : null;
  return { rows, weightsTotalPct, indicatedValue, opinionOfValue, adjustedRange, checks: gridChecks(input, rows, weightsOk, weightsTotalPct, opinionOfValue, adjustedRange) };
}

function gridChecks(input: GridInput, rows: GridRow[], weightsOk: boolean, weightsTotalPct: number, opinion: number | null, range: [number, number] | null): GridCheck[] {
  const { limits } = input;
  const checks: GridCheck[] = [];
  if (input.sales.length < 3) checks.push({ code: 'few-sales', saleId: null, message: `Only ${input.sales.length} closed sale${input.sales.length === 1 ? '' : 's'} in the grid; three or more is the usual minimum.` });
  for (const [i, s] of input.sales.entries()) {
    if (s.monthsBefore > limits.maxSaleAgeMonths) checks.push({ code: 'old-sale', saleId: s.saleId, message: `${s.address} sold ${s.monthsBefore.toFixed(1)} months before the effective date (over ${limits.maxSaleAgeMonths}).` });
    if (s.distanceKm !== null && s.distanceKm > limits.maxDistanceKm) checks.push({ code: 'far-sale', saleId: s.saleId, message: `${s.address} is ${s.distanceKm.toFixed(2)} km from the subject (over ${limits.maxDistanceKm.toFixed(2)} km).` });
    if (s.flaggedByFit) checks.push({ code: 'flagged-sale', saleId: s.saleId, message: `${s.address} is flagged by the fit: ${s.flaggedByFit}` });
    const row = rows[i];
    if (row.netOverLimit) checks.push({ code: 'net-over', saleId: s.saleId, message: `${s.address}: net adjustment ${pct(row.netAdjustmentPct)} is above ${limits.netLimitPct}% (a legacy guideline many reviewers still apply; common practice, no single source).` });
    if (row.grossOverLimit) checks.push({ code: 'gross-over', saleId: s.saleId, message: `${s.address}: gross adjustment ${pct(row.grossAdjustmentPct)} is above ${limits.grossLimitPct}% (a legacy guideline many reviewers still apply; common practice, no single source).` });
  }
  if (limits.checkBracketing && input.sales.length > 0) {
    if (input.sales.every((s) => s.floorArea > input.subjectArea)) checks.push({ code: 'not-bracketed', saleId: null, message: 'Every grid sale is larger than the subject: the floor areas do not bracket it.' });
    else if (input.sales.every((s) => s.floorArea < input.subjectArea)) checks.push({ code: 'not-bracketed', saleId: null, message: 'Every grid sale is smaller than the subject: the floor areas do not bracket it.' });
  }
  if (rows.length > 0 && !weightsOk) checks.push({ code: 'weights-total', saleId: null, message: `The weights total ${weightsTotalPct.toFixed(2)}%; they must total 100%.` });
  if (opinion !== null && range && (opinion < range[0] || opinion > range[1])) checks.push({ code: 'outside-range', saleId: null, message: 'The opinion of value falls outside the range of adjusted prices.' });
  return checks;
}

/** Whether a floor-area rate needs a written justification: when the correlation gate fails, or the
 * appraiser typed a rate instead of the fit's. */
export function rateNeedsJustification(gatePasses: boolean, typedRate: number | null): boolean {
  return !gatePasses || typedRate !== null;
}
