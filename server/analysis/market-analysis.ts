// The market analysis of one assignment, pure: groups the usable sales by neighbourhood, fits price
// on floor area per group and pooled, applies the correlation gate, predicts at the subject, flags
// the sales the line cannot explain (in words), and fits the market-conditions trend.
import type { Analysis, FlaggedSale, GroupAnalysis, Trend } from '../contracts/analysis';
import { saleTypeLabels, type SaleType } from '../contracts/sales';
import { median } from 'simple-statistics';
import { describeFlags } from './flag-reasons';
import { summariseFit } from './fit-summary';
import { fitLine, type FitPoint } from './regression';
import { revealMaskedOutliers } from './masked-outliers';
import { fitTrend, monthsBefore, timeAdjustedPrice } from './time-trend';

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
export const NO_NEIGHBOURHOOD = 'No neighbourhood';

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

function analyseGroup(name: string, pooled: boolean, sales: readonly AnalysisSale[], prices: Map<number, number>, x0: number | null, unit: 'sqft' | 'sqm'): GroupAnalysis {
  const fit = fitLine(
    sales.map((s) => ({ x: s.floorArea, y: prices.get(s.id)! })),
    x0 !== null ? { x0 } : {},
  );
  if (!fit.ok) {
    return { neighbourhood: name, pooled, n: fit.n, fit: null, refusal: { reason: fit.reason, message: fit.message }, gate: null, prediction: null, points: [], flagged: [], warnings: [fit.message] };
  }
  const points = fit.points.map((p, i) => ({ saleId: sales[i].id, ...p }));
  const context = { n: fit.n, xMin: fit.xMin, xMax: fit.xMax };
  const xMedian = median(points.map((p) => p.x));
  // Flags are judged within a neighbourhood: across neighbourhoods, price levels differ by design.
  const flagged: FlaggedSale[] = points
    .map((p, i) => ({ p, sale: sales[i] }))
    .filter(({ p }) => p.flags.length > 0 && !pooled)
    .map(({ p, sale }) => flaggedSale(sale, p, `${describeFlags(p, context)}${areaWords(p.x, xMedian, unit)}`, []));
  const firstPassOutliers = points.flatMap((p, i) => (p.flags.includes('outlier') ? [i] : []));
  for (const hidden of pooled ? [] : revealMaskedOutliers(points, firstPassOutliers)) {
    const sale = sales[hidden.index];
    const names = hidden.setAside.map((i) => sales[i].address).join(', ');
    const pct = hidden.point.fitted > 0 ? Math.round((Math.abs(hidden.point.residual) / hidden.point.fitted) * 100) : 0;
    const words = `once ${names} ${hidden.setAside.length === 1 ? 'is' : 'are'} set aside, it sold ${pct}% ${hidden.point.residual < 0 ? 'below' : 'above'} the line, far outside the scatter of the other sales (the outlier${hidden.setAside.length === 1 ? '' : 's'} had hidden it)`;
    const existing = flagged.find((f) => f.saleId === sale.id);
    if (existing) {
      existing.reason = `${existing.reason} Also: ${words}.`;
      existing.revealedWhenSetAside = hidden.setAside.map((i) => sales[i].id);
      if (!existing.flags.includes('outlier')) existing.flags = [...existing.flags, 'outlier'];
    } else {
      flagged.push(flaggedSale(sale, { ...hidden.point, flags: ['outlier'] }, words, hidden.setAside.map((i) => sales[i].id)));
    }
  }
  flagged.sort((a, b) => Math.abs(b.externallyStudentized ?? 0) - Math.abs(a.externallyStudentized ?? 0));
  const gate = correlationGate(fit.r);
  const warnings: string[] = [];
  if (fit.n < SMALL_SAMPLE) warnings.push(`Only ${fit.n} sales: a line through so few points moves a lot with each one.`);
  if (!gate.passes) warnings.push(gate.message);
  if (gate.passes && fit.slope <= 0) warnings.push('The line falls as floor area rises: check the flagged sales before using the slope.');
  if (fit.prediction?.extrapolated) {
    warnings.push(`The subject's floor area (${formatArea(fit.prediction.x0, unit)}) lies outside the sales' range (${formatArea(fit.xMin, unit)} to ${formatArea(fit.xMax, unit)}): the estimate extrapolates.`);
  }
  return { neighbourhood: name, pooled, n: fit.n, fit: summariseFit(fit), refusal: null, gate, prediction: fit.prediction ?? null, points, flagged, warnings };
}

function groupBy(sales: readonly AnalysisSale[]): Map<string, AnalysisSale[]> {
  const groups = new Map<string, AnalysisSale[]>();
  for (const s of sales) {
    const key = s.neighbourhood ?? NO_NEIGHBOURHOOD;
    let list = groups.get(key);
    if (!list) groups.set(key, (list = []));
    list.push(s);
  }
  return groups;
}

export function analyseMarket(input: AnalysisInput): Analysis {
  const usable = input.sales.filter((s) => !s.excluded);
  const byNeighbourhood = groupBy(usable);
  const names = [...byNeighbourhood.keys()].sort((a, b) => (a === input.subject.neighbourhood ? -1 : b === input.subject.neighbourhood ? 1 : a.localeCompare(b)));
  const toTrendSales = (list: readonly AnalysisSale[]) => list.map((s) => ({ saleId: s.id, salePrice: s.salePrice, saleDate: s.saleDate, floorArea: s.floorArea }));

  const trends: Trend[] = names.map((name) => fitTrend(name, toTrendSales(byNeighbourhood.get(name)!), input.effectiveDate));
  const pooledTrend = fitTrend(POOLED, toTrendSales(usable), input.effectiveDate);
  trends.push(pooledTrend);

  // Prices used by the floor-area fits: time-adjusted with the sale's own neighbourhood trend (the
  // pooled one where its neighbourhood has none) when the appraiser turns the adjustment on.
  const prices = new Map<number, number>();
  for (const [i, name] of names.entries()) {
    const rate = trends[i].monthlyRate ?? pooledTrend.monthlyRate;
    for (const s of byNeighbourhood.get(name)!) {
      prices.set(s.id, input.timeAdjustment ? timeAdjustedPrice(s.salePrice, monthsBefore(s.saleDate, input.effectiveDate), rate) : s.salePrice);
    }
  }

  const x0 = input.subject.floorArea;
  const groups = names.map((name) => analyseGroup(name, false, byNeighbourhood.get(name)!, prices, name === input.subject.neighbourhood ? x0 : null, input.areaUnit));
  groups.push(analyseGroup(POOLED, true, usable, prices, x0, input.areaUnit));

  const warnings: string[] = [];
  const subjectTrend = trends.find((t) => t.neighbourhood === input.subject.neighbourhood)?.fit;
  if (input.timeAdjustment && subjectTrend && subjectTrend.slopeInterval[0] < 0 && subjectTrend.slopeInterval[1] > 0) {
    warnings.push('The market-conditions trend of the subject’s neighbourhood cannot be told apart from no change (its 95% interval spans zero): weigh the time adjustment with care.');
  }
  if (x0 === null) warnings.push('Enter the subject’s floor area to get an estimate at the subject.');
  if (!input.subject.neighbourhood) warnings.push('Place the subject on the map or type its neighbourhood to pick its neighbourhood’s fit.');
  else if (!byNeighbourhood.has(input.subject.neighbourhood)) warnings.push(`No usable sale lies in ${input.subject.neighbourhood}, the subject’s neighbourhood.`);

  return {
    assignmentId: input.assignmentId,
    dataRevision: input.dataRevision,
    areaUnit: input.areaUnit,
    currency: input.currency,
    effectiveDate: input.effectiveDate,
    timeAdjustment: input.timeAdjustment,
    subject: input.subject,
    subjectGroup: input.subject.neighbourhood && byNeighbourhood.has(input.subject.neighbourhood) ? input.subject.neighbourhood : null,
    groups,
    trends,
    excluded: input.sales.filter((s) => s.excluded).map((s) => ({ saleId: s.id, address: s.address, reason: s.exclusionReason })),
    adjustedPrices: Object.fromEntries([...prices].map(([id, p]) => [String(id), p])),
    warnings,
  };
}
