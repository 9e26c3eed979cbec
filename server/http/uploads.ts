import multer from 'multer';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { env } from '../env';

/** Scratch folder for uploads in flight (removed after each request). */
export const uploadScratchDir = path.resolve(env.DATA_DIR, 'tmp');
mkdirSync(uploadScratchDir, { recursive: true });

const scratchStorage = multer.diskStorage({
  destination: uploadScratchDir,
  // Never use the client's file name on disk: it may carry path tricks.
  filename: (_req, _file, cb) => cb(null, randomUUID()),
});

export const CSV_MAX_BYTES = 60 * 1024 * 1024;
export const PHOTO_MAX_BYTES = 15 * 1024 * 1024;

/** CSV exports stream to disk, then are read row by row. */
export const csvUpload = multer({ storage: scratchStorage, limits: { fileSize: CSV_MAX_BYTES, files: 1, fields: 10, fieldSize: 64 * 1024 } });

/** Photos: up to 15 MB each, up to 20 at once, to disk (not memory) until sharp has checked them. */
export const photoUpload = multer({ storage: scratchStorage, limits: { fileSize: PHOTO_MAX_BYTES, files: 20, fields: 5 } });

/** What a file over the limit is told, by its form field ("file" for a CSV, "files" for photos). */
export function fileTooLargeMessage(field: string | undefined): string {
  return field === 'file'
    ? 'The CSV file is larger than 60 MB. Split the export into smaller files and import them one by one.'
    : 'A photo is larger than 15 MB. Export it at a smaller size and add it again.';
}
