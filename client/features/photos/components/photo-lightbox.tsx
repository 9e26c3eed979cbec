import { useEffect, useRef } from 'react';
import { photoUrl, type Photo } from '@contracts/photos';
import { Button } from '../../../components/ui/button';

interface PhotoLightboxProps {
  photos: readonly Photo[];
  /** Index of the photo shown, or null when the lightbox is closed. */
  index: number | null;
  onIndex: (index: number | null) => void;
}

/**
 * The display size of one photo in a modal dialog (the platform's <dialog>: focus stays inside,
 * Escape closes). Left and right arrow keys step through the strip.
 */
export function PhotoLightbox({ photos, index, onIndex }: PhotoLightboxProps) {
  const dialog = useRef<HTMLDialogElement>(null);
  const photo = index === null ? undefined : photos[index];

  useEffect(() => {
    const element = dialog.current;
    if (!element) return;
    if (photo && !element.open) element.showModal();
    if (!photo && element.open) element.close();
  }, [photo]);

  const step = (by: number) => {
    if (index === null || photos.length < 2) return;
    onIndex((index + by + photos.length) % photos.length);
  };

  return (
    <dialog
      ref={dialog}
      aria-label={photo ? `Photo: ${photo.originalName}` : 'Photo'}
      onClose={() => onIndex(null)}
      onClick={(event) => {
        if (event.target === dialog.current) onIndex(null);
      }}
      onKeyDown={(event) => {
        if (event.key === 'ArrowRight') step(1);
        if (event.key === 'ArrowLeft') step(-1);
      }}
      className="m-auto max-h-[92dvh] max-w-[min(92vw,1100px)] rounded-lg border border-rule-strong bg-paper-raised p-0 text-ink shadow-xl backdrop:bg-ink/70"
    >
      {photo && (
        <figure className="flex flex-col">
          <img
            src={photoUrl(photo.id, 'display')}
            alt={photo.originalName}
            width={photo.width}
            height={photo.height}
            className="max-h-[78dvh] w-auto bg-paper-sunk object-contain"
          />
          <figcaption className="flex flex-wrap items-center gap-x-4 gap-y-2 border-t border-rule px-4 py-3">
            <span className="min-w-0 flex-1 truncate font-medium">{photo.originalName}</span>
            <span className="figures text-sm text-ink-soft">
              {photo.width} × {photo.height} px · {index! + 1} of {photos.length}
            </span>
            {photos.length > 1 && (
              <span className="flex gap-2">
                <Button size="sm" onClick={() => step(-1)} aria-label="Previous photo">
                  ←
                </Button>
                <Button size="sm" onClick={() => step(1)} aria-label="Next photo">
                  →
                </Button>
              </span>
            )}
            <Button size="sm" autoFocus onClick={() => onIndex(null)}>
              Close
            </Button>
          </figcaption>
        </figure>
      )}
    </dialog>
  );
}
