import { z } from 'zod';

const num = z.number();
const nullableNum = z.number().nullable();
export const pointFlags = ['unusual', 'outlier', 'influential', 'high-leverage'] as const;

export const analysedPointSchema = z.object({
  saleId: z.number().int(),
  x: num,
  y: num,
  fitted: num,
  residual: num,
  leverage: num,
  internallyStudentized: nullableNum,
  externallyStudentized: nullableNum,
  cooksDistance: nullableNum,
  flags: z.array(z.enum(pointFlags)),
});

export const fitSummarySchema = z.object({
  n: z.number().int(),
  slope: num,
  intercept: num,
  r: nullableNum,
  rSquared: nullableNum,
  adjustedRSquared: nullableNum,
  sst: num,
  ssr: num,
  sse: num,
  residualStdError: num,
  slopeStdError: num,
  interceptStdError: num,
  slopeTStat: nullableNum,
  slopePValue: nullableNum,
  slopeInterval: z.tuple([num, num]),
  tCritical: num,
  xMean: num,
  yMean: num,
  xMin: num,
  xMax: num,
});
export type FitSummary = z.infer<typeof fitSummarySchema>;

export const refusalSchema = z.object({ reason: z.enum(['too-few-points', 'no-spread-in-x', 'non-finite-input']), message: z.string() });

export const predictionSchema = z.object({
  x0: num,
  estimate: num,
  lower: num,
  upper: num,
  meanLower: num,
  meanUpper: num,
  extrapolated: z.boolean(),
});

export const flaggedSaleSchema = z.object({
  saleId: z.number().int(),
  address: z.string(),
  neighbourhood: z.string(),
  saleType: z.string(),
  flags: z.array(z.enum(pointFlags)),
  reason: z.string(),
  residual: num,
  residualPct: nullableNum,
  externallyStudentized: nullableNum,
  cooksDistance: nullableNum,
  leverage: num,
  inGrid: z.boolean(),
  /** Empty when the full fit flags the sale; else the sales set aside before it stood out (masking). */
  revealedWhenSetAside: z.array(z.number().int()),
});
export type FlaggedSale = z.infer<typeof flaggedSaleSchema>;

export const correlationGateSchema = z.object({ passes: z.boolean(), threshold: num, message: z.string() });

/** One neighbourhood's price-on-floor-area fit (or the pooled fit over all of them). */
export const groupAnalysisSchema = z.object({
  neighbourhood: z.string(),
  pooled: z.boolean(),
  n: z.number().int(),
  fit: fitSummarySchema.nullable(),
  refusal: refusalSchema.nullable(),
  gate: correlationGateSchema.nullable(),
  prediction: predictionSchema.nullable(),
  points: z.array(analysedPointSchema),
  flagged: z.array(flaggedSaleSchema),
  warnings: z.array(z.string()),
});
export type GroupAnalysis = z.infer<typeof groupAnalysisSchema>;

export const trendSchema = z.object({
  neighbourhood: z.string(),
  n: z.number().int(),
  fit: fitSummarySchema.nullable(),
  refusal: refusalSchema.nullable(),
  /** Change of price per unit area per month, as a fraction of the mean (0.004 = +0.4%/month). */
  monthlyRate: nullableNum,
  points: z.array(z.object({ saleId: z.number().int(), monthsBefore: num, pricePerArea: num })),
});
export type Trend = z.infer<typeof trendSchema>;

export const analysisResponse = z.object({
  assignmentId: z.number().int(),
  dataRevision: z.number().int(),
  areaUnit: z.enum(['sqft', 'sqm']),
  currency: z.string(),
  effectiveDate: z.string(),
  timeAdjustment: z.boolean(),
  subject: z.object({ floorArea: nullableNum, neighbourhood: z.string().nullable() }),
  subjectGroup: z.string().nullable(),
  groups: z.array(groupAnalysisSchema),
  trends: z.array(trendSchema),
  excluded: z.array(z.object({ saleId: z.number().int(), address: z.string(), reason: z.string().nullable() })),
  /** Time-adjusted price of each usable sale (equal to the sale price when the adjustment is off). */
  adjustedPrices: z.record(z.string(), num),
  warnings: z.array(z.string()),
});
export type Analysis = z.infer<typeof analysisResponse>;
