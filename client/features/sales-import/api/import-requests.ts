import { z } from 'zod';
import { importCommitResponse, importPreviewResponse, importProblem, type ColumnMapping } from '@contracts/sales-import';
import { CSV_MAX_BYTES, csvTooLargeMessage } from '@contracts/uploads';
import { UploadError, uploadForm, type UploadOptions } from '../../../lib/upload';


export type ImportResult = z.infer<typeof importCommitResponse>;

/** Why a chosen file is not sent at all, or null when it may go. */
export function refuseCsvLocally(file: File): string | null {
  const looksLikeCsv = /\.csv$/i.test(file.name) || file.type === 'text/csv';
  if (!looksLikeCsv) return `${file.name} is not a CSV file. Export the sales as CSV (comma-separated values) and choose that file.`;
  if (file.size === 0) return `${file.name} is empty: it needs a header row and at least one sale.`;
  if (file.size > CSV_MAX_BYTES) return csvTooLargeMessage(file.name);
  return null;
}

function csvForm(file: File, fields: Record<string, string>): FormData {
  const form = new FormData();
  // Text fields first, then the file, as a browser form would send them.
  for (const [name, value] of Object.entries(fields)) form.append(name, value);
  form.append('file', file, file.name);
  return form;
}

/** Uploads the file for a dry run: headers, the mapping (the server's guess when `mapping` is null),
 * the first rows, the counts and the row-numbered problems. Nothing is written. */
export function requestImportPreview(assignmentId: number, file: File, mapping: ColumnMapping | null, options: UploadOptions) {
  const form = csvForm(file, mapping ? { mapping: JSON.stringify(mapping) } : {});
  return uploadForm(`/api/assignments/${assignmentId}/sales/import/preview`, form, importPreviewResponse, options);
}

/** Uploads the file again and commits it in one transaction on the server: all or nothing. */
export function requestImportCommit(assignmentId: number, file: File, mapping: ColumnMapping, skipInvalid: boolean, options: UploadOptions) {
  const form = csvForm(file, { mapping: JSON.stringify(mapping), skipInvalid: String(skipInvalid) });
  return uploadForm(`/api/assignments/${assignmentId}/sales/import`, form, importCommitResponse, options);
}

const refusalDetails = z.object({
  problems: z.array(importProblem),
  problemCount: z.number().int(),
  invalidRows: z.number().int(),
});
export type ImportRefusal = z.infer<typeof refusalDetails>;

/** The row problems a 422 refusal of the commit carries, or null for any other failure. */
export function refusedRows(error: unknown): ImportRefusal | null {
  if (!(error instanceof UploadError) || error.status !== 422) return null;
  const parsed = refusalDetails.safeParse(error.details);
  return parsed.success ? parsed.data : null;
}
