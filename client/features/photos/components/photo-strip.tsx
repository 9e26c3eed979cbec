import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Notice } from '../../../components/ui/notice';
import { ErrorPanel } from '../../../components/ui/query-states';
import { LoadingBar } from '../../../components/ui/loading';
import { describeError } from '../../../lib/api-error';
import { photoQueries } from '../api/photo-queries';
import { useDeletePhoto, useMakeCover } from '../hooks/use-photo-actions';
import { PhotoLightbox } from './photo-lightbox';
import { PhotoTile } from './photo-tile';

/** What the strip needs to know of the sale: its cover and the version a cover change must name. */
export interface PhotoStripSale {
  id: number;
  version: number;
  coverPhotoId: number | null;
}

interface PhotoStripProps {
  assignmentId: number;
  /** The sale whose photos to show; null for the subject's. */
  saleId: number | null;
  editable: boolean;
  sale?: PhotoStripSale;
}

/** The photos of the subject or of one sale, as lazy thumbnails: open one to see it larger; mark
 * the sale's cover; delete with a confirmation. */
export function PhotoStrip({ assignmentId, saleId, editable, sale }: PhotoStripProps) {
  const photos = useQuery(photoQueries.list(assignmentId));
  const makeCover = useMakeCover(assignmentId);
  const remove = useDeletePhoto(assignmentId);
  const [open, setOpen] = useState<number | null>(null);

  if (photos.isPending) return <LoadingBar className="my-4 max-w-40" />;
  if (photos.isError) return <ErrorPanel title="Photos could not be loaded" error={photos.error} onRetry={() => void photos.refetch()} retrying={photos.isFetching} />;

  const shown = photos.data.filter((p) => p.saleId === saleId);
  const knownSale = sale && sale.id === saleId ? sale : undefined;
  const failed = makeCover.error ?? remove.error;
  const label = saleId === null ? 'Photos of the subject' : 'Photos of this sale';

  return (
    <div className="flex flex-col gap-2">
      {shown.length === 0 ? (
        <p className="text-[0.875rem] text-ink-faint">No photos yet.</p>
      ) : (
        <ul aria-label={label} className="flex gap-3 overflow-x-auto pb-1">
          {shown.map((photo, index) => (
            <PhotoTile
              key={photo.id}
              photo={photo}
              isCover={knownSale?.coverPhotoId === photo.id}
              canMakeCover={knownSale !== undefined}
              editable={editable}
              busy={makeCover.isPending || remove.isPending}
              onOpen={() => setOpen(index)}
              onMakeCover={() => knownSale && makeCover.mutate({ saleId: knownSale.id, photoId: photo.id, version: knownSale.version })}
              onDelete={() => remove.mutate(photo.id)}
            />
          ))}
        </ul>
      )}
      {failed && (
        <Notice tone="error" title={makeCover.error ? 'The cover was not changed' : 'The photo was not deleted'}>
          {describeError(failed)}
        </Notice>
      )}
      <PhotoLightbox photos={shown} index={open} onIndex={setOpen} />
    </div>
  );
}
