import { useState } from 'react';
import { reportPhotoUrl } from '../api/report-queries';

/** A frozen photo of the report (thumbnail), or a quiet drawn placeholder when there is none or
 * it cannot be loaded. */
export function ReportPhoto({ reportId, photoId, alt }: { reportId: number; photoId: number | null; alt: string }) {
  const [failed, setFailed] = useState(false);
  if (photoId === null || failed) {
    return (
      <div className="flex aspect-[4/3] w-full items-center justify-center rounded-md border border-dashed border-rule-strong bg-paper-sunk/60" role="img" aria-label={`${alt}: no photo`}>
        <svg viewBox="0 0 48 36" className="w-14 text-rule-strong" aria-hidden>
          <path d="M8 30V17L24 5l16 12v13Z" fill="none" stroke="currentColor" strokeWidth="2" strokeLinejoin="round" />
          <path d="M20 30v-8h8v8" fill="none" stroke="currentColor" strokeWidth="2" />
        </svg>
      </div>
    );
  }
  return (
    <img
      src={reportPhotoUrl(reportId, photoId, 'thumb')}
      alt={alt}
      width={320}
      height={240}
      loading="lazy"
      onError={() => setFailed(true)}
      className="aspect-[4/3] w-full rounded-md border border-rule object-cover"
    />
  );
}
