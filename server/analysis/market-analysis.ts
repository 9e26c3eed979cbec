// The market analysis of one assignment, pure: groups the usable sales by neighbourhood, fits price
// on floor area per group and pooled, applies the correlation gate, predicts at the subject, flags
// the sales the line cannot explain (in words), and fits the market-conditions trend. The numbers
// come from market-columns.ts; this module puts the answer together from them, in words.
import { expandAnalysis, type Analysis, type AnalysisWire, type FlaggedSale, type PointColumnsWire } from '../contracts/analysis';
import { saleTypeLabels, type SaleType } from '../contracts/sales';
import { median } from 'simple-statistics';
import { describeFlags } from './flag-reasons';
import type { FitColumnsOut } from './lean-fit';
import { analyseColumns, type MarketColumns } from './market-columns';
import { NO_NEIGHBOURHOOD, readSales } from './sale-columns';
import type { FitPoint } from './regression';
import { pointAt } from './point-diagnostics';

/** Any of the four flag bits of a point's state (point-diagnostics.ts). */
const FLAGS = 15;

export interface AnalysisSale {
  id: number;
  address: string;
  neighbourhood: string | null;
  salePrice: number;
  saleDate: string;
  floorArea: number;
  saleType: SaleType;
  excluded: boolean;
  exclusionReason: string | null;
  inGrid: boolean;
}

export interface AnalysisInput {
  assignmentId: number;
  dataRevision: number;
  areaUnit: 'sqft' | 'sqm';
  currency: string;
  effectiveDate: string;
  timeAdjustment: boolean;
  subject: { floorArea: number | null; neighbourhood: string | null };
  sales: readonly AnalysisSale[];
}

/** |r| below this and the slope is not market support for a floor-area rate (common practice, no single source). */
export const CORRELATION_GATE = 0.5;
export const SMALL_SAMPLE = 10;
export const POOLED = 'All neighbourhoods';
export { NO_NEIGHBOURHOOD };

const fmt = (v: number, digits = 2) => v.toFixed(digits);

export function correlationGate(r: number | null) {
  if (r === null) return { passes: false, threshold: CORRELATION_GATE, message: 'Every sale has the same price, so there is no relationship to measure.' };
  const passes = Math.abs(r) >= CORRELATION_GATE;
  return {
    passes,
    threshold: CORRELATION_GATE,
    message: passes
      ? `r = ${fmt(r)}: price and floor area move together strongly enough (|r| ≥ ${CORRELATION_GATE}, common practice) for the slope to support a floor-area rate.`
      : `r = ${fmt(r)} is weaker than ±${CORRELATION_GATE}: the slope is not market support for a floor-area rate here. Type a rate and write down its support.`,
  };
}

function flaggedSale(sale: AnalysisSale, p: FitPoint, words: string, revealedWhenSetAside: number[]): FlaggedSale {
  return {
    saleId: sale.id,
    address: sale.address,
    neighbourhood: sale.neighbourhood ?? NO_NEIGHBOURHOOD,
    saleType: sale.saleType,
    flags: p.flags,
    reason: `${words.charAt(0).toUpperCase()}${words.slice(1)}. Sale type on record: ${saleTypeLabels[sale.saleType].toLowerCase()}.`,
    residual: p.residual,
    residualPct: p.fitted > 0 ? p.residual / p.fitted : null,
    externallyStudentized: p.externallyStudentized,
    cooksDistance: p.cooksDistance,
    leverage: p.leverage,
    inGrid: sale.inGrid,
    revealedWhenSetAside,
  };
}

/** A floor area this far from the neighbourhood's median is more likely a typing error than a house. */
export const AREA_TYPO_RATIO = 3;

function areaWords(x: number, xMedian: number, unit: 'sqft' | 'sqm'): string {
  const ratio = x / xMedian;
  if (ratio < AREA_TYPO_RATIO && ratio > 1 / AREA_TYPO_RATIO) return '';
  const times = ratio >= 1 ? `${ratio.toFixed(1)} times` : `${(1 / ratio).toFixed(1)} times smaller than`;
  return `; its floor area (${formatArea(x, unit)}) is ${times} the median of this neighbourhood's sales: check it for a typing error`;
}

export function formatArea(v: number, unit: 'sqft' | 'sqm'): string {
  return `${Math.round(v).toLocaleString('en-US')} ${unit === 'sqft' ? 'ft²' : 'm²'}`;
}

/** Figures in a column slice as a plain array (NaN stays NaN; JSON writes it as null). */
function slice(c: Float64Array | Uint8Array, from: number, to: number): number[] {
  const out = new Array<number>(to - from);
  for (let k = from; k < to; k++) out[k - from] = c[k];
  return out;
}

function pointColumnsWire(c: FitColumnsOut, from: number, to: number): PointColumnsWire {
  const flags = new Array<number>(to - from);
  for (let k = from; k < to; k++) flags[k - from] = c.state[k] & FLAGS;
  return {
    fitted: slice(c.fitted, from, to), residual: slice(c.residual, from, to), leverage: slice(c.leverage, from, to),
    internallyStudentized: slice(c.internal, from, to), externallyStudentized: slice(c.external, from, to), cooksDistance: slice(c.cooks, from, to),
    flags,
  };
}

type GroupWire = AnalysisWire['groups'][number];

/** One fit of the columns as the answer reports it: figures, gate, prediction, flagged sales in words, warnings. */
function groupWire(m: MarketColumns, g: number, unit: 'sqft' | 'sqm'): GroupWire {
  const { sales } = m;
  const G = sales.names.length;
  const pooled = g === G;
  const name = pooled ? POOLED : sales.names[g];
  const from = pooled ? 0 : sales.start[g];
  const to = pooled ? sales.start[G] : sales.start[g + 1];
  const fit = m.fits[g];
  if (!fit.ok) {
    return { neighbourhood: name, pooled, n: fit.n, from, to, fit: null, refusal: { reason: fit.reason, message: fit.message }, gate: null, prediction: null, points: null, flagged: [], warnings: [fit.message] };
  }
  const columns = pooled ? m.pooledPoints : m.points;
  const saleAt = (k: number) => sales.usable[sales.order[k]];
  const pointOf = (k: number) => pointAt(sales.floorArea, m.prices, columns.residual, columns, k);
  // Flags are judged within a neighbourhood: across neighbourhoods, price levels differ by design.
  const flagged: FlaggedSale[] = [];
  if (!pooled) {
    let anyFlag = false;
    for (let k = from; k < to && !anyFlag; k++) anyFlag = (columns.state[k] & FLAGS) !== 0;
    if (anyFlag) {
      const context = { n: fit.summary.n, xMin: fit.summary.xMin, xMax: fit.summary.xMax };
      const xMedian = median(slice(sales.floorArea, from, to));
      for (let k = from; k < to; k++) {
        if (!(columns.state[k] & FLAGS)) continue;
        const p = pointOf(k);
        flagged.push(flaggedSale(saleAt(k), p, `${describeFlags(p, context)}${areaWords(p.x, xMedian, unit)}`, []));
      }
    }
  }
  for (const hidden of m.revealed[g]) {
    const sale = saleAt(from + hidden.index);
    const names = hidden.setAside.map((k) => saleAt(from + k).address).join(', ');
    const pct = hidden.point.fitted > 0 ? Math.round((Math.abs(hidden.point.residual) / hidden.point.fitted) * 100) : 0;
    const words = `once ${names} ${hidden.setAside.length === 1 ? 'is' : 'are'} set aside, it sold ${pct}% ${hidden.point.residual < 0 ? 'below' : 'above'} the line, far outside the scatter of the other sales (the outlier${hidden.setAside.length === 1 ? '' : 's'} had hidden it)`;
    const setAsideIds = hidden.setAside.map((k) => saleAt(from + k).id);
    const existing = flagged.find((f) => f.saleId === sale.id);
    if (existing) {
      existing.reason = `${existing.reason} Also: ${words}.`;
      existing.revealedWhenSetAside = setAsideIds;
      if (!existing.flags.includes('outlier')) existing.flags = [...existing.flags, 'outlier'];
    } else {
      flagged.push(flaggedSale(sale, { ...hidden.point, flags: ['outlier'] }, words, setAsideIds));
    }
  }
  flagged.sort((a, b) => Math.abs(b.externallyStudentized ?? 0) - Math.abs(a.externallyStudentized ?? 0));
  const { summary, prediction } = fit;
  const gate = correlationGate(summary.r);
  const warnings: string[] = [];
  if (summary.n < SMALL_SAMPLE) warnings.push(`Only ${summary.n} sales: a line through so few points moves a lot with each one.`);
  if (!gate.passes) warnings.push(gate.message);
  if (gate.passes && summary.slope <= 0) warnings.push('The line falls as floor area rises: check the flagged sales before using the slope.');
  if (prediction?.extrapolated) {
    warnings.push(`The subject's floor area (${formatArea(prediction.x0, unit)}) lies outside the sales' range (${formatArea(summary.xMin, unit)} to ${formatArea(summary.xMax, unit)}): the estimate extrapolates.`);
  }
  return { neighbourhood: name, pooled, n: summary.n, from, to, fit: summary, refusal: null, gate, prediction, points: pointColumnsWire(columns, from, to), flagged, warnings };
}

/** The answer, with every per-sale figure in columns (the endpoint sends this; expandAnalysis makes rows of it). */
export function analysisWire(input: AnalysisInput, m: MarketColumns = analyseColumns(readSales(input), { timeAdjustment: input.timeAdjustment, x0: input.subject.floorArea })): AnalysisWire {
  const { sales } = m;
  const G = sales.names.length;
  const n = sales.start[G];
  const trends: AnalysisWire['trends'] = [];
  for (let g = 0; g <= G; g++) {
    const fit = m.trends[g];
    const rate = m.monthlyRates[g];
    const [from, to] = g < G ? [sales.start[g], sales.start[g + 1]] : [0, n];
    const neighbourhood = g < G ? sales.names[g] : POOLED;
    trends.push(
      fit.ok
        ? { neighbourhood, n: fit.summary.n, from, to, fit: fit.summary, refusal: null, monthlyRate: Number.isNaN(rate) ? null : rate }
        : { neighbourhood, n: fit.n, from, to, fit: null, refusal: { reason: fit.reason, message: fit.message }, monthlyRate: null },
    );
  }
  const groups: GroupWire[] = [];
  for (let g = 0; g <= G; g++) groups.push(groupWire(m, g, input.areaUnit));

  const warnings: string[] = [];
  const subjectTrend = trends.find((t) => t.neighbourhood === input.subject.neighbourhood)?.fit;
  if (input.timeAdjustment && subjectTrend && subjectTrend.slopeInterval[0] < 0 && subjectTrend.slopeInterval[1] > 0) {
    warnings.push('The market-conditions trend of the subject’s neighbourhood cannot be told apart from no change (its 95% interval spans zero): weigh the time adjustment with care.');
  }
  if (input.subject.floorArea === null) warnings.push('Enter the subject’s floor area to get an estimate at the subject.');
  if (!input.subject.neighbourhood) warnings.push('Place the subject on the map or type its neighbourhood to pick its neighbourhood’s fit.');
  else if (sales.subjectGroup < 0) warnings.push(`No usable sale lies in ${input.subject.neighbourhood}, the subject’s neighbourhood.`);

  return {
    assignmentId: input.assignmentId,
    dataRevision: input.dataRevision,
    areaUnit: input.areaUnit,
    currency: input.currency,
    effectiveDate: input.effectiveDate,
    timeAdjustment: input.timeAdjustment,
    subject: input.subject,
    subjectGroup: input.subject.neighbourhood && sales.subjectGroup >= 0 ? input.subject.neighbourhood : null,
    sales: { saleId: slice(sales.saleId, 0, n), x: slice(sales.floorArea, 0, n), y: slice(m.prices, 0, n), monthsBefore: slice(sales.monthsBefore, 0, n), pricePerArea: slice(sales.pricePerArea, 0, n) },
    groups,
    trends,
    excluded: sales.excluded.map((s) => ({ saleId: s.id, address: s.address, reason: s.exclusionReason })),
    warnings,
  };
}

/** The analysis with its per-sale rows (for the report snapshot, the grid and the tests). */
export function analyseMarket(input: AnalysisInput): Analysis {
  return expandAnalysis(analysisWire(input));
}


const cents = (v: number) => Math.round(v * 100) / 100;
const fourDecimals = (v: number) => Math.round(v * 1e4) / 1e4;
/**
 * Six significant digits (NaN and 0 as they are): an integer times or over an exact power of ten
 * (10^k is exact up to k = 22), so the double is the one nearest the short decimal and prints as it.
 */
function sixDigits(v: number): number {
  if (v === 0 || !Number.isFinite(v)) return v;
  const shift = 5 - Math.floor(Math.log10(Math.abs(v)));
  if (shift > 22 || shift < -22) return Number(v.toPrecision(6));
  return shift >= 0 ? Math.round(v * 10 ** shift) / 10 ** shift : Math.round(v / 10 ** -shift) * 10 ** -shift;
}
function rounded(column: number[], round: (v: number) => number): number[] {
  const out = new Array<number>(column.length);
  for (let k = 0; k < column.length; k++) {
    const v = column[k];
    out[k] = v === null ? v : round(v);
  }
  return out;
}

/**
 * The per-sale figures rounded for the wire: prices, fitted values and residuals to the cent,
 * months to 1e-4 (under a minute), leverage, studentized residuals and Cook's distance to six
 * significant digits. The page and the report show fewer; the flags were decided at full precision
 * and travel as they are. The summaries (slopes, r, intervals) keep every digit.
 */
export function transportWire(wire: AnalysisWire): AnalysisWire {
  const { sales } = wire;
  return {
    ...wire,
    sales: { saleId: sales.saleId, x: rounded(sales.x, cents), y: rounded(sales.y, cents), monthsBefore: rounded(sales.monthsBefore, fourDecimals), pricePerArea: rounded(sales.pricePerArea, cents) },
    groups: wire.groups.map((group) => {
      const c = group.points;
      if (!c) return group;
      return {
        ...group,
        points: {
          fitted: rounded(c.fitted, cents), residual: rounded(c.residual, cents), leverage: rounded(c.leverage, sixDigits),
          internallyStudentized: rounded(c.internallyStudentized as number[], sixDigits), externallyStudentized: rounded(c.externallyStudentized as number[], sixDigits),
          cooksDistance: rounded(c.cooksDistance as number[], sixDigits), flags: c.flags,
        },
      };
    }),
  };
}
