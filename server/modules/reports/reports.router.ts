import { Router } from 'express';
import { z } from 'zod';
import { db } from '../../../db/client';
import { allow, anyone } from '../../http/access';
import { appOrigin } from '../../http/app-origin';
import { parse, parseId } from '../../http/validate';
import { signRequest, type ReportSnapshot } from '../../contracts/report';
import { photoSizes } from '../../contracts/photos';
import { notFound } from '../../errors';
import { photoStorage } from '../../integrations/storage/photo-storage';
import { listReportVersions } from './reports.repo';
import * as service from './reports.service';
import { renderReportPdf } from './pdf/report-pdf';
import { photos } from '../../../db/schema/assignments';
import { eq } from 'drizzle-orm';
import type { SignResponse } from '../../contracts/report';
import type { OkResponse } from '../../contracts/review';

export const reportsRouter = Router();

const everyone = allow('appraiser', 'reviewer', 'admin', 'client');

reportsRouter.post('/assignments/:id/sign', allow('appraiser'), async (req, res) => {
  const id = parseId(req.params);
  res.status(201).json((await service.signAssignment(req.auth!.user, id, parse(signRequest, req.body), appOrigin(req))) satisfies SignResponse);
});

reportsRouter.post('/assignments/:id/new-draft', allow('appraiser'), async (req, res) => {
  const id = parseId(req.params);
  const body = parse(z.object({ version: z.number().int().positive(), reason: z.string().trim().min(3, 'Say why a new draft is needed.').max(2000) }), req.body);
  await service.openNewDraft(req.auth!.user, id, body.version, body.reason);
  res.json({ ok: true } satisfies OkResponse);
});

reportsRouter.get('/reports', everyone, async (req, res) => {
  const { assignmentId } = parse(z.object({ assignmentId: z.coerce.number().int().positive().max(2_147_483_647).optional() }), req.query);
  res.json({ reports: await service.reportsFor(req.auth!.user, assignmentId) });
});

reportsRouter.get('/reports/:id', everyone, async (req, res) => {
  const row = await service.readableVersion(req.auth!.user, parseId(req.params));
  const siblings = await listReportVersions(db, { assignmentId: row.assignmentId });
  res.json({
    id: row.id,
    sha256: row.sha256,
    snapshot: row.snapshot,
    laterVersions: siblings.filter((s) => s.versionNumber > row.versionNumber).map((s) => s.id),
  });
});

reportsRouter.get('/reports/:id/pdf', everyone, async (req, res) => {
  const row = await service.readableVersion(req.auth!.user, parseId(req.params));
  const snapshot = row.snapshot as ReportSnapshot;
  const pdf = await renderReportPdf(snapshot, row.sha256, { verifyUrl: `${appOrigin(req)}/verify/${row.sha256}` });
  const fileName = `compline-report-${snapshot.assignment.id}-v${row.versionNumber}.pdf`;
  res.set({ 'Content-Type': 'application/pdf', 'Content-Disposition': `attachment; filename="${fileName}"`, 'Cache-Control': 'private, no-store' }).send(pdf);
});

const reportPhotoParams = z.object({ id: z.coerce.number().int().positive().max(2_147_483_647), photoId: z.coerce.number().int().positive().max(2_147_483_647), size: z.enum(photoSizes) });

/** Photos as frozen into a report: readable by whoever may read the report (the client included). */
reportsRouter.get('/reports/:id/photos/:photoId/:size', everyone, async (req, res) => {
  const { id, photoId, size } = parse(reportPhotoParams, req.params);
  const row = await service.readableVersion(req.auth!.user, id);
  const frozen = (row.snapshot as ReportSnapshot).photos.find((p) => p.id === photoId);
  if (!frozen) throw notFound('That photo');
  const [photo] = await db.select({ storageKey: photos.storageKey }).from(photos).where(eq(photos.id, photoId));
  const bytes = photo ? await photoStorage().get(`${photo.storageKey}-${size}.jpg`) : null;
  if (!bytes) throw notFound('That photo file');
  res.set({ 'Content-Type': 'image/jpeg', 'Cache-Control': 'private, max-age=86400, immutable' }).send(bytes);
});

reportsRouter.get('/verify/:sha256', anyone, async (req, res) => {
  const { sha256 } = parse(z.object({ sha256: z.string().regex(/^[0-9a-fA-F]{64}$/, 'A fingerprint is 64 hexadecimal characters.') }), req.params);
  res.json(await service.verifyFingerprint(sha256));
});
