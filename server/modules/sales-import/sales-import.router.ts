import { Router } from 'express';
import { rm } from 'node:fs/promises';
import { z } from 'zod';
import { allow } from '../../http/access';
import { csvUpload } from '../../http/uploads';
import { uploadRateLimit } from '../../middleware/upload-rate-limit';
import { parse, parseId } from '../../http/validate';
import { columnMapping } from '../../contracts/sales-import';
import { badRequest } from '../../errors';
import { commitImport, previewImport } from './sales-import.service';

export const salesImportRouter = Router();

const mappingField = z
  .string()
  .max(20_000)
  .transform((s, ctx) => {
    try {
      return JSON.parse(s) as unknown;
    } catch {
      ctx.addIssue({ code: 'custom', message: 'The column mapping is not valid JSON.' });
      return z.NEVER;
    }
  })
  .pipe(columnMapping);

const previewForm = z.object({ mapping: mappingField.optional() });
const commitForm = z.object({ mapping: mappingField, skipInvalid: z.enum(['true', 'false']).default('false') });

salesImportRouter.post('/assignments/:id/sales/import/preview', allow('appraiser'), uploadRateLimit, csvUpload.single('file'), async (req, res) => {
  let preview;
  try {
    const id = parseId(req.params);
    if (!req.file) throw badRequest('Attach a CSV file.', { file: 'No file.' });
    const form = parse(previewForm, req.body);
    preview = await previewImport(req.auth!.user, id, req.file.path, form.mapping ?? null);
  } finally {
    // The scratch file goes before the answer does.
    if (req.file) await rm(req.file.path, { force: true });
  }
  res.json(preview);
});

salesImportRouter.post('/assignments/:id/sales/import', allow('appraiser'), uploadRateLimit, csvUpload.single('file'), async (req, res) => {
  let result;
  try {
    const id = parseId(req.params);
    if (!req.file) throw badRequest('Attach a CSV file.', { file: 'No file.' });
    const form = parse(commitForm, req.body);
    result = await commitImport(req.auth!.user, id, {
      filePath: req.file.path,
      fileName: req.file.originalname,
      mapping: form.mapping,
      skipInvalid: form.skipInvalid === 'true',
    });
  } finally {
    if (req.file) await rm(req.file.path, { force: true });
  }
  res.status(201).json(result);
});
