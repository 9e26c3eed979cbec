import { useState } from 'react';
import { photoUrl, type Photo } from '@contracts/photos';
import { Button } from '../../../components/ui/button';

interface PhotoTileProps {
  photo: Photo;
  isCover: boolean;
  /** Offered only for a sale's photos when the sale's version is known. */
  canMakeCover: boolean;
  editable: boolean;
  busy: boolean;
  onOpen: () => void;
  onMakeCover: () => void;
  onDelete: () => void;
}

/** One thumbnail: opens the display size; says "Cover" in words; asks before deleting. */
export function PhotoTile({ photo, isCover, canMakeCover, editable, busy, onOpen, onMakeCover, onDelete }: PhotoTileProps) {
  const [confirming, setConfirming] = useState(false);
  return (
    <li className="flex w-48 shrink-0 flex-col gap-1.5" data-photo-id={photo.id} aria-label={`${photo.originalName}${isCover ? ' (cover)' : ''}`}>
      <button
        type="button"
        onClick={onOpen}
        className={`relative block aspect-[4/3] overflow-hidden rounded-md border bg-paper-sunk ${isCover ? 'border-ink ring-2 ring-ink/25' : 'border-rule-strong'}`}
        aria-label={`Open ${photo.originalName}`}
      >
        <img src={photoUrl(photo.id, 'thumb')} alt="" loading="lazy" width={320} height={240} className="size-full object-cover" />
        {isCover && (
          <span className="absolute top-1.5 left-1.5 rounded-sm bg-ink px-1.5 py-0.5 text-[0.6875rem] font-semibold tracking-wide text-paper uppercase">
            Cover
          </span>
        )}
      </button>
      <p className="truncate text-[0.8125rem] text-ink-soft" title={photo.originalName}>
        {photo.originalName}
      </p>
      {editable && !confirming && (
        <div className="flex gap-3">
          {canMakeCover && !isCover && (
            <Button variant="quiet" className="text-[0.8125rem]" disabled={busy} onClick={onMakeCover}>
              Make cover
            </Button>
          )}
          <Button variant="quiet" className="text-[0.8125rem] text-rust hover:text-rust" disabled={busy} onClick={() => setConfirming(true)}>
            Delete
          </Button>
        </div>
      )}
      {editable && confirming && (
        <div role="group" aria-label={`Delete ${photo.originalName}?`} className="flex flex-col gap-1.5 rounded-md border border-rust/35 bg-rust-wash px-2 py-1.5">
          <p className="text-[0.8125rem] text-ink">Delete this photo?</p>
          <div className="flex flex-wrap gap-1.5">
            <Button size="sm" variant="danger" className="px-2.5" disabled={busy} autoFocus onClick={onDelete}>
              Yes, delete
            </Button>
            <Button size="sm" className="px-2.5" onClick={() => setConfirming(false)}>
              Keep
            </Button>
          </div>
        </div>
      )}
    </li>
  );
}
