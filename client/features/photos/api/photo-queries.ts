import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { photoListResponse, photoSchema } from '@contracts/photos';
import { saleSchema } from '@contracts/sales';
import { apiRequest } from '../../../lib/api-client';
import { uploadForm, type UploadOptions } from '../../../lib/upload';
import { PHOTO_MAX_BYTES, photoTooLargeMessage, PHOTOS_PER_UPLOAD } from '@contracts/uploads';

/** Query keys and fetchers of the photos feature, general → specific: ['photos'] clears them all. */
export const photoQueries = {
  all: () => ['photos'] as const,
  lists: () => [...photoQueries.all(), 'list'] as const,
  /** Every live photo of an assignment (the subject's and each sale's); views filter by sale. */
  list: (assignmentId: number) =>
    queryOptions({
      queryKey: [...photoQueries.lists(), assignmentId] as const,
      queryFn: ({ signal }) => apiRequest(`/api/assignments/${assignmentId}/photos`, photoListResponse, { signal }),
      select: (data) => data.photos,
    }),
};

/** The server's limits (server/http/uploads.ts): checked here too, because a server that stops
 * reading a too-large upload half way can leave the browser with a dropped connection instead of
 * its explanation. */
export const PHOTO_ACCEPT = 'image/jpeg,image/png,image/webp,.jpg,.jpeg,.png,.webp';

/** Why this batch is not sent at all, or null when it may go. Whether a file really is an image
 * is for the server to say: it decodes every one. */
export function refusePhotosLocally(files: readonly File[]): string | null {
  if (files.length > PHOTOS_PER_UPLOAD) return `That is ${files.length} files; add at most ${PHOTOS_PER_UPLOAD} at a time.`;
  const tooLarge = files.find((f) => f.size > PHOTO_MAX_BYTES);
  if (tooLarge) return photoTooLargeMessage(tooLarge.name);
  return null;
}

const uploadedPhotos = z.object({ photos: z.array(photoSchema) });

/** One request for the whole batch: the server checks every file first and stores all or none. */
export function uploadPhotos(assignmentId: number, saleId: number | null, files: readonly File[], options: UploadOptions) {
  const form = new FormData();
  if (saleId !== null) form.append('saleId', String(saleId));
  for (const file of files) form.append('files', file, file.name);
  return uploadForm(`/api/assignments/${assignmentId}/photos`, form, uploadedPhotos, options);
}

export function deletePhoto(photoId: number) {
  return apiRequest(`/api/photos/${photoId}`, null, { method: 'DELETE' });
}

/** Makes a photo the sale's cover; `version` is the sale's, as read (a stale one answers 409). */
export function setSaleCover(assignmentId: number, saleId: number, photoId: number, version: number) {
  return apiRequest(`/api/assignments/${assignmentId}/sales/${saleId}`, z.object({ sale: saleSchema }), {
    method: 'PATCH',
    body: { coverPhotoId: photoId, version },
  });
}
