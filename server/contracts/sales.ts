import { z } from 'zod';
import { isoDate, latField, lonField, ratingField } from './assignments';

export const saleTypes = ['arms_length', 'distressed', 'family', 'estate', 'new_construction', 'other'] as const;
export type SaleType = (typeof saleTypes)[number];
export const saleTypeLabels: Record<SaleType, string> = {
  arms_length: 'Arm’s length',
  distressed: 'Distressed',
  family: 'Family or related party',
  estate: 'Estate',
  new_construction: 'New construction',
  other: 'Other',
};

/** The fields of a comparable sale, validated the same way for the form, the API and each CSV row. */
export const saleFields = z.object({
  address: z.string().trim().min(1, 'Enter the address.').max(200),
  lon: lonField.nullable(),
  lat: latField.nullable(),
  neighbourhood: z.string().trim().max(80).nullable(),
  salePrice: z.number({ error: 'Enter the sale price as a number.' }).positive('Sale price must be more than 0.').max(1e10, 'Sale price is implausibly large.'),
  saleDate: isoDate.refine((s) => s >= '1900-01-01', 'Sale date is before 1900.'),
  floorArea: z.number({ error: 'Enter the floor area as a number.' }).positive('Floor area must be more than 0.').max(1e6, 'Floor area is implausibly large.'),
  lotSize: z.number().positive('Lot size must be more than 0.').max(1e9).nullable(),
  bedrooms: z.number().int().min(0, 'Bedrooms cannot be negative.').max(30).nullable(),
  bathrooms: z.number().min(0, 'Bathrooms cannot be negative.').max(30).nullable(),
  yearBuilt: z.number().int().min(1600, 'Year built before 1600?').max(2100).nullable(),
  condition: ratingField.nullable(),
  quality: ratingField.nullable(),
  garageSpaces: z.number().int().min(0).max(20).nullable(),
  saleType: z.enum(saleTypes),
  sellerConcessions: z.number().min(0, 'Concessions cannot be negative.').max(1e9),
  dataSource: z.string().trim().max(200).nullable(),
  verificationNote: z.string().trim().max(2000).nullable(),
});
export type SaleFields = z.infer<typeof saleFields>;

const optionalNullable = <T extends z.ZodType>(s: T) => s.nullable().optional();
export const saleCreate = saleFields.extend({
  lon: optionalNullable(lonField),
  lat: optionalNullable(latField),
  neighbourhood: optionalNullable(z.string().trim().max(80)),
  lotSize: optionalNullable(saleFields.shape.lotSize.unwrap()),
  bedrooms: optionalNullable(saleFields.shape.bedrooms.unwrap()),
  bathrooms: optionalNullable(saleFields.shape.bathrooms.unwrap()),
  yearBuilt: optionalNullable(saleFields.shape.yearBuilt.unwrap()),
  condition: optionalNullable(ratingField),
  quality: optionalNullable(ratingField),
  garageSpaces: optionalNullable(saleFields.shape.garageSpaces.unwrap()),
  saleType: z.enum(saleTypes).default('arms_length'),
  sellerConcessions: saleFields.shape.sellerConcessions.default(0),
  dataSource: optionalNullable(z.string().trim().max(200)),
  verificationNote: optionalNullable(z.string().trim().max(2000)),
});
export const saleUpdate = saleFields
  .partial()
  .extend({ version: z.number().int().positive(), inGrid: z.boolean().optional(), coverPhotoId: z.number().int().positive().optional() });

export const saleSchema = saleFields.extend({
  id: z.number().int(),
  assignmentId: z.number().int(),
  inGrid: z.boolean(),
  excluded: z.boolean(),
  exclusionReason: z.string().nullable(),
  coverPhotoId: z.number().int().nullable(),
  photoCount: z.number().int(),
  version: z.number().int(),
  updatedAt: z.coerce.date(),
});
export type Sale = z.infer<typeof saleSchema>;
export const saleListResponse = z.object({ sales: z.array(saleSchema), dataRevision: z.number().int() });
