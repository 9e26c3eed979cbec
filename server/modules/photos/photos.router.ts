import { Router } from 'express';
import { rm } from 'node:fs/promises';
import { z } from 'zod';
import { allow } from '../../http/access';
import { photoUpload } from '../../http/uploads';
import { uploadRateLimit } from '../../middleware/upload-rate-limit';
import { parse, parseId } from '../../http/validate';
import { photoSizes } from '../../contracts/photos';
import { badRequest } from '../../errors';
import * as service from './photos.service';

export const photosRouter = Router();

photosRouter.get('/assignments/:id/photos', allow('appraiser', 'reviewer', 'admin'), async (req, res) => {
  res.json({ photos: await service.listPhotos(req.auth!.user, parseId(req.params)) });
});

const uploadForm = z.object({ saleId: z.coerce.number().int().positive().max(2_147_483_647).optional() });

photosRouter.post('/assignments/:id/photos', allow('appraiser'), uploadRateLimit, photoUpload.array('files', 20), async (req, res) => {
  const files = (req.files as Express.Multer.File[] | undefined) ?? [];
  let photos;
  try {
    const id = parseId(req.params);
    const { saleId } = parse(uploadForm, req.body);
    if (files.length === 0) throw badRequest('Attach at least one photo.', { files: 'No file.' });
    photos = await service.addPhotos(req.auth!.user, id, saleId ?? null, files);
  } finally {
    // Scratch files go before the answer does: a client that got its answer finds no scratch left.
    await Promise.all(files.map((f) => rm(f.path, { force: true })));
  }
  res.status(201).json({ photos });
});

const photoParams = z.object({ id: z.coerce.number().int().positive().max(2_147_483_647), size: z.enum(photoSizes) });

photosRouter.get('/photos/:id/:size', allow('appraiser', 'reviewer', 'admin'), async (req, res) => {
  const { id, size } = parse(photoParams, req.params);
  const bytes = await service.readPhoto(req.auth!.user, id, size);
  res.set({ 'Content-Type': 'image/jpeg', 'Cache-Control': 'private, max-age=86400, immutable' }).send(bytes);
});

photosRouter.delete('/photos/:id', allow('appraiser'), async (req, res) => {
  await service.deletePhoto(req.auth!.user, parseId(req.params));
  res.status(204).end();
});
