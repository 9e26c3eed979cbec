// The market analysis as numbers only, on columns: every sale's figures sit in typed arrays, sorted
// so that each neighbourhood's sales are one contiguous run (sale-columns.ts), and every fit writes
// its per-point figures into columns of the same order (lean-fit.ts). No objects per sale, no words:
// market-analysis.ts puts the answer (with the flag words, gates and warnings) together from these
// columns.
import { maskedOutliers } from './column-masking';
import { fitColumnsOut, fitRange, type FitColumnsOut, type GroupFit } from './lean-fit';
import type { RevealedOutlier } from './masked-outliers';
import type { SaleColumns } from './sale-columns';
import { timeAdjustedPrice } from './time-trend';

export interface MarketColumns {
  sales: SaleColumns;
  /** The prices the floor-area fits use, by position (time-adjusted or as sold). */
  prices: Float64Array;
  /** Trend fits by group, the pooled one last (index names.length). */
  trends: GroupFit[];
  /** Monthly rate by group, pooled last; NaN where there is none. */
  monthlyRates: Float64Array;
  /** Floor-area fits by group, the pooled one last. */
  fits: GroupFit[];
  /** Per-point figures of each neighbourhood's fit, by position. */
  points: FitColumnsOut;
  /** Per-point figures of the pooled fit, by position. */
  pooledPoints: FitColumnsOut;
  /** Sales the masked-outlier pass revealed, by group; `index` and `setAside` are offsets within the group. */
  revealed: RevealedOutlier[][];
}

export interface ColumnOptions {
  timeAdjustment: boolean;
  /** The subject's floor area: the subject's neighbourhood and the pooled fit predict there. */
  x0: number | null;
  confidence?: number;
}

/** The whole analysis of the columns: trends, prices, floor-area fits with diagnostics, masking. */
export function analyseColumns(sales: SaleColumns, options: ColumnOptions): MarketColumns {
  const confidence = options.confidence ?? 0.95;
  const { start, monthsBefore, pricePerArea, salePrice, floorArea } = sales;
  const G = sales.names.length;
  const n = start[G];
  const trends = new Array<GroupFit>(G + 1);
  const monthlyRates = new Float64Array(G + 1);
  for (let g = 0; g <= G; g++) {
    const [a, b] = g < G ? [start[g], start[g + 1]] : [0, n];
    const fit = fitRange(monthsBefore, pricePerArea, a, b, null, undefined, confidence);
    trends[g] = fit;
    // The slope is per month *before* the effective date, so a rising market has a negative slope.
    monthlyRates[g] = fit.ok && fit.summary.yMean > 0 ? -fit.summary.slope / fit.summary.yMean : NaN;
  }
  let prices = salePrice;
  if (options.timeAdjustment) {
    prices = new Float64Array(n);
    const rateOf = (g: number) => (Number.isNaN(monthlyRates[g]) ? null : monthlyRates[g]);
    for (let g = 0; g < G; g++) {
      // A neighbourhood without a trend of its own takes the pooled one.
      const rate = rateOf(g) ?? rateOf(G);
      for (let k = start[g]; k < start[g + 1]; k++) prices[k] = timeAdjustedPrice(salePrice[k], monthsBefore[k], rate);
    }
  }
  const points = fitColumnsOut(n);
  const pooledPoints = fitColumnsOut(n);
  const fits = new Array<GroupFit>(G + 1);
  const revealed = new Array<RevealedOutlier[]>(G + 1);
  const x0 = options.x0 ?? undefined;
  for (let g = 0; g < G; g++) {
    const a = start[g], b = start[g + 1];
    fits[g] = fitRange(floorArea, prices, a, b, points, g === sales.subjectGroup ? x0 : undefined, confidence);
    revealed[g] = fits[g].ok ? maskedOutliers(floorArea, prices, a, b, points) : [];
  }
  fits[G] = fitRange(floorArea, prices, 0, n, pooledPoints, x0, confidence);
  revealed[G] = [];
  return { sales, prices, trends, monthlyRates, fits, points, pooledPoints, revealed };
}
