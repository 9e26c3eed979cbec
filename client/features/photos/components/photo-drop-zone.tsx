import { useState } from 'react';
import type { Photo } from '@contracts/photos';
import { FileDropZone } from '../../../components/ui/file-drop-zone';
import { Notice } from '../../../components/ui/notice';
import { ProgressBar } from '../../../components/ui/progress-bar';
import { describeError } from '../../../lib/api-error';
import { countOf } from '../../../lib/count-of';
import { formatBytes } from '../../../lib/upload';
import { PHOTO_MAX_SIZE, PHOTOS_PER_UPLOAD } from '@contracts/uploads';
import { PHOTO_ACCEPT } from '../api/photo-queries';
import { useUploadPhotos } from '../hooks/use-photo-actions';

interface PhotoDropZoneProps {
  assignmentId: number;
  /** The sale the photos belong to; null for photos of the subject. */
  saleId: number | null;
  onUploaded?: (photos: Photo[]) => void;
}

/**
 * Adds several photos at once, by drag and drop or the picker, in one request with one progress
 * bar. The server checks every file before storing any: when it refuses one, none is added, and
 * its reason is shown beside the names of the files that were sent.
 */
export function PhotoDropZone({ assignmentId, saleId, onUploaded }: PhotoDropZoneProps) {
  const [batch, setBatch] = useState<File[]>([]);
  const { upload, progress, localRefusal, mutation } = useUploadPhotos(assignmentId, saleId, onUploaded);
  const busy = mutation.isPending;

  const send = (files: File[]) => {
    setBatch(files);
    upload(files);
  };

  return (
    <div className="flex flex-col gap-3">
      <FileDropZone
        inputLabel={saleId === null ? 'Add photos of the subject' : 'Add photos of this sale'}
        accept={PHOTO_ACCEPT}
        multiple
        compact
        disabled={busy}
        title="Drop photos here"
        hint={`JPEG, PNG or WebP; up to ${PHOTOS_PER_UPLOAD} at a time, ${PHOTO_MAX_SIZE} each. Location data is removed.`}
        buttonLabel="Choose photos"
        onFiles={send}
      />
      {batch.length > 0 && (busy || mutation.isError || localRefusal) && (
        <ul aria-label="Files in this upload" className="flex flex-wrap gap-x-4 gap-y-1 text-[0.875rem] text-ink-soft">
          {batch.map((file, index) => (
            <li key={`${file.name}-${index}`}>
              {file.name} <span className="figures text-ink-faint">{formatBytes(file.size)}</span>
            </li>
          ))}
        </ul>
      )}
      {busy && progress && (
        <div>
          <ProgressBar
            value={progress.phase === 'uploading' ? progress.fraction : null}
            label={progress.phase === 'uploading' ? `Uploading ${countOf(batch.length, 'photo')}` : `Checking and storing ${countOf(batch.length, 'photo')}`}
          />
        </div>
      )}
      {localRefusal && (
        <Notice tone="error" title="No photo was added">
          {localRefusal}
        </Notice>
      )}
      {mutation.isError && (
        <Notice tone="error" title="No photo was added">
          {describeError(mutation.error)}
          {batch.length > 1 && ' None of the other files in this upload was added either: take that one out and add the rest again.'}
        </Notice>
      )}
      {mutation.isSuccess && !busy && (
        <p role="status" className="text-[0.875rem] text-teal">
          Added {countOf(mutation.data.photos.length, 'photo')}.
        </p>
      )}
    </div>
  );
}
