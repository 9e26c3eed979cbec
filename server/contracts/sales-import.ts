import { z } from 'zod';

/** Rows one import may hold: far beyond any comparable search, and a bound on the memory and the
 * single transaction of an import (a 60 MB file could otherwise carry most of a million rows). The
 * server enforces it; the import panel states it. */
export const MAX_IMPORT_ROWS = 100_000;

/** The Compline fields a CSV column can map to, with the words export headers commonly use. */
export const importFields = {
  address: { label: 'Address', required: true, synonyms: ['address', 'street address', 'property address', 'addr', 'location address'] },
  salePrice: { label: 'Sale price', required: true, synonyms: ['sale price', 'price', 'sold price', 'close price', 'closing price', 'sales price', 'amount'] },
  saleDate: { label: 'Sale date', required: true, synonyms: ['sale date', 'date', 'sold date', 'close date', 'closing date', 'date of sale', 'recorded'] },
  floorArea: { label: 'Floor area', required: true, synonyms: ['floor area', 'gla', 'living area', 'gross living area', 'sqft', 'sq ft', 'square feet', 'area', 'size', 'm2'] },
  lon: { label: 'Longitude', required: false, synonyms: ['lon', 'lng', 'long', 'longitude', 'x'] },
  lat: { label: 'Latitude', required: false, synonyms: ['lat', 'latitude', 'y'] },
  neighbourhood: { label: 'Neighbourhood', required: false, synonyms: ['neighbourhood', 'neighborhood', 'area name', 'subdivision', 'district', 'market area'] },
  lotSize: { label: 'Lot size', required: false, synonyms: ['lot size', 'lot', 'land area', 'site area', 'lot sqft'] },
  bedrooms: { label: 'Bedrooms', required: false, synonyms: ['bedrooms', 'beds', 'br', 'bed'] },
  bathrooms: { label: 'Bathrooms', required: false, synonyms: ['bathrooms', 'baths', 'ba', 'bath'] },
  yearBuilt: { label: 'Year built', required: false, synonyms: ['year built', 'built', 'yr built', 'year'] },
  condition: { label: 'Condition (1–6)', required: false, synonyms: ['condition', 'cond'] },
  quality: { label: 'Quality (1–6)', required: false, synonyms: ['quality', 'qual'] },
  garageSpaces: { label: 'Garage spaces', required: false, synonyms: ['garage', 'garage spaces', 'parking', 'car spaces'] },
  saleType: { label: 'Sale type', required: false, synonyms: ['sale type', 'type of sale', 'transaction type', 'sale condition'] },
  sellerConcessions: { label: 'Seller concessions', required: false, synonyms: ['concessions', 'seller concessions', 'seller credit'] },
  dataSource: { label: 'Data source', required: false, synonyms: ['source', 'data source'] },
  verificationNote: { label: 'Verification note', required: false, synonyms: ['verification', 'verified', 'notes', 'remarks', 'comment'] },
} as const;
export type ImportField = keyof typeof importFields;
export const importFieldNames = Object.keys(importFields) as ImportField[];

/** field → CSV header */
export const columnMapping = z.partialRecord(z.enum(importFieldNames as [ImportField, ...ImportField[]]), z.string().max(200));
export type ColumnMapping = z.infer<typeof columnMapping>;

export const importProblem = z.object({ row: z.number().int(), field: z.string(), message: z.string() });
export type ImportProblem = z.infer<typeof importProblem>;

export const importPreviewResponse = z.object({
  headers: z.array(z.string()),
  mapping: columnMapping,
  previewRows: z.array(z.record(z.string(), z.string())),
  totalRows: z.number().int(),
  validRows: z.number().int(),
  invalidRows: z.number().int(),
  problems: z.array(importProblem),
  problemCount: z.number().int(),
});
export type ImportPreview = z.infer<typeof importPreviewResponse>;

export const importCommitResponse = z.object({ importId: z.number().int(), imported: z.number().int(), skipped: z.number().int() });
