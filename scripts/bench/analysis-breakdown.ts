// Where the time of one full analysis goes, phase by phase, on the same input as analysis.bench.ts.
// Each phase redoes one part of analyseMarket's work with the same exported pieces it uses
// (fit-columns.ts, point-diagnostics.ts, time-trend.ts, masked-outliers.ts, flag-reasons.ts), so
// the parts are measured alone; "the rest" is whatever the full analysis takes beyond their sum.
// The computing phases make no objects per point; the objects of the answer are timed apart, made
// again from an earlier answer's figures and kept to the end, as the analysis keeps them.
import { fitColumns, fitScratch } from '../../server/analysis/fit-columns';
import { describeFlags } from '../../server/analysis/flag-reasons';
import type { Analysis } from '../../server/contracts/analysis';
import { analyseMarket, type AnalysisInput, type AnalysisSale } from '../../server/analysis/market-analysis';
import { revealMaskedOutliers } from '../../server/analysis/masked-outliers';
import { diagnoseColumns, flagsOf, HIGH_LEVERAGE, INFLUENTIAL, OUTLIER, pointAt, UNUSUAL } from '../../server/analysis/point-diagnostics';
import type { FitPoint, LineFitOk, PointFlag } from '../../server/analysis/regression';
import { monthsBetween, utcDayMs } from '../../server/analysis/time-trend';

/** The sales of each neighbourhood, and then all of them (the pooled group). */
function groupsOf(sales: readonly AnalysisSale[]): AnalysisSale[][] {
  const byName = new Map<string, AnalysisSale[]>();
  for (const s of sales) {
    const key = s.neighbourhood ?? '';
    if (!byName.has(key)) byName.set(key, []);
    byName.get(key)!.push(s);
  }
  return [...byName.values(), [...sales]];
}

function fitGroup(group: readonly AnalysisSale[]): LineFitOk {
  const { xs, ys } = fitScratch(group.length);
  group.forEach((s, k) => {
    xs[k] = s.floorArea;
    ys[k] = s.salePrice;
  });
  return fitColumns(group.length, -1) as LineFitOk;
}

function fitTrend(months: Float64Array, pricePerArea: Float64Array): void {
  const { xs, ys } = fitScratch(months.length);
  xs.set(months);
  ys.set(pricePerArea);
  fitColumns(months.length, -1);
}

const FLAG_BITS: Record<PointFlag, number> = { unusual: UNUSUAL, outlier: OUTLIER, influential: INFLUENTIAL, 'high-leverage': HIGH_LEVERAGE };
const column = <T>(list: readonly T[], pick: (item: T) => number | null) => Float64Array.from(list, (item) => pick(item) ?? Number.NaN);
const orNull = (v: number) => (Number.isNaN(v) ? null : v);

/**
 * The figures of an analysis's answer in typed arrays (no objects per point, so that holding them
 * costs the collector nothing), and a function that makes every object of that answer again.
 */
function answerMaker(analysis: Analysis): () => number {
  const groups = analysis.groups.map((g) => ({
    columns: (['saleId', 'x', 'y', 'fitted', 'residual', 'leverage', 'internallyStudentized', 'externallyStudentized', 'cooksDistance'] as const).map((key) => column(g.points, (p) => p[key])),
    flags: Uint8Array.from(g.points, (p) => p.flags.reduce((bits, f) => bits | FLAG_BITS[f], 0)),
    flagged: g.flagged,
  }));
  const trends = analysis.trends.map((t) => (['saleId', 'monthsBefore', 'pricePerArea'] as const).map((key) => column(t.points, (p) => p[key])));
  const priceIds = Object.keys(analysis.adjustedPrices);
  const prices = column(priceIds, (id) => analysis.adjustedPrices[id]);
  return () => {
    const points = groups.map(({ columns: [id, x, y, fitted, residual, leverage, internal, external, cooks], flags }) =>
      Array.from(id, (saleId, k) => ({
        saleId, x: x[k], y: y[k], fitted: fitted[k], residual: residual[k], leverage: leverage[k],
        internallyStudentized: orNull(internal[k]), externallyStudentized: orNull(external[k]), cooksDistance: orNull(cooks[k]), flags: flagsOf(flags[k]),
      })));
    const flagged = groups.map((g) => g.flagged.map((f) => ({ ...f, flags: [...f.flags], reason: `${f.reason} ` })));
    const trendPoints = trends.map(([id, months, pricePerArea]) => Array.from(id, (saleId, k) => ({ saleId, monthsBefore: months[k], pricePerArea: pricePerArea[k] })));
    const byId: Record<string, number> = {};
    priceIds.forEach((key, k) => (byId[key] = prices[k]));
    return points.length + flagged.length + trendPoints.length;
  };
}

/** Phases to time (each a function to run), and how their times make up the breakdown. */
export function breakdownPhases(input: AnalysisInput) {
  const usable = input.sales.filter((s) => !s.excluded);
  const groups = groupsOf(usable);
  const effectiveMs = utcDayMs(input.effectiveDate);
  const answer = answerMaker(analyseMarket(input));
  const trendColumns = groups.map((group) => ({
    months: Float64Array.from(group, (s) => monthsBetween(utcDayMs(s.saleDate), effectiveMs)),
    pricePerArea: Float64Array.from(group, (s) => s.salePrice / s.floorArea),
  }));
  // What the masking pass and the flag words start from: only the groups with an outlier, and only
  // the flagged points (holding every point of every fit would weigh on the collector throughout).
  const masked: Array<{ points: FitPoint[]; outliers: number[] }> = [];
  const flagged: Array<{ context: { n: number; xMin: number; xMax: number }; points: FitPoint[] }> = [];
  for (const group of groups.slice(0, -1)) {
    const fit = fitGroup(group);
    const { xs, ys, residuals, points } = fitScratch(group.length);
    const all = Array.from({ length: group.length }, (_, k) => pointAt(xs, ys, residuals, points, k));
    const outliers = all.flatMap((p, k) => (p.flags.includes('outlier') ? [k] : []));
    if (outliers.length > 0) masked.push({ points: all, outliers });
    flagged.push({ context: { n: fit.n, xMin: fit.xMin, xMax: fit.xMax }, points: all.filter((p) => p.flags.length > 0) });
  }

  const phases = {
    dates: () => usable.forEach((s) => monthsBetween(utcDayMs(s.saleDate), effectiveMs)),
    trendFits: () => trendColumns.forEach(({ months, pricePerArea }) => fitTrend(months, pricePerArea)),
    /** Sums, ANOVA, t and p, with the per-point diagnostics into columns (no objects). */
    fits: () => groups.forEach(fitGroup),
    /** The same, then the per-point diagnostics once more on each fit's own columns. */
    fitsThenDiagnostics: () => {
      for (const group of groups) {
        const fit = fitGroup(group);
        const { xs, ys, dx, dy, residuals, points } = fitScratch(group.length);
        const sxx = (fit.residualStdError / fit.slopeStdError) ** 2;
        diagnoseColumns({ n: group.length, xs, ys, dx, dy, residuals, sxx, sst: fit.sst, s: fit.residualStdError, yMean: fit.yMean, slope: fit.slope, exactFit: fit.exactFit }, points);
      }
    },
    /** Every object of the answer, made again from the figures of an earlier one and kept to the end. */
    answer,
    masking: () => masked.forEach(({ points, outliers }) => revealMaskedOutliers(points, outliers, points)),
    words: () => flagged.forEach(({ context, points }) => points.forEach((p) => describeFlags(p, context))),
  };
  type Phase = keyof typeof phases;
  const rows = (ms: Record<Phase, number>): Array<[string, number]> => [
    ['months from sale dates (50,000)', ms.dates],
    ['time-trend fits with their diagnostics (201, into columns)', ms.trendFits],
    ['floor-area fits: sums, ANOVA, t, p (201)', 2 * ms.fits - ms.fitsThenDiagnostics],
    ['per-point diagnostics of those fits (100,000 points, into columns)', ms.fitsThenDiagnostics - ms.fits],
    ['masked-outlier refits', ms.masking],
    ['flag words', ms.words],
    ['the answer’s objects alone: 200,000 points, 50,000 prices, flagged sales (allocation and collection)', ms.answer],
  ];
  return { phases, rows };
}
