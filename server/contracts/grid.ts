import { z } from 'zod';

export const lineItemFeatures = ['bathrooms', 'garage', 'view', 'condition', 'lot', 'quality', 'other'] as const;
export type LineItemFeature = (typeof lineItemFeatures)[number];

/** A line item's feature as the grid, the report page and the PDF name it. */
export const lineItemFeatureLabels: Record<LineItemFeature, string> = {
  bathrooms: 'Bathrooms',
  garage: 'Garage',
  view: 'View',
  condition: 'Condition',
  lot: 'Lot',
  quality: 'Quality',
  other: 'Other',
};
export const lineItemSchema = z.object({
  feature: z.enum(lineItemFeatures),
  amount: z.number().min(-1e9).max(1e9),
  note: z.string().trim().max(500),
});

export const gridSettingsUpdate = z.object({
  version: z.number().int().positive(),
  typedRate: z.number().min(-1e6).max(1e6).nullable().optional(),
  rateJustification: z.string().trim().max(4000).nullable().optional(),
  rateIncrement: z.number().positive().max(1e6).optional(),
  valueIncrement: z.number().positive().max(1e7).optional(),
  reconciliationComment: z.string().trim().max(8000).nullable().optional(),
});

export const gridEntryUpdate = z.object({
  /** 0 when the sale has no grid entry yet. */
  version: z.number().int().min(0),
  lineItems: z.array(lineItemSchema).max(30),
  weightPct: z.number().min(0).max(100).nullable(),
});

export const firmSettingsSchema = z.object({
  netLimitPct: z.number().positive().max(100),
  grossLimitPct: z.number().positive().max(200),
  maxSaleAgeMonths: z.number().int().positive().max(120),
  maxDistanceKm: z.number().positive().max(500),
  checkBracketing: z.boolean(),
});
export const firmSettingsUpdate = firmSettingsSchema.partial().extend({ version: z.number().int().positive() });

const gridRow = z.object({
  saleId: z.number().int(),
  address: z.string(),
  salePrice: z.number(),
  concessionAdjustment: z.number(),
  timeAdjustment: z.number(),
  areaAdjustment: z.number(),
  lineItemTotal: z.number(),
  adjustedPrice: z.number(),
  netAdjustmentPct: z.number(),
  grossAdjustmentPct: z.number(),
  netOverLimit: z.boolean(),
  grossOverLimit: z.boolean(),
  weightPct: z.number(),
  weightIsDefault: z.boolean(),
});

export const gridResponse = z.object({
  settings: z.object({
    typedRate: z.number().nullable(),
    rateJustification: z.string().nullable(),
    rateIncrement: z.number(),
    valueIncrement: z.number(),
    reconciliationComment: z.string().nullable(),
    version: z.number().int(),
  }),
  limits: firmSettingsSchema,
  rate: z.object({
    fitSlope: z.number().nullable(),
    fitNeighbourhood: z.string().nullable(),
    gatePasses: z.boolean(),
    gateMessage: z.string(),
    value: z.number().nullable(),
    source: z.enum(['fit', 'typed', 'none']),
    needsJustification: z.boolean(),
  }),
  monthlyRate: z.number().nullable(),
  subjectArea: z.number().nullable(),
  entries: z.array(z.object({ saleId: z.number().int(), lineItems: z.array(lineItemSchema), weightPct: z.number().nullable(), version: z.number().int() })),
  rows: z.array(gridRow),
  weightsTotalPct: z.number(),
  indicatedValue: z.number().nullable(),
  opinionOfValue: z.number().nullable(),
  adjustedRange: z.tuple([z.number(), z.number()]).nullable(),
  regression: z.object({ estimate: z.number(), lower: z.number(), upper: z.number(), neighbourhood: z.string() }).nullable(),
  checks: z.array(z.object({ code: z.string(), saleId: z.number().int().nullable(), message: z.string() })),
  /** What still stands between the grid and submission to review. */
  missing: z.array(z.string()),
});
export type GridResponse = z.infer<typeof gridResponse>;
