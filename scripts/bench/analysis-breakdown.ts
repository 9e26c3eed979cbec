// Where the time of one full analysis goes, phase by phase, on the same input as analysis.bench.ts.
// Each phase redoes one part of analyseMarket's work with the same exported pieces it uses
// (fit-columns.ts, point-diagnostics.ts, time-trend.ts, masked-outliers.ts, flag-reasons.ts), so
// the parts are measured alone; "the rest" is whatever the full analysis takes beyond their sum.
import { fitColumns, fitScratch } from '../../server/analysis/fit-columns';
import { describeFlags } from '../../server/analysis/flag-reasons';
import type { AnalysisInput, AnalysisSale } from '../../server/analysis/market-analysis';
import { revealMaskedOutliers } from '../../server/analysis/masked-outliers';
import { diagnoseColumns, flagsOf, HAS_EXTERNAL, HAS_INTERNAL, pointAt } from '../../server/analysis/point-diagnostics';
import type { FitPoint, LineFitOk } from '../../server/analysis/regression';
import { fitTrendPoints, monthsBetween, utcDayMs, type TrendPoint } from '../../server/analysis/time-trend';

type Timer = (fn: () => unknown, runs: number) => number;

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

function fillScratch(group: readonly AnalysisSale[]): number {
  const { xs, ys } = fitScratch(group.length);
  group.forEach((s, k) => {
    xs[k] = s.floorArea;
    ys[k] = s.salePrice;
  });
  return group.length;
}

export function analysisBreakdown(input: AnalysisInput, time: Timer, runs: number): Array<[string, number]> {
  const groups = groupsOf(input.sales.filter((s) => !s.excluded));
  const effectiveMs = utcDayMs(input.effectiveDate);

  const trend = time(() => {
    for (const group of groups) {
      const points: TrendPoint[] = group.map((s) => ({ saleId: s.id, monthsBefore: monthsBetween(utcDayMs(s.saleDate), effectiveMs), pricePerArea: s.salePrice / s.floorArea }));
      fitTrendPoints('', points);
    }
  }, runs);

  // Sums, ANOVA, t and p, with the per-point diagnostics into columns (no objects).
  const fitsWithDiagnostics = time(() => {
    for (const group of groups) fitColumns(fillScratch(group), -1);
  }, runs);

  // The per-point diagnostics alone, once more on each fit's own columns.
  const fits = groups.map((group) => {
    const n = fillScratch(group);
    return { n, fit: fitColumns(n, -1) as LineFitOk };
  });
  const diagnostics = time(() => {
    for (const [g, group] of groups.entries()) {
      const { n, fit } = fits[g];
      fillScratch(group);
      fitColumns(n, -1);
      const { xs, ys, dx, dy, residuals, points } = fitScratch(n);
      diagnoseColumns({ n, xs, ys, dx, dy, residuals, sxx: (fit.residualStdError / fit.slopeStdError) ** 2, sst: fit.sst, s: fit.residualStdError, yMean: fit.yMean, slope: fit.slope, exactFit: fit.exactFit }, points);
    }
  }, runs) - fitsWithDiagnostics;

  // One object per sale and fit, as the response carries them.
  const objects = time(() => {
    for (const group of groups) {
      const n = fillScratch(group);
      fitColumns(n, -1);
      const { xs, ys, residuals, points: c } = fitScratch(n);
      const out = new Array<FitPoint & { saleId: number }>(n);
      for (let k = 0; k < n; k++) {
        const state = c.state[k];
        const internal = (state & HAS_INTERNAL) !== 0;
        out[k] = {
          saleId: group[k].id, x: xs[k], y: ys[k], fitted: c.fitted[k], residual: residuals[k], leverage: c.leverage[k],
          internallyStudentized: internal ? c.internal[k] : null, externallyStudentized: state & HAS_EXTERNAL ? c.external[k] : null,
          cooksDistance: internal ? c.cooks[k] : null, flags: flagsOf(state),
        };
      }
    }
  }, runs) - fitsWithDiagnostics;

  const pointsOf = groups.map((group) => {
    const n = fillScratch(group);
    fitColumns(n, -1);
    const { xs, ys, residuals, points } = fitScratch(n);
    return Array.from({ length: n }, (_, k) => pointAt(xs, ys, residuals, points, k));
  });
  const neighbourhoods = pointsOf.slice(0, -1);
  const masking = time(() => {
    for (const points of neighbourhoods) {
      const outliers = points.flatMap((p, k) => (p.flags.includes('outlier') ? [k] : []));
      revealMaskedOutliers(points, outliers, points);
    }
  }, runs);

  const words = time(() => {
    for (const [g, points] of neighbourhoods.entries()) {
      const { n, fit } = fits[g];
      const context = { n, xMin: fit.xMin, xMax: fit.xMax };
      for (const p of points) if (p.flags.length > 0) describeFlags(p, context);
    }
  }, runs);

  return [
    ['time trends (201 fits, with their point objects)', trend],
    ['floor-area fits: sums, ANOVA, t, p (201 fits)', fitsWithDiagnostics - diagnostics],
    ['per-point diagnostics into columns (100,000 points)', diagnostics],
    ['per-point objects for the response (100,000)', objects],
    ['masked-outlier refits', masking],
    ['flag words', words],
  ];
}
