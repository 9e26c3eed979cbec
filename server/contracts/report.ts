import { z } from 'zod';
import { assignmentSchema, subjectSchema } from './assignments';
import { saleSchema } from './sales';
import { analysisResponse } from './analysis';
import { gridResponse } from './grid';
import { reviewQuerySchema } from './review';

export const signRequest = z.object({
  certify: z.literal(true, { error: 'Confirm the certification to sign.' }),
  licenceNumber: z.string().trim().min(3, 'Enter your licence or certificate number.').max(60),
  jurisdiction: z.string().trim().min(2, 'Enter the jurisdiction that issued it.').max(120),
  extraordinaryAssumptions: z.string().trim().max(4000).default(''),
  hypotheticalConditions: z.string().trim().max(4000).default(''),
  version: z.number().int().positive(),
});

/** Everything a signed report shows, frozen. Its canonical JSON is fingerprinted with SHA-256. */
export const reportSnapshotSchema = z.object({
  schemaVersion: z.literal(1),
  firmName: z.string(),
  clientName: z.string(),
  assignment: assignmentSchema.omit({ updatedAt: true }).extend({ updatedAt: z.string() }),
  subject: subjectSchema,
  sales: z.array(saleSchema.omit({ updatedAt: true })),
  photos: z.array(z.object({ id: z.number().int(), saleId: z.number().int().nullable(), sha256: z.string(), width: z.number().int(), height: z.number().int() })),
  analysis: analysisResponse,
  grid: gridResponse,
  queries: z.array(reviewQuerySchema.extend({ createdAt: z.string(), messages: z.array(reviewQuerySchema.shape.messages.element.extend({ createdAt: z.string() })) })),
  cautions: z.array(z.string()),
  certification: z.array(z.string()),
  limitingConditions: z.array(z.string()),
  extraordinaryAssumptions: z.string(),
  hypotheticalConditions: z.string(),
  signer: z.object({ name: z.string(), licenceNumber: z.string(), jurisdiction: z.string() }),
  signedAt: z.string(),
  versionNumber: z.number().int(),
  reconciliationComment: z.string().nullable(),
  opinionOfValue: z.number().nullable(),
});
export type ReportSnapshot = z.infer<typeof reportSnapshotSchema>;

export const reportVersionSummary = z.object({
  id: z.number().int(),
  assignmentId: z.number().int(),
  versionNumber: z.number().int(),
  subjectAddress: z.string(),
  clientName: z.string(),
  opinionOfValue: z.number().nullable(),
  currency: z.string(),
  effectiveDate: z.string(),
  sha256: z.string(),
  signedAt: z.coerce.date(),
  signerName: z.string(),
});
export const reportListResponse = z.object({ reports: z.array(reportVersionSummary) });
export const reportResponse = z.object({ id: z.number().int(), sha256: z.string(), snapshot: reportSnapshotSchema, laterVersions: z.array(z.number().int()) });

export const verifyResponse = z.object({
  found: z.boolean(),
  report: z.object({ subjectAddress: z.string(), versionNumber: z.number().int(), signedAt: z.coerce.date(), signerName: z.string(), opinionOfValue: z.number().nullable(), currency: z.string(), effectiveDate: z.string() }).nullable(),
});

/** The answer of POST /api/assignments/:id/sign: the frozen version and its fingerprint. */
export const signResponse = z.object({ reportVersionId: z.number().int(), versionNumber: z.number().int(), sha256: z.string() });
export type SignResponse = z.infer<typeof signResponse>;
