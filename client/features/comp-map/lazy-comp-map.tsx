import { lazy, Suspense } from 'react';
import type { CompMapProps } from './map-types';

// maplibre (~300 kB gzip) lives only in this chunk: pages without a map never load it.
const MapImplementation = lazy(() => import('./components/comp-map').then((m) => ({ default: m.CompMapCanvas })));

function MapPlaceholder({ className = '' }: { className?: string }) {
  return (
    <div role="status" className={`flex items-center justify-center rounded-lg border border-rule bg-paper-sunk/60 ${className}`}>
      <span className="text-sm text-ink-faint">Drawing the map of Port Ellery…</span>
    </div>
  );
}

/** The Port Ellery map with the subject, distance rings and sales; loaded on first use. */
export function CompMap(props: CompMapProps) {
  return (
    <Suspense fallback={<MapPlaceholder className={props.className} />}>
      <MapImplementation {...props} />
    </Suspense>
  );
}
