import multer from 'multer';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import { env } from '../env';
import { CSV_MAX_BYTES, csvTooLargeMessage, PHOTO_MAX_BYTES, photoTooLargeMessage, PHOTOS_PER_UPLOAD } from '../contracts/uploads';

/** Scratch folder for uploads in flight (removed after each request). */
export const uploadScratchDir = path.resolve(env.DATA_DIR, 'tmp');
mkdirSync(uploadScratchDir, { recursive: true });

const scratchStorage = multer.diskStorage({
  destination: uploadScratchDir,
  // Never use the client's file name on disk: it may carry path tricks.
  filename: (_req, _file, cb) => cb(null, randomUUID()),
});


/** CSV exports stream to disk, then are read row by row. */
export const csvUpload = multer({ storage: scratchStorage, limits: { fileSize: CSV_MAX_BYTES, files: 1, fields: 10, fieldSize: 64 * 1024 } });

/** Photos: up to PHOTO_MAX_BYTES each, PHOTOS_PER_UPLOAD at once, to disk (not memory) until sharp has checked them. */
export const photoUpload = multer({ storage: scratchStorage, limits: { fileSize: PHOTO_MAX_BYTES, files: PHOTOS_PER_UPLOAD, fields: 5 } });

/** What a file over the limit is told, by its form field ("file" for a CSV, "files" for photos). */
export function fileTooLargeMessage(field: string | undefined): string {
  return field === 'file' ? csvTooLargeMessage() : photoTooLargeMessage();
}
