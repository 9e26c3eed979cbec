// The market analysis of one assignment, pure: groups the usable sales by neighbourhood, fits price
// on floor area per group and pooled, applies the correlation gate, predicts at the subject, flags
// the sales the line cannot explain (in words), and fits the market-conditions trend.
import type { Analysis, FlaggedSale, GroupAnalysis, Trend } from '../contracts/analysis';
import { saleTypeLabels, type SaleType } from '../contracts/sales';
import { median } from 'simple-statistics';
import { describeFlags } from './flag-reasons';
import { summariseFit } from './fit-summary';
import { fitColumns, fitScratch } from './fit-columns';
import type { FitPoint } from './regression';
import { revealMaskedOutliers } from './masked-outliers';
import { flagsOf, HAS_EXTERNAL, HAS_INTERNAL, OUTLIER } from './point-diagnostics';
import { compareNames, groupBy, pricesById } from './sale-groups';
import { fitTrendPoints, monthsBetween, timeAdjustedPrice, utcDayMs, type TrendPoint } from './time-trend';

type AnalysedPoint = GroupAnalysis['points'][number];
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

/** Each usable sale's figures, read from the sale objects once, in order (indexed like `usable`). */
interface SaleColumns {
  usable: readonly AnalysisSale[];
  ids: number[];
  floorArea: Float64Array;
  /** 1 where the floor area is a finite number. */
  floorAreaOk: Uint8Array;
  /** The prices the floor-area fits use (time-adjusted or as sold). */
  prices: Float64Array;
}

/**
 * The group's sales are `usable[members[k]]`. The fit reads floor area and price from the columns
 * into its scratch columns (fit-columns.ts), and each point object is built once, with its sale
 * id, from the fit's columns.
 */
function analyseGroup(name: string, pooled: boolean, sales: SaleColumns, members: readonly number[], x0: number | null, unit: 'sqft' | 'sqm'): GroupAnalysis {
  const n = members.length;
  const saleAt = (k: number) => sales.usable[members[k]];
  const { xs, ys } = fitScratch(n);
  let bad = -1;
  for (let k = 0; k < n; k++) {
    const i = members[k];
    const y = sales.prices[i];
    if (bad < 0 && !(sales.floorAreaOk[i] && Number.isFinite(y))) bad = k;
    xs[k] = sales.floorArea[i];
    ys[k] = y;
  }
  const fit = fitColumns(n, bad, x0 !== null ? { x0 } : {});
  if (!fit.ok) {
    return { neighbourhood: name, pooled, n: fit.n, fit: null, refusal: { reason: fit.reason, message: fit.message }, gate: null, prediction: null, points: [], flagged: [], warnings: [fit.message] };
  }
  const { residuals, points: columns } = fitScratch(n);
  const points = new Array<AnalysedPoint>(n);
  const firstPassOutliers: number[] = [];
  let anyFlag = false;
  for (let k = 0; k < n; k++) {
    const state = columns.state[k];
    const hasInternal = (state & HAS_INTERNAL) !== 0;
    points[k] = {
      saleId: sales.ids[members[k]], x: xs[k], y: ys[k], fitted: columns.fitted[k], residual: residuals[k], leverage: columns.leverage[k],
      internallyStudentized: hasInternal ? columns.internal[k] : null,
      externallyStudentized: state & HAS_EXTERNAL ? columns.external[k] : null,
      cooksDistance: hasInternal ? columns.cooks[k] : null,
      flags: flagsOf(state),
    };
    if (state & OUTLIER) firstPassOutliers.push(k);
    if (state & FLAGS) anyFlag = true;
  }
  // Flags are judged within a neighbourhood: across neighbourhoods, price levels differ by design.
  const flagged: FlaggedSale[] = [];
  if (!pooled && anyFlag) {
    const context = { n: fit.n, xMin: fit.xMin, xMax: fit.xMax };
    const xMedian = median(points.map((p) => p.x));
    for (let k = 0; k < n; k++) {
      const p = points[k];
      if (p.flags.length > 0) flagged.push(flaggedSale(saleAt(k), p, `${describeFlags(p, context)}${areaWords(p.x, xMedian, unit)}`, []));
    }
  }
  for (const hidden of pooled ? [] : revealMaskedOutliers(points, firstPassOutliers, points)) {
    const sale = saleAt(hidden.index);
    const names = hidden.setAside.map((k) => saleAt(k).address).join(', ');
    const pct = hidden.point.fitted > 0 ? Math.round((Math.abs(hidden.point.residual) / hidden.point.fitted) * 100) : 0;
    const words = `once ${names} ${hidden.setAside.length === 1 ? 'is' : 'are'} set aside, it sold ${pct}% ${hidden.point.residual < 0 ? 'below' : 'above'} the line, far outside the scatter of the other sales (the outlier${hidden.setAside.length === 1 ? '' : 's'} had hidden it)`;
    const existing = flagged.find((f) => f.saleId === sale.id);
    if (existing) {
      existing.reason = `${existing.reason} Also: ${words}.`;
      existing.revealedWhenSetAside = hidden.setAside.map((k) => saleAt(k).id);
      if (!existing.flags.includes('outlier')) existing.flags = [...existing.flags, 'outlier'];
    } else {
      flagged.push(flaggedSale(sale, { ...hidden.point, flags: ['outlier'] }, words, hidden.setAside.map((k) => saleAt(k).id)));
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

export function analyseMarket(input: AnalysisInput): Analysis {
  const usable: AnalysisSale[] = [];
  const excluded: Analysis['excluded'] = [];
  for (const s of input.sales) {
    if (!s.excluded) usable.push(s);
    else excluded.push({ saleId: s.id, address: s.address, reason: s.exclusionReason });
  }
  const { members: byNeighbourhood, groupOf } = groupBy(usable, NO_NEIGHBOURHOOD);
  const subjectName = input.subject.neighbourhood;
  const names = [...byNeighbourhood.keys()].sort((a, b) => (a === subjectName ? -1 : b === subjectName ? 1 : compareNames(a, b)));

  // Each sale's figures, read once and in order: the later passes go neighbourhood by
  // neighbourhood, and would otherwise read the sale objects scattered through memory, many times.
  const n = usable.length;
  const effectiveMs = utcDayMs(input.effectiveDate);
  const ids = new Array<number>(n);
  const salePrice = new Float64Array(n);
  const floorArea = new Float64Array(n);
  const floorAreaOk = new Uint8Array(n);
  const pricePerArea = new Float64Array(n);
  const months = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const s = usable[i];
    ids[i] = s.id;
    salePrice[i] = s.salePrice;
    floorArea[i] = s.floorArea;
    floorAreaOk[i] = Number.isFinite(s.floorArea) ? 1 : 0;
    pricePerArea[i] = s.salePrice / s.floorArea;
    months[i] = monthsBetween(utcDayMs(s.saleDate), effectiveMs);
  }
  const trendPoint = (i: number): TrendPoint => ({ saleId: ids[i], monthsBefore: months[i], pricePerArea: pricePerArea[i] });
  const trends: Trend[] = names.map((name) => fitTrendPoints(name, byNeighbourhood.get(name)!.map(trendPoint)));
  const everyone = new Array<number>(n);
  for (let i = 0; i < n; i++) everyone[i] = i;
  const pooledTrend = fitTrendPoints(POOLED, everyone.map(trendPoint));
  trends.push(pooledTrend);

  // Prices used by the floor-area fits: time-adjusted with the sale's own neighbourhood trend (the
  // pooled one where its neighbourhood has none) when the appraiser turns the adjustment on.
  const rateOf = new Map(names.map((name, g) => [name, trends[g].monthlyRate ?? pooledTrend.monthlyRate]));
  const rates = [...byNeighbourhood.keys()].map((name) => rateOf.get(name)!); // in groupOf's order
  const prices = new Float64Array(n);
  for (let i = 0; i < n; i++) prices[i] = input.timeAdjustment ? timeAdjustedPrice(salePrice[i], months[i], rates[groupOf[i]]) : salePrice[i];
  const adjustedPrices = pricesById(usable, prices, names.map((name) => byNeighbourhood.get(name)!));
  const columns: SaleColumns = { usable, ids, floorArea, floorAreaOk, prices };
  const x0 = input.subject.floorArea;
  const groups = names.map((name) => analyseGroup(name, false, columns, byNeighbourhood.get(name)!, name === subjectName ? x0 : null, input.areaUnit));
  groups.push(analyseGroup(POOLED, true, columns, everyone, x0, input.areaUnit));

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
    excluded,
    adjustedPrices,
    warnings,
  };
}
