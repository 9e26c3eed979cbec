import { pgTable, integer, text, timestamp, pgEnum, boolean, date, doublePrecision, index, jsonb } from 'drizzle-orm/pg-core';
import { organisations, users } from './organisations';

export const areaUnit = pgEnum('area_unit', ['sqft', 'sqm']);
export const assignmentStatus = pgEnum('assignment_status', ['in_progress', 'in_review', 'revisions_requested', 'approved', 'signed']);
export const saleType = pgEnum('sale_type', ['arms_length', 'distressed', 'family', 'estate', 'new_construction', 'other']);

/** An appraisal assignment. Never hard-deleted (work files are kept for years): `archivedAt` hides it.
 * `version` guards concurrent edits of the row itself; `dataRevision` rises with every change to its
 * subject or sales, and keys the cached analysis. Areas are stored in the assignment's unit. */
export const assignments = pgTable(
  'assignments',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    firmOrganisationId: integer('firm_organisation_id').notNull().references(() => organisations.id),
    clientOrganisationId: integer('client_organisation_id').notNull().references(() => organisations.id),
    appraiserUserId: integer('appraiser_user_id').notNull().references(() => users.id),
    subjectAddress: text('subject_address').notNull(),
    intendedUse: text('intended_use').notNull(),
    loanReference: text('loan_reference'),
    effectiveDate: date('effective_date', { mode: 'string' }).notNull(),
    dueDate: date('due_date', { mode: 'string' }),
    areaUnit: areaUnit('area_unit').notNull().default('sqft'),
    currency: text('currency').notNull().default('USD'),
    status: assignmentStatus('status').notNull().default('in_progress'),
    timeAdjustment: boolean('time_adjustment').notNull().default(false),
    version: integer('version').notNull().default(1),
    dataRevision: integer('data_revision').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    archivedAt: timestamp('archived_at', { withTimezone: true }),
  },
  (t) => [index('assignments_firm_idx').on(t.firmOrganisationId), index('assignments_client_idx').on(t.clientOrganisationId)],
);

/** The property being appraised: one row per assignment. */
export const subjects = pgTable('subjects', {
  assignmentId: integer('assignment_id').primaryKey().references(() => assignments.id),
  lon: doublePrecision('lon'),
  lat: doublePrecision('lat'),
  neighbourhood: text('neighbourhood'),
  floorArea: doublePrecision('floor_area'),
  lotSize: doublePrecision('lot_size'),
  bedrooms: integer('bedrooms'),
  bathrooms: doublePrecision('bathrooms'),
  yearBuilt: integer('year_built'),
  condition: integer('condition'),
  quality: integer('quality'),
  garageSpaces: integer('garage_spaces'),
  notes: text('notes'),
  version: integer('version').notNull().default(1),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});

/** A closed sale offered as a comparable. Soft-deleted through `deletedAt`; an exclusion (from a
 * review query) keeps the row visible with its reason but takes it out of every fit and grid. */
export const sales = pgTable(
  'sales',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    assignmentId: integer('assignment_id').notNull().references(() => assignments.id),
    address: text('address').notNull(),
    lon: doublePrecision('lon'),
    lat: doublePrecision('lat'),
    neighbourhood: text('neighbourhood'),
    salePrice: doublePrecision('sale_price').notNull(),
    saleDate: date('sale_date', { mode: 'string' }).notNull(),
    floorArea: doublePrecision('floor_area').notNull(),
    lotSize: doublePrecision('lot_size'),
    bedrooms: integer('bedrooms'),
    bathrooms: doublePrecision('bathrooms'),
    yearBuilt: integer('year_built'),
    condition: integer('condition'),
    quality: integer('quality'),
    garageSpaces: integer('garage_spaces'),
    saleType: saleType('sale_type').notNull().default('arms_length'),
    sellerConcessions: doublePrecision('seller_concessions').notNull().default(0),
    dataSource: text('data_source'),
    verificationNote: text('verification_note'),
    inGrid: boolean('in_grid').notNull().default(false),
    excluded: boolean('excluded').notNull().default(false),
    exclusionReason: text('exclusion_reason'),
    coverPhotoId: integer('cover_photo_id'),
    importId: integer('import_id'),
    version: integer('version').notNull().default(1),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
    deletedAt: timestamp('deleted_at', { withTimezone: true }),
  },
  (t) => [index('sales_assignment_idx').on(t.assignmentId, t.deletedAt)],
);

/** Photos of the subject (saleId null) or of a sale. Files live behind the storage module. */
export const photos = pgTable(
  'photos',
  {
    id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
    assignmentId: integer('assignment_id').notNull().references(() => assignments.id),
    saleId: integer('sale_id').references(() => sales.id),
    storageKey: text('storage_key').notNull(),
    width: integer('width').notNull(),
    height: integer('height').notNull(),
    bytes: integer('bytes').notNull(),
    sha256: text('sha256').notNull(),
    originalName: text('original_name').notNull(),
    uploadedBy: integer('uploaded_by').notNull().references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    deletedAt: timestamp('deleted_at', { withTimezone: true }),
  },
  (t) => [index('photos_assignment_idx').on(t.assignmentId, t.saleId)],
);

/** One CSV import: all of its rows commit in one transaction or none do. */
export const salesImports = pgTable('sales_imports', {
  id: integer('id').primaryKey().generatedAlwaysAsIdentity(),
  assignmentId: integer('assignment_id').notNull().references(() => assignments.id),
  userId: integer('user_id').notNull().references(() => users.id),
  fileName: text('file_name').notNull(),
  rowsImported: integer('rows_imported').notNull(),
  rowsSkipped: integer('rows_skipped').notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

/** Each user's last column mapping, offered as the guess next time. */
export const importMappings = pgTable('import_mappings', {
  userId: integer('user_id').primaryKey().references(() => users.id),
  mapping: jsonb('mapping').$type<Record<string, string>>().notNull(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});
