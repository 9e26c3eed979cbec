import { z } from 'zod';

const num = z.number();
const nullableNum = z.number().nullable();
export const pointFlags = ['unusual', 'outlier', 'influential', 'high-leverage'] as const;
export type PointFlagName = (typeof pointFlags)[number];

/** The flags in Compline's own short words, lower case for running text ("unusual, outlier"). */
export const pointFlagWords: Record<PointFlagName, string> = {
  unusual: 'unusual',
  outlier: 'outlier',
  influential: 'influential',
  'high-leverage': 'high leverage',
};

/** The word for a flag read from a stored report, which may name one this version does not know. */
export const pointFlagWord = (flag: string): string => (flag in pointFlagWords ? pointFlagWords[flag as PointFlagName] : flag);

/** The same words as a chip or badge label ("High leverage"). */
export const pointFlagLabel = (flag: PointFlagName): string => pointFlagWords[flag].charAt(0).toUpperCase() + pointFlagWords[flag].slice(1);

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

// The analysis as it travels: every per-sale figure in columns (one array per figure, no repeated
// keys), which the client expands into the rows above with expandAnalysis. The columns index the
// usable sales by "position": each neighbourhood's sales form one run [from, to), the pooled fit
// covers every position.

/** Flags as bits, in the fixed order of pointFlags: 1 unusual, 2 outlier, 4 influential, 8 high leverage. */
export function flagsFromBits(bits: number): Array<(typeof pointFlags)[number]> {
  const flags: Array<(typeof pointFlags)[number]> = [];
  for (let i = 0; i < pointFlags.length; i++) if (bits & (1 << i)) flags.push(pointFlags[i]);
  return flags;
}

const column = z.array(num);
const nullableColumn = z.array(nullableNum);

export const pointColumnsSchema = z.object({
  fitted: column,
  residual: column,
  leverage: column,
  internallyStudentized: nullableColumn,
  externallyStudentized: nullableColumn,
  cooksDistance: nullableColumn,
  flags: z.array(z.number().int().min(0).max(15)),
});
export type PointColumnsWire = z.infer<typeof pointColumnsSchema>;

const range = { from: z.number().int().min(0), to: z.number().int().min(0) };

export const analysisWireSchema = analysisResponse
  .omit({ groups: true, trends: true, adjustedPrices: true })
  .extend({
    /** Each usable sale's figures by position; y is the price the floor-area fits use. */
    sales: z.object({ saleId: z.array(z.number().int()), x: column, y: column, monthsBefore: column, pricePerArea: column }),
    /** points is null where the fit was refused; else its columns cover positions [from, to). */
    groups: z.array(groupAnalysisSchema.omit({ points: true }).extend({ ...range, points: pointColumnsSchema.nullable() })),
    trends: z.array(trendSchema.omit({ points: true }).extend(range)),
  });
export type AnalysisWire = z.infer<typeof analysisWireSchema>;

/** null for null, NaN or a missing slot (an undefined figure either way). */
const orNull = (v: number | null | undefined): number | null => (typeof v === 'number' && v === v ? v : null);

/** The rows of the analysis from its columns. */
export function expandAnalysis(wire: AnalysisWire): Analysis {
  const { sales, groups, trends, ...rest } = wire;
  const adjustedPrices: Record<string, number> = {};
  for (let k = 0; k < sales.saleId.length; k++) adjustedPrices[sales.saleId[k]] = sales.y[k];
  return {
    ...rest,
    groups: groups.map(({ from, to, points: c, ...group }) => {
      const points: Analysis['groups'][number]['points'] = [];
      if (c) {
        for (let k = from; k < to; k++) {
          const j = k - from;
          points.push({
            saleId: sales.saleId[k], x: sales.x[k], y: sales.y[k], fitted: c.fitted[j], residual: c.residual[j], leverage: c.leverage[j],
            internallyStudentized: orNull(c.internallyStudentized[j]), externallyStudentized: orNull(c.externallyStudentized[j]),
            cooksDistance: orNull(c.cooksDistance[j]), flags: flagsFromBits(c.flags[j]),
          });
        }
      }
      return { ...group, points };
    }),
    trends: trends.map(({ from, to, ...trend }) => {
      const points: Trend['points'] = [];
      for (let k = from; k < to; k++) points.push({ saleId: sales.saleId[k], monthsBefore: sales.monthsBefore[k], pricePerArea: sales.pricePerArea[k] });
      return { ...trend, points };
    }),
    adjustedPrices,
  };
}

/** The analysis endpoint's answer, checked and expanded into rows. */
export const analysisWireResponse = analysisWireSchema.transform(expandAnalysis);
