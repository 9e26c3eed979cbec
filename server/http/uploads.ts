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

/** CSV exports stream to disk, then are read row by row. */
export const csvUpload = multer({ storage: scratchStorage, limits: { fileSize: 60 * 1024 * 1024, files: 1, fields: 10, fieldSize: 64 * 1024 } });

/** Photos: up to 15 MB each, up to 20 at once, to disk (not memory) until sharp has checked them. */
export const photoUpload = multer({ storage: scratchStorage, limits: { fileSize: 15 * 1024 * 1024, files: 20, fields: 5 } });
