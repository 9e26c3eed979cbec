import { randomUUID } from 'node:crypto';
import { and, asc, eq, isNull, sql } from 'drizzle-orm';
import { db } from '../../../db/client';
import { photos, sales } from '../../../db/schema/assignments';
import type { SessionUser } from '../../contracts/auth';
import { photoSizes } from '../../contracts/photos';
import { notFound } from '../../errors';
import { photoStorage } from '../../integrations/storage/photo-storage';
import { audit } from '../audit/audit.service';
import { assertEditable, loadAssignmentFor } from '../assignments/assignment-access';
import { photoFrozenInReport } from '../reports/reports.repo';
import { findSale } from '../sales/sales.repo';
import { processPhoto, type ProcessedPhoto } from './photo-pipeline';

const photoColumns = {
  id: photos.id,
  assignmentId: photos.assignmentId,
  saleId: photos.saleId,
  width: photos.width,
  height: photos.height,
  originalName: photos.originalName,
  createdAt: photos.createdAt,
};

export async function listPhotos(user: SessionUser, assignmentId: number) {
  await loadAssignmentFor(db, user, assignmentId);
  return db
    .select(photoColumns)
    .from(photos)
    .where(and(eq(photos.assignmentId, assignmentId), isNull(photos.deletedAt)))
    .orderBy(asc(photos.id));
}

/** All files are checked before any is stored: one refused file refuses the whole upload. */
export async function addPhotos(user: SessionUser, assignmentId: number, saleId: number | null, files: Array<{ path: string; originalname: string }>) {
  assertEditable(await loadAssignmentFor(db, user, assignmentId));
  if (saleId !== null && !(await findSale(db, assignmentId, saleId))) throw notFound('That sale');
  const processed: Array<ProcessedPhoto & { name: string }> = [];
  for (const file of files) processed.push({ ...(await processPhoto(file.path, file.originalname)), name: file.originalname.slice(0, 200) });
  const storage = photoStorage();
  const stored = processed.map((p) => ({ ...p, key: `${assignmentId}/${randomUUID()}` }));
  for (const p of stored) {
    await storage.put(`${p.key}-display.jpg`, p.display, 'image/jpeg');
    await storage.put(`${p.key}-thumb.jpg`, p.thumb, 'image/jpeg');
  }
  try {
    return await db.transaction(async (tx) => {
      const rows = await tx
        .insert(photos)
        .values(stored.map((p) => ({ assignmentId, saleId, storageKey: p.key, width: p.width, height: p.height, bytes: p.display.length, sha256: p.sha256, originalName: p.name, uploadedBy: user.id })))
        .returning(photoColumns);
      // The first photo of a sale becomes its cover.
      if (saleId !== null) {
        await tx.update(sales).set({ coverPhotoId: rows[0].id }).where(and(eq(sales.id, saleId), isNull(sales.coverPhotoId)));
      }
      await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'photos-added', entityType: saleId ? 'sale' : 'subject', entityId: saleId ?? assignmentId, details: { assignmentId, photoIds: rows.map((r) => r.id) } });
      return rows;
    });
  } catch (err) {
    // The rows did not commit: take the files back so that nothing is left on disk.
    await Promise.all(stored.flatMap((p) => [storage.delete(`${p.key}-display.jpg`), storage.delete(`${p.key}-thumb.jpg`)]));
    throw err;
  }
}

async function findPhotoFor(user: SessionUser, photoId: number) {
  const [row] = await db.select().from(photos).where(and(eq(photos.id, photoId), isNull(photos.deletedAt)));
  if (!row) throw notFound('That photo');
  await loadAssignmentFor(db, user, row.assignmentId);
  return row;
}

export async function readPhoto(user: SessionUser, photoId: number, size: 'thumb' | 'display') {
  const row = await findPhotoFor(user, photoId);
  const bytes = await photoStorage().get(`${row.storageKey}-${size}.jpg`);
  if (!bytes) throw notFound('That photo file');
  return bytes;
}

/** Soft delete: the row stays for the record; a sale whose cover it was gets its next photo. The
 * files go once the transaction has committed (a rolled-back delete keeps them), unless a signed
 * report version froze the photo: that report still shows it. */
export async function deletePhoto(user: SessionUser, photoId: number) {
  const row = await findPhotoFor(user, photoId);
  assertEditable(await loadAssignmentFor(db, user, row.assignmentId));
  const frozen = await db.transaction(async (tx) => {
    await tx.update(photos).set({ deletedAt: sql`now()` }).where(eq(photos.id, photoId));
    if (row.saleId !== null) {
      const next = sql`(select id from ${photos} where ${photos.saleId} = ${row.saleId} and ${photos.deletedAt} is null order by id limit 1)`;
      await tx.update(sales).set({ coverPhotoId: next }).where(and(eq(sales.id, row.saleId), eq(sales.coverPhotoId, photoId)));
    }
    const inReport = await photoFrozenInReport(tx, row.assignmentId, photoId);
    await audit(tx, { actorUserId: user.id, organisationId: user.organisationId, action: 'photo-deleted', entityType: 'photo', entityId: photoId, details: { assignmentId: row.assignmentId, saleId: row.saleId, filesKept: inReport } });
    return inReport;
  });
  if (!frozen) await removePhotoFiles(photoId, row.storageKey);
}

/** Removes both sizes of a deleted photo. The delete has already committed, so a file that cannot
 * be removed is logged for an operator to clear, never reported to the user as a failed delete. */
async function removePhotoFiles(photoId: number, storageKey: string) {
  const storage = photoStorage();
  const keys = photoSizes.map((size) => `${storageKey}-${size}.jpg`);
  const results = await Promise.allSettled(keys.map((key) => storage.delete(key)));
  results.forEach((result, i) => {
    if (result.status === 'rejected') console.error(`photo ${photoId}: could not remove stored file ${keys[i]}:`, (result.reason as Error)?.message ?? result.reason);
  });
}
