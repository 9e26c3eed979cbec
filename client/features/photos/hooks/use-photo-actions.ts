import { useState } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Photo } from '@contracts/photos';
import { invalidateAssignmentSales } from '../../../lib/assignment-cache';
import type { UploadProgress } from '../../../lib/upload';
import { deletePhoto, photoQueries, refusePhotosLocally, setSaleCover, uploadPhotos } from '../api/photo-queries';

/** After any change to photos: the assignment's photo list, and its sales (cover, photo count). */
function useRefreshPhotos(assignmentId: number) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([queryClient.invalidateQueries({ queryKey: photoQueries.list(assignmentId).queryKey }), invalidateAssignmentSales(queryClient, assignmentId)]);
}

/** Uploads a batch with one overall progress figure. */
export function useUploadPhotos(assignmentId: number, saleId: number | null, onUploaded?: (photos: Photo[]) => void) {
  const refresh = useRefreshPhotos(assignmentId);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [localRefusal, setLocalRefusal] = useState<string | null>(null);
  const mutation = useMutation({
    mutationFn: (files: File[]) => uploadPhotos(assignmentId, saleId, files, { onProgress: setProgress }),
    onSettled: () => setProgress(null),
    onSuccess: async ({ photos }) => {
      onUploaded?.(photos);
      await refresh();
    },
  });
  const upload = (files: File[]) => {
    const refusal = refusePhotosLocally(files);
    setLocalRefusal(refusal);
    if (refusal) {
      mutation.reset();
      return;
    }
    mutation.mutate(files);
  };
  return { upload, progress, localRefusal, mutation };
}

export function useDeletePhoto(assignmentId: number) {
  const refresh = useRefreshPhotos(assignmentId);
  return useMutation({ mutationFn: (photoId: number) => deletePhoto(photoId), onSuccess: refresh });
}

export function useMakeCover(assignmentId: number) {
  const refresh = useRefreshPhotos(assignmentId);
  return useMutation({
    mutationFn: ({ saleId, photoId, version }: { saleId: number; photoId: number; version: number }) => setSaleCover(assignmentId, saleId, photoId, version),
    onSuccess: refresh,
  });
}
