import { z } from 'zod';

export const areaUnits = ['sqft', 'sqm'] as const;
export const assignmentStatuses = ['in_progress', 'in_review', 'revisions_requested', 'approved', 'signed'] as const;
export type AssignmentStatus = (typeof assignmentStatuses)[number];
export const statusLabels: Record<AssignmentStatus, string> = {
  in_progress: 'In progress',
  in_review: 'In review',
  revisions_requested: 'Revisions requested',
  approved: 'Approved',
  signed: 'Signed and delivered',
};

/** A calendar day that exists: Date.parse rolls 2026-02-30 over to 2 March, so round-trip it instead. */
const isRealDay = (s: string) => {
  const day = new Date(`${s}T00:00:00Z`);
  return !Number.isNaN(day.getTime()) && day.toISOString().slice(0, 10) === s;
};
const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date like 2026-11-15.').refine(isRealDay, 'Not a real date.');
const text = (max: number, label: string) => z.string().trim().min(1, `Enter the ${label}.`).max(max);

export const assignmentInput = z.object({
  subjectAddress: text(200, 'subject address'),
  intendedUse: text(300, 'intended use'),
  loanReference: z.string().trim().max(80).nullable().optional(),
  clientOrganisationId: z.number().int().positive(),
  effectiveDate: isoDate,
  dueDate: isoDate.nullable().optional(),
  areaUnit: z.enum(areaUnits).default('sqft'),
  currency: z.string().regex(/^[A-Z]{3}$/, 'Use a three-letter ISO 4217 code such as USD.').default('USD'),
});
export const assignmentUpdate = assignmentInput.partial().extend({
  version: z.number().int().positive(),
  timeAdjustment: z.boolean().optional(),
});

export const assignmentSchema = z.object({
  id: z.number().int(),
  subjectAddress: z.string(),
  intendedUse: z.string(),
  loanReference: z.string().nullable(),
  clientOrganisationId: z.number().int(),
  clientOrganisationName: z.string(),
  appraiserUserId: z.number().int(),
  appraiserName: z.string(),
  effectiveDate: z.string(),
  dueDate: z.string().nullable(),
  areaUnit: z.enum(areaUnits),
  currency: z.string(),
  status: z.enum(assignmentStatuses),
  timeAdjustment: z.boolean(),
  version: z.number().int(),
  dataRevision: z.number().int(),
  saleCount: z.number().int().optional(),
  updatedAt: z.coerce.date(),
});
export type Assignment = z.infer<typeof assignmentSchema>;
export const assignmentListResponse = z.object({ assignments: z.array(assignmentSchema) });

const lon = z.number().min(-180, 'Longitude must be between −180 and 180.').max(180, 'Longitude must be between −180 and 180.');
const lat = z.number().min(-90, 'Latitude must be between −90 and 90.').max(90, 'Latitude must be between −90 and 90.');
const rating = z.number().int().min(1, 'Ratings run from 1 (best) to 6.').max(6, 'Ratings run from 1 (best) to 6.');
const positive = (label: string) => z.number().positive(`${label} must be more than 0.`).max(1e9);
const count = (label: string, max: number) => z.number().int().min(0, `${label} cannot be negative.`).max(max);

export const subjectInput = z.object({
  lon: lon.nullable(),
  lat: lat.nullable(),
  neighbourhood: z.string().trim().max(80).nullable(),
  floorArea: positive('Floor area').nullable(),
  lotSize: positive('Lot size').nullable(),
  bedrooms: count('Bedrooms', 30).nullable(),
  bathrooms: z.number().min(0).max(30).multipleOf(0.5, 'Count bathrooms in halves.').nullable(),
  yearBuilt: z.number().int().min(1600).max(2100).nullable(),
  condition: rating.nullable(),
  quality: rating.nullable(),
  garageSpaces: count('Garage spaces', 20).nullable(),
  notes: z.string().max(4000).nullable(),
});
export const subjectUpdate = subjectInput.partial().extend({ version: z.number().int().positive() });
export const subjectSchema = subjectInput.extend({ assignmentId: z.number().int(), version: z.number().int() });
export type Subject = z.infer<typeof subjectSchema>;

export const assignmentDetailResponse = z.object({ assignment: assignmentSchema, subject: subjectSchema });
export type AssignmentDetail = z.infer<typeof assignmentDetailResponse>;

export { isoDate, lon as lonField, lat as latField, rating as ratingField };
