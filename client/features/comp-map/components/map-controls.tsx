import type { Map as MaplibreMap } from 'maplibre-gl';
import type { LonLat, MapSale } from '../map-types';
import { withinTown } from '../lib/basemap-style';
import { outerRingBounds } from '../lib/rings';
import { boundsOf } from '../../../lib/geo-bounds';

const buttonClass =
  'flex h-8 min-w-8 items-center justify-center px-2 text-[0.8125rem] font-semibold text-ink hover:bg-paper focus-visible:relative focus-visible:z-10 disabled:text-ink-faint disabled:hover:bg-transparent';

function salesBounds(sales: readonly MapSale[], subject: LonLat | null): [number, number, number, number] | null {
  const points = sales.map((s) => [s.lon, s.lat]);
  if (subject) points.push([subject.lon, subject.lat]);
  return boundsOf(points);
}

/** Our own zoom and framing buttons, drawn in the page's style over the map's top-right corner. */
export function MapControls({ map, subject, sales, areaUnit }: { map: MaplibreMap; subject: LonLat | null; sales: readonly MapSale[]; areaUnit: 'sqft' | 'sqm' }) {
  const fitSales = () => {
    const bounds = salesBounds(sales, subject);
    if (bounds) map.fitBounds(bounds, { padding: 36, maxZoom: 16 });
  };
  const toSubject = () => {
    if (subject) map.fitBounds(withinTown(outerRingBounds(subject, areaUnit)), { padding: 28 });
  };
  return (
    <div className="absolute top-3 right-3 z-10 flex flex-col gap-2">
      <div className="flex flex-col divide-y divide-rule overflow-hidden rounded-md border border-rule-strong bg-paper-raised shadow-[0_1px_3px_rgb(29_42_68/0.12)]">
        <button type="button" className={buttonClass} aria-label="Zoom in" onClick={() => map.zoomIn()}>
          <span aria-hidden className="text-base leading-none">+</span>
        </button>
        <button type="button" className={buttonClass} aria-label="Zoom out" onClick={() => map.zoomOut()}>
          <span aria-hidden className="text-base leading-none">−</span>
        </button>
      </div>
      <div className="flex flex-col divide-y divide-rule overflow-hidden rounded-md border border-rule-strong bg-paper-raised shadow-[0_1px_3px_rgb(29_42_68/0.12)]">
        <button type="button" className={buttonClass} onClick={toSubject} disabled={!subject} title="Frame the subject and its rings">
          Subject
        </button>
        {sales.length > 0 && (
          <button type="button" className={buttonClass} onClick={fitSales} title="Frame every sale shown">
            All sales
          </button>
        )}
      </div>
    </div>
  );
}
